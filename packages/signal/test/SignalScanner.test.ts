// Constructed signals (invented for the tests) against the documented rules; thresholds are the
// defaults, `common practice, no source`.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { SignalError, SignalScanner, scanSignal, type SignalScanOptions } from '@loopwise/signal';
import { checkProperty } from '../../../test/property';

const sine = (n: number, amplitude = 100, period = 40 * Math.SQRT2) => Float64Array.from({ length: n }, (_, i) => amplitude * Math.sin((2 * Math.PI * i) / period));
const codes = (x: ArrayLike<number>, o: SignalScanOptions = {}) => scanSignal(x, o).findings.toArray().map((f) => f.code);

function chunked(x: Float64Array, cuts: number[], options: SignalScanOptions = {}) {
  const s = new SignalScanner(options);
  let from = 0;
  for (const c of [...cuts].sort((p, q) => p - q)) {
    s.push(x.subarray(from, Math.max(from, c)));
    from = Math.max(from, c);
  }
  s.push(x.subarray(from));
  return s.finish();
}

describe('new SignalScanner(options)', () => {
  it('finds nothing on a clean sine', () => {
    expect(codes(sine(10000))).toEqual([]);
  });

  it('finds one-sample spikes with their sample index and height, in every block and across chunkings', () => {
    const x = sine(10000);
    for (const i of [5, 1000, 4095, 4098, 5001, 9998]) x[i] += i % 2 ? 5000 : -4000;
    for (const cuts of [[], [1], [4095, 4096, 4097], [7, 8192, 9999]]) {
      const spikes = chunked(x, cuts).findings.select('spike').toArray();
      expect(spikes.map((f) => f.index)).toEqual([5, 1000, 4095, 4098, 5001, 9998]);
      expect(spikes[1].length).toBe(1);
      expect(Math.abs(spikes[1].size + 4000)).toBeLessThan(2); // the height above the line through its neighbours
    }
  });

  it('does not call a step a spike (it does not come back)', () => {
    const x = sine(3000, 1);
    for (let i = 1000; i < 3000; i++) x[i] += 50;
    expect(codes(x, { drift: false, offset: false })).toEqual([]);
  });

  it('keeps the threshold of the block before a dropout for the block after it', () => {
    const x = sine(20000);
    x.fill(0, 8192, 12288); // one whole block at zero
    const f = scanSignal(x).findings.toArray();
    expect(f.map((r) => [r.code, r.index, r.length])).toEqual([['zero-run', 8192, 4096]]);
  });

  it('finds a spike on an otherwise constant record (the first block falls back to the mean |Δx|)', () => {
    const x = new Float64Array(500).fill(2);
    x[250] = 9;
    const f = scanSignal(x, { stuckRuns: false, offset: false, clipping: false }).findings.toArray();
    expect(f.map((r) => [r.code, r.index])).toEqual([['spike', 250]]);
  });

  it('finds stuck runs and runs at zero of at least minimumSamples identical samples', () => {
    const x = sine(3000);
    x.fill(12.5, 500, 650); // 150 samples frozen
    x.fill(0, 2000, 2100); // 100 samples at zero
    x.fill(3, 2500, 2599); // 99 samples: below the threshold
    const f = chunked(x, [64, 128, 2050]).findings.toArray();
    expect(f.map((r) => [r.code, r.index, r.length, r.size])).toEqual([
      ['stuck-run', 500, 150, 12.5],
      ['zero-run', 2000, 100, 0],
    ]);
  });

  it('reports a stuck run that lasts to the end', () => {
    const x = sine(1000);
    x.fill(7, 800);
    expect(scanSignal(x, { drift: false }).findings.select('stuck-run').toArray().map((r) => [r.index, r.length])).toEqual([[800, 200]]);
  });

  it('finds clipping: every run of samples exactly at the largest value', () => {
    const x = sine(10000);
    for (let i = 0; i < x.length; i++) if (x[i] > 80) x[i] = 80;
    const clips = scanSignal(x).findings.select('clipped-maximum').toArray();
    expect(clips.length).toBeGreaterThan(100);
    expect(clips[0].index).toBe(x.indexOf(80));
    expect(clips.every((c) => c.size === 80 && c.length >= 1)).toBe(true);
    expect(clips.reduce((s, c) => s + c.length, 0)).toBe(x.filter((v) => v === 80).length);
    expect(scanSignal(x).findings.count('clipped-minimum')).toBe(0);
  });

  it('a rounded periodic signal meets its extreme in single samples or pairs: not clipping; the same signal clipped is', () => {
    // 200·sin(2πi/50) with one decimal: samples 12 and 13 of every period are both 199.6
    const x = Float64Array.from({ length: 20000 }, (_, i) => Number((200 * Math.sin((2 * Math.PI * i) / 50)).toFixed(1)));
    expect(x.filter((v) => v === 199.6).length).toBe(800);
    expect(scanSignal(x).findings.count('clipped-maximum')).toBe(0);
    expect(scanSignal(x).findings.count('clipped-minimum')).toBe(0);
    const clipped = x.map((v) => Math.min(v, 150));
    const runs = scanSignal(clipped).findings.select('clipped-maximum').toArray();
    expect(runs.length).toBe(400);
    expect(runs.every((r) => r.length >= 3)).toBe(true);
    // a run shorter than minimumRun does not count
    expect(scanSignal(clipped, { clipping: { minimumRun: 100 } }).findings.count('clipped-maximum')).toBe(0);
  });

  it('finds an offset (|mean| above half the range) and a drift (trend above a quarter of the range)', () => {
    const x = sine(4000);
    for (let i = 0; i < x.length; i++) x[i] += 500;
    expect(codes(x)).toEqual(['offset']);
    const y = sine(4000);
    for (let i = 0; i < y.length; i++) y[i] += (150 * i) / 4000;
    const scan = scanSignal(y);
    expect(scan.findings.toArray().map((f) => f.code)).toEqual(['drift']);
    expect(Math.abs(scan.findings.row(0).size - 150)).toBeLessThan(2); // the sine adds a little trend of its own
    expect(Math.abs(scan.trendPerSample * 3999 - scan.findings.row(0).size)).toBeLessThan(1e-9);
  });

  it('gives findings their time with a time base', () => {
    const x = sine(3000);
    x[1000] += 5000;
    const f = scanSignal(x, { timeBase: { sampleRate: 500, startTime: 2 } }).findings.row(0);
    expect(f.time).toBe(2 + 1000 / 500);
  });

  it('handles no samples, one sample and a constant record', () => {
    expect(new SignalScanner().finish()).toEqual(expect.objectContaining({ samples: 0, trendPerSample: 0 }));
    expect(scanSignal([1]).findings.toArray().map((f) => f.code)).toEqual(['offset']);
    const c = scanSignal(new Float64Array(50).fill(3));
    expect(c.findings.toArray().map((f) => [f.code, f.index, f.length])).toEqual([['offset', 0, 50]]);
    expect([c.minimum, c.maximum, c.mean]).toEqual([3, 3, 3]);
  });

  it('rejects NaN and ±Infinity naming the sample index, across chunks', () => {
    const s = new SignalScanner();
    s.push(new Float64Array(10));
    expect(() => s.push(Float64Array.of(1, Infinity))).toThrow(expect.objectContaining({ code: 'non-finite-sample', index: 11 }));
    expect(() => scanSignal([NaN])).toThrow(expect.objectContaining({ code: 'non-finite-sample', index: 0 }));
    expect(() => scanSignal([1, 2, -Infinity])).toThrow(/history\[2\] = -Infinity/);
  });

  it('rejects unknown and bad options naming the field', () => {
    expect(() => new SignalScanner({ spikes: { factr: 3 } } as never)).toThrow(expect.objectContaining({ code: 'unknown-option', field: 'spikes.factr' }));
    expect(() => new SignalScanner({ spike: {} } as never)).toThrow(expect.objectContaining({ code: 'unknown-option', field: 'options.spike' }));
    expect(() => new SignalScanner({ spikes: { factor: -1 } })).toThrow(expect.objectContaining({ code: 'invalid-option', field: 'spikes.factor', value: -1 }));
    expect(() => new SignalScanner({ spikes: { blockLength: 8 } })).toThrow(SignalError);
    expect(() => new SignalScanner({ stuckRuns: { minimumSamples: 1.5 } })).toThrow(expect.objectContaining({ field: 'stuckRuns.minimumSamples' }));
    expect(() => new SignalScanner({ timeBase: { sampleRate: 0 } })).toThrow(expect.objectContaining({ field: 'timeBase.sampleRate', value: 0 }));
    expect(() => new SignalScanner({ timeBase: 5 as never })).toThrow(expect.objectContaining({ field: 'timeBase' }));
    const s = new SignalScanner();
    s.finish();
    expect(() => s.push([1])).toThrow(expect.objectContaining({ code: 'invalid-argument' }));
  });

  it('gives the same findings for any chunking (property)', () => {
    // Arrange: a generated history with spikes, stuck runs and clipping; Act: scan it whole and in pieces
    checkProperty(
      'scanner chunking invariance',
      fc.property(
        fc.integer({ min: 2, max: 6000 }),
        fc.array(fc.nat(6000), { maxLength: 8 }),
        fc.integer({ min: 1, max: 2 ** 31 - 1 }),
        fc.constantFrom(16, 64, 4096),
        (n, cuts, seed, blockLength) => {
          let s = seed;
          const rnd = () => ((s = (Math.imul(s, 48271) >>> 0) % 2147483647) / 2147483647);
          const x = Float64Array.from({ length: n }, (_, i) => Math.round(50 * Math.sin(i / 9) + 10 * rnd()));
          for (let i = 3; i < n; i += 97) x[i] += 900 * (rnd() - 0.5);
          for (let i = 0; i + 120 < n; i += 1500) x.fill(x[i], i, i + 120);
          const options = { spikes: { blockLength } };
          const whole = scanSignal(x, options);
          const pieces = chunked(x, cuts.map((c) => c % (n + 1)), options);
          // Assert
          expect(pieces.findings.columns()).toEqual(whole.findings.columns());
          expect([pieces.minimum, pieces.maximum]).toEqual([whole.minimum, whole.maximum]);
          expect(pieces.mean).toBe(whole.mean);
          expect(pieces.trendPerSample).toBe(whole.trendPerSample);
        },
      ),
      { numRuns: 200 },
    );
  });
});
