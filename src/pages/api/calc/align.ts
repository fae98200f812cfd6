import { fillDelayMs, speedOfSound } from '~/lib/acoustics';
import { AlignQuerySchema } from '~/lib/schemas/calc';
import { calcGet } from './_calc-route';

/**
 * Delay for a fill so it lands `offset` ms after the main at the listener. When the fill is the
 * farther source no fill delay can help; the answer then says the main would need the delay.
 */
export const GET = calcGet(AlignQuerySchema, ({ mainMeters, fillMeters, temperatureCelsius, offset }) => {
  const result = fillDelayMs({ mainMeters, fillMeters, temperatureCelsius, precedenceOffsetMs: offset });
  return {
    ...result,
    speed: speedOfSound(temperatureCelsius),
    ...(result.delayOn === 'main'
      ? { note: 'The fill is farther from the listener than the main (or too close to it for the offset), so the main would need this delay; delaying a main moves everything it covers.' }
      : {}),
  };
});
