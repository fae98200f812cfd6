import { solveBand } from '~/lib/acoustics';
import { BandQuerySchema } from '~/lib/schemas/calc';
import { calcGet } from './_calc-route';

/** Q ↔ octaves, and the −3 dB edges with their geometric-mean centre when a frequency is given. */
export const GET = calcGet(BandQuerySchema, (input) => solveBand(input));
