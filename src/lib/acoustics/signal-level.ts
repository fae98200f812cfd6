/** Line levels: dBu, dBV, dBFS on a console, volts, and watts into a load. */
import { LIMITS } from './limits';
import { formatNumber, requireInRange, requireOneOf } from './guards';

/** 0 dBu: the voltage that dissipates 1 mW in 600 Ω, √0.6 V ≈ 0.7746 V (definition; IEC 60268-3 uses it as the reference, clause from memory). */
export const DBU_REFERENCE_VOLTS = Math.sqrt(0.6);
/** 0 dBV: 1 V rms (definition). */
export const DBV_REFERENCE_VOLTS = 1;
/** A common digital console full scale: 0 dBFS = +24 dBu (common practice; consoles differ, so it is an input). */
export const DEFAULT_FULL_SCALE_DBU = 24;

export type SignalUnit = 'dBu' | 'dBV' | 'V' | 'dBFS' | 'W';

export interface SignalLevel {
  dBu: number;
  dBV: number;
  /** rms volts. */
  volts: number;
  dBFS: number;
  /** Power into `ohms`, only when a load was given. */
  watts?: number;
}

/**
 * One signal level in every unit: dBu = 20·log10(V/0.7746), dBV = 20·log10(V/1), dBFS = dBu − full scale,
 * P = V²/R. Sources: the definitions of the dBu and dBV (IEC 60027-3 for the level in decibels, from
 * memory) and Ohm's law / Joule's law for power into a resistive load. A loudspeaker's impedance is not a
 * resistor, so the watts are a nominal figure.
 */
export function signalLevel(value: number, unit: SignalUnit, fullScaleDbu: number = DEFAULT_FULL_SCALE_DBU, ohms?: number): SignalLevel {
  const which = requireOneOf(unit, ['dBu', 'dBV', 'V', 'dBFS', 'W'] as const, 'The unit');
  const fullScale = requireInRange(fullScaleDbu, LIMITS.fullScaleDbu, 'The console’s full scale (0 dBFS)', 'dBu');
  const load = ohms === undefined ? undefined : requireInRange(ohms, LIMITS.loadOhms, 'The load', 'Ω');
  let volts: number;
  if (which === 'V') volts = requireInRange(value, LIMITS.volts, 'The voltage', 'V', { hint: 'Enter the rms voltage.' });
  else if (which === 'W') {
    if (load === undefined) throw new RangeError('Watts need a load: give the load in Ω (e.g. 8) to convert power to a voltage.');
    volts = Math.sqrt(requireInRange(value, LIMITS.watts, 'The power', 'W') * load);
  } else {
    const db = requireInRange(value, LIMITS.signalDb, `The level in ${which}`, which);
    const dBu = which === 'dBu' ? db : which === 'dBV' ? db + 20 * Math.log10(DBV_REFERENCE_VOLTS / DBU_REFERENCE_VOLTS) : db + fullScale;
    volts = DBU_REFERENCE_VOLTS * 10 ** (dBu / 20);
  }
  if (!(volts > 0) || !Number.isFinite(volts)) throw new RangeError(`That level is outside what this converter handles; got ${formatNumber(value)} ${which}.`);
  const dBu = 20 * Math.log10(volts / DBU_REFERENCE_VOLTS);
  const result: SignalLevel = { dBu, dBV: 20 * Math.log10(volts / DBV_REFERENCE_VOLTS), volts, dBFS: dBu - fullScale };
  if (load !== undefined) result.watts = (volts * volts) / load;
  return result;
}

/** The gap between "+4 dBu" professional and "−10 dBV" consumer line level, dB: 4 − (−10 + 20·log10(1/0.7746)) ≈ 11.79 dB. */
export function proConsumerGapDb(): number {
  return 4 - signalLevel(-10, 'dBV').dBu;
}
