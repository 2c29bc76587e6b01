import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { rainflow } from '@loopwise/rainflow';
import { decimatePeaks, PeakDecimator } from '@loopwise/signal';
import { checkProperty } from '../../../test/property';

/** Cycles of a count as comparable rows; sample indices mapped through `indices` when given. */
function cycles(x: ArrayLike<number>, gate: number, indices?: Float64Array): string[] {
  const t = rainflow(x, { gate }).cycles!;
  const out: string[] = [];
  for (let i = 0; i < t.length; i++) {
    const r = t.row(i);
    const at = (k: number) => (indices ? indices[k] : k);
    out.push([r.range, r.mean, r.from, r.to, r.count, at(r.startIndex), at(r.turnIndex), at(r.closeIndex)].join('|'));
  }
  return out;
}

describe('decimatePeaks(history, { gate })', () => {
  it('keeps the first sample, the reversals the gate keeps and the last sample', () => {
    const d = decimatePeaks([0, 1, 2, 3, 2, 1, 1.5, 0, 4], { gate: 1 });
    expect(Array.from(d.values)).toEqual([0, 3, 0, 4]);
    expect(Array.from(d.indices)).toEqual([0, 3, 7, 8]);
    expect(d.correction).toEqual(expect.objectContaining({ kind: 'decimated', samples: 5 }));
    // gate 0: every turning point, plateaus collapsed to their first sample
    expect(Array.from(decimatePeaks([0, 2, 2, 1, 3, 3]).indices)).toEqual([0, 1, 3, 4, 5]);
  });

  it('handles empty, one sample and a constant history', () => {
    expect(decimatePeaks([]).values.length).toBe(0);
    expect(Array.from(decimatePeaks([5]).values)).toEqual([5]);
    expect(Array.from(decimatePeaks([5, 5, 5]).indices)).toEqual([0, 2]);
  });

  it('rejects NaN naming the sample, a negative gate and unknown fields', () => {
    expect(() => decimatePeaks([0, Infinity])).toThrow(expect.objectContaining({ code: 'non-finite-sample', index: 1 }));
    expect(() => decimatePeaks([0, 1], { gate: -1 })).toThrow(expect.objectContaining({ field: 'gate', value: -1 }));
    expect(() => decimatePeaks([0, 1], { gates: 1 } as never)).toThrow(expect.objectContaining({ code: 'unknown-option' }));
  });

  it('keeps the rainflow cycles above the gate: same ranges, means, counts and sample indices (property)', () => {
    // the oracle is @loopwise/rainflow (four-point counting, ASTM E1049-85 5.4.4) on the whole history
    checkProperty(
      'decimation keeps rainflow cycles',
      fc.property(
        fc.array(fc.integer({ min: -20, max: 20 }), { minLength: 0, maxLength: 300 }),
        fc.constantFrom(0, 1, 2.5, 7),
        (values, gate) => {
          const d = decimatePeaks(values, { gate });
          expect(cycles(d.values, gate, d.indices)).toEqual(cycles(values, gate));
          expect(d.indices.length).toBeLessThanOrEqual(values.length);
        },
      ),
      { numRuns: 500 },
    );
  });
});

describe('new PeakDecimator({ gate })', () => {
  it('keeps the same samples as decimatePeaks for any chunking (property)', () => {
    checkProperty(
      'decimation chunking invariance',
      fc.property(fc.array(fc.integer({ min: -20, max: 20 }), { maxLength: 300 }), fc.array(fc.nat(300), { maxLength: 6 }), fc.constantFrom(0, 1, 2.5, 7), (values, cuts, gate) => {
        const whole = decimatePeaks(values, { gate });
        const d = new PeakDecimator({ gate });
        const v = new Float64Array(values.length + 8);
        const ix = new Float64Array(values.length + 8);
        let from = 0;
        let w = 0;
        for (const c of [...cuts.map((c) => c % (values.length + 1)), values.length].sort((p, q) => p - q)) {
          w += d.push(values.slice(from, Math.max(from, c)), v, ix, w);
          from = Math.max(from, c);
        }
        w += d.finish(v, ix, w);
        expect(Array.from(v.subarray(0, w))).toEqual(Array.from(whole.values));
        expect(Array.from(ix.subarray(0, w))).toEqual(Array.from(whole.indices));
      }),
      { numRuns: 300 },
    );
  });

  it('names the sample index of a NaN in a later chunk', () => {
    const d = new PeakDecimator();
    const out = new Float64Array(8);
    d.push([1, 2, 3], out, out.slice());
    expect(() => d.push([4, NaN], out, out.slice())).toThrow(expect.objectContaining({ code: 'non-finite-sample', index: 4 }));
  });
});
