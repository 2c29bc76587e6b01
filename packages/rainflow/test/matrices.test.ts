import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { binIndex } from '@loopwise/base';
import { BinError, FromToMatrix, InvalidOptionError, OutsideBinsError, RangeMeanMatrix, binEdges, rainflow } from '@loopwise/rainflow';
import { checkProperty } from '../../../test/property';
import { tiedHistory } from './support/arbitraries';

const bins = { range: { count: 12, min: 0, max: 12 }, mean: { count: 12, min: -6, max: 6 } };

describe('binEdges(spec, field)', () => {
  test('binEdges({count, min, max}) makes count equal bins ending exactly at max', () => {
    expect(Array.from(binEdges({ count: 4, min: 0, max: 100 }, 'range'))).toEqual([0, 25, 50, 75, 100]);
    expect(binEdges({ count: 3, min: 0, max: 0.3 }, 'x')[3]).toBe(0.3);
  });

  test('the bins of binEdges are looked up with binIndex of @loopwise/base', () => {
    const e = binEdges({ edges: [0, 1, 2, 3] }, 'x');
    expect([0, 0.5, 1, 2.999, 3].map((v) => binIndex(e, v))).toEqual([0, 0, 1, 2, 2]);
  });

  test('binEdges rejects edges that do not increase, are not finite or are too few', () => {
    expect(() => binEdges({ edges: [0, 2, 1] }, 'range')).toThrow(BinError);
    expect(() => binEdges({ edges: [0, 2, 1] }, 'range')).toThrow(/range: edges must increase strictly: edge 2/);
    expect(() => binEdges({ edges: [0, 0] }, 'mean')).toThrow(/mean/);
    expect(() => binEdges({ edges: [0, NaN] }, 'x')).toThrow(/finite/);
    expect(() => binEdges({ edges: [1] }, 'x')).toThrow(/two edges/);
    expect(() => binEdges({ count: 0, min: 0, max: 1 }, 'x')).toThrow(/count/);
    expect(() => binEdges({ count: 2, min: 1, max: 1 }, 'x')).toThrow(/min < max/);
  });

  test('binEdges errors carry code invalid-bins, the field, the bad value and the edge index', () => {
    expect(() => binEdges({ edges: [0, 2, 1] }, 'range')).toThrow(
      expect.objectContaining({ code: 'invalid-bins', field: 'range', value: 1, index: 2 }),
    );
    expect(() => binEdges({ edges: [0, NaN] }, 'mean')).toThrow(expect.objectContaining({ code: 'invalid-bins', field: 'mean', index: 1 }));
    expect(() => binEdges({ count: 0, min: 0, max: 1 }, 'from')).toThrow(expect.objectContaining({ field: 'from', value: 0, index: undefined }));
  });
});

describe('RangeMeanMatrix and FromToMatrix', () => {
  test('a matrix holds every count: inside plus outside equals the cycle table total', () => {
    checkProperty(
      'no silent loss',
      fc.property(tiedHistory(80), (h) => {
        const small = new RangeMeanMatrix({ range: { count: 3, min: 0, max: 3 }, mean: { count: 2, min: -1, max: 1 } });
        const r = rainflow(h);
        r.cycles!.replayInto(small);
        expect(small.totalCount()).toBe(r.cycles!.totalCount());
        const ft = new FromToMatrix({ from: { count: 4, min: -2, max: 2 }, to: { count: 4, min: -2, max: 2 } });
        r.cycles!.replayInto(ft);
        expect(ft.totalCount()).toBe(r.cycles!.totalCount());
      }),
      { numRuns: 300 },
    );
  });

  test('the ASTM E1049 5.4.4 example lands in the expected range-mean bins', () => {
    // ASTM E1049-85 5.4.4 example (values from memory, see ../shared/reference/README.md)
    const m = new RangeMeanMatrix(bins);
    rainflow([-2, 1, -3, 5, -1, 3, -4, 4, -2], { sink: m });
    expect(m.at(4, 7)).toBe(1); // range 4, mean 1 (the full cycle -1 → 3)
    expect(m.at(9, 6)).toBe(0.5); // range 9, mean 0.5 (5 → -4)
    expect(m.totalCount()).toBe(4);
    expect(m.outside.count).toBe(0);
  });

  test("outside: 'error' throws OutsideBinsError naming the coordinate outside and the cycle's start sample", () => {
    const m = new RangeMeanMatrix({ ...bins, range: { count: 2, min: 0, max: 2 }, outside: 'error' });
    expect(() => rainflow([0, 5, 0], { sink: m })).toThrow(OutsideBinsError);
    expect(() => rainflow([0, 5, 0], { sink: new RangeMeanMatrix({ ...bins, range: { count: 2, min: 0, max: 2 }, outside: 'error' }) })).toThrow(
      expect.objectContaining({ code: 'outside-bins', field: 'range', value: 5, index: 0, row: 5, column: 2.5, startIndex: 0 }),
    );
    const ft = new FromToMatrix({ from: { count: 2, min: -1, max: 6 }, to: { count: 2, min: -1, max: 1 }, outside: 'error' });
    expect(() => ft.addCycle(0, 5, 1, 7)).toThrow(expect.objectContaining({ field: 'to', value: 5, index: 7 }));
    expect(() => ft.addCycle(0, 5, 1, 7)).toThrow(/to: 5 of the cycle starting at sample 7 is outside the bins/);
    expect(new OutsideBinsError('range', 5, 5, 2.5, 0)).toBeInstanceOf(BinError);
  });

  test("a matrix with a bad outside option throws InvalidOptionError naming it", () => {
    expect(() => new RangeMeanMatrix({ ...bins, outside: 'drop' as never })).toThrow(InvalidOptionError);
    expect(() => new RangeMeanMatrix({ ...bins, outside: 'drop' as never })).toThrow(
      expect.objectContaining({ code: 'invalid-option', field: 'outside', value: 'drop' }),
    );
  });

  test('matrix.add(other) sums two recordings and equals counting them into one matrix', () => {
    const a = new RangeMeanMatrix(bins);
    const b = new RangeMeanMatrix(bins);
    const both = new RangeMeanMatrix(bins);
    rainflow([0, 3, -2, 4, 0], { sink: a });
    rainflow([1, -3, 2, -1], { sink: b });
    rainflow([0, 3, -2, 4, 0], { sink: both });
    rainflow([1, -3, 2, -1], { sink: both });
    expect(Array.from(a.add(b).counts)).toEqual(Array.from(both.counts));
  });

  test('matrix.scale(repeats) multiplies every count; add refuses different bins or kinds', () => {
    const a = new RangeMeanMatrix(bins);
    rainflow([0, 3, -2, 4, 0], { sink: a });
    const total = a.totalCount();
    expect(a.scale(1000).totalCount()).toBe(total * 1000);
    expect(() => a.scale(-1)).toThrow(expect.objectContaining({ code: 'invalid-option', field: 'factor', value: -1 }));
    expect(() => a.add(new RangeMeanMatrix({ ...bins, mean: { count: 6, min: -6, max: 6 } }))).toThrow(/different bins/);
    expect(() => a.add(new FromToMatrix({ from: bins.range, to: bins.mean }) as never)).toThrow(/from-to/);
  });

  test('RangeMeanMatrix.fromJSON(JSON round trip) restores counts and the outside tally exactly', () => {
    const a = new RangeMeanMatrix({ range: { count: 2, min: 0, max: 2 }, mean: bins.mean });
    rainflow([0, 5, -0, 1, 0.5, 1], { sink: a });
    const text = JSON.stringify(a);
    const b = RangeMeanMatrix.fromJSON(JSON.parse(text));
    expect(JSON.stringify(b)).toBe(text);
    expect(b.outside).toEqual(a.outside);
    expect(() => FromToMatrix.fromJSON(JSON.parse(text))).toThrow(/from-to/);
    expect(() => RangeMeanMatrix.fromJSON({ ...JSON.parse(text), counts: [1] })).toThrow(/counts/);
  });

  test('a from-to matrix keeps the direction of each cycle', () => {
    const m = new FromToMatrix({ from: { count: 2, min: -1, max: 1 }, to: { count: 2, min: -1, max: 1 } });
    m.addCycle(-0.5, 0.5, 1, 0);
    expect(m.at(0, 1)).toBe(1);
    expect(m.at(1, 0)).toBe(0);
  });
});
