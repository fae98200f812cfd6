import type { QueryState } from '~/components/calc/use-query-state';

export const LEVELS_DEFAULTS: QueryState = {
  sval: '4',
  sunit: 'dBu',
  fs: '24',
  sohms: '',
  loads: '8,8',
  wiring: 'parallel',
  minload: '4',
  sens: '100',
  sref: '1W',
  zbox: '8',
  power: '1000',
  mdist: '32',
  boxes: '1',
  unit: 'm',
};

export const LEVELS_REMEMBERED = ['unit', 'fs'] as const;

export interface LevelsPanelProps {
  s: QueryState;
  set: (patch: QueryState) => void;
}

export const GUIDE = '/calc/guide/levels-and-loads';
