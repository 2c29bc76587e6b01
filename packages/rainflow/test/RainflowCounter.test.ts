import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import {
  CounterStateError,
  InvalidOptionError,
  RainflowCounter,
  RangeMeanMatrix,
  type ResiduePolicy,
} from '@loopwise/rainflow';
import { checkProperty } from '../../../test/property';
import { anyHistory, chunking, cut, tiedHistory } from './support/arbitraries';
import { cycleKeys, rows, sameTable } from './support/rows';

const policy = fc.constantFrom<ResiduePolicy>('half', 'repeat', 'none');
const gate = fc.oneof(fc.constant(0), fc.constant(0), fc.integer({ min: 1, max: 4 }), fc.double({ min: 0, max: 5, noNaN: true }));

function countWhole(h: number[], residue: ResiduePolicy, g: number) {
  return new RainflowCounter({ residue, gate: g }).push(h).finish();
}

type Result = ReturnType<RainflowCounter['finish']>;

function sameResult(a: Result, b: Result): void {
  expect(sameTable(a.cycles, b.cycles)).toBe(true);
  sameApartFromClosing(a, b);
}

/**
 * The same cycles (values, counts, start and turn sample) and the same residue, in any order: what
 * a merge of segments promises. A cycle that closes across the junction may be closed by a later
 * turning point than in the single count (the one that closed it inside the later segment was
 * used up there), so close indices, and the order they set, may differ.
 */
function sameApartFromClosing(a: Result, b: Result): void {
  expect(cycleKeys(rows(a.cycles))).toEqual(cycleKeys(rows(b.cycles)));
  expect(Array.from(a.residue.values)).toEqual(Array.from(b.residue.values));
  expect(Array.from(a.residue.indices)).toEqual(Array.from(b.residue.indices));
  expect(a.removedReversals).toBe(b.removedReversals);
  expect(a.turningPointCount).toBe(b.turningPointCount);
  expect(a.sampleCount).toBe(b.sampleCount);
}

describe('RainflowCounter', () => {
  test('counter.push(chunks) gives the batch result for every chunking, chunk size 1 included', () => {
    checkProperty(
      'chunking invariance',
      fc.property(
        anyHistory(80).chain((h) => fc.tuple(fc.constant(h), chunking(h.length))),
        policy,
        gate,
        ([h, points], residue, g) => {
          const c = new RainflowCounter({ residue, gate: g });
          for (const part of cut(h, points)) c.push(Float64Array.from(part));
          sameResult(c.finish(), countWhole(h, residue, g));
        },
      ),
      { numRuns: 1500 },
    );
  });

  test('RainflowCounter.fromJSON(JSON.parse(JSON.stringify(counter))) resumes exactly, -0 included', () => {
    checkProperty(
      'JSON resume',
      fc.property(
        tiedHistory(80).chain((h) => fc.tuple(fc.constant(h), fc.integer({ min: 0, max: h.length }))),
        policy,
        gate,
        ([h, at], residue, g) => {
          const first = new RainflowCounter({ residue, gate: g }).push(h.slice(0, at));
          const text = JSON.stringify(first);
          const resumed = RainflowCounter.fromJSON(JSON.parse(text));
          expect(JSON.stringify(resumed)).toBe(text);
          sameResult(resumed.push(h.slice(at)).finish(), countWhole(h, residue, g));
        },
      ),
      { numRuns: 1000 },
    );
  });

  test('RainflowCounter.fromJSON(a version-1 state, whose table called turnIndex endIndex) resumes exactly', () => {
    const h = [0, 3, -2, 5, -1, 4, -3, 2];
    const state = JSON.parse(JSON.stringify(new RainflowCounter().push(h.slice(0, 6))));
    expect(state.version).toBe(2);
    expect(state.cycles.turnIndex.length).toBeGreaterThan(0);
    // Arrange: the same state as version 1 wrote it
    const { turnIndex, ...rest } = state.cycles;
    const v1 = { ...state, version: 1, cycles: { ...rest, endIndex: turnIndex } };
    // Act / Assert
    const resumed = RainflowCounter.fromJSON(v1).push(h.slice(6)).finish();
    sameResult(resumed, countWhole(h, 'half', 0));
  });

  test('segments counted apart and appended give the cycles and residue of the whole count, for any split and gate', () => {
    checkProperty(
      'segment merge',
      fc.property(
        anyHistory(80).chain((h) => fc.tuple(fc.constant(h), chunking(h.length))),
        policy,
        gate,
        ([h, points], residue, g) => {
          const parts = cut(h, points);
          let start = 0;
          const counters = parts.map((p) => {
            const c = new RainflowCounter({ residue, gate: g, startIndex: start }).push(p);
            start += p.length;
            return c;
          });
          const merged = counters.reduce((a, b) => a.append(b));
          sameApartFromClosing(merged.finish(), countWhole(h, residue, g));
        },
      ),
      { numRuns: 1500 },
    );
  });

  test('an appended then resumed counter continues exactly', () => {
    checkProperty(
      'merge then continue',
      fc.property(
        tiedHistory(90).chain((h) =>
          fc.tuple(fc.constant(h), fc.integer({ min: 0, max: h.length }), fc.integer({ min: 0, max: h.length })),
        ),
        gate,
        ([h, x, y], g) => {
        const i = Math.min(x, y);
        const j = Math.max(x, y);
        const a = new RainflowCounter({ gate: g }).push(h.slice(0, i));
        const b = new RainflowCounter({ gate: g, startIndex: i }).push(h.slice(i, j));
        const c = RainflowCounter.fromJSON(JSON.parse(JSON.stringify(a.append(b))));
        sameApartFromClosing(c.push(h.slice(j)).finish(), countWhole(h, 'half', g));
      }),
      { numRuns: 500 },
    );
  });

  test('counting into a RangeMeanMatrix sink equals binning the cycle table', () => {
    checkProperty(
      'sink equals table',
      fc.property(tiedHistory(80), policy, (h, residue) => {
        const bins = { range: { count: 6, min: 0, max: 12 }, mean: { count: 6, min: -6, max: 6 } };
        const direct = new RangeMeanMatrix(bins);
        new RainflowCounter({ residue, sink: direct }).push(h).finish();
        const fromTable = new RangeMeanMatrix(bins);
        countWhole(h, residue, 0).cycles!.replayInto(fromTable);
        expect(Array.from(direct.counts)).toEqual(Array.from(fromTable.counts));
        expect(direct.outside).toEqual(fromTable.outside);
      }),
      { numRuns: 300 },
    );
  });

  test('a gate removes reversals and reports how many', () => {
    // hand case: 0 → 3 → 2.5 → 3.5 → -1 → -0.5 with gate 1: the dip 3 → 2.5 and the last rise
    // -1 → -0.5 are below the gate
    const r = new RainflowCounter({ gate: 1, residue: 'none' }).push([0, 3, 2.5, 3.5, -1, -0.5]).finish();
    // turning points 0, 3.5, -1; the range 0 → 3.5 is exceeded by 3.5 → -1, so the standard's
    // list (the residue under 'none') starts at 3.5
    expect(Array.from(r.residue.values)).toEqual([3.5, -1]);
    expect(Array.from(r.residue.indices)).toEqual([3, 4]);
    expect(r.removedReversals).toBe(3); // 3, 2.5 and the final -0.5 are gone
    expect(r.turningPointCount).toBe(3);
  });

  test('misuse throws CounterStateError with a clear message', () => {
    const c = new RainflowCounter().push([0, 1, 0]);
    c.finish();
    expect(() => c.push([1])).toThrow(CounterStateError);
    expect(() => c.finish()).toThrow(/finished/);
    const a = new RainflowCounter().push([0, 1]);
    expect(() => a.append(new RainflowCounter({ startIndex: 5 }).push([2]))).toThrow(/starts at sample 5/);
    expect(() => a.append(new RainflowCounter({ startIndex: 2, gate: 1 }))).toThrow(/gate/);
    expect(() => RainflowCounter.fromJSON({} as never)).toThrow(CounterStateError);
    const withSink = new RainflowCounter({ sink: new RangeMeanMatrix({ range: { count: 1, min: 0, max: 1 }, mean: { count: 1, min: 0, max: 1 } }) });
    expect(() => RainflowCounter.fromJSON(withSink.toJSON())).toThrow(/options.sink/);
  });

  test('new RainflowCounter(bad options) names the option', () => {
    expect(() => new RainflowCounter({ residue: 'halves' as never })).toThrow(InvalidOptionError);
    expect(() => new RainflowCounter({ gate: -1 })).toThrow(/gate = -1/);
    expect(() => new RainflowCounter({ gate: NaN })).toThrow(/gate = NaN/);
    expect(() => new RainflowCounter({ startIndex: 1.5 })).toThrow(/startIndex/);
  });

  test('a NaN in a later chunk names its index in the whole history', () => {
    const c = new RainflowCounter().push([0, 1, 2]);
    expect(() => c.push([3, NaN])).toThrow(/sample 4/);
  });
});
