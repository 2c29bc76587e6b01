import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  ArgumentError,
  ConvergenceError,
  defineMaterial,
  REVERSALS_TABLE_MIN_COUNT,
  reversalsToFailure,
  reversalsToFailureInto,
  STRAIN_LIFE_FLAG_BITS,
} from '@loopwise/material';
import { checkProperty } from '../../../test/property';
import { realisticMaterial } from './arbitraries';

// Invented values for tests only.
const m = defineMaterial({ E: 200000, sigmaF: 1000, b: -0.1, epsilonF: 1, c: -0.5, K: 1000, n: 0.2 });

describe('reversalsToFailureInto(material, strainAmplitudes, out, flags?, options?)', () => {
  it('writes the same values as reversalsToFailure into the caller-owned column and returns it', () => {
    const amplitudes = Float64Array.of(0, -0, 1e-4, 0.002, 0.0131548, 0.5, 10);
    const out = new Float64Array(amplitudes.length);
    const flags = new Uint8Array(amplitudes.length);
    expect(reversalsToFailureInto(m, amplitudes, out, flags)).toBe(out);
    amplitudes.forEach((ea, i) => expect(out[i]).toBe(reversalsToFailure(m, ea).reversals));
    expect(Array.from(flags)).toEqual([1, 1, 0, 0, 0, 0, 2]);
    expect(STRAIN_LIFE_FLAG_BITS).toEqual({ 'below-cutoff': 1, 'at-or-above-first-reversal': 2 });
  });
  it('accepts an empty column and plain arrays', () => {
    expect(reversalsToFailureInto(m, [], new Float64Array(0)).length).toBe(0);
    expect(reversalsToFailureInto(m, [0.01], new Float64Array(1))[0]).toBe(reversalsToFailure(m, 0.01).reversals);
  });
  it('names the index of a NaN, infinite or negative amplitude', () => {
    expect(() => reversalsToFailureInto(m, [0.01, NaN], new Float64Array(2))).toThrow(/strainAmplitudes\[1\]/);
    expect(() => reversalsToFailureInto(m, [Infinity], new Float64Array(1))).toThrow(ArgumentError);
    expect(() => reversalsToFailureInto(m, [0.01, 0.02, -1], new Float64Array(3))).toThrow(/\[2\]/);
  });
  it('rejects an output (or flags) column shorter than the input', () => {
    expect(() => reversalsToFailureInto(m, [0.01, 0.02], new Float64Array(1))).toThrow(/out/);
    expect(() => reversalsToFailureInto(m, [0.01, 0.02], new Float64Array(2), new Uint8Array(1))).toThrow(/flags/);
  });

  it(`from ${REVERSALS_TABLE_MIN_COUNT} amplitudes on (table start) equals reversalsToFailure to 1e-12 relative, flags exactly`, () => {
    checkProperty(
      'reversalsToFailureInto with table = reversalsToFailure',
      fc.property(
        realisticMaterial,
        fc.array(fc.double({ min: -7, max: 1, noNaN: true }), { minLength: REVERSALS_TABLE_MIN_COUNT, maxLength: REVERSALS_TABLE_MIN_COUNT + 200 }),
        fc.nat(),
        (mat, logs, tie) => {
          // Arrange: amplitudes from far below the cut-off to above the first reversal, zeros,
          // and ties (the first amplitude repeated)
          const amplitudes = Float64Array.from(logs, (lg) => (lg < -6.9 ? 0 : 10 ** lg));
          for (let i = tie % 7; i < amplitudes.length; i += 7) amplitudes[i] = amplitudes[0];
          const out = new Float64Array(amplitudes.length);
          const flags = new Uint8Array(amplitudes.length);
          // Act
          reversalsToFailureInto(mat, amplitudes, out, flags);
          // Assert
          amplitudes.forEach((ea, i) => {
            const expected = reversalsToFailure(mat, ea);
            expect(Number.isNaN(out[i])).toBe(false);
            if (expected.reversals === 1 || expected.reversals === Infinity) expect(out[i]).toBe(expected.reversals);
            else expect(Math.abs(out[i] / expected.reversals - 1)).toBeLessThan(1e-12);
            expect(flags[i]).toBe(expected.flags.reduce((bits, f) => bits | STRAIN_LIFE_FLAG_BITS[f], 0));
          });
        },
      ),
      { numRuns: 40 },
    );
  });
  it('from the table size on, names the index of a bad amplitude before writing any output, and honours the cap', () => {
    const amplitudes = new Float64Array(REVERSALS_TABLE_MIN_COUNT).fill(0.004);
    const out = new Float64Array(amplitudes.length).fill(-1);
    amplitudes[300 % amplitudes.length] = NaN;
    expect(() => reversalsToFailureInto(m, amplitudes, out)).toThrow(/strainAmplitudes\[44\]/);
    expect(out.every((v) => v === -1)).toBe(true);
    amplitudes[44] = 0.004;
    expect(() => reversalsToFailureInto(m, amplitudes, out, undefined, { maxIterations: 0 })).toThrow(ConvergenceError);
  });
});
