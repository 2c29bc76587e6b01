import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { HOT_SPOT_RULES, hotSpotStress, hotSpotStressInto, StressLifeError, type HotSpotRule } from '@loopwise/stress-life';
import { checkProperty } from '../../../test/property';

// Lagrange extrapolation of the gauges to the weld toe (x = 0): the published coefficients
// of the quadratic and type-b rules are exactly these weights; the linear type-a ones round
// 5/3 and 2/3 to 1.67 and 0.67 (IIW recommendations, 2.2.3; value from memory).
function lagrangeAtZero(points: readonly number[]): number[] {
  return points.map((xi, i) => points.reduce((w, xj, j) => (j === i ? w : (w * (0 - xj)) / (xi - xj)), 1));
}

describe('hotSpotStressInto(rule, gauges, out)', () => {
  test('the coefficients are the extrapolation to the toe from the stated points', () => {
    for (const rule of ['typeAQuadratic', 'typeBQuadratic', 'typeBLinear'] as HotSpotRule[]) {
      const w = lagrangeAtZero(HOT_SPOT_RULES[rule].points);
      HOT_SPOT_RULES[rule].coefficients.forEach((c, i) => expect(c).toBeCloseTo(w[i], 12));
    }
    const w = lagrangeAtZero(HOT_SPOT_RULES.typeALinear.points);
    expect(w[0]).toBeCloseTo(5 / 3, 14);
    expect(HOT_SPOT_RULES.typeALinear.coefficients).toEqual([1.67, -0.67]);
    for (const rule of Object.keys(HOT_SPOT_RULES) as HotSpotRule[]) expect(HOT_SPOT_RULES[rule].coefficients.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 14);
  });

  test('a stress field linear (quadratic) in the distance is extrapolated exactly, sample by sample (property)', () => {
    checkProperty(
      'hot spot exact on polynomial fields',
      fc.property(
        fc.array(fc.tuple(fc.double({ min: -500, max: 500, noNaN: true }), fc.double({ min: -50, max: 50, noNaN: true }), fc.double({ min: -5, max: 5, noNaN: true })), { minLength: 1, maxLength: 30 }),
        fc.constantFrom<HotSpotRule>('typeAQuadratic', 'typeBQuadratic', 'typeBLinear'),
        (samples, rule) => {
          // Arrange: σ(x) = a + b·x (+ c·x² for the quadratic rules) at each sample
          const def = HOT_SPOT_RULES[rule];
          const quadratic = def.points.length === 3;
          const gauges = def.points.map((x) => Float64Array.from(samples, ([a, b, c]) => a + b * x + (quadratic ? c * x * x : 0)));
          const out = new Float64Array(samples.length);
          // Act
          const got = hotSpotStressInto(rule, gauges, out);
          // Assert: the value at the toe is a
          expect(got).toBe(out);
          samples.forEach(([a, b, c], i) => expect(Math.abs(got[i] - a)).toBeLessThan(1e-9 * (1 + Math.abs(a) + 20 * Math.abs(b) + 200 * Math.abs(c))));
        },
      ),
    );
  });

  test('empty, one sample, constant, and the published type-a formulas', () => {
    expect(hotSpotStress('typeALinear', [[], []]).length).toBe(0);
    // a constant field stays constant (the coefficients sum to 1, up to rounding)
    expect(hotSpotStress('typeAQuadratic', [[10], [10], [10]])[0]).toBeCloseTo(10, 13);
    const h = hotSpotStress('typeAQuadratic', [[100, 50], [80, 40], [70, 35]]);
    expect(h[0]).toBeCloseTo(2.52 * 100 - 2.24 * 80 + 0.72 * 70, 12);
    expect(hotSpotStress('typeALinear', [[-0], [-0]])[0]).toBe(0);
  });

  test('bad input: unknown rule, wrong gauge count, different lengths, NaN/Infinity naming gauge and sample', () => {
    expect(() => hotSpotStress('typeC' as never, [[1], [1]])).toThrow(expect.objectContaining({ field: 'rule' }));
    expect(() => hotSpotStress('typeALinear', [[1]])).toThrow(expect.objectContaining({ field: 'gauges' }));
    expect(() => hotSpotStress('typeALinear', [[1, 2], [1]])).toThrow(expect.objectContaining({ field: 'gauges[1].length' }));
    for (const bad of [NaN, Infinity, -Infinity]) {
      try {
        hotSpotStress('typeBLinear', [[1, 2, 3], [1, bad, 3]]);
        expect.unreachable();
      } catch (e) {
        expect(e).toBeInstanceOf(StressLifeError);
        expect([(e as StressLifeError).code, (e as StressLifeError).field, (e as StressLifeError).index]).toEqual(['non-finite-sample', 'gauges[1]', 1]);
      }
    }
    expect(() => hotSpotStressInto('typeBLinear', [[1, 2], [1, 2]], new Float64Array(1))).toThrow(/out.length/);
  });
});
