import { speakerLoad } from '~/lib/acoustics';
import { ImpedanceQuerySchema } from '~/lib/schemas/calc';
import { calcGet } from './_calc-route';

/** Nominal load of the boxes on one amplifier channel, checked against the amplifier's minimum. */
export const GET = calcGet(ImpedanceQuerySchema, ({ ohms, wiring, minLoad }) => ({ ...speakerLoad(ohms, wiring, minLoad), wiring, boxes: ohms.length }));
