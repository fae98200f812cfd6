import { describe, expect, it } from 'vitest';
import { validateDoc } from '~/lib/doc/validate-doc';
import { structuralDiff } from '~/lib/doc/structural-diff';
import { delaysBlock, mainsEqBlock, subEqBlock, subMainCrossoverBlock } from './haverkin-hall-blocks';

const states = [
  { cardioid: false, delaysRehung: false },
  { cardioid: true, delaysRehung: false },
  { cardioid: true, delaysRehung: true },
];
const page = (s: (typeof states)[number]) => ({ type: 'doc', content: [subMainCrossoverBlock(s), mainsEqBlock(s), subEqBlock(s), delaysBlock(s)] });

describe('demo processing blocks', () => {
  it('pass the server check in every rig state', () => {
    for (const s of states) expect(validateDoc(page(s))).toMatchObject({ ok: true });
  });
  it('tell the retune in the history: the sub delay, the mains low-mid band, the balcony delay', () => {
    const retune = structuralDiff(page(states[0]!), page(states[1]!)).flatMap((c) => c.lines);
    expect(retune).toContain('Sub delay 8.2 → 7.6 ms');
    expect(retune).toContain('Band 2: 180 → 160 Hz, −3.0 → −1.0 dB');
    const rehang = structuralDiff(page(states[1]!), page(states[2]!)).flatMap((c) => c.lines);
    expect(rehang.some((l) => l.startsWith('Balcony (out 11–12): distance 16.9 m → 17.2 m'))).toBe(true);
  });
});
