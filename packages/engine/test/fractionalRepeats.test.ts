import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { assessDutyCycle, EngineError } from '@loopwise/engine';
import { defineSnCurve } from '@loopwise/stress-life';
import { checkProperty } from '../../../test/property';
import { sae1045 } from './support';

// Fractional repeats of duty-cycle events (issue 11, item 7). Our own rule (docs/engine.md):
// repeats = n + f adds f times the loops one more repeat adds, so the damage lies on the line
// between n and n + 1 repeats, for any n >= 1 on both routes. Histories generated.

const rel = (a: number, b: number) => (a === b ? 0 : Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(b)));

const historyArb = fc.array(fc.integer({ min: -300, max: 300 }), { minLength: 3, maxLength: 14 });
const strainJob = { material: sae1045, notch: { Kt: 2 } };
// a Basquin curve with a knee, in ranges (an invented curve for the property, not a standard's)
const stressJob = { stressLife: { curve: defineSnCurve({ measure: 'range', stress: 100, cycles: 2e6, slope: 3, knees: [{ cycles: 1e7, slope: 5 }] }) } };

describe('fractional repeats of an event', () => {
  for (const [route, job] of [
    ['strain-life', strainJob],
    ['stress-life', stressJob],
  ] as const) {
    test(`${route}: damage at n + f lies on the line from n to n + 1`, () => {
      checkProperty(
        `${route} fraction interpolates`,
        fc.property(historyArb, historyArb, fc.integer({ min: 1, max: 9 }), fc.double({ min: 0.05, max: 0.95, noNaN: true }), (a, b, n, f) => {
          const events = (r: number) => [
            { name: 'road', history: [...a, 450], repeats: r },
            { name: 'yard', history: [...b, -450], repeats: 2 },
          ];
          const at = (r: number) => assessDutyCycle(events(r), job).damage.perRepeat;
          const lo = at(n);
          const hi = at(n + 1);
          const mid = at(n + f);
          return rel(mid, lo + f * (hi - lo)) < 1e-9;
        }),
        { numRuns: 60 },
      );
    });

    test(`${route}: a whole number given as a fraction changes nothing`, () => {
      const h = [0, 380, -120, 260, -400, 150, -50, 300, 0];
      expect(assessDutyCycle([{ name: 'e', history: h, repeats: 3 }], job).damage.perRepeat).toBe(assessDutyCycle([{ name: 'e', history: h, repeats: 3.0 }], job).damage.perRepeat);
    });
  }

  test('repeats must be a finite number >= 1; the error names the event', () => {
    for (const bad of [0, 0.5, -1, Infinity, NaN]) {
      expect(() => assessDutyCycle([{ name: 'e', history: [0, 100, 0], repeats: bad }], strainJob)).toThrow(EngineError);
    }
    expect(() => assessDutyCycle([{ name: 'e', history: [0, 100, 0], repeats: 0 }], strainJob)).toThrow(/events\[0\]\.repeats.*event 'e'/);
  });
});
