import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { MinerSum, damageTimeline } from '@loopwise/miner';
import { checkProperty } from '../../../test/property';
import { closeRelative, loopRecords, toColumns } from './support/arbitraries';

describe('damageTimeline(loops, {binSize, sampleCount?, out?})', () => {
  test('damageTimeline gives half of each loop to the bin of each reversal (the TSDoc example)', () => {
    const t = damageTimeline({ damage: [0.2, 0.1], startIndex: [0, 5], turnIndex: [9, 6] }, { binSize: 5 });
    expect(Array.from(t)).toEqual([0.1, 0.2]);
  });

  test('damageTimeline bins sum to the total damage for any bin size (property)', () => {
    checkProperty(
      'timeline sums to total',
      fc.property(loopRecords(200), fc.integer({ min: 1, max: 250 }), (loops, binSize) => {
        const sum = new MinerSum().addColumns(toColumns(loops));
        const t = damageTimeline(sum, { binSize, sampleCount: 200 });
        expect(t.length).toBe(Math.ceil(200 / binSize));
        const s = t.reduce((a, b) => a + b, 0);
        expect(closeRelative(s, sum.damage(), 1e-12)).toBe(true);
      }),
    );
  });

  test('damageTimeline with binSize 1 equals a brute-force per-sample attribution (property)', () => {
    checkProperty(
      'timeline brute force',
      fc.property(loopRecords(50), (loops) => {
        const sum = new MinerSum().addColumns(toColumns(loops));
        const t = damageTimeline(sum, { binSize: 1, sampleCount: 50 });
        const brute = new Array(50).fill(0);
        const d = sum.columns().damage;
        loops.forEach((l, i) => {
          brute[l.startIndex] += d[i] / 2;
          brute[l.turnIndex] += d[i] / 2;
        });
        expect(Array.from(t)).toEqual(brute);
      }),
    );
  });

  test('damageTimeline defaults sampleCount to the largest index + 1 and reuses a caller-owned out', () => {
    const loops = { damage: [1], startIndex: [3], turnIndex: [7] };
    expect(Array.from(damageTimeline(loops, { binSize: 4 }))).toEqual([0.5, 0.5]);
    const out = new Float64Array(5).fill(9);
    const t = damageTimeline(loops, { binSize: 4, sampleCount: 8, out });
    expect(Array.from(t)).toEqual([0.5, 0.5]);
    expect(t.buffer).toBe(out.buffer);
    expect(Array.from(damageTimeline({ damage: [], startIndex: [], turnIndex: [] }, { binSize: 10 }))).toEqual([0]);
  });

  test('damageTimeline rejects bad bin sizes, indices beyond sampleCount, NaN damage', () => {
    const loops = { damage: [1], startIndex: [3], turnIndex: [7] };
    expect(() => damageTimeline(loops, { binSize: 0 })).toThrow(expect.objectContaining({ code: 'invalid-argument', field: 'binSize' }));
    expect(() => damageTimeline(loops, { binSize: 1.5 })).toThrow(/binSize = 1.5/);
    expect(() => damageTimeline(loops, { binSize: 2, sampleCount: 7 })).toThrow(expect.objectContaining({ code: 'invalid-index', field: 'turnIndex', index: 0 }));
    expect(() => damageTimeline({ ...loops, damage: [NaN] }, { binSize: 2 })).toThrow(expect.objectContaining({ field: 'damage', index: 0 }));
    expect(() => damageTimeline({ ...loops, startIndex: [-1] }, { binSize: 2 })).toThrow(expect.objectContaining({ code: 'invalid-index' }));
    expect(() => damageTimeline(loops, { binSize: 2, out: new Float64Array(1) })).toThrow(expect.objectContaining({ field: 'out' }));
  });
});
