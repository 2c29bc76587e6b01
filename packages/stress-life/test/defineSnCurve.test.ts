import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { cyclesToFailure, cyclesToFailureInto, defineSnCurve, stressAtCycles, StressLifeError } from '@loopwise/stress-life';
import { checkProperty } from '../../../test/property';

const REL = 1e-12; // round-off of pow and log between a curve and its inverse

describe('defineSnCurve({ stress, cycles, slope, knees?, cutoffCycles? })', () => {
  test('a Basquin curve passes through its reference point and follows S^m·N = const (cycles)', () => {
    const c = defineSnCurve({ stress: 100, cycles: 2e6, slope: 3 });
    expect(cyclesToFailure(c, 100)).toBe(2e6);
    expect(cyclesToFailure(c, 200)).toBe(2.5e5);
    expect(c.measure).toBe('range');
    expect(Object.isFrozen(c)).toBe(true);
  });

  test('a trilinear curve is continuous at its knees and infinite below its cut-off', () => {
    const c = defineSnCurve({ stress: 100, cycles: 2e6, slope: 3, knees: [{ cycles: 5e6, slope: 5 }], cutoffCycles: 1e8 });
    const sD = c.kneeStresses[0];
    expect(sD).toBeCloseTo(100 * Math.pow(2 / 5, 1 / 3), 12);
    expect(cyclesToFailure(c, sD) / 5e6).toBeCloseTo(1, 12);
    expect(cyclesToFailure(c, sD * (1 - 1e-12)) / 5e6).toBeCloseTo(1, 9);
    expect(c.cutoffStress).toBeCloseTo(sD * Math.pow(5 / 100, 1 / 5), 12);
    expect(cyclesToFailure(c, c.cutoffStress) / 1e8).toBeCloseTo(1, 12);
    expect(cyclesToFailure(c, c.cutoffStress * 0.999)).toBe(Infinity);
    expect(cyclesToFailure(c, 0)).toBe(Infinity);
  });

  test('stressAtCycles is the inverse of cyclesToFailure on the sloped part (property)', () => {
    checkProperty(
      'stressAtCycles inverts cyclesToFailure',
      fc.property(
        fc.double({ min: 1, max: 1000, noNaN: true }),
        fc.double({ min: 1.5, max: 20, noNaN: true }),
        fc.double({ min: 1.5, max: 25, noNaN: true }),
        fc.double({ min: 1e2, max: 1e9, noNaN: true }),
        (s, m1, m2, n) => {
          // Arrange
          const c = defineSnCurve({ stress: s, cycles: 1e6, slope: m1, knees: [{ cycles: 1e7, slope: m2 }] });
          // Act
          const back = cyclesToFailure(c, stressAtCycles(c, n));
          // Assert
          expect(Math.abs(back / n - 1)).toBeLessThan(1e3 * REL * Math.max(m1, m2));
        },
      ),
    );
  });

  test('cyclesToFailureInto writes in place without allocation and equals the scalar', () => {
    const c = defineSnCurve({ stress: 80, cycles: 2e6, slope: 3, knees: [{ cycles: 5e6, slope: 5 }], cutoffCycles: 1e8 });
    const x = Float64Array.of(300, 80, 50, 40, 20, 0);
    const want = Array.from(x, (s) => cyclesToFailure(c, s));
    const out = cyclesToFailureInto(c, x, x);
    expect(out).toBe(x);
    expect(Array.from(out)).toEqual(want);
    expect(cyclesToFailureInto(c, [], new Float64Array(0)).length).toBe(0);
  });

  test('defineSnCurve rejects non-positive slopes, knees out of order and bad points, naming the field', () => {
    const bad: [object, string][] = [
      [{ stress: 100, cycles: 2e6, slope: 0 }, 'slope'],
      [{ stress: 100, cycles: 2e6, slope: -3 }, 'slope'],
      [{ stress: 100, cycles: 2e6, slope: Infinity }, 'slope'],
      [{ stress: -1, cycles: 2e6, slope: 3 }, 'stress'],
      [{ stress: NaN, cycles: 2e6, slope: 3 }, 'stress'],
      [{ stress: 100, cycles: 0, slope: 3 }, 'cycles'],
      [{ stress: 100, cycles: 2e6, slope: 3, knees: [{ cycles: 1e7, slope: 5 }, { cycles: 5e6, slope: 9 }] }, 'knees[1].cycles'],
      [{ stress: 100, cycles: 2e6, slope: 3, knees: [{ cycles: 1e7, slope: 5 }, { cycles: 1e7, slope: 9 }] }, 'knees[1].cycles'],
      [{ stress: 100, cycles: 2e6, slope: 3, knees: [{ cycles: 1e7, slope: -5 }] }, 'knees[0].slope'],
      [{ stress: 100, cycles: 2e6, slope: 3, cutoffCycles: -1 }, 'cutoffCycles'],
      [{ stress: 100, cycles: 2e6, slope: 3, measure: 'reversals' }, 'measure'],
    ];
    for (const [input, field] of bad) {
      try {
        defineSnCurve(input as never);
        expect.unreachable(`accepted ${JSON.stringify(input)}`);
      } catch (e) {
        expect(e).toBeInstanceOf(StressLifeError);
        expect((e as StressLifeError).code).toBe('invalid-curve');
        expect((e as StressLifeError).field).toBe(field);
      }
    }
  });

  test('cyclesToFailure rejects negative and non-finite stresses with the element index', () => {
    const c = defineSnCurve({ stress: 100, cycles: 2e6, slope: 3 });
    for (const v of [-1, NaN, Infinity, -Infinity]) expect(() => cyclesToFailure(c, v)).toThrow(/invalid-stress/);
    try {
      cyclesToFailureInto(c, [1, 2, -3], new Float64Array(3));
    } catch (e) {
      expect([(e as StressLifeError).field, (e as StressLifeError).index]).toEqual(['stresses', 2]);
    }
    expect(() => cyclesToFailureInto(c, [1, 2], new Float64Array(1))).toThrow(/out.length/);
    expect(() => stressAtCycles(c, 0)).toThrow(/invalid-cycles/);
    expect(cyclesToFailure(c, -0)).toBe(Infinity);
  });
});
