import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { assessDutyCycle, assessLife, EngineError, findLoadMargin } from '@loopwise/engine';
import { defineSnCurve } from '@loopwise/stress-life';
import { checkProperty } from '../../../test/property';
import { sae1045 } from './support';

// generated histories with plateaus and repeated samples (runs of equal values), so the
// reduction to turning points has something to drop
const sampleArb = fc.array(fc.tuple(fc.integer({ min: -300, max: 300 }), fc.integer({ min: 1, max: 3 })), { minLength: 2, maxLength: 12 }).map((runs) => runs.flatMap(([v, k]) => Array<number>(k).fill(v)));
// a Basquin curve with a knee, in ranges (an invented curve for the property, not a standard's)
const stressJob = { stressLife: { curve: defineSnCurve({ measure: 'range', stress: 100, cycles: 2e6, slope: 3, knees: [{ cycles: 1e7, slope: 5 }] }) } };

describe('findLoadMargin(events, job, options)', () => {
  test('the factor found gives the target life within the stated tolerance', () => {
    const history = [0, 200, -150, 180, -40, 160, 0];
    const job = { material: sae1045, notch: { Kt: 2 }, meanStress: 'none' as const };
    const base = assessLife(history, job).life.repeats;
    const target = base / 50; // a shorter life: the factor must be above 1
    const m = findLoadMargin([{ name: 'h', history, repeats: 1 }], job, { targetRepeats: target, tolerance: 1e-8 });
    expect(m.factor).toBeGreaterThan(1);
    expect(m.repeats).toBeLessThanOrEqual(target);
    const [lo, hi] = m.bracket;
    expect((hi - lo) / hi).toBeLessThanOrEqual(1e-8);
    const below = assessLife(history.map((x) => x * lo), job).life.repeats;
    expect(below).toBeGreaterThan(target);
    expect(m.nonMonotone).toBe(false);
  });

  test('a target that no scanned factor reaches gives Infinity; one reached at the smallest factor says so', () => {
    const job = { material: sae1045, notch: { Kt: 2 } };
    const events = [{ name: 'h', history: [0, 100, -100, 0], repeats: 1 }];
    expect(findLoadMargin(events, job, { targetRepeats: 1e-3, maxFactor: 2 }).factor).toBe(Infinity);
    const m = findLoadMargin(events, job, { targetRepeats: 1e30, minFactor: 0.5 });
    expect(m.belowScan).toBe(true);
  });

  for (const [route, job] of [
    ['strain-life', { material: sae1045, notch: { Kt: 2 }, gate: 20 }],
    ['stress-life', { ...stressJob, gate: 20 }],
  ] as const) {
    test(`${route}: every life of the scan equals the assessment of the scaled samples (the search runs on turning points)`, () => {
      checkProperty(
        `${route} margin scan equals scaled assessments`,
        fc.property(sampleArb, sampleArb, fc.integer({ min: 1, max: 4 }), (a, b, r) => {
          const events = [
            { name: 'road', history: [...a, 350, 350, 349], repeats: r },
            { name: 'yard', history: [...b, -350], repeats: 2 },
          ];
          const m = findLoadMargin(events, job, { targetRepeats: 1e4, scanPoints: 6 });
          return m.scan.every(({ factor, repeats }) => {
            const scaled = events.map((e) => ({ ...e, history: e.history.map((x) => x * factor) }));
            const direct = assessDutyCycle(scaled, { ...job, gate: job.gate * factor }).life.repeats;
            return direct === repeats || Math.abs(direct - repeats) <= 1e-12 * Math.abs(direct);
          });
        }),
        { numRuns: 40 },
      );
    });
  }

  test('onProgress counts every assessment and never passes the most it announced', () => {
    const calls: [number, number][] = [];
    const history = [0, 200, -150, 180, -40, 160, 0];
    const m = findLoadMargin([{ name: 'h', history, repeats: 1 }], { material: sae1045, notch: { Kt: 2 } }, { targetRepeats: 1e5, onProgress: (done, most) => calls.push([done, most]) });
    expect(calls.map((c) => c[0])).toEqual(calls.map((_, k) => k + 1));
    expect(calls.length).toBeGreaterThan(m.scan.length); // the scan and the bisection
    for (const [done, most] of calls) expect(done).toBeLessThanOrEqual(most);
    expect(calls[calls.length - 1][1]).toBe(calls[0][1]); // the bound held: the announced most never grew
  });

  test('bad margin options name the field', () => {
    const events = [{ name: 'h', history: [0, 100], repeats: 1 }];
    expect(() => findLoadMargin(events, { material: sae1045 }, { targetRepeats: 0 })).toThrow(EngineError);
    expect(() => findLoadMargin(events, { material: sae1045 }, { targetRepeats: 10, minFactor: 3, maxFactor: 2 })).toThrow(/minFactor/);
    expect(() => findLoadMargin(events, { material: sae1045 }, { targetRepeats: 10, scanPoints: 1 })).toThrow(/scanPoints/);
  });
});
