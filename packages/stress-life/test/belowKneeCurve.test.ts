import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { belowKneeCurve, defineSnCurve, stressLifeDamage, StressLifeError, type BelowKneeRule } from '@loopwise/stress-life';
import { checkProperty } from '../../../test/property';

const ca = defineSnCurve({ stress: 90, cycles: 2e6, slope: 3, cutoffCycles: 1e7 });
const TOL = 1e-12; // relative: the sums are Neumaier-compensated, the lives differ only by pow rounding

const spectrum = fc.array(
  fc.record({ range: fc.double({ min: 0, max: 400, noNaN: true }), count: fc.oneof(fc.constantFrom(0.5, 1), fc.double({ min: 0, max: 1e5, noNaN: true })) }),
  { minLength: 1, maxLength: 40 },
);

function damage(rule: BelowKneeRule, rows: { range: number; count: number }[], scale = 1): number {
  const curve = belowKneeCurve(ca, rule);
  return stressLifeDamage(curve, { range: rows.map((r) => r.range * scale), mean: rows.map(() => 0), count: rows.map((r) => r.count) }).damage;
}

describe('belowKneeCurve(curve, rule, {kneeCycles?, cutoffCycles?})', () => {
  test('the four rules build the curves of their definitions', () => {
    expect(belowKneeCurve(ca, 'original').cutoffCycles).toBe(1e7);
    expect(belowKneeCurve(ca, 'elementary').slopes).toEqual([3]);
    expect(belowKneeCurve(ca, 'elementary').cutoffCycles).toBe(Infinity);
    expect(belowKneeCurve(ca, 'haibach').slopes).toEqual([3, 5]);
    expect(belowKneeCurve(ca, 'haibach').kneeCycles).toEqual([1e7]);
    expect(belowKneeCurve(ca, { slope: 22 }, { cutoffCycles: 1e9 }).slopes).toEqual([3, 22]);
    expect(belowKneeCurve(ca, { slope: 22 }, { cutoffCycles: 1e9 }).cutoffCycles).toBe(1e9);
  });

  test('damage is non-negative and Haibach lies between original and elementary Miner (property)', () => {
    checkProperty(
      'original <= haibach <= elementary',
      fc.property(spectrum, (rows) => {
        // Act
        const o = damage('original', rows);
        const h = damage('haibach', rows);
        const e = damage('elementary', rows);
        // Assert
        expect(o).toBeGreaterThanOrEqual(0);
        expect(o).toBeLessThanOrEqual(h * (1 + TOL));
        expect(h).toBeLessThanOrEqual(e * (1 + TOL));
      }),
    );
  });

  test('damage is monotone in amplitude under every rule (property)', () => {
    checkProperty(
      'damage monotone in the range scale',
      fc.property(spectrum, fc.double({ min: 1, max: 3, noNaN: true }), fc.constantFrom<BelowKneeRule>('original', 'elementary', 'haibach', { slope: 9 }), (rows, s, rule) => {
        expect(damage(rule, rows)).toBeLessThanOrEqual(damage(rule, rows, s) * (1 + TOL));
      }),
    );
  });

  test('a rule needs a knee: without knee, cut-off or kneeCycles it throws; an unknown rule throws', () => {
    const plain = defineSnCurve({ stress: 90, cycles: 2e6, slope: 3 });
    expect(() => belowKneeCurve(plain, 'haibach')).toThrow(StressLifeError);
    expect(belowKneeCurve(plain, 'haibach', { kneeCycles: 1e7 }).slopes).toEqual([3, 5]);
    expect(() => belowKneeCurve(ca, 'modified' as never)).toThrow(/rule/);
    expect(() => belowKneeCurve(ca, { slope: 0 })).toThrow(/knees\[0\]\.slope/);
  });
});
