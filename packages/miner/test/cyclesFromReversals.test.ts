import { describe, expect, test } from 'vitest';
import { cyclesFromReversals, cyclesFromReversalsInto } from '@loopwise/miner';

// One cycle is two reversals (ASTM E1823, terminology; the strain-life curve is in 2Nf).
describe('cyclesFromReversals(reversals) and cyclesFromReversalsInto(reversals, out)', () => {
  test('cyclesFromReversals halves reversals; Infinity stays Infinity', () => {
    expect(cyclesFromReversals(43494.7)).toBe(21747.35);
    expect(cyclesFromReversals(1)).toBe(0.5);
    expect(cyclesFromReversals(Infinity)).toBe(Infinity);
  });

  test('cyclesFromReversalsInto fills out, in place too', () => {
    expect(Array.from(cyclesFromReversalsInto(Float64Array.of(2, 1e6, Infinity), new Float64Array(3)))).toEqual([1, 5e5, Infinity]);
    const a = Float64Array.of(4, 8);
    expect(cyclesFromReversalsInto(a, a)).toBe(a);
    expect(Array.from(a)).toEqual([2, 4]);
    expect(cyclesFromReversalsInto([], new Float64Array(0)).length).toBe(0);
  });

  test('NaN, 0, -0 and negative reversals throw invalid-life naming the index', () => {
    for (const bad of [NaN, 0, -0, -2, -Infinity]) {
      expect(() => cyclesFromReversals(bad)).toThrow(expect.objectContaining({ code: 'invalid-life', field: 'reversals' }));
    }
    expect(() => cyclesFromReversalsInto([2, NaN], new Float64Array(2))).toThrow(expect.objectContaining({ index: 1 }));
    expect(() => cyclesFromReversalsInto([2, 2], new Float64Array(1))).toThrow(expect.objectContaining({ field: 'out.length' }));
  });
});
