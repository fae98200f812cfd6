import { fillDelayMs, speedOfSound } from '~/lib/acoustics';
import { AlignQuerySchema } from '~/lib/schemas/calc';
import { calcGet } from './_calc-route';

const NOTES = {
  fill: undefined,
  none: 'No delay needed: the fill already arrives after the main by at least the offset, inside the precedence window.',
  main: 'The fill is farther from the listener than the offset allows (or its feed is later), so only delaying the main lines them up; delaying a main moves everything it covers.',
} as const;

/** Which box waits, and how long, so the fill lands `offset` ms after the main at the listener. */
export const GET = calcGet(AlignQuerySchema, ({ mainMeters, fillMeters, temperatureCelsius, offset, latency, rh }) => {
  const result = fillDelayMs({ mainMeters, fillMeters, temperatureCelsius, precedenceOffsetMs: offset, latencyMs: latency, relativeHumidityPercent: rh });
  const note = NOTES[result.delayOn];
  return { ...result, speed: speedOfSound(temperatureCelsius, rh), ...(note ? { note } : {}) };
});
