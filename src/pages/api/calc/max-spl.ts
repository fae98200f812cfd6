import { maxSpl } from '~/lib/acoustics';
import { MaxSplQuerySchema } from '~/lib/schemas/calc';
import { calcGet } from './_calc-route';

/** On-paper maximum level at a distance; the caution about power compression always comes with it. */
export const GET = calcGet(MaxSplQuerySchema, ({ sensitivity, sensitivityRef, power, distanceMeters, boxes, ohms }) => ({
  ...maxSpl({ sensitivityDb: sensitivity, sensitivityRef, powerWatts: power, distanceMeters, boxes, ohms }),
  boxes,
  boxesNote: 'Boxes are summed coherently (+20·log10 n), as they add far enough away to act as one source in phase; close to them or out of phase they add less.',
}));
