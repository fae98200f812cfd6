import type { QueryState } from '~/components/calc/use-query-state';

export const BAND_DEFAULTS: QueryState = {
  start: 'q',
  q: '1.41',
  oct: '1',
  f0: '1000',
  low: '707',
  high: '1414',
  frac: '3',
  bfrom: '20',
  bto: '20000',
  ndir: 'freq',
  nfreq: '440',
  note: 'A4',
  a4: '440',
};

export interface BandPanelProps {
  s: QueryState;
  set: (patch: QueryState) => void;
}

export const GUIDE = '/calc/guide/bandwidth';
