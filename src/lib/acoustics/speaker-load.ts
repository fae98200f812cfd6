/** The load that several loudspeakers on one amplifier channel present. */
import { LIMITS } from './limits';
import { formatNumber, requireArray, requireInRange, requireOneOf } from './guards';

export type Wiring = 'parallel' | 'series';

export interface SpeakerLoad {
  /** Nominal load on the channel, Ω. */
  ohms: number;
  /** True when a minimum load was given and the result is below it. */
  belowMinimum?: boolean;
  /** Sentence for the screen when the load is below the amplifier's minimum. */
  warning?: string;
}

/**
 * Nominal load of boxes on one channel: series R = ΣRi, parallel 1/R = Σ1/Ri (Kirchhoff's laws for
 * resistances; e.g. P. Horowitz & W. Hill, The Art of Electronics, 3rd ed., §1.2, from memory). Nominal
 * impedances are not resistances: the real load dips below nominal at some frequencies.
 */
export function speakerLoad(ohmsEach: number[], wiring: Wiring, minimumLoadOhms?: number): SpeakerLoad {
  const list = requireArray(ohmsEach, 'The list of loudspeaker impedances', 1, LIMITS.maxBoxes);
  const loads = list.map((r, i) => requireInRange(r, LIMITS.loadOhms, `Impedance ${i + 1}`, 'Ω'));
  const how = requireOneOf(wiring, ['parallel', 'series'] as const, 'The wiring');
  const ohms = how === 'series' ? loads.reduce((a, b) => a + b, 0) : 1 / loads.reduce((a, r) => a + 1 / r, 0);
  if (minimumLoadOhms === undefined) return { ohms };
  const minimum = requireInRange(minimumLoadOhms, LIMITS.loadOhms, 'The amplifier’s minimum load', 'Ω');
  // A 2 Ω-rated channel with four 8 Ω boxes is exactly at its rating, not below it.
  const belowMinimum = ohms < minimum - 1e-9;
  return belowMinimum
    ? {
        ohms,
        belowMinimum,
        warning: `${formatNumber(ohms)} Ω is below the amplifier’s ${formatNumber(minimum)} Ω minimum: it may overheat, limit or shut down, and can be damaged. Use fewer boxes per channel or wire them in series.`,
      }
    : { ohms, belowMinimum };
}
