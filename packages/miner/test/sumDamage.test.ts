import { describe, expect, test } from 'vitest';
import { sumDamage } from '@loopwise/miner';

describe('sumDamage(counts, cyclesToFailure, {cutoff?})', () => {
  test('sumDamage sums count / Nf in one pass (the TSDoc examples)', () => {
    expect(sumDamage(Float64Array.of(1, 1, 0.5), Float64Array.of(1e3, 1e6, 1e3))).toBeCloseTo(0.001501, 18);
    expect(sumDamage([1, 1], [1e3, 1e7], { cutoff: { cycles: 1e6 } })).toBe(0.001);
  });

  test('sumDamage on empty, single, -0, Infinity life; NaN and Infinity counts throw naming the row', () => {
    expect(sumDamage([], [])).toBe(0);
    expect(sumDamage([2], [8])).toBe(0.25);
    expect(Object.is(sumDamage([-0], [8]), 0)).toBe(true);
    expect(sumDamage([1], [Infinity])).toBe(0);
    expect(() => sumDamage([1, NaN], [1, 1])).toThrow(expect.objectContaining({ code: 'invalid-count', field: 'counts', index: 1 }));
    expect(() => sumDamage([Infinity], [1])).toThrow(expect.objectContaining({ code: 'invalid-count' }));
    expect(() => sumDamage([1], [-0])).toThrow(expect.objectContaining({ code: 'invalid-life', index: 0 }));
    expect(() => sumDamage([1], [1, 2])).toThrow(expect.objectContaining({ field: 'cyclesToFailure.length' }));
  });

  test('sumDamage keeps a million small terms accurate (compensated sum)', () => {
    const n = 1_000_000;
    const counts = new Float64Array(n).fill(1);
    const lives = new Float64Array(n).fill(3e6);
    // exact value n / 3e6 = 1/3; a plain running sum drifts by about 1e-11 relative here
    expect(Math.abs(sumDamage(counts, lives) - 1 / 3)).toBeLessThan(1e-15);
  });
});
