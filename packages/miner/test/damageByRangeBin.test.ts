import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { MinerSum, damageByRangeBin } from '@loopwise/miner';
import { checkProperty } from '../../../test/property';
import { closeRelative, loopRecords, toColumns } from './support/arbitraries';

describe('damageByRangeBin(loops, edges)', () => {
  test('damageByRangeBin sums damage by range bin, the outside separately (the TSDoc example)', () => {
    const r = damageByRangeBin({ damage: [0.1, 0.3, 0.1], range: [50, 150, 500] }, [0, 100, 200]);
    expect(Array.from(r.damage)).toEqual([0.1, 0.3]);
    expect(r.share[0]).toBeCloseTo(0.2, 15);
    expect(r.share[1]).toBeCloseTo(0.6, 15);
    expect(r.outsideDamage).toBe(0.1);
    expect(r.outsideShare).toBeCloseTo(0.2, 15);
    expect(r.total).toBeCloseTo(0.5, 15);
  });

  test('damageByRangeBin: inside plus outside is the total, shares sum to the inside share (property)', () => {
    checkProperty(
      'range bins conserve damage',
      fc.property(loopRecords(), fc.integer({ min: 1, max: 12 }), (loops, bins) => {
        const sum = new MinerSum().addColumns(toColumns(loops));
        const edges = Array.from({ length: bins + 1 }, (_, j) => 100 + (j * 800) / bins); // [100, 900]: some outside
        const r = damageByRangeBin(sum, edges);
        const inside = r.damage.reduce((a, b) => a + b, 0);
        expect(closeRelative(inside + r.outsideDamage, sum.damage(), 1e-12)).toBe(true);
        if (sum.damage() > 0) {
          expect(closeRelative(r.share.reduce((a, b) => a + b, 0) + r.outsideShare, 1, 1e-12)).toBe(true);
        } else expect(Array.from(r.share).every((s) => s === 0)).toBe(true);
      }),
    );
  });

  test('damageByRangeBin puts a range on an inner edge in the upper bin and the top edge in the last bin', () => {
    const r = damageByRangeBin({ damage: [1, 2, 4], range: [0, 1, 2] }, [0, 1, 2]);
    expect(Array.from(r.damage)).toEqual([1, 6]);
  });

  test('damageByRangeBin needs ranges: a sum record without one is a missing-range error', () => {
    const sum = new MinerSum();
    sum.addCycles(1, 10, 0, 1, 5);
    sum.addCycles(1, 10, 1, 2);
    expect(() => damageByRangeBin(sum, [0, 10])).toThrow(expect.objectContaining({ code: 'missing-range', index: 1 }));
    expect(() => damageByRangeBin({ damage: [1], range: [-1] }, [0, 10])).toThrow(expect.objectContaining({ code: 'invalid-range', index: 0 }));
    expect(() => damageByRangeBin({ damage: [1], range: [1] }, [0, 0])).toThrow(expect.objectContaining({ code: 'invalid-bins', field: 'edges' }));
    expect(() => damageByRangeBin({ damage: [1], range: [1] }, [0, NaN])).toThrow(expect.objectContaining({ code: 'invalid-bins' }));
  });
});
