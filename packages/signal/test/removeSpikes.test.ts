import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { FindingTable, removeSpikes, removeSpikesInto, scanSignal } from '@loopwise/signal';
import { checkProperty } from '../../../test/property';

describe('removeSpikes(history, spikes)', () => {
  it('interpolates each spike between its neighbours and records it', () => {
    const { values, correction } = removeSpikes([0, 1, 50, 3, 4, -60, 6], [2, 5]);
    expect(Array.from(values)).toEqual([0, 1, 2, 3, 4, 5, 6]);
    expect(correction.kind).toBe('spikes-interpolated');
    expect(Array.from(correction.first)).toEqual([2, 5]);
    expect(Array.from(correction.length)).toEqual([1, 1]);
    expect(correction.samples).toBe(2);
    expect(correction.summary).toBe('2 spike(s) interpolated (2 samples), first at sample 2');
  });

  it('bridges a run of adjacent spike samples as one, and holds the neighbour at the ends', () => {
    expect(Array.from(removeSpikes([0, 9, 9, 3], [1, 2]).values)).toEqual([0, 1, 2, 3]);
    expect(Array.from(removeSpikes([9, 1, 2], [0]).values)).toEqual([1, 1, 2]);
    expect(Array.from(removeSpikes([0, 1, 9], [2]).values)).toEqual([0, 1, 1]);
    expect(Array.from(removeSpikes([9], [0]).values)).toEqual([9]);
  });

  it('takes the spike rows of a FindingTable, and corrects in place with removeSpikesInto', () => {
    const x = Float64Array.from({ length: 3000 }, (_, i) => 100 * Math.sin(i / 9));
    x[1234] += 7000;
    const scan = scanSignal(x);
    const out = x.slice();
    const record = removeSpikesInto(out, scan.findings, out);
    expect(record.samples).toBe(1);
    expect(Math.abs(out[1234] - 100 * Math.sin(1234 / 9))).toBeLessThan(1);
    expect(scanSignal(out).findings.count('spike')).toBe(0);
    expect(removeSpikes(x, new FindingTable()).correction.summary).toBe('no spikes interpolated');
  });

  it('rejects NaN naming the sample, indices out of the history or out of order', () => {
    expect(() => removeSpikes([0, NaN, 1], [1])).toThrow(expect.objectContaining({ code: 'non-finite-sample', index: 1 }));
    expect(() => removeSpikes([0, 1, 2], [3])).toThrow(expect.objectContaining({ code: 'invalid-range', field: 'spikes[0]' }));
    expect(() => removeSpikes([0, 1, 2], [2, 1])).toThrow(expect.objectContaining({ code: 'invalid-range', field: 'spikes[1]' }));
    const x = Float64Array.of(0, 5, Infinity);
    expect(() => removeSpikesInto(x, [1], x)).toThrow(expect.objectContaining({ code: 'non-finite-sample', index: 2 }));
  });

  it('never creates NaN or ±Infinity, and changes only the spike samples (property)', () => {
    checkProperty(
      'spike removal finite and local',
      fc.property(fc.array(fc.double({ noNaN: true, noDefaultInfinity: true }), { minLength: 1, maxLength: 200 }), fc.array(fc.nat(), { maxLength: 20 }), (x, picks) => {
        const idx = [...new Set(picks.map((p) => p % x.length))].sort((a, b) => a - b);
        const y = removeSpikes(x, idx).values;
        expect(y.every((v) => Number.isFinite(v))).toBe(true);
        for (let i = 0; i < x.length; i++) if (!idx.includes(i)) expect(y[i]).toBe(x[i]);
      }),
      { numRuns: 300 },
    );
  });
});
