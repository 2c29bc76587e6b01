import { describe, expect, test } from 'vitest';
import { assessLife, EngineError, findLoadMargin } from '@loopwise/engine';
import { sae1045 } from './support';

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

  test('bad margin options name the field', () => {
    const events = [{ name: 'h', history: [0, 100], repeats: 1 }];
    expect(() => findLoadMargin(events, { material: sae1045 }, { targetRepeats: 0 })).toThrow(EngineError);
    expect(() => findLoadMargin(events, { material: sae1045 }, { targetRepeats: 10, minFactor: 3, maxFactor: 2 })).toThrow(/minFactor/);
    expect(() => findLoadMargin(events, { material: sae1045 }, { targetRepeats: 10, scanPoints: 1 })).toThrow(/scanPoints/);
  });
});
