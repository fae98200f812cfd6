import type { QueryState } from '~/components/calc/use-query-state';

export const LEVEL_DEFAULTS: QueryState = {
  mode: 'incoherent',
  levels: '94,91',
  phases: '0,0',
  level: '100',
  from: '10',
  to: '20',
  source: 'point',
  unit: 'm',
  total: '96',
  bg: '88',
  wfreq: '100',
  curve: 'A',
  exp: '94',
};

export const LEVEL_REMEMBERED = ['unit'] as const;

export interface LevelPanelProps {
  s: QueryState;
  set: (patch: QueryState) => void;
}

export const GUIDE = '/calc/guide/sound-level';
