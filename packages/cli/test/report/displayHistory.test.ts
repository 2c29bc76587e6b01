// Invented signals (tests only).
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { checkProperty } from '../../../../test/property';
import { DisplayHistory, displayHistory } from '../../src/report/displayHistory.js';

describe('displayHistory(values, buckets)', () => {
  it('copies a short history whole, with its indices', () => {
    const h = displayHistory([3, 1, 2], 10);
    expect([...h.index]).toEqual([0, 1, 2]);
    expect([...h.value]).toEqual([3, 1, 2]);
    expect(displayHistory([], 10).index.length).toBe(0);
  });

  it('keeps the extremes of each bucket in index order, and both ends', () => {
    const n = 10000;
    const x = Float64Array.from({ length: n }, (_, i) => Math.sin(i * 0.37) * (i === 4321 ? 50 : 1));
    const h = displayHistory(x, 100);
    expect(h.index.length).toBeLessThanOrEqual(202);
    expect(h.index[0]).toBe(0);
    expect(h.index[h.index.length - 1]).toBe(n - 1);
    for (let i = 1; i < h.index.length; i++) expect(h.index[i]).toBeGreaterThan(h.index[i - 1]);
    for (let i = 0; i < h.index.length; i++) expect(h.value[i]).toBe(x[h.index[i]]);
    expect([...h.index]).toContain(4321);
    expect(Math.max(...h.value)).toBe(Math.max(...x));
    expect(Math.min(...h.value)).toBe(Math.min(...x));
  });
});

describe('DisplayHistory (streaming)', () => {
  it('gives the batch copy for any chunking, keeping the ends and the extremes', () => {
    checkProperty(
      'streamed display copy = batch',
      fc.property(
        fc.array(fc.double({ min: -100, max: 100, noNaN: true }), { maxLength: 400 }),
        fc.array(fc.integer({ min: 1, max: 50 }), { minLength: 1, maxLength: 20 }),
        fc.integer({ min: 1, max: 20 }),
        (values, sizes, buckets) => {
          const d = new DisplayHistory(buckets);
          let at = 0;
          for (let k = 0; at < values.length; k++) {
            const n = sizes[k % sizes.length];
            d.push(values.slice(at, at + n), at);
            at += n;
          }
          const streamed = d.points();
          const batch = displayHistory(values, buckets);
          expect([...streamed.index]).toEqual([...batch.index]);
          expect([...streamed.value]).toEqual([...batch.value]);
          if (values.length > 0) {
            expect(streamed.index[0]).toBe(0);
            expect(streamed.index[streamed.index.length - 1]).toBe(values.length - 1);
            expect(Math.max(...streamed.value)).toBe(Math.max(...values));
            expect(Math.min(...streamed.value)).toBe(Math.min(...values));
            expect(streamed.index.length).toBeLessThanOrEqual(2 * buckets + 2);
          }
        },
      ),
      { numRuns: 300 },
    );
  });
});
