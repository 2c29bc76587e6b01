import { describe, expect, test } from 'vitest';
import { envelopeInto, envelopeLevels } from '../src/envelope';
import { mulberry32 } from '../../../fixtures/generate.mjs';

// The page's history plot: the envelope from the pyramid must equal the smallest and largest
// sample of each pixel, found by a plain scan (the oracle), for any view and width.
function plainEnvelope(values: Float32Array, from: number, to: number, width: number): [number[], number[]] {
  const s = (to - from) / width;
  const lo: number[] = [];
  const hi: number[] = [];
  for (let p = 0; p < width; p++) {
    const i0 = from + Math.floor(p * s);
    const i1 = Math.max(i0 + 1, Math.min(to, from + Math.floor((p + 1) * s)));
    let a = Infinity;
    let b = -Infinity;
    for (let i = i0; i < i1; i++) {
      a = Math.min(a, values[i]);
      b = Math.max(b, values[i]);
    }
    lo.push(a);
    hi.push(b);
  }
  return [lo, hi];
}

describe('envelopeInto(values, levels, from, to, width, min, max)', () => {
  test('equals a plain scan of each pixel for views from a few samples to the whole history', () => {
    // Arrange: an invented random history (seeded) long enough for three levels
    const next = mulberry32(7);
    const values = new Float32Array(300_001);
    for (let i = 0; i < values.length; i++) values[i] = (next() - 0.5) * 1000 + (i % 997 === 0 ? 5000 : 0);
    const levels = envelopeLevels(values);
    expect(levels.map((l) => l.block)).toEqual([16, 256, 4096]);
    for (const [from, to, width] of [[0, values.length, 1200], [12345, 12400, 300], [777, 250_000, 317], [0, 10, 40], [99_999, 299_999, 2]]) {
      const min = new Float32Array(width);
      const max = new Float32Array(width);
      // Act
      envelopeInto(values, levels, from, to, width, min, max);
      // Assert
      const [lo, hi] = plainEnvelope(values, from, to, width);
      expect(Array.from(min)).toEqual(lo);
      expect(Array.from(max)).toEqual(hi);
    }
  });

  test('a short history has no levels and is scanned sample by sample', () => {
    const values = Float32Array.from([3, -1, 4, 1, -5]);
    expect(envelopeLevels(values)).toEqual([]);
    const min = new Float32Array(2);
    const max = new Float32Array(2);
    envelopeInto(values, [], 0, 5, 2, min, max);
    expect([Array.from(min), Array.from(max)]).toEqual([[-1, -5], [3, 4]]);
  });
});
