import { periodMs, subTopCandidates } from '~/lib/acoustics';
import { SubTopQuerySchema } from '~/lib/schemas/calc';
import { calcGet } from './_calc-route';

/** Every usual way to line sub and top up at the crossover, best first, with the phase each leaves. */
export const GET = calcGet(SubTopQuerySchema, ({ freq, phase }) => ({ candidates: subTopCandidates(freq, phase), periodMs: periodMs(freq) }));
