import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { bandwidthHz, centreFromEdges, edgesFromCentre, octavesFromQ, qFromOctaves, solveBand } from './bandwidth';

const RUN = { seed: 20261202, numRuns: 500 };

// Bandwidth ↔ Q table: RaneNote 170, "Bandwidth in Octaves Versus Q in Bandpass Filters" (D. Bohn) —
// from memory, printed to three decimals, hence the 0.0005 tolerance.
const RANE_TABLE: [octaves: number, q: number][] = [
  [2, 0.667],
  [1, 1.414],
  [2 / 3, 2.145],
  [1 / 2, 2.871],
  [1 / 3, 4.318],
  [1 / 6, 8.651],
];

describe('qFromOctaves / octavesFromQ', () => {
  for (const [octaves, q] of RANE_TABLE) {
    it(`${octaves.toFixed(3)} octave ↔ Q ${q} (RaneNote 170 table, from memory)`, () => {
      expect(Math.abs(qFromOctaves(octaves) - q)).toBeLessThan(0.0005);
      expect(Math.abs(octavesFromQ(q) - octaves)).toBeLessThan(0.001);
    });
  }

  it('one octave is exactly Q = √2 (Audio EQ Cookbook analog relation: 1/Q = 2·sinh(ln2/2))', () => {
    expect(qFromOctaves(1)).toBeCloseTo(Math.SQRT2, 14);
  });

  it('Q → octaves → Q round-trips (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.1, max: 100, noNaN: true }), (q) => {
        expect(qFromOctaves(octavesFromQ(q)) / q).toBeCloseTo(1, 10);
      }),
      RUN,
    );
  });

  it('octaves → Q → octaves round-trips (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 10, noNaN: true }), (octaves) => {
        expect(octavesFromQ(qFromOctaves(octaves)) / octaves).toBeCloseTo(1, 10);
      }),
      RUN,
    );
  });

  it('is finite for very wide bands instead of NaN (2^N overflow)', () => {
    expect(Number.isFinite(qFromOctaves(900))).toBe(true);
    expect(qFromOctaves(900)).toBeGreaterThan(0);
  });
});

describe('edges and centre', () => {
  it('a one-octave band at 1 kHz spans 1000/√2 … 1000·√2 Hz (definition of an octave band)', () => {
    const { lowHz, highHz } = edgesFromCentre(1000, qFromOctaves(1));
    expect(lowHz).toBeCloseTo(707.1068, 3);
    expect(highHz).toBeCloseTo(1414.2136, 3);
  });

  it('the edges are f0·(√(1 + 1/4Q²) ∓ 1/2Q) (roots of |H|² = ½ for the cookbook BPF prototype)', () => {
    const q = 2;
    const { lowHz, highHz } = edgesFromCentre(500, q);
    expect(lowHz).toBeCloseTo(500 * (Math.sqrt(1 + 1 / 16) - 1 / 4), 9);
    expect(highHz).toBeCloseTo(500 * (Math.sqrt(1 + 1 / 16) + 1 / 4), 9);
  });

  it('the centre is the geometric mean of the edges, and the edges are f0/Q apart (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 100_000, noNaN: true }), fc.double({ min: 0.1, max: 100, noNaN: true }), (f0, q) => {
        const { lowHz, highHz } = edgesFromCentre(f0, q);
        expect(centreFromEdges(lowHz, highHz) / f0).toBeCloseTo(1, 10);
        expect((highHz - lowHz) / bandwidthHz(f0, q)).toBeCloseTo(1, 8);
      }),
      RUN,
    );
  });

  it('centreFromEdges is the geometric mean √(f1·f2) (IEC 61260-1: f1·f2 = fm²)', () => {
    expect(centreFromEdges(100, 400)).toBe(200);
  });
});

describe('solveBand', () => {
  it('from Q alone gives octaves and no frequencies', () => {
    const band = solveBand({ q: 4.318 });
    expect(band.octaves).toBeCloseTo(1 / 3, 3); // RaneNote 170 (from memory)
    expect(band.f0).toBeUndefined();
  });

  it('from f0 + octaves gives the edges an octave apart', () => {
    const band = solveBand({ f0: 1000, octaves: 1 });
    expect(band.q).toBeCloseTo(Math.SQRT2, 12);
    expect(band.high! / band.low!).toBeCloseTo(2, 12);
    expect(band.bandwidthHz).toBeCloseTo(1000 / Math.SQRT2, 9);
  });

  it('from f0 + Q agrees with edgesFromCentre', () => {
    const band = solveBand({ f0: 250, q: 2.145 });
    expect(band.octaves).toBeCloseTo(2 / 3, 3); // RaneNote 170 (from memory)
    expect(band.low).toBeCloseTo(edgesFromCentre(250, 2.145).lowHz, 12);
  });

  it('from the edges recovers one octave and Q = √2', () => {
    const band = solveBand({ low: 1000 / Math.SQRT2, high: 1000 * Math.SQRT2 });
    expect(band.f0).toBeCloseTo(1000, 9);
    expect(band.octaves).toBeCloseTo(1, 12);
    expect(band.q).toBeCloseTo(Math.SQRT2, 12);
  });

  it('refuses contradictory or incomplete input with a sentence', () => {
    expect(() => solveBand({ q: 2, octaves: 1 } as never)).toThrow(/not both/);
    expect(() => solveBand({} as never)).toThrow(RangeError);
    expect(() => solveBand({ low: 500, high: 400 })).toThrow(/above the lower edge/);
    expect(() => solveBand({ low: 100, high: 200, q: 3 } as never)).toThrow(/not both/);
    expect(() => solveBand({ f0: 1000 } as never)).toThrow(/width/);
    expect(() => solveBand(null as never)).toThrow(RangeError);
  });
});
