import type { QueryState } from '~/components/calc/use-query-state';
import type { Outcome } from '~/components/calc/attempt';

export const WAVES_DEFAULTS: QueryState = {
  temp: '20',
  tempUnit: 'C',
  rh: '50',
  unit: 'm',
  wfreq: '100',
  cmode: 'time',
  cms: '1',
  cdist: '0.34',
  afreq: '4000',
  adist: '50',
  sfreq: '60',
  kind: 'gradient',
};

/** Shared with the delay screen: the same air and units. */
export const WAVES_REMEMBERED = ['temp', 'tempUnit', 'rh', 'unit'] as const;

export interface AirNow {
  celsius: number;
  rh: number;
  speed: number;
}

export interface WavesPanelProps {
  s: QueryState;
  set: (patch: QueryState) => void;
  air: Outcome<AirNow>;
}

export const GUIDE = '/calc/guide/wavelength-and-air';
