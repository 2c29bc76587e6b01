import fc from 'fast-check';
import { RangeMeanMatrix } from '@loopwise/rainflow';
import { describe, expect, test } from 'vitest';
import { checkProperty } from '../../../test/property';
import { extrapolateRangeMeanTail } from '../src/extrapolateRangeMean';
import { seeded } from './support/makeFleet';

const sum = (a: ArrayLike<number>) => {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i];
  return s;
};

/** A matrix holding n cycles with exponential ranges of scale beta (seeded), means uniform in ±50. */
function exponentialMatrix(n: number, beta: number, seed: number, max = 1000, count = 100): RangeMeanMatrix {
  const m = new RangeMeanMatrix({ range: { count, min: 0, max }, mean: { count: 4, min: -50, max: 50 } });
  const rnd = seeded(seed);
  for (let i = 0; i < n; i++) {
    const r = -beta * Math.log(1 - rnd());
    const mean = -50 + 100 * rnd();
    m.addCycle(mean - r / 2, mean + r / 2, 1, i);
  }
  return m;
}

describe('extrapolateRangeMeanTail(matrix, factor)', () => {
  test('extrapolateRangeMeanTail(exponential ranges, 1, { tailShare: 1 }) recovers the scale β of the sample within 2 %', () => {
    // the mean excess is the maximum-likelihood scale of the exponential law (Pickands 1975, the
    // generalised Pareto law with shape 0); binned at a tenth of β it is biased by w/2·… ≈ +0.5 %
    // (computed from the geometric law of the bins); 20 000 cycles give a standard error of 0.7 %
    const m = exponentialMatrix(20000, 40, 3);
    const x = extrapolateRangeMeanTail(m, 1, { tailShare: 1 });
    expect(x.fitted).toBe(true);
    expect(x.threshold).toBe(0);
    expect(Math.abs(x.meanExcess - 40) / 40).toBeLessThan(0.02);
  });

  test('extrapolateRangeMeanTail(m, 1000) keeps the rows below the threshold as exactly 1000 × the measured ones and reaches r* = u + β ln(1000 N_u)', () => {
    const m = exponentialMatrix(5000, 30, 5);
    const x = extrapolateRangeMeanTail(m, 1000);
    const C = m.columns;
    const J = m.rowEdges.indexOf(x.threshold);
    expect(J).toBeGreaterThan(0);
    for (let i = 0; i < J * C; i++) expect(x.matrix.counts[i]).toBe(m.counts[i] * 1000);
    expect(x.largestRange).toBeCloseTo(x.threshold + x.meanExcess * Math.log(1000 * x.tailCycles), 9);
    expect(x.largestRange).toBeGreaterThan(x.measuredLargestRange); // cycles larger than any measured
    // the last row holding cycles is the one that holds r*
    const edges = x.matrix.rowEdges;
    let last = -1;
    for (let j = 0; j < x.matrix.rows; j++) if (sum(x.matrix.counts.subarray(j * C, (j + 1) * C)) > 0) last = j;
    expect(edges[last]).toBeLessThanOrEqual(x.largestRange);
    expect(edges[last + 1]).toBeGreaterThanOrEqual(x.largestRange);
    // the tail's expected number of cycles at or above r* is one; its row holds at least that
    expect(sum(x.matrix.counts.subarray(last * C, (last + 1) * C))).toBeGreaterThanOrEqual(1 - 1e-9);
  });

  test('extrapolateRangeMeanTail conserves the count: factor × the measured cycles, inside and outside', () => {
    checkProperty(
      'tail extrapolation conserves the count',
      fc.property(fc.integer({ min: 30, max: 3000 }), fc.double({ min: 1, max: 200, noNaN: true }), fc.double({ min: 1, max: 1e6, noNaN: true }), fc.integer({ min: 1, max: 1e6 }), (n, beta, factor, seed) => {
        // Arrange
        const m = exponentialMatrix(n, beta, seed, 600, 30);
        // Act
        const x = extrapolateRangeMeanTail(m, factor);
        // Assert: rounding of sums of n terms only
        const want = factor * m.totalCount();
        return Math.abs(x.matrix.totalCount() - want) <= 1e-9 * want;
      }),
      { numRuns: 150 },
    );
  });

  test('extrapolateRangeMeanTail with too few cycles in the tail, no cycles, or a bad factor', () => {
    const few = exponentialMatrix(50, 30, 9);
    const x = extrapolateRangeMeanTail(few, 10);
    expect(x.fitted).toBe(false);
    expect(x.note).toMatch(/fewer than 20/);
    expect(Array.from(x.matrix.counts)).toEqual(Array.from(few.counts, (c) => c * 10));
    const empty = new RangeMeanMatrix({ range: { count: 4, min: 0, max: 4 }, mean: { count: 1, min: -1, max: 1 } });
    expect(extrapolateRangeMeanTail(empty, 5).note).toMatch(/no cycles/);
    expect(() => extrapolateRangeMeanTail(few, 0)).toThrow(RangeError);
    expect(() => extrapolateRangeMeanTail(few, Infinity)).toThrow(/finite and > 0/);
    expect(() => extrapolateRangeMeanTail(few, NaN)).toThrow(RangeError);
    expect(() => extrapolateRangeMeanTail(few, 2, { tailShare: 0 })).toThrow(/tailShare/);
  });

  test('extrapolateRangeMeanTail caps the rows it adds and says so', () => {
    const m = exponentialMatrix(5000, 300, 11, 100, 10);
    const x = extrapolateRangeMeanTail(m, 1e9, { maxExtraRows: 5 });
    expect(x.matrix.rows).toBe(15);
    expect(x.note).toMatch(/beyond the 5 rows allowed/);
    expect(x.matrix.totalCount()).toBeCloseTo(1e9 * m.totalCount(), -3);
  });
});
