import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { MinerSum, mostDamagingLoops } from '@loopwise/miner';
import { checkProperty } from '../../../test/property';
import { loopRecords, toColumns } from './support/arbitraries';

describe('mostDamagingLoops(loops, n)', () => {
  test('mostDamagingLoops orders by damage, ties to the lower index (the TSDoc example)', () => {
    expect(Array.from(mostDamagingLoops({ damage: [0.1, 0.5, 0.2, 0.5] }, 3))).toEqual([1, 3, 2]);
    expect(Array.from(mostDamagingLoops({ damage: [0.1, 0.5] }, 0))).toEqual([]);
    expect(Array.from(mostDamagingLoops({ damage: [0.1, 0.5] }, 5))).toEqual([1, 0]);
    expect(Array.from(mostDamagingLoops({ damage: [] }, 5))).toEqual([]);
  });

  test('mostDamagingLoops equals the first n of a brute-force full sort (property)', () => {
    checkProperty(
      'top-n equals sort',
      fc.property(loopRecords(100, 120), fc.integer({ min: 0, max: 130 }), (loops, n) => {
        const sum = new MinerSum().addColumns(toColumns(loops));
        const d = sum.columns().damage;
        const brute = Array.from(d, (_, i) => i)
          .sort((a, b) => d[b] - d[a] || a - b)
          .slice(0, n);
        expect(Array.from(mostDamagingLoops(sum, n))).toEqual(brute);
      }),
    );
  });

  test('mostDamagingLoops rejects a bad n and NaN damage, naming the index', () => {
    expect(() => mostDamagingLoops({ damage: [1] }, -1)).toThrow(expect.objectContaining({ code: 'invalid-argument', field: 'n' }));
    expect(() => mostDamagingLoops({ damage: [1] }, 1.5)).toThrow(/n = 1.5/);
    expect(() => mostDamagingLoops({ damage: [1, NaN] }, 1)).toThrow(expect.objectContaining({ field: 'damage', index: 1 }));
    expect(() => mostDamagingLoops({ damage: [1, -Infinity] }, 1)).toThrow(expect.objectContaining({ field: 'damage', index: 1 }));
  });
});
