import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { NonFiniteSampleError, RangeOverflowError, rainflow, rainflowFourPoint, turningPoints } from '@loopwise/rainflow';
import { checkProperty } from '../../../test/property';
import { anyHistory, tiedHistory } from './support/arbitraries';
import { astmRainflow, astmRepeating, referenceTurningPoints } from './support/astmE1049.mjs';
import { cycleKeys, rangeMeanKeys, rows } from './support/rows';

// ASTM E1049-85 (reapproved 2017), section 5.4.4 and its figure of the rainflow example: the
// peaks and valleys -2, 1, -3, 5, -1, 3, -4, 4, -2 (values from memory, confirmed by two
// independent hand counts; see ../shared/reference/README.md).
const ASTM_EXAMPLE = [-2, 1, -3, 5, -1, 3, -4, 4, -2];

function countsByRange(table: ReturnType<typeof rainflow>['cycles']): Record<number, number> {
  const out: Record<number, number> = {};
  for (const r of rows(table)) out[r.range] = (out[r.range] ?? 0) + r.count;
  return out;
}

describe('rainflowFourPoint(history, options)', () => {
  test("rainflow(ASTM E1049 5.4.4 example, {residue: 'half'}) gives its table of ranges and counts", () => {
    // Expected table, ASTM E1049-85 5.4.4 example: range 3: 0.5, 4: 1.5, 6: 0.5, 8: 1.0, 9: 0.5.
    const { cycles } = rainflow(ASTM_EXAMPLE, { residue: 'half' });
    expect(countsByRange(cycles)).toEqual({ 3: 0.5, 4: 1.5, 6: 0.5, 8: 1, 9: 0.5 });
    // The one full cycle is -1 → 3 (samples 4 and 5), closed by the valley -4 at sample 6.
    expect(rows(cycles).filter((c) => c.count === 1)).toEqual([
      { range: 4, mean: 1, from: -1, to: 3, count: 1, startIndex: 4, turnIndex: 5, closeIndex: 6 },
    ]);
  });

  test("rainflow(ASTM E1049 5.4.4 example, {residue: 'repeat'}) gives the repeating-history count", () => {
    // ASTM E1049-85 5.4.5 (repeating history, counted from the largest peak): one full cycle each
    // of ranges 3, 4, 7 and 9 (values from memory, confirmed by two hand counts).
    const r = rainflow(ASTM_EXAMPLE, { residue: 'repeat' });
    expect(countsByRange(r.cycles)).toEqual({ 3: 1, 4: 1, 7: 1, 9: 1 });
    expect(Array.from(r.residue.values)).toEqual([-2, 1, -3, 5, -4, 4, -2]);
  });

  test("rainflow(ASTM example, {residue: 'none'}) keeps only the full cycle and returns the standard's final list", () => {
    // the list left at the end of ASTM E1049-85 5.4.4 steps 1-5: 5, -4, 4, -2 (samples 3, 6, 7, 8)
    const r = rainflow(ASTM_EXAMPLE, { residue: 'none' });
    expect(countsByRange(r.cycles)).toEqual({ 4: 1 });
    expect(Array.from(r.residue.indices)).toEqual([3, 6, 7, 8]);
  });

  test("rainflow(history, {residue: 'half'}) keeps only the standard's list: memory stays small on constant amplitude", () => {
    // 10^5 exact repeats of 0, 1: every range ties the one before it
    const h = new Float64Array(200001);
    for (let i = 0; i < h.length; i++) h[i] = i % 2;
    const r = rainflow(h);
    expect(r.residue.values.length).toBe(2);
    expect(r.cycles!.totalCount()).toBe(100000);
  });

  test('rainflow is the documented alias of rainflowFourPoint', () => {
    expect(rainflow).toBe(rainflowFourPoint);
  });

  test("rainflow(history, {residue: 'half'}) equals the literal ASTM E1049 5.4.4 procedure cycle by cycle", () => {
    // Same cycles, same half cycles, same sample indices: the four-point rule with the tie
    // convention of the package (a range equal to the one before it closes that earlier range,
    // as the standard's X >= Y does) is the standard's procedure run on a stack.
    checkProperty(
      'four-point with half residue = ASTM E1049 5.4.4 three-point procedure',
      fc.property(anyHistory(80), (h) => {
        const expected = astmRainflow(referenceTurningPoints(h));
        const got = rows(rainflow(h, { residue: 'half' }).cycles);
        expect(cycleKeys(got)).toEqual(cycleKeys(expected));
      }),
      { numRuns: 4000 },
    );
  });

  test("rainflow(history, {residue: 'repeat'}) equals the literal ASTM E1049 5.4.5 repeating-history count", () => {
    checkProperty(
      'four-point with repeat residue = ASTM E1049 5.4.5',
      fc.property(anyHistory(60), (h) => {
        const expected = astmRepeating(referenceTurningPoints(h));
        const got = rows(rainflow(h, { residue: 'repeat' }).cycles);
        expect(rangeMeanKeys(got)).toEqual(rangeMeanKeys(expected));
      }),
      { numRuns: 3000 },
    );
  });

  test('count conservation: twice the full cycles plus the half cycles equals the number of ranges', () => {
    checkProperty(
      'count conservation',
      fc.property(anyHistory(80), (h) => {
        const r = rainflow(h, { residue: 'half' });
        let units = 0;
        for (const c of rows(r.cycles)) units += c.count === 1 ? 2 : 1;
        expect(units).toBe(Math.max(0, r.turningPointCount - 1));
      }),
      { numRuns: 1000 },
    );
  });

  test("rainflow(history, {residue: 'repeat'}) leaves nothing open: full cycles cover every cyclic range", () => {
    checkProperty(
      'repeat closes everything',
      fc.property(anyHistory(60), (h) => {
        const r = rainflow(h, { residue: 'repeat' });
        const ring = referenceTurningPoints(h).map((p) => p.value);
        // circular peaks and valleys, as the standard's repeating history sees them
        while (ring.length > 1 && ring[ring.length - 1] === ring[0]) ring.pop();
        const reversals = ring.filter((v, k) => {
          const p = ring[(k - 1 + ring.length) % ring.length];
          const q = ring[(k + 1) % ring.length];
          return Math.sign(v - p) !== Math.sign(q - v);
        }).length;
        const c = rows(r.cycles);
        expect(c.every((x) => x.count === 1)).toBe(true);
        expect(2 * c.length).toBe(reversals >= 2 ? reversals : 0);
      }),
      { numRuns: 1000 },
    );
  });

  test('rainflow(k · history) scales every range, from and to by k (k a power of two, so exactly)', () => {
    checkProperty(
      'scaling',
      // integer histories: k · x is exact for |e| <= 20, so ties stay ties
      fc.property(tiedHistory(60), fc.integer({ min: -20, max: 20 }), (h, e) => {
        const k = 2 ** e;
        const a = rows(rainflow(h).cycles);
        const b = rows(rainflow(h.map((x) => k * x)).cycles);
        expect(b.map((c) => [c.range, c.from, c.to, c.count])).toEqual(a.map((c) => [k * c.range, k * c.from, k * c.to, c.count]));
      }),
      { numRuns: 500 },
    );
  });

  test('rainflow(history + c) moves every mean by c and leaves ranges and counts unchanged', () => {
    checkProperty(
      'offset',
      fc.property(tiedHistory(60), fc.integer({ min: -1000, max: 1000 }), (h, c) => {
        const a = rows(rainflow(h).cycles);
        const b = rows(rainflow(h.map((x) => x + c)).cycles);
        expect(b.map((x) => [x.range, x.mean, x.count, x.startIndex])).toEqual(a.map((x) => [x.range, x.mean + c, x.count, x.startIndex]));
      }),
      { numRuns: 500 },
    );
  });

  test('rainflow(history) agrees with turningPoints(history) on the turning points it counted', () => {
    checkProperty(
      'turning point count',
      fc.property(anyHistory(80), (h) => {
        expect(rainflow(h).turningPointCount).toBe(turningPoints(h).values.length);
      }),
      { numRuns: 500 },
    );
  });
});

describe('rainflowFourPoint edge cases', () => {
  test('rainflow([]) gives no cycles and an empty residue', () => {
    const r = rainflow([]);
    expect(r.cycles?.length).toBe(0);
    expect(r.residue.values.length).toBe(0);
    expect(r.sampleCount).toBe(0);
  });

  test('rainflow([x]) and a constant history give no cycles and a one-point residue', () => {
    for (const h of [[3], [2, 2, 2, 2]]) {
      for (const residue of ['half', 'repeat', 'none'] as const) {
        const r = rainflow(h, { residue });
        expect(r.cycles?.length).toBe(0);
        expect(Array.from(r.residue.values)).toEqual([h[0]]);
      }
    }
  });

  test('rainflow(history with NaN or ±Infinity) throws NonFiniteSampleError naming the sample', () => {
    for (const bad of [NaN, Infinity, -Infinity]) {
      const h = [0, 1, -1, bad, 2];
      expect(() => rainflow(h)).toThrow(NonFiniteSampleError);
      try {
        rainflow(h);
      } catch (e) {
        expect((e as NonFiniteSampleError).index).toBe(3);
        expect((e as NonFiniteSampleError).code).toBe('non-finite-sample');
        expect((e as NonFiniteSampleError).field).toBe('history');
        expect(Object.is((e as NonFiniteSampleError).value, bad)).toBe(true);
        expect((e as Error).message).toContain('sample 3');
      }
    }
    expect(() => rainflow([NaN])).toThrow(/sample 0/);
  });

  test('rainflow keeps -0 as a value and treats it as equal to 0 (a plateau)', () => {
    const r = rainflow([-0, 0, 1, -0], { residue: 'repeat' });
    expect(Object.is(r.residue.values[0], -0)).toBe(true);
    expect(Array.from(r.residue.indices)).toEqual([0, 2, 3]);
  });

  test('rainflow works at 1e-300 and 1e300 magnitudes: same counts and indices, ranges scaled', () => {
    const plain = rows(rainflow(ASTM_EXAMPLE).cycles);
    for (const s of [1e-300, 1e300]) {
      const scaled = rows(rainflow(ASTM_EXAMPLE.map((x) => x * s)).cycles);
      expect(scaled.map((c) => [c.count, c.startIndex, c.turnIndex, c.closeIndex])).toEqual(
        plain.map((c) => [c.count, c.startIndex, c.turnIndex, c.closeIndex]),
      );
      scaled.forEach((c, i) => {
        expect(Number.isFinite(c.range) && Number.isFinite(c.mean)).toBe(true);
        expect(Math.abs(c.range / s - plain[i].range)).toBeLessThanOrEqual(1e-14 * plain[i].range);
      });
    }
  });

  test('rainflow of values whose range overflows a double throws RangeOverflowError naming both samples', () => {
    expect(() => rainflow([0, 1.5e308, -1.5e308, 1.5e308])).toThrow(RangeOverflowError);
    // the first range that overflows is 1.5e308 → -1.5e308, samples 1 and 2
    expect(() => rainflow([0, 1.5e308, -1.5e308, 1.5e308])).toThrow(
      expect.objectContaining({ code: 'range-overflow', field: 'history', index: 1, value: 1.5e308, startIndex: 1, turnIndex: 2 }),
    );
  });
});
