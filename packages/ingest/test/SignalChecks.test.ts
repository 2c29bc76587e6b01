// Constructed signals (invented for the tests) against the documented rules; thresholds are the
// defaults, `common practice, no source`.
import { describe, expect, it } from 'vitest';
import { SignalChecks } from '../src/SignalChecks.js';
import { TimeAxisCheck } from '../src/TimeAxisCheck.js';

const sine = (n: number, amplitude = 100, period = 40 * Math.SQRT2) => Float64Array.from({ length: n }, (_, i) => amplitude * Math.sin((2 * Math.PI * i) / period));
function run(x: Float64Array, chunk = x.length, thresholds = {}) {
  const c = new SignalChecks('ch', thresholds);
  for (let s = 0; s < x.length; s += chunk) c.push(x.subarray(s, Math.min(x.length, s + chunk)), s);
  return c.finish();
}

describe('SignalChecks(channel, thresholds)', () => {
  it('finds nothing on a clean sine', () => {
    expect(run(sine(5000))).toEqual([]);
  });

  it('finds isolated one-sample spikes with their sample indices, across any chunking', () => {
    const x = sine(5000);
    x[1000] += 5000;
    x[3001] -= 4000;
    for (const chunk of [1, 7, 5000]) {
      const w = run(x, chunk);
      expect(w.map((v) => v.kind)).toEqual(['spike']);
      expect(w[0].ranges).toEqual([
        { first: 1000, last: 1000 },
        { first: 3001, last: 3001 },
      ]);
    }
  });

  it('does not call a step a spike (it does not come back)', () => {
    const x = sine(2000, 1);
    for (let i = 1000; i < 2000; i++) x[i] += 50;
    expect(run(x).filter((w) => w.kind === 'spike')).toEqual([]);
  });

  it('finds flat lines and dropouts of at least flatRunSamples identical samples', () => {
    const x = sine(3000);
    x.fill(12.5, 500, 650); // 150 samples frozen
    x.fill(0, 2000, 2100); // 100 samples at zero
    x.fill(3, 2500, 2599); // 99 samples: below the threshold
    const w = run(x, 64);
    expect(w.find((v) => v.kind === 'flat-line')!.ranges).toEqual([{ first: 500, last: 649 }]);
    expect(w.find((v) => v.kind === 'dropout')!.ranges).toEqual([{ first: 2000, last: 2099 }]);
  });

  it('reports a flat run that lasts to the end', () => {
    const x = sine(1000);
    x.fill(7, 800);
    expect(run(x).find((v) => v.kind === 'flat-line')!.ranges).toEqual([{ first: 800, last: 999 }]);
  });

  it('finds a clipped full scale: many samples exactly at the maximum', () => {
    const x = sine(10000);
    for (let i = 0; i < x.length; i++) if (x[i] > 80) x[i] = 80;
    const w = run(x).find((v) => v.kind === 'clipped-maximum')!;
    expect(w.samples).toBeGreaterThan(1000);
    expect(w.ranges[0].first).toBe(x.indexOf(80));
    expect(run(x).some((v) => v.kind === 'clipped-minimum')).toBe(false);
  });

  it('finds a large offset: |mean| above half the range', () => {
    const x = sine(4000);
    for (let i = 0; i < x.length; i++) x[i] += 500;
    const w = run(x).find((v) => v.kind === 'large-offset')!;
    expect(w.ranges).toEqual([{ first: 0, last: 3999 }]);
    expect(run(sine(4000)).some((v) => v.kind === 'large-offset')).toBe(false);
  });

  it('keeps at most maxRanges ranges and counts the others', () => {
    const x = sine(20000);
    for (let i = 100; i < 20000; i += 500) x[i] += 10000;
    const w = run(x, 333, { maxRanges: 5 })[0];
    expect(w.kind).toBe('spike');
    expect(w.ranges.length).toBe(5);
    expect(w.rangesOmitted).toBe(40 - 5);
  });

  it('rejects bad thresholds and out-of-order chunks', () => {
    expect(() => new SignalChecks('ch', { spikeFactor: -1 })).toThrow('option checks.spikeFactor = -1 is invalid');
    const c = new SignalChecks('ch');
    c.push(new Float64Array(3));
    expect(() => c.push(new Float64Array(3), 5)).toThrow('chunks must follow each other: expected 3');
  });

  it('reports nothing for no samples and one sample', () => {
    expect(new SignalChecks('ch').finish()).toEqual([]);
    expect(run(new Float64Array([1]))).toEqual([{ kind: 'large-offset', channel: 'ch', samples: 1, ranges: [{ first: 0, last: 0 }], rangesOmitted: 0, message: 'ch: mean 1 is more than 0.5 × the range 0: an offset not zeroed?' }]);
  });
});

describe('TimeAxisCheck()', () => {
  it('gives step statistics and the non-increasing steps, chunk by chunk', () => {
    const t = new TimeAxisCheck();
    t.push(new Float64Array([0, 0.5, 1]));
    t.push(new Float64Array([1, 0.75, 2]));
    expect(t.summary()).toEqual({
      samples: 6,
      first: 0,
      last: 2,
      minStep: -0.25,
      maxStep: 1.25,
      meanStep: 0.4,
      nonIncreasingSteps: 2,
      nonIncreasingAt: [
        { first: 2, last: 3 },
        { first: 3, last: 4 },
      ],
    });
  });
});
