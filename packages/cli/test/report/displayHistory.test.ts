// Invented signals (tests only).
import { describe, expect, it } from 'vitest';
import { displayHistory } from '../../src/report/displayHistory.js';

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
