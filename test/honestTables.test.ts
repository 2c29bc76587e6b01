import { describe, expect, test } from 'vitest';
import { assessDutyCycle, assessLife, compareCorrections, LifeSession } from '@loopwise/engine';
import { handbookSteels } from '@loopwise/material';
import { NotchTracker, RepeatingNotchTracker, trackNotch, trackNotchRepeating } from '@loopwise/notch';
import { rainflow, RainflowCounter } from '@loopwise/rainflow';
import { decimatePeaks, excludeRanges, removeSpikes, scanSignal, splitAtDropouts, zeroPhaseLowPass } from '@loopwise/signal';

// Honest tables: a result handed to a caller can't be changed through any of its columns in a
// way that changes another result. Each case builds several results that could share storage
// (two passes of one call, two calls, a tracker's result before and after more pushes, a report
// and the tables it was made from), writes -1 through every typed-array column of one of them
// (tables through their columns()), and checks every other result is as it was. Rainflow's own
// results are checked the same way in packages/rainflow/test/honestTables.test.ts.

const material = handbookSteels.find((m) => m.name?.startsWith('SAE 1045'))!;
const history = [0, 300, -200, 100, -150, 200, -100, 250, -240, 150, -50];

type Columns = () => Record<string, ArrayLike<number>>;

/** A plain, deep copy of a result: typed arrays and tables as number arrays. */
function snapshot(x: unknown): unknown {
  if (ArrayBuffer.isView(x)) return Array.from(x as unknown as ArrayLike<number>);
  if (x !== null && typeof x === 'object') {
    const cols = (x as { columns?: Columns }).columns;
    if (typeof cols === 'function') return Object.fromEntries(Object.entries(cols.call(x)).map(([k, v]) => [k, Array.from(v)]));
    if (Array.isArray(x)) return x.map(snapshot);
    return Object.fromEntries(Object.entries(x).map(([k, v]) => [k, snapshot(v)]));
  }
  return x;
}

/** Writes -1 through every typed-array column reachable from a result; returns how many. */
function scribble(x: unknown, seen = new Set<unknown>()): number {
  if (x === null || typeof x !== 'object' || seen.has(x)) return 0;
  seen.add(x);
  if (ArrayBuffer.isView(x)) {
    (x as unknown as Float64Array).fill(-1);
    return 1;
  }
  let n = 0;
  const cols = (x as { columns?: Columns }).columns;
  if (typeof cols === 'function') for (const c of Object.values(cols.call(x))) n += scribble(c, seen);
  for (const v of Object.values(x)) n += scribble(v, seen);
  return n;
}

/** For every result in turn: scribble over it, check that the others did not change. */
function expectHonest(make: () => Record<string, unknown>, observedOnly: string[] = []): void {
  const names = Object.keys(make());
  for (const target of names.filter((n) => !observedOnly.includes(n))) {
    const results = make();
    const before = Object.fromEntries(names.filter((n) => n !== target).map((n) => [n, snapshot(results[n])]));
    expect(scribble(results[target]), `${target} has columns`).toBeGreaterThan(0);
    for (const n of Object.keys(before)) expect(snapshot(results[n]), `${n} after writing through ${target}`).toEqual(before[n]);
  }
}

describe('honest tables: writing through one result never changes another', () => {
  test('trackNotchRepeating: the first and the stabilised pass, and a second call', () => {
    expectHonest(() => {
      const a = trackNotchRepeating(history, { material, Kt: 2, recordReversals: true });
      const b = trackNotchRepeating(history, { material, Kt: 2 });
      return { first: a.first, stabilised: a.stabilised, other: b };
    });
    // the case the review measured: first.loops.columns().stressMax.fill(-1)
    const r = trackNotchRepeating(history, { material, Kt: 2 });
    const before = r.stabilised.loops.toRows();
    r.first.loops.columns().stressMax.fill(-1);
    expect(r.stabilised.loops.toRows()).toEqual(before);
  });

  test('trackNotch twice, NotchTracker.end() before and after more samples', () => {
    expectHonest(() => {
      const t = new NotchTracker({ material, Kt: 2 });
      t.push(history.slice(0, 6));
      const early = t.end();
      t.push(history.slice(6));
      return { early, late: t.end(), again: t.end(), batch: trackNotch(history, { material, Kt: 2 }) };
    });
  });

  test('RepeatingNotchTracker.finish() and the loops taken before it', () => {
    expectHonest(() => {
      const t = new RepeatingNotchTracker({ material, Kt: 2 });
      t.push(history.slice(0, 7));
      const taken = t.takeLoops();
      t.push(history.slice(7));
      t.endFirstPass();
      t.pushAgain(history);
      return { taken: taken.loops, result: t.finish(), other: trackNotchRepeating(history, { material, Kt: 2 }) };
    });
  });

  test('assessLife, assessDutyCycle, compareCorrections and LifeSession reports', () => {
    expectHonest(() => {
      const job = { material, notch: { Kt: 2 }, meanStress: 'smithWatsonTopper' as const };
      const s = new LifeSession(job);
      s.push(history);
      if (s.endFirstPass() > 0) s.pushSecondPass(history);
      return {
        batch: assessLife(history, job),
        oneOff: assessLife(history, { ...job, repeating: false }),
        duty: assessDutyCycle([{ name: 'a', history, repeats: 3 }, { name: 'b', history: history.slice(0, 5), repeats: 2 }], job),
        stream: s.finish(),
        corrections: compareCorrections([{ name: 'a', history, repeats: 1 }], job),
      };
    }, ['corrections']); // plain numbers only: observed, nothing to write through
  });

  test('rainflow and RainflowCounter results beside notch and engine results', () => {
    expectHonest(() => {
      const c = new RainflowCounter();
      c.push(history);
      return { batch: rainflow(history), counted: c.finish(), life: assessLife(history, { material, notch: { Kt: 2 } }) };
    });
  });

  test('signal: scans, corrections and their records, made from one history and one scan', () => {
    expectHonest(() => {
      const x = Float64Array.from({ length: 600 }, (_, i) => 100 * Math.sin(i / 7));
      x[300] = 5000; // invented spike
      x.fill(0, 400, 520); // invented dropout
      const scan = scanSignal(x);
      return {
        scan,
        again: scanSignal(x),
        removed: removeSpikes(x, scan.findings),
        excluded: excludeRanges(x, [{ first: 10, last: 20 }]),
        split: splitAtDropouts(x, scan.findings),
        filtered: zeroPhaseLowPass(x, { cutoff: 5, sampleRate: 100 }),
        decimated: decimatePeaks(x),
      };
    });
  });
});
