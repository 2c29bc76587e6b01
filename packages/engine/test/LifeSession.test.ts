import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { assessLife, EngineError, findLoadMargin, LifeSession, type LifeReport } from '@loopwise/engine';
import { cycleLivesInto, defineSnCurve } from '@loopwise/stress-life';
import { checkProperty } from '../../../test/property';
import { sae1045 } from './support';

const plain = (r: LifeReport) => JSON.stringify(r, (_k, v) => (ArrayBuffer.isView(v) ? Array.from(v as Float64Array) : v));

function streamed(history: number[], cuts: number[], job: Parameters<typeof assessLife>[1]): LifeReport {
  const s = new LifeSession(job);
  let at = 0;
  for (const c of [...cuts, history.length]) {
    s.push(history.slice(at, c));
    at = c;
  }
  let left = s.endFirstPass();
  // the second pass re-reads the history in other chunks (a file read again)
  for (let i = 0; left > 0; i += 3) {
    const part = history.slice(i, i + 3);
    s.pushSecondPass(part);
    left -= part.length;
  }
  return s.finish();
}

describe('LifeSession', () => {
  test('a streamed history gives the same report as assessLife, for any chunking, repeating or not, with a gate', () => {
    checkProperty(
      'session = batch',
      fc.property(
        fc.array(fc.integer({ min: -400, max: 400 }), { minLength: 1, maxLength: 60 }).chain((h) =>
          fc.tuple(fc.constant(h), fc.uniqueArray(fc.integer({ min: 0, max: h.length }), { maxLength: 6 }).map((a) => a.sort((x, y) => x - y))),
        ),
        fc.boolean(),
        fc.constantFrom(0, 15, 60),
        ([history, cuts], repeating, gate) => {
          const job = { material: sae1045, notch: { Kt: 2 }, repeating, gate, timelineBins: 7 };
          expect(plain(streamed(history, cuts, job))).toBe(plain(assessLife(history, job)));
        },
      ),
      { numRuns: 200 },
    );
  });

  test('a steadily growing history (a new largest value at every sample) streams like any other', () => {
    const history = Array.from({ length: 200000 }, (_, i) => 0.002 * i + 30 * Math.sin(i / 7));
    const job = { material: sae1045, notch: { Kt: 2 }, timelineBins: 5 };
    expect(plain(streamed(history, [50000, 120000], job))).toBe(plain(assessLife(history, job)));
  });

  test('the second pass needs only the samples up to the largest |value|, and the block in which the gate settles it', () => {
    // 300 000 samples, the largest |value| at sample 3: the second read ends with the first
    // block of 65 536 samples (in which the point after it was confirmed), not at the history's end
    const history = Array.from({ length: 300000 }, (_, i) => (i === 3 ? 300 : 100 * Math.sin(i / 9)));
    const job = { material: sae1045, notch: { Kt: 2 } };
    const s = new LifeSession(job);
    s.push(history);
    expect(s.endFirstPass()).toBe(65536);
    s.pushSecondPass(history);
    const r = s.finish();
    expect(r.damage.reusedFirstPass).toBe(true);
    expect(plain(r)).toBe(plain(assessLife(history, job)));
  });

  test('a gate as large as the history\'s range: the second read goes on until the gate has settled the largest |value| (fuzz case)', () => {
    // found by the fuzz (issue 15): read only up to the largest |value|, the gate still held
    // sample 1 as a leading extreme, which the full read drops; tiny values as found
    const history = [-4.400000000004607e-201, -3.8000000000039785e-201, -1.340000000001403e-200, -8.0000000000083765e-202, -1.2000000000012565e-200, -6.400000000006701e-201];
    const job = { material: sae1045, notch: { Kt: 2.92 }, gate: 1.3400000000014027e-200 };
    expect(plain(streamed(history, [3], job))).toBe(plain(assessLife(history, job)));
    expect(plain(streamed(history.map((x) => x * 1e202), [3], { ...job, gate: job.gate * 1e202 }))).toBe(plain(assessLife(history.map((x) => x * 1e202), { ...job, gate: job.gate * 1e202 })));
  });

  test('an initial value beyond the history needs the whole history again', () => {
    const history = [0, 100, -50, 80, 0];
    const job = { material: sae1045, notch: { Kt: 2 }, initial: 150 };
    const s = new LifeSession(job);
    s.push(history);
    expect(s.endFirstPass()).toBe(history.length);
    s.pushSecondPass(history);
    expect(plain(s.finish())).toBe(plain(assessLife(history, job)));
    // the initial value is after the offset, as the samples are: |-170| exceeds 100 + 60, the
    // largest |sample + offset|, though |-170 + 60| would not
    const shifted = { ...job, initial: -170, offset: 60 };
    const t = new LifeSession(shifted);
    t.push(history);
    expect(t.endFirstPass()).toBe(history.length);
    t.pushSecondPass(history);
    expect(plain(t.finish())).toBe(plain(assessLife(history, shifted)));
  });

  test('a history that starts at its largest |value| and ends on it (a plateau across the seam) streams like batch', () => {
    // found by the running-totals property under an unpinned seed: the session asked for one
    // sample again and then stopped, because the seam plateau keeps the end's sample index
    const history = [-352, 0, -352];
    const job = { material: sae1045, notch: { Kt: 2 } };
    const s = new LifeSession(job);
    s.push(history);
    expect(s.endFirstPass()).toBe(history.length);
    s.pushSecondPass(history);
    expect(plain(s.finish())).toBe(plain(assessLife(history, job)));
  });

  test('a second read that ends before the gate confirms its first reversal gets the points the first pass kept', () => {
    // found by a random search: the largest |value| (-60) lies before the gate's first reversal,
    // and the first pass kept the extreme before it (-1) only when that reversal came
    const history = [-2, -1, -60, 0];
    const job = { material: sae1045, notch: { Kt: 2 }, gate: 60 };
    expect(plain(streamed(history, [], job))).toBe(plain(assessLife(history, job)));
    const s = new LifeSession(job);
    s.push(history);
    expect(s.endFirstPass()).toBe(4); // the whole (short) history: its one block settles the points
  });

  test('misuse and bad input get clear errors', () => {
    const job = { material: sae1045, notch: { Kt: 2 } };
    expect(() => new LifeSession({ ...job, gateFraction: 0.1 })).toThrow(/fullScale/);
    const s = new LifeSession(job);
    s.push([0, 200, -100]);
    void s.endFirstPass();
    expect(() => s.push([1])).toThrow(EngineError);
    expect(() => s.finish()).toThrow(/samples 0 to 2 again/);
    expect(() => new LifeSession(job).push([0, NaN])).toThrow(/sample 1/);
    expect(() => new LifeSession(job).finish()).toThrow(/no samples/);
  });
});

describe('LifeSession({ keepLoops: false })', () => {
  test('running totals give the damage, life, worst loops and timeline totals of the kept-loop report', () => {
    checkProperty(
      'aggregate session = batch',
      fc.property(
        fc.array(fc.integer({ min: -400, max: 400 }), { minLength: 1, maxLength: 80 }),
        fc.boolean(),
        fc.constantFrom(0, 20),
        fc.constantFrom(undefined, 2e4),
        (history, repeating, gate, cutoffCycles) => {
          const job = { material: sae1045, notch: { Kt: 2 }, repeating, gate, worstLoopCount: 5, ...(cutoffCycles ? { cutoffCycles } : {}) };
          const batch = assessLife(history, job);
          const s = new LifeSession(job, { keepLoops: false, timelineBinSize: 7 });
          s.push(history);
          if (s.endFirstPass() > 0) s.pushSecondPass(history);
          const r = s.finish();
          const close = (a: number, b: number) => Math.abs(a - b) <= 1e-12 * Math.max(Math.abs(a), Math.abs(b));
          expect(close(r.damage.perRepeat, batch.damage.perRepeat)).toBe(true);
          expect(close(r.damage.firstPass, batch.damage.firstPass)).toBe(true);
          expect(r.life.repeats === batch.life.repeats || close(r.life.repeats, batch.life.repeats)).toBe(true);
          expect(r.loops.count.length).toBe(0);
          expect(r.worstLoops.map((w) => w.damage)).toEqual(batch.worstLoops.map((w) => w.damage));
          const sum = r.timeline.damage.reduce((a, b) => a + b, 0);
          expect(close(sum, r.damage.perRepeat) || sum === r.damage.perRepeat).toBe(true);
          expect(r.warnings.map((w) => w.code)).toEqual(batch.warnings.map((w) => w.code));
        },
      ),
      { numRuns: 200 },
    );
  });
});

describe('LifeSession({ onLoops })', () => {
  /** The rows of `reportedLoopRows` picked out of everything the sink received, per column. */
  function picked(stream: Map<number, LifeReport['loops']>, ranges: { from: number; to: number }[]): Record<string, number[]> {
    const rows: Record<string, number[]> = {};
    const all = [...stream.entries()].sort((a, b) => a[0] - b[0]);
    for (const { from, to } of ranges) {
      for (const [first, cols] of all) {
        for (const key of Object.keys(cols) as (keyof LifeReport['loops'])[]) {
          const c = cols[key];
          for (let i = 0; i < c.length; i++) if (first + i >= from && first + i < to) (rows[key] ??= []).push(c[i]);
        }
      }
    }
    return rows;
  }

  test('the loops handed to the sink, at the reported rows, are the kept-loop report table value for value, for any chunking', () => {
    checkProperty(
      'loop sink rows = kept loop table',
      fc.property(
        fc.array(fc.integer({ min: -400, max: 400 }), { minLength: 1, maxLength: 80 }),
        fc.integer({ min: 1, max: 9 }),
        fc.boolean(),
        fc.constantFrom(0, 20),
        (history, chunk, repeating, gate) => {
          const job = { material: sae1045, notch: { Kt: 2 }, repeating, gate };
          const kept = new LifeSession(job);
          const stream = new Map<number, LifeReport['loops']>();
          let next = 0;
          const s = new LifeSession(job, {
            onLoops: (cols, first) => {
              // rows arrive once each, in order, numbered without gaps
              expect(first).toBe(next);
              next += cols.count.length;
              stream.set(first, cols);
            },
          });
          for (let i = 0; i < history.length; i += chunk) {
            kept.push(history.slice(i, i + chunk));
            s.push(history.slice(i, i + chunk));
          }
          const need = kept.endFirstPass();
          expect(s.endFirstPass()).toBe(need);
          for (let i = 0; i < need; i += chunk) {
            kept.pushSecondPass(history.slice(i, Math.min(need, i + chunk)));
            s.pushSecondPass(history.slice(i, Math.min(need, i + chunk)));
          }
          const a = kept.finish();
          const b = s.finish();
          const want: Record<string, number[]> = {};
          for (const key of Object.keys(a.loops) as (keyof LifeReport['loops'])[]) if (a.loops[key].length > 0) want[key] = Array.from(a.loops[key]);
          expect(picked(stream, s.reportedLoopRows)).toEqual(want);
          // relative: damages are small numbers, an absolute tolerance would pass anything
          expect(Math.abs(b.damage.perRepeat - a.damage.perRepeat)).toBeLessThanOrEqual(1e-12 * Math.max(a.damage.perRepeat, 1e-300));
        },
      ),
      { numRuns: 200 },
    );
  });

  test('rows are known after finish only, and a sink with kept loops is refused', () => {
    const s = new LifeSession({ material: sae1045, notch: { Kt: 2 } }, { onLoops: () => {} });
    expect(() => s.reportedLoopRows).toThrow(/finish/);
    expect(() => new LifeSession({ material: sae1045 }, { keepLoops: true, onLoops: () => {} })).toThrow(EngineError);
  });
});

describe('LifeSession chunks', () => {
  test('a chunk that is not an array of samples is an input error naming the method (fuzz report, issue 15)', () => {
    const s = new LifeSession({ material: sae1045, notch: { Kt: 2 } });
    expect(() => s.push(5 as unknown as number[])).toThrow(expect.objectContaining({ code: 'invalid-event', field: 'push' }));
    expect(() => s.push(null as unknown as number[])).toThrow(EngineError);
    expect(() => s.push('123' as unknown as number[])).toThrow(/push: .*array or typed array/);
    s.push([0, 100, -50]);
    expect(s.sampleCount).toBe(3);
  });
});

describe('messages of samples that overflow with the offset', () => {
  test('a finite sample that overflows once the offset is added says so, in the session and the batch route', () => {
    const job = { material: sae1045, notch: { Kt: 2 }, offset: 1e308 };
    const s = new LifeSession(job);
    expect(() => {
      s.push([0, 1e308, 0]);
      s.endFirstPass();
    }).toThrow(/sample 1 of event 'history' is 1e\+308, which with the offset 1e\+308 added is beyond the largest number/);
    expect(() => assessLife([0, 1e308, 0], job)).toThrow(/sample 1 of event 'history' is 1e\+308, which with the offset 1e\+308 added/);
  });

  test('the margin search bounds its scan points', () => {
    expect(() => findLoadMargin([{ name: 'h', history: [0, 100, 0], repeats: 1 }], { material: sae1045 }, { targetRepeats: 1e5, scanPoints: 1e6 })).toThrow(/scanPoints: .*from 2 to 10000/);
  });
});

describe('job fields of the wrong kind (issue 15, item 6)', () => {
  test('a material by name, a BigInt or a null field is an invalid-job error naming the field, never a TypeError', () => {
    const field = (job: unknown) => {
      try {
        assessLife([0, 100, 0], job as Parameters<typeof assessLife>[1]);
      } catch (e) {
        expect(e).toBeInstanceOf(EngineError);
        return `${(e as EngineError).field}: ${(e as Error).message}`;
      }
      return 'no error';
    };
    expect(field({ material: 'SAE 1045' })).toMatch(/^material: .*handbookSteels/);
    expect(field({ material: sae1045, gate: BigInt(10) })).toMatch(/^gate: .*BigInt/);
    expect(field({ material: sae1045, notch: null })).toMatch(/^notch: .*must not be null/);
    expect(field({ material: sae1045, meanStress: null })).toMatch(/^meanStress: .*must not be null/);
  });
});

describe('unknown option fields of the session, the margin search and the stress-life route', () => {
  test('each names the nearest known field', () => {
    const job = { material: sae1045 };
    expect(() => new LifeSession(job, { keeploops: false } as never)).toThrow(/unknown field 'keeploops' in the session options; did you mean 'keepLoops'\?/);
    expect(() => findLoadMargin([{ name: 'h', history: [0, 100, 0], repeats: 1 }], job, { targetRepeats: 1e5, scanpoints: 10 } as never)).toThrow(/did you mean 'scanPoints'\?/);
    expect(() => defineSnCurve({ stress: 100, cycles: 2e6, slope: 3, cutoff: 1e8 } as never)).toThrow(/unknown field 'cutoff' in the curve/);
    expect(() => cycleLivesInto(defineSnCurve({ stress: 100, cycles: 2e6, slope: 3 }), [10], [0], new Float64Array(1), { Kf: 2 } as never)).toThrow(/did you mean 'kf'\?/);
  });
});
