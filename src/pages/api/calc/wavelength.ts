import { wavelength } from '~/lib/acoustics';
import { WavelengthQuerySchema } from '~/lib/schemas/calc';
import { calcGet } from './_calc-route';

/** λ = c/f at the air temperature (and humidity, when given). */
export const GET = calcGet(WavelengthQuerySchema, ({ freq, temperatureCelsius, rh }) => wavelength(freq, temperatureCelsius, rh));
