import { describe, expect, it } from 'vitest';
import { ArgumentError, defineMaterial, reversalsToFailure, reversalsToFailureInto, STRAIN_LIFE_FLAG_BITS } from '@loopwise/material';

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
});
