/** Noise dose over a day made of segments at different levels, and the energy average of readings. */
import { LIMITS } from './limits';
import { requireArray, requireInRange, requireOneOf } from './guards';
import { EU_LIMITS_DBA, OSHA_TABLE_MAX_DBA } from './exposure';

export interface DoseSegment {
  levelDba: number;
  hours: number;
}

/** OSHA leaves levels below 80 dBA out of the dose (29 CFR 1910.95 Appendix A, A.2; from memory). */
export const OSHA_DOSE_THRESHOLD_DBA = 80;

export interface UsDose {
  /** Daily noise dose, % (100 % = the whole allowance). */
  dosePercent: number;
  /** 8-hour time-weighted average, dBA (null when the dose is 0). */
  twa: number | null;
  /** Some segment is above the rule's end (OSHA: 115 dBA): that exposure is not permitted at all. */
  notPermitted: boolean;
}

export interface EuDose {
  /** Daily noise exposure level LEX,8h, dB(A). */
  lex8h: number;
  /** Which EU 2003/10/EC value it reaches: none, lower action (80), upper action (85) or limit (87). */
  actionLevel: 'none' | 'lower' | 'upper' | 'limit';
}

function requireSegments(segments: unknown): DoseSegment[] {
  const list = requireArray(segments, 'The list of segments', 1, LIMITS.maxSegments);
  const checked = list.map((seg, i) => {
    const s = (seg ?? {}) as Partial<DoseSegment>;
    return {
      levelDba: requireInRange(s.levelDba, LIMITS.levelDb, `The level of segment ${i + 1}`, 'dB(A)'),
      hours: requireInRange(s.hours, LIMITS.segmentHours, `The time of segment ${i + 1}`, 'h'),
    };
  });
  const total = checked.reduce((sum, s) => sum + s.hours, 0);
  if (total > LIMITS.segmentHours.max + 1e-9) throw new RangeError(`The segments add up to ${Number(total.toFixed(4))} h, more than a day; check the times.`);
  return checked;
}

/**
 * Daily dose D = 100·Σ Ci/Ti (Ci hours at level Li, Ti the hours the rule allows at Li):
 * - OSHA: Ti = 8/2^((L − 90)/5), levels below 80 dBA left out; TWA = 16.61·log10(D/100) + 90.
 *   Source: 29 CFR 1910.95 Appendix A (A.1 dose, A.2 TWA; worked example 110 dBA ¼ h, 100 dBA ½ h,
 *   90 dBA 1½ h → D = 93.8 %, TWA 89.5 dBA; example from memory).
 * - NIOSH: Ti = 8/2^((L − 85)/3); TWA = 10·log10(D/100) + 85. Source: NIOSH Publication 98-126, §1.1 (from memory).
 */
export function usDose(segments: DoseSegment[], standard: 'osha' | 'niosh'): UsDose {
  const list = requireSegments(segments);
  const rule = requireOneOf(standard, ['osha', 'niosh'] as const, 'The rule');
  const criterion = rule === 'osha' ? 90 : 85;
  const exchange = rule === 'osha' ? 5 : 3;
  let fraction = 0;
  let notPermitted = false;
  for (const s of list) {
    if (rule === 'osha' && s.levelDba < OSHA_DOSE_THRESHOLD_DBA) continue;
    if (s.hours > 0 && s.levelDba > (rule === 'osha' ? OSHA_TABLE_MAX_DBA : 140) + 1e-9) notPermitted = true;
    fraction += s.hours / (8 / 2 ** ((s.levelDba - criterion) / exchange));
  }
  const dosePercent = 100 * fraction;
  const twa = fraction > 0 ? (rule === 'osha' ? 16.61 : 10) * Math.log10(fraction) + criterion : null;
  return { dosePercent, twa, notPermitted };
}

/**
 * EU daily exposure LEX,8h = 10·log10((1/8)·Σ ti·10^(Li/10)) dB(A), compared with the lower and upper
 * exposure action values (80, 85) and the exposure limit value (87) of Directive 2003/10/EC Art. 3.
 * Source: Directive 2003/10/EC Art. 2(b) referring to ISO 1999:1990 §3.6 (clause from memory).
 */
export function euDailyExposure(segments: DoseSegment[]): EuDose {
  const list = requireSegments(segments).filter((s) => s.hours > 0);
  if (!list.length) throw new RangeError('Give at least one segment with some time in it, e.g. 95:2.');
  const loudest = Math.max(...list.map((s) => s.levelDba));
  const energy = list.reduce((sum, s) => sum + s.hours * 10 ** ((s.levelDba - loudest) / 10), 0);
  const lex8h = loudest + 10 * Math.log10(energy / 8);
  const at = (limit: number) => lex8h >= limit - 1e-9;
  const actionLevel = at(EU_LIMITS_DBA.limit) ? 'limit' : at(EU_LIMITS_DBA.upperAction) ? 'upper' : at(EU_LIMITS_DBA.lowerAction) ? 'lower' : 'none';
  return { lex8h, actionLevel };
}

/**
 * Equivalent continuous level of readings taken at equal intervals: Leq = 10·log10((1/N)·Σ 10^(Li/10)).
 * Source: IEC 61672-1:2013 §3.9 time-average sound level (clause from memory). The loudest reading is
 * factored out so that nothing overflows.
 */
export function leq(levelsDb: number[]): number {
  const list = requireArray(levelsDb, 'The list of readings', 1, LIMITS.maxReadings).map((l, i) => requireInRange(l, LIMITS.levelDb, `Reading ${i + 1}`, 'dB'));
  const loudest = Math.max(...list);
  return loudest + 10 * Math.log10(list.reduce((sum, l) => sum + 10 ** ((l - loudest) / 10), 0) / list.length);
}
