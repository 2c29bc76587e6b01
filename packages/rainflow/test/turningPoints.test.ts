import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { InvalidOptionError, NonFiniteSampleError, ReversalFilter, turningPoints } from '@loopwise/rainflow';
import { checkProperty } from '../../../test/property';
import { anyHistory, chunking, cut, tiedHistory } from './support/arbitraries';
import { referenceTurningPoints } from './support/astmE1049.mjs';

describe('turningPoints(history, options)', () => {
  test('turningPoints(history) collapses plateaus to their first sample and keeps the first and last', () => {
    const tp = turningPoints([1, 1, 2, 3, 3, 3, 0, 0, 4, 4]);
    expect(Array.from(tp.values)).toEqual([1, 3, 0, 4]);
    expect(Array.from(tp.indices)).toEqual([0, 3, 6, 8]);
    expect(tp.removed).toBe(0);
  });

  test('turningPoints(history) equals the peaks and valleys of ASTM E1049-85 3.1 (literal reference)', () => {
    checkProperty(
      'turning points = reference',
      fc.property(anyHistory(100), (h) => {
        const tp = turningPoints(h);
        const ref = referenceTurningPoints(h);
        expect(Array.from(tp.values)).toEqual(ref.map((p) => p.value));
        expect(Array.from(tp.indices)).toEqual(ref.map((p) => p.index));
      }),
      { numRuns: 2000 },
    );
  });

  test('turningPoints(history, {gate}) keeps alternating points whose inner ranges all reach the gate', () => {
    checkProperty(
      'gate invariants',
      fc.property(anyHistory(100), fc.double({ min: 0, max: 8, noNaN: true }), (h, gate) => {
        const tp = turningPoints(h, { gate });
        const v = tp.values;
        for (let k = 1; k + 1 < v.length; k++) {
          expect(Math.sign(v[k] - v[k - 1])).toBe(-Math.sign(v[k + 1] - v[k])); // alternate
          if (k >= 1 && k + 1 < v.length - 1) expect(Math.abs(v[k + 1] - v[k])).toBeGreaterThanOrEqual(gate);
        }
        // every kept point is a turning point of the raw history, and the count adds up
        const raw = turningPoints(h);
        const rawIdx = new Set(Array.from(raw.indices));
        for (const i of tp.indices) expect(rawIdx.has(i)).toBe(true);
        expect(tp.removed).toBe(gate > 0 ? raw.values.length - v.length : 0);
      }),
      { numRuns: 1500 },
    );
  });

  test('turningPoints(history, {gate: g}) with g at or below the smallest raw range changes nothing', () => {
    checkProperty(
      'small gate is transparent',
      fc.property(tiedHistory(80), (h) => {
        const raw = turningPoints(h);
        fc.pre(raw.values.length >= 2);
        let smallest = Infinity;
        for (let k = 1; k < raw.values.length; k++) smallest = Math.min(smallest, Math.abs(raw.values[k] - raw.values[k - 1]));
        const gated = turningPoints(h, { gate: smallest });
        // the last point is pending until the end, so a last range below the gate would drop it;
        // with every range >= the gate nothing drops
        expect(Array.from(gated.indices)).toEqual(Array.from(raw.indices));
      }),
      { numRuns: 800 },
    );
  });

  test('turningPoints(history, {gateFraction}) uses the largest range of the history', () => {
    const h = [0, 10, 9, 10.5, -10, -9.5, 0];
    expect(turningPoints(h, { gateFraction: 0.1 }).gate).toBeCloseTo(2.05, 12);
    expect(Array.from(turningPoints(h, { gateFraction: 0.1 }).values)).toEqual([0, 10.5, -10, 0]);
    expect(turningPoints(h, { gateFraction: 0.1, fullScale: 40 }).gate).toBe(4);
  });

  test('turningPoints of empty, single, constant and -0 histories', () => {
    expect(turningPoints([]).values.length).toBe(0);
    expect(Array.from(turningPoints([7]).values)).toEqual([7]);
    expect(Array.from(turningPoints([2, 2, 2]).indices)).toEqual([0]);
    const z = turningPoints([-0, 0, -0]);
    expect(z.values.length).toBe(1);
    expect(Object.is(z.values[0], -0)).toBe(true);
  });

  test('turningPoints with NaN or ±Infinity throws NonFiniteSampleError with the index', () => {
    expect(() => turningPoints([0, 1, NaN])).toThrow(NonFiniteSampleError);
    expect(() => turningPoints([Infinity])).toThrow(/sample 0 is Infinity/);
    expect(() => turningPoints([0, -Infinity], { gate: 1 })).toThrow(/sample 1 is -Infinity/);
    expect(() => turningPoints([0, NaN], { gateFraction: 0.1 })).toThrow(/sample 1 is NaN/);
  });

  test('a NaN anywhere, before or after the first reversal and in any chunk, is named by its index', () => {
    checkProperty(
      'NaN index',
      fc.property(
        anyHistory(60).filter((h) => h.length > 0).chain((h) => fc.tuple(fc.constant(h), fc.nat(h.length - 1), chunking(h.length))),
        ([h, at, points]) => {
          const bad = Float64Array.from(h);
          bad[at] = NaN;
          const f = new ReversalFilter();
          const v = new Float64Array(h.length + 1);
          const i = new Float64Array(h.length + 1);
          let n = 0;
          expect(() => {
            for (const part of cut(Array.from(bad), points)) n += f.push(part, v, i, n);
          }).toThrow(new RegExp(`sample ${at} is NaN`));
        },
      ),
      { numRuns: 500 },
    );
  });

  test('turningPoints with bad gate options names the option', () => {
    expect(() => turningPoints([0, 1], { gate: -1 })).toThrow(InvalidOptionError);
    expect(() => turningPoints([0, 1], { gate: 1, gateFraction: 0.1 })).toThrow(/either gate or gateFraction/);
    expect(() => turningPoints([0, 1], { gateFraction: 1.5 })).toThrow(/gateFraction = 1.5/);
    expect(() => turningPoints([0, 1], { gateFraction: 0.1, fullScale: 0 })).toThrow(/fullScale = 0/);
    expect(() => turningPoints([0, 1], { fullScale: 10 })).toThrow(/only used with gateFraction/);
  });
});

describe('ReversalFilter', () => {
  test('filter.push(chunks) gives the batch turning points for every chunking', () => {
    checkProperty(
      'filter chunking',
      fc.property(
        anyHistory(80).chain((h) => fc.tuple(fc.constant(h), chunking(h.length))),
        fc.oneof(fc.constant(0), fc.double({ min: 0, max: 5, noNaN: true })),
        ([h, points], gate) => {
          const f = new ReversalFilter({ gate });
          const v = new Float64Array(h.length + 1);
          const i = new Float64Array(h.length + 1);
          let n = 0;
          for (const part of cut(h, points)) n += f.push(part, v, i, n);
          n += f.pendingInto(v, i, n);
          const batch = turningPoints(h, { gate });
          expect(Array.from(v.subarray(0, n))).toEqual(Array.from(batch.values));
          expect(Array.from(i.subarray(0, n))).toEqual(Array.from(batch.indices));
          expect(f.removedCount).toBe(batch.removed);
        },
      ),
      { numRuns: 1000 },
    );
  });

  test('ReversalFilter.fromJSON(filter.toJSON()) keeps -0 and ±Infinity exactly', () => {
    const f = new ReversalFilter({ gate: 0.5 });
    const v = new Float64Array(4);
    f.push([-0], v, v);
    const back = ReversalFilter.fromJSON(JSON.parse(JSON.stringify(f.toJSON())));
    expect(back.toJSON()).toEqual(f.toJSON());
    expect(JSON.stringify(f.toJSON())).toContain('"-0"');
  });
});

describe('turningPoints with keepLeadingExtremes', () => {
  test('keeps the extreme before the first reversal that the gate would drop', () => {
    // 38 precedes the first reversal 33: dropped by the plain gate, kept with the option
    expect(Array.from(turningPoints([35, 38, 33, 80], { gate: 6 }).values)).toEqual([35, 33, 80]);
    const kept = turningPoints([35, 38, 33, 80], { gate: 6, keepLeadingExtremes: true });
    expect(Array.from(kept.values)).toEqual([35, 38, 33, 80]);
    expect(Array.from(kept.indices)).toEqual([0, 1, 2, 3]);
    expect(kept.removed).toBe(0);
    // a history that never leaves one gate range of its first sample keeps its maximum and minimum
    expect(Array.from(turningPoints([35, 36, 34, 35], { gate: 5 }).values)).toEqual([35]);
    const flat = turningPoints([35, 36, 34, 35], { gate: 5, keepLeadingExtremes: true });
    expect(Array.from(flat.values)).toEqual([35, 36, 34]);
    expect(flat.removed).toBe(1); // the last sample, 35
  });

  test('whatever came before the first sample, the points a gate keeps over the longer history are among them', () => {
    checkProperty(
      'leading extremes cover any predecessor',
      fc.property(tiedHistory(), fc.integer({ min: -20, max: 20 }), fc.integer({ min: 1, max: 6 }), (h, before, gate) => {
        const kept = new Set(Array.from(turningPoints(h, { gate, keepLeadingExtremes: true }).indices));
        const longer = turningPoints([before, ...h], { gate });
        for (let k = 0; k < longer.indices.length; k++) {
          const i = longer.indices[k] - 1; // index in h
          if (i >= 0) expect(kept.has(i)).toBe(true);
        }
      }),
    );
  });

  test('the option survives toJSON / fromJSON and gives the same points streamed', () => {
    const f = new ReversalFilter({ gate: 6, keepLeadingExtremes: true });
    const v = new Float64Array(8);
    const i = new Float64Array(8);
    let n = f.push([35, 38], v, i, 0);
    const g = ReversalFilter.fromJSON(JSON.parse(JSON.stringify(f.toJSON())));
    n += g.push([33, 80], v, i, n);
    n += g.pendingInto(v, i, n);
    expect(Array.from(v.subarray(0, n))).toEqual([35, 38, 33, 80]);
  });
});
