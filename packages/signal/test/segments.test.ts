import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { detectTimeGaps, excludeRanges, removeOffset, scanSignal, splitAtDropouts } from '@loopwise/signal';
import { checkProperty } from '../../../test/property';

const ramp = (n: number) => Float64Array.from({ length: n }, (_, i) => i);

describe('excludeRanges(history, ranges, options)', () => {
  it('removes sample ranges and returns the rest as segments with their first sample index', () => {
    const { segments, correction } = excludeRanges(ramp(10), [
      { first: 2, last: 3 },
      { first: 7, last: 7 },
    ]);
    expect(segments.map((s) => [s.first, Array.from(s.values)])).toEqual([
      [0, [0, 1]],
      [4, [4, 5, 6]],
      [8, [8, 9]],
    ]);
    expect([Array.from(correction.first), Array.from(correction.length), correction.samples]).toEqual([[2, 7], [2, 1], 3]);
  });

  it('removes time ranges with a sample rate or a time column, both ends included', () => {
    const byRate = excludeRanges(ramp(10), [{ startTime: 0.2, endTime: 0.45 }], { timeBase: { sampleRate: 10 } });
    expect(byRate.segments.map((s) => s.first)).toEqual([0, 5]);
    const byColumn = excludeRanges(ramp(5), [{ startTime: 1, endTime: 2 }], { timeBase: [0, 0.5, 1, 2, 3] });
    expect(byColumn.segments.map((s) => Array.from(s.values))).toEqual([[0, 1], [4]]);
  });

  it('drops segments shorter than minimumSegment and records them as removed', () => {
    const r = excludeRanges(ramp(10), [{ first: 1, last: 2 }], { minimumSegment: 2 });
    expect(r.segments.map((s) => s.first)).toEqual([3]);
    expect([Array.from(r.correction.first), r.correction.samples]).toEqual([[0], 3]);
  });

  it('rejects ranges out of order, overlapping, outside the history, time ranges without a time base, and unknown fields', () => {
    expect(() => excludeRanges(ramp(10), [{ first: 5, last: 3 }])).toThrow(expect.objectContaining({ code: 'invalid-range', field: 'ranges[0].last' }));
    expect(() => excludeRanges(ramp(10), [{ first: 5, last: 6 }, { first: 6, last: 7 }])).toThrow(expect.objectContaining({ code: 'invalid-range', field: 'ranges[1]' }));
    expect(() => excludeRanges(ramp(10), [{ first: 5, last: 10 }])).toThrow(expect.objectContaining({ field: 'ranges[0].last' }));
    expect(() => excludeRanges(ramp(10), [{ startTime: 1, endTime: 2 }])).toThrow(expect.objectContaining({ field: 'timeBase' }));
    expect(() => excludeRanges(ramp(10), [{ startTime: 2, endTime: 1 }], { timeBase: { sampleRate: 1 } })).toThrow(expect.objectContaining({ field: 'ranges[0].endTime' }));
    expect(() => excludeRanges(ramp(10), [{ first: 1, last: 2, why: 'x' } as never])).toThrow(expect.objectContaining({ code: 'unknown-option', field: 'ranges[0].why' }));
    expect(() => excludeRanges([1, NaN], [])).toThrow(expect.objectContaining({ code: 'non-finite-sample', index: 1 }));
  });
});

describe('splitAtDropouts(history, findings, options)', () => {
  it('removes stuck runs and runs at zero and cuts at time gaps', () => {
    const x = Float64Array.from({ length: 400 }, (_, i) => Math.sin(i / 3));
    x.fill(0, 100, 220);
    const time = Float64Array.from({ length: 400 }, (_, i) => i / 100 + (i >= 300 ? 1 : 0));
    const findings = scanSignal(x, { offset: false, drift: false, clipping: false }).findings;
    const gaps = detectTimeGaps(time);
    const both = splitAtDropouts(x, findings);
    expect(both.segments.map((s) => [s.first, s.values.length])).toEqual([
      [0, 100],
      [220, 180],
    ]);
    // a time gap cuts without removing a sample
    const g = gaps.row(0);
    expect([g.code, g.index, g.length, g.time]).toEqual(['time-gap', 300, 100, 4]);
    const cut = splitAtDropouts(x, gaps);
    expect(cut.segments.map((s) => [s.first, s.values.length])).toEqual([
      [0, 300],
      [300, 100],
    ]);
    expect(cut.correction.samples).toBe(0);
  });

  it('rejects unknown codes and fields', () => {
    const f = scanSignal([1, 2, 3]).findings;
    expect(() => splitAtDropouts([1, 2, 3], f, { codes: ['dropout' as never] })).toThrow(expect.objectContaining({ field: 'codes[0]' }));
    expect(() => splitAtDropouts([1, 2, 3], f, { code: [] } as never)).toThrow(expect.objectContaining({ code: 'unknown-option' }));
  });
});

describe('removeOffset(history, { offset })', () => {
  it('subtracts the mean or a given offset', () => {
    expect(Array.from(removeOffset([10, 12, 8, 10]).values)).toEqual([0, 2, -2, 0]);
    const r = removeOffset([10, 12], { offset: 10 });
    expect([Array.from(r.values), r.offset, r.correction.kind, r.correction.samples]).toEqual([[0, 2], 10, 'offset-removed', 2]);
    expect(removeOffset([]).values.length).toBe(0);
  });

  it('rejects a bad offset and NaN samples', () => {
    expect(() => removeOffset([1], { offset: NaN })).toThrow(expect.objectContaining({ field: 'offset' }));
    expect(() => removeOffset([1, -Infinity])).toThrow(expect.objectContaining({ index: 1 }));
  });
});

describe('detectTimeGaps(time, options)', () => {
  it('finds steps above gapFactor nominal steps, with the samples missing', () => {
    const f = detectTimeGaps([0, 0.01, 0.02, 0.05, 0.06]).toArray();
    expect(f.map((r) => [r.code, r.index, r.length])).toEqual([['time-gap', 3, 2]]);
    expect(detectTimeGaps([0, 1, 2, 3]).length).toBe(0);
    expect(detectTimeGaps([0, 1, 3], { step: 1, gapFactor: 2.5 }).length).toBe(0);
    expect(detectTimeGaps([]).length).toBe(0);
  });

  it('rejects NaN naming the sample and a gap factor below 1', () => {
    expect(() => detectTimeGaps([0, NaN])).toThrow(expect.objectContaining({ code: 'non-finite-sample', field: 'time', index: 1 }));
    expect(() => detectTimeGaps([0, 1], { gapFactor: 0.5 })).toThrow(expect.objectContaining({ field: 'gapFactor' }));
  });
});

describe('corrections never create NaN (property)', () => {
  it('excludeRanges, splitAtDropouts and removeOffset give finite samples for finite input', () => {
    checkProperty(
      'segment corrections finite',
      fc.property(fc.array(fc.double({ min: -1e300, max: 1e300, noNaN: true }), { minLength: 1, maxLength: 300 }), fc.nat(), fc.nat(), (x, p, q) => {
        const a = p % x.length;
        const b = a + (q % (x.length - a));
        for (const s of excludeRanges(x, [{ first: a, last: b }]).segments) expect(s.values.every(Number.isFinite)).toBe(true);
        const f = scanSignal(x, { stuckRuns: { minimumSamples: 2 } }).findings;
        for (const s of splitAtDropouts(x, f).segments) expect(s.values.every(Number.isFinite)).toBe(true);
        expect(removeOffset(x).values.every(Number.isFinite)).toBe(true);
      }),
      { numRuns: 300 },
    );
  });
});
