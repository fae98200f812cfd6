import type { QueryState } from '~/components/calc/use-query-state';
import type { Outcome } from '~/components/calc/attempt';

export const DELAY_DEFAULTS: QueryState = {
  temp: '20',
  rh: '',
  tempUnit: 'C',
  unit: 'm',
  timeUnit: 'ms',
  rate: '48000',
  start: 'distance',
  dist: '10',
  time: '10',
  main: '30',
  fill: '8',
  offset: '0',
  latency: '0',
  xover: '80',
  phase: '0',
};

/** Kept between visits and shared with the other calculators. */
export const DELAY_REMEMBERED = ['temp', 'tempUnit', 'rh', 'unit', 'timeUnit', 'rate'] as const;

export interface Air {
  celsius: number;
  /** Relative humidity, %, when typed; dry air otherwise. */
  rh?: number;
  speed: number;
}

export interface DelayPanelProps {
  s: QueryState;
  set: (patch: QueryState) => void;
  air: Outcome<Air>;
}

export const GUIDE = '/calc/guide/delay';
