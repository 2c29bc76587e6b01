// Ticks at 1, 2 or 5 × 10^k (common practice, no source).
import { describe, expect, it } from 'vitest';
import { niceTicks } from '../../src/report/niceTicks.js';

describe('niceTicks(min, max, target)', () => {
  it('covers the interval with round steps', () => {
    expect(niceTicks(0, 12000, 6).values).toEqual([0, 2000, 4000, 6000, 8000, 10000, 12000]);
    expect(niceTicks(0, 12000, 10).values).toHaveLength(13);
    expect(niceTicks(-1100, 3100, 6).labels).toEqual(['−1000', '0', '1000', '2000', '3000']);
  });

  it('moves a power of ten of small steps into the axis label', () => {
    const t = niceTicks(0, 1.9e-6, 5);
    expect(t.factor).toBe(' (× 10⁻⁷)');
    expect(t.labels).toEqual(['0', '5', '10', '15']);
  });

  it('gives one tick for a constant and none for non-finite bounds', () => {
    expect(niceTicks(3, 3).values).toEqual([3]);
    expect(niceTicks(0, Infinity).values).toEqual([]);
    expect(niceTicks(NaN, 1).values).toEqual([]);
  });
});
