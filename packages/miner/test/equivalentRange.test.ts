import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { damageEquivalentRange, rainflow } from '@loopwise/rainflow';
import { MinerError, MinerSum, equivalentRange, sumDamage } from '@loopwise/miner';
import { checkProperty } from '../../../test/property';
import { closeRelative } from './support/arbitraries';

describe('equivalentRange(loops, {slope, referenceCount})', () => {
  test('equivalentRange of two loops is the closed form (the TSDoc example)', () => {
    expect(equivalentRange({ count: [1, 1], range: [100, 200] }, { slope: 3, referenceCount: 2 })).toBeCloseTo(Math.cbrt(9e6 / 2), 10);
    expect(equivalentRange({ count: [], range: [] }, { slope: 3, referenceCount: 1 })).toBe(0);
    expect(equivalentRange({ count: [0, 1], range: [5, 0] }, { slope: 3, referenceCount: 1 })).toBe(0);
    expect(equivalentRange({ count: [1], range: [1e200] }, { slope: 9, referenceCount: 1 })).toBe(1e200);
  });

  test("equivalentRange equals rainflow's damageEquivalentRange on counted histories (property)", () => {
    checkProperty(
      'cross-check with rainflow',
      fc.property(
        fc.array(fc.double({ min: -1000, max: 1000, noNaN: true }), { maxLength: 80 }),
        fc.double({ min: 1, max: 12, noNaN: true }),
        fc.double({ min: 1, max: 1e7, noNaN: true }),
        (history, slope, referenceCount) => {
          const { cycles } = rainflow(history, { residue: 'half' });
          const cols = cycles!.columns();
          const ours = equivalentRange({ count: cols.count, range: cols.range }, { slope, referenceCount });
          const theirs = damageEquivalentRange(cycles!, { slope, referenceCount });
          expect(closeRelative(ours, theirs, 1e-12)).toBe(true);
        },
      ),
    );
  });

  test('N_ref cycles of the equivalent range do the damage of the loops on the line N = C / ΔS^m (property)', () => {
    checkProperty(
      'damage equivalence',
      fc.property(
        fc.array(fc.record({ count: fc.constantFrom(0.5, 1, 3), range: fc.double({ min: 1, max: 500, noNaN: true }) }), { minLength: 1, maxLength: 40 }),
        fc.constantFrom(3, 5, 8),
        (loops, m) => {
          const C = 1e20; // invented S-N constant, cancels
          const sum = new MinerSum();
          loops.forEach((l, i) => sum.addCycles(l.count, C / l.range ** m, i, i + 1, l.range));
          const nRef = 1e6;
          const eq = equivalentRange(sum, { slope: m, referenceCount: nRef });
          expect(closeRelative(sumDamage([nRef], [C / eq ** m]), sum.damage(), 1e-10)).toBe(true);
        },
      ),
    );
  });

  test('equivalentRange needs ranges and valid options', () => {
    const sum = new MinerSum();
    sum.addCycles(1, 10, 0, 1);
    expect(() => equivalentRange(sum, { slope: 3, referenceCount: 1 })).toThrow(expect.objectContaining({ code: 'missing-range', index: 0 }));
    const loops = { count: [1], range: [1] };
    expect(() => equivalentRange(loops, { slope: 0, referenceCount: 1 })).toThrow(expect.objectContaining({ field: 'slope' }));
    expect(() => equivalentRange(loops, { slope: 3, referenceCount: Infinity })).toThrow(expect.objectContaining({ field: 'referenceCount' }));
    expect(() => equivalentRange({ count: [NaN], range: [1] }, { slope: 3, referenceCount: 1 })).toThrow(MinerError);
    expect(() => equivalentRange({ count: [1], range: [1, 2] }, { slope: 3, referenceCount: 1 })).toThrow(expect.objectContaining({ field: 'range.length' }));
  });
});
