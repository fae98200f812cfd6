/**
 * A block's computed curve as the plain-text columns measurement tools read (the same format as
 * trace uploads), so an engineer can take the intended response back into their own tools.
 */
import type { PmNode } from '~/lib/doc/types';
import { traceToText } from '~/lib/traces/trace-text';
import { CROSSOVER_BLOCK, EQ_BLOCK, type CrossoverBlockAttrs, type EqBlockAttrs } from './block-data';
import { crossoverCurves, eqCurves } from './block-curves';

/** Null for blocks without a frequency response (delays). */
export function blockCurveText(node: PmNode, title: string): string | null {
  let freqs: number[];
  let magnitude: number[];
  let phase: (number | null)[];
  if (node.type === EQ_BLOCK) {
    const c = eqCurves(node.attrs as EqBlockAttrs);
    [freqs, magnitude, phase] = [c.freqs, c.total, c.phase];
  } else if (node.type === CROSSOVER_BLOCK) {
    const c = crossoverCurves(node.attrs as CrossoverBlockAttrs);
    [freqs, magnitude, phase] = [c.freqs, c.sum, c.sumPhase];
  } else {
    return null;
  }
  // Phase is undefined where the magnitude sits at its floor; a column with holes would not
  // read back, so the phase column is left out rather than filled with invented values.
  const phaseComplete = phase.every((p): p is number => p !== null && Number.isFinite(p));
  return traceToText(
    { freqHz: freqs, magnitudeDb: magnitude, ...(phaseComplete ? { phaseDeg: phase as number[] } : {}) },
    phaseComplete ? title : `${title} (phase left out: the magnitude reaches its floor)`,
  );
}
