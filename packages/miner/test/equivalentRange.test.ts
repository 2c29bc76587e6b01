import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { rainflow } from '@loopwise/rainflow';
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

  test("equivalentRange(cycles.columns()) of rainflow-counted histories is the plain closed form (property)", () => {
    checkProperty(
      'rainflow columns, closed form',
      fc.property(
        // eighths from -1000 to 1000: ranges 0 or >= 1/8, so the plain form below cannot underflow
        fc.array(fc.integer({ min: -8000, max: 8000 }).map((v) => v / 8), { maxLength: 80 }),
        fc.double({ min: 1, max: 12, noNaN: true }),
        fc.double({ min: 1, max: 1e7, noNaN: true }),
        (history, slope, referenceCount) => {
          // Arrange: a rainflow table's own columns (count, range and the rest) are accepted as they are
          const { cycles } = rainflow(history, { residue: 'half' });
          const cols = cycles!.columns();
          // Act
          const ours = equivalentRange(cols, { slope, referenceCount });
          // Assert: (Σ n·ΔS^m / N_ref)^(1/m), written out plainly (1/8 <= ranges <= 2000, m <= 12: no
          // overflow, no underflow)
          let s = 0;
          for (let i = 0; i < cols.count.length; i++) s += cols.count[i] * cols.range[i] ** slope;
          const plain = s === 0 ? 0 : (s / referenceCount) ** (1 / slope);
          expect(closeRelative(ours, plain, 1e-12)).toBe(true);
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
