import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { RangeMeanMatrix } from '@loopwise/rainflow';
import { MinerSum, damageFromMatrix } from '@loopwise/miner';
import { checkProperty } from '../../../test/property';
import { closeRelative } from './support/arbitraries';

// An invented Basquin-type life with a Goodman-like mean term, for tests only (not a material).
const life = (range: number, mean: number) => (range === 0 ? Infinity : 1e13 / (range * (1 + Math.max(mean, -50) / 500)) ** 3);

describe('damageFromMatrix(matrix, life, {cutoff?})', () => {
  test('damageFromMatrix takes the bin centres as the loops (the TSDoc example)', () => {
    const matrix = { rowEdges: [0, 100, 200], columnEdges: [-50, 50], counts: [1000, 10] };
    const r = damageFromMatrix(matrix, (range) => 1e12 / range ** 3);
    expect(r.damage).toBeCloseTo(1000 / (1e12 / 50 ** 3) + 10 / (1e12 / 150 ** 3), 18);
    expect(r.damage).toBeCloseTo(0.00015875, 18);
    expect(Array.from(r.rangeCentres)).toEqual([50, 150]);
    expect(Array.from(r.meanCentres)).toEqual([0]);
    expect(r.outsideCount).toBe(0);
  });

  test('the matrix route equals the loop route when every loop sits at a bin centre (property)', () => {
    checkProperty(
      'matrix equals loops at centres',
      fc.property(
        fc.array(fc.record({ row: fc.nat(9), column: fc.nat(7), half: fc.boolean() }), { maxLength: 60 }),
        (cells) => {
          // Arrange: a RangeMeanMatrix of @loopwise/rainflow with bins of width 40 and 25
          const matrix = new RangeMeanMatrix({ range: { count: 10, min: 0, max: 400 }, mean: { count: 8, min: -100, max: 100 } });
          const sum = new MinerSum();
          cells.forEach(({ row, column, half }, i) => {
            const range = 20 + 40 * row;
            const mean = -87.5 + 25 * column;
            const count = half ? 0.5 : 1;
            matrix.addCycle(mean - range / 2, mean + range / 2, count, i, i + 1, i + 1);
            sum.addCycles(count, life(range, mean), i, i + 1, range);
          });
          // Act
          const fromMatrix = damageFromMatrix(matrix, life);
          // Assert
          expect(closeRelative(fromMatrix.damage, sum.damage(), 1e-12)).toBe(true);
        },
      ),
    );
  });

  test('the column-kernel form equals the function form, and per-bin damage sums to the total', () => {
    const matrix = new RangeMeanMatrix({ range: { count: 5, min: 0, max: 500 }, mean: { count: 3, min: -90, max: 90 } });
    for (let k = 0; k < 40; k++) matrix.addCycle(-k * 3, k * 9, k % 2 ? 1 : 0.5, k, k + 1, k + 1);
    const kernel = {
      cyclesToFailureInto(ranges: Float64Array, means: Float64Array, out: Float64Array) {
        for (let i = 0; i < ranges.length; i++) out[i] = life(ranges[i], means[i]);
        return out;
      },
    };
    const a = damageFromMatrix(matrix, life);
    const b = damageFromMatrix(matrix, kernel);
    expect(b.damage).toBe(a.damage);
    expect(Array.from(b.binDamage)).toEqual(Array.from(a.binDamage));
    expect(closeRelative(a.binDamage.reduce((s, d) => s + d, 0), a.damage, 1e-12)).toBe(true);
  });

  test('damageFromMatrix applies the cut-off and reports the outside tally of a RangeMeanMatrix', () => {
    const matrix = new RangeMeanMatrix({ range: { count: 2, min: 0, max: 200 }, mean: { count: 1, min: -10, max: 10 } });
    matrix.addCycle(-25, 25, 1, 0, 1, 1); // range 50, centre 50
    matrix.addCycle(-75, 75, 1, 1, 2, 2); // range 150, centre 150
    matrix.addCycle(-500, 500, 1, 2, 3, 3); // range 1000: outside
    const nf = (range: number) => 1e12 / range ** 3; // 8e6 at 50, 2.96e5 at 150
    const cut = damageFromMatrix(matrix, nf, { cutoff: { cycles: 1e6 } });
    expect(cut.damage).toBeCloseTo(150 ** 3 / 1e12, 18);
    expect(cut.binDamage[0]).toBe(0);
    expect(cut.outsideCount).toBe(1);
  });

  test('damageFromMatrix rejects counts that do not fit, negative range edges, bad lives and bad life mappings', () => {
    const ok = { rowEdges: [0, 1], columnEdges: [0, 1], counts: [1] };
    expect(() => damageFromMatrix({ ...ok, counts: [1, 2] }, () => 1)).toThrow(expect.objectContaining({ code: 'invalid-bins', field: 'counts.length' }));
    expect(() => damageFromMatrix({ ...ok, rowEdges: [-1, 1] }, () => 1)).toThrow(expect.objectContaining({ code: 'invalid-bins', field: 'rowEdges' }));
    expect(() => damageFromMatrix({ ...ok, counts: [NaN] }, () => 1)).toThrow(expect.objectContaining({ code: 'invalid-count', field: 'counts', index: 0 }));
    expect(() => damageFromMatrix(ok, () => NaN)).toThrow(expect.objectContaining({ code: 'invalid-life', field: 'cyclesToFailure', index: 0 }));
    expect(() => damageFromMatrix(ok, () => 0)).toThrow(expect.objectContaining({ code: 'invalid-life' }));
    expect(() => damageFromMatrix(ok, {} as never)).toThrow(expect.objectContaining({ code: 'invalid-argument', field: 'life' }));
    expect(damageFromMatrix(ok, () => Infinity).damage).toBe(0);
  });
});
