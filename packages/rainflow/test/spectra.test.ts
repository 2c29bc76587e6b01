import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { InvalidOptionError, levelCrossings, rainflow, rangeSpectrum } from '@loopwise/rainflow';
import { checkProperty } from '../../../test/property';
import { tiedHistory } from './support/arbitraries';

describe('levelCrossings(history, levels)', () => {
  test('levelCrossings counts up- and down-crossings on a hand example', () => {
    const c = levelCrossings([0, 3, -1, 2], [0, 1, 2, 3]);
    expect(Array.from(c.up)).toEqual([1, 2, 2, 1]);
    expect(Array.from(c.down)).toEqual([1, 1, 1, 1]);
  });

  test('levelCrossings equals a brute-force count over consecutive samples', () => {
    checkProperty(
      'crossings = brute force',
      fc.property(tiedHistory(60), (h) => {
        const levels = [-5.5, -2, -0.5, 0, 1, 3.5, 6];
        const c = levelCrossings(h, levels);
        levels.forEach((L, k) => {
          let up = 0;
          let down = 0;
          for (let i = 1; i < h.length; i++) {
            if (h[i - 1] < L && L <= h[i]) up++;
            if (h[i] < L && L <= h[i - 1]) down++;
          }
          expect(c.up[k]).toBe(up);
          expect(c.down[k]).toBe(down);
        });
      }),
      { numRuns: 500 },
    );
  });

  test('levelCrossings rejects levels that are not increasing or not finite', () => {
    expect(() => levelCrossings([0, 1], [1, 0])).toThrow(InvalidOptionError);
    expect(() => levelCrossings([0, 1], [0, Infinity])).toThrow(/levels\[1\]/);
  });
});

describe('rangeSpectrum(cycles)', () => {
  test('rangeSpectrum of the ASTM E1049 5.4.4 example accumulates from the largest range', () => {
    // ranges and counts of ASTM E1049-85 5.4.4 (values from memory, see ../shared/reference/README.md)
    const s = rangeSpectrum(rainflow([-2, 1, -3, 5, -1, 3, -4, 4, -2]).cycles!);
    expect(Array.from(s.range)).toEqual([9, 8, 6, 4, 3]);
    expect(Array.from(s.exceedances)).toEqual([0.5, 1.5, 2, 3.5, 4]);
  });

  test('rangeSpectrum of no cycles is empty', () => {
    const s = rangeSpectrum(rainflow([1]).cycles!);
    expect(s.range.length).toBe(0);
  });
});
