import type { QueryState } from '~/components/calc/use-query-state';

export const DOSE_DEFAULTS: QueryState = {
  seg: '95:2,90:4',
  readings: '98,101,97,99',
  limit: '100',
};

export interface DosePanelProps {
  s: QueryState;
  set: (patch: QueryState) => void;
}

export const GUIDE = '/calc/guide/show-dose';
