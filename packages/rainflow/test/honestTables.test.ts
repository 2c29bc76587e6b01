import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import {
  CycleTable,
  FromToMatrix,
  RainflowCounter,
  RangeMeanMatrix,
  ReversalFilter,
  binEdges,
  levelCrossings,
  rainflow,
  rainflowFourPoint,
  rangeSpectrum,
  turningPoints,
  type RainflowResult,
  type ResiduePolicy,
} from '@loopwise/rainflow';
import { checkProperty } from '../../../test/property';
import { chunking, cut, tiedHistory } from './support/arbitraries';

// Honest tables: no table, column or array handed to a caller can be written in a way that
// changes another result (a second call, a counter's later output, an earlier table, a matrix).
// Each test writes through every public column of one result (fill(-1)) and checks that every
// other result equals what it was, compared as plain copies taken before the write.

type Plain = Record<string, number[]>;

/** Plain copies of every column of a table (Object.is-exact comparison via toEqual on arrays). */
function plainTable(t: CycleTable | null): Plain {
  if (t === null) return {};
  const out: Plain = {};
  for (const [name, column] of Object.entries(t.columns())) out[name] = Array.from(column);
  return out;
}

/** Plain copy of every number a result holds. */
function plainResult(r: RainflowResult): unknown {
  return {
    cycles: plainTable(r.cycles),
    residue: { values: Array.from(r.residue.values), indices: Array.from(r.residue.indices) },
    rest: [r.residuePolicy, r.gate, r.removedReversals, r.turningPointCount, r.sampleCount],
  };
}

/** Writes -1 through every column of a table and of a result's residue. */
function scribble(t: CycleTable | null): void {
  if (t === null) return;
  for (const column of Object.values(t.columns())) column.fill(-1);
}

function scribbleResult(r: RainflowResult): void {
  scribble(r.cycles);
  r.residue.values.fill(-1);
  r.residue.indices.fill(-1);
}

const policy = fc.constantFrom<ResiduePolicy>('half', 'repeat', 'none');
const HISTORY = [0, 3, -2, 5, -1, 4, -3, 2, -4, 6, 0];

describe('rainflow(history) results share nothing', () => {
  test('writing every column of one rainflow(history) result leaves a second call and an earlier result unchanged', () => {
    checkProperty(
      'rainflow results are independent',
      fc.property(tiedHistory(60), policy, (h, residue) => {
        // Arrange
        const earlier = rainflow(h, { residue });
        const reference = plainResult(earlier);
        const written = rainflowFourPoint(h, { residue });
        // Act
        scribbleResult(written);
        // Assert
        expect(plainResult(earlier)).toEqual(reference);
        expect(plainResult(rainflow(h, { residue }))).toEqual(reference);
      }),
      { numRuns: 300 },
    );
  });

  test('rainflow(history) does not keep or alias the caller\'s history', () => {
    const h = Float64Array.from(HISTORY);
    const r = rainflow(h);
    const reference = plainResult(r);
    h.fill(-1);
    expect(plainResult(r)).toEqual(reference);
  });
});

describe('RainflowCounter results share nothing with the counter', () => {
  test('writing a counter.cycles snapshot changes neither the counter\'s later snapshots nor its result', () => {
    checkProperty(
      'counter snapshots are independent',
      fc.property(
        tiedHistory(80).chain((h) => fc.tuple(fc.constant(h), chunking(h.length))),
        policy,
        ([h, points], residue) => {
          const whole = plainResult(rainflow(h, { residue }));
          const c = new RainflowCounter({ residue });
          const snapshots: [CycleTable, Plain][] = [];
          for (const part of cut(h, points)) {
            c.push(part);
            const s = c.cycles!;
            snapshots.push([s, plainTable(s)]);
            const written = c.cycles!;
            scribble(written);
            written.addCycle(9, 9, 1, 0, 0, 0); // a row added to a snapshot is its own too
          }
          for (const [s, plain] of snapshots) expect(plainTable(s)).toEqual(plain);
          const result = c.finish();
          expect(plainResult(result)).toEqual(whole);
          // and the other way: writing the result leaves every earlier snapshot as it was
          scribbleResult(result);
          for (const [s, plain] of snapshots) expect(plainTable(s)).toEqual(plain);
        },
      ),
      { numRuns: 300 },
    );
  });

  test('clearing or refilling a snapshot, or the result, leaves the others as they were', () => {
    const c = new RainflowCounter().push(HISTORY.slice(0, 7));
    const s1 = c.cycles!;
    const plain1 = plainTable(s1);
    expect(s1.length).toBeGreaterThan(0);
    c.cycles!.clear();
    const s2 = c.cycles!;
    s2.clear();
    s2.addCycle(-7, 7, 1, 0, 1, 2);
    expect(plainTable(s1)).toEqual(plain1);
    c.push(HISTORY.slice(7));
    const result = c.finish();
    const plainResult1 = plainTable(result.cycles);
    expect(plainResult1).toEqual(plainTable(rainflow(HISTORY).cycles));
    result.cycles!.clear();
    for (let i = 0; i < 40; i++) result.cycles!.addCycle(-1, 1, 1, i, i, i); // overwrites the old rows' storage
    expect(plainTable(s1)).toEqual(plain1);
  });

  test('after finish() the counter hands its table over: counter.cycles throws instead of sharing it', () => {
    const c = new RainflowCounter().push(HISTORY);
    c.finish();
    expect(() => c.cycles).toThrow(expect.objectContaining({ code: 'counter-state', field: 'counter' }));
  });

  test('writing the state from toJSON() changes neither the counter nor a counter resumed from it', () => {
    const c = new RainflowCounter({ residue: 'repeat' }).push(HISTORY.slice(0, 8));
    const text = JSON.stringify(c.toJSON());
    const state = c.toJSON();
    const resumed = RainflowCounter.fromJSON(state);
    // Act: write through every array of the state object
    for (const a of [state.stackValues, state.stackIndices, ...Object.values(state.cycles!)]) (a as unknown[]).fill(-1);
    // Assert
    expect(JSON.stringify(c.toJSON())).toBe(text);
    expect(JSON.stringify(resumed.toJSON())).toBe(text);
    const rest = HISTORY.slice(8);
    expect(plainResult(resumed.push(rest).finish())).toEqual(plainResult(c.push(rest).finish()));
  });

  test('writing a resumed counter\'s results leaves the state it was resumed from unchanged', () => {
    const state = JSON.parse(JSON.stringify(new RainflowCounter().push(HISTORY.slice(0, 8))));
    const text = JSON.stringify(state);
    const resumed = RainflowCounter.fromJSON(state);
    scribble(resumed.cycles);
    scribbleResult(resumed.push(HISTORY.slice(8)).finish());
    expect(JSON.stringify(state)).toBe(text);
  });

  test('append(later): writing the joined result leaves a snapshot of the later segment unchanged', () => {
    const a = new RainflowCounter().push(HISTORY.slice(0, 5));
    const b = new RainflowCounter({ startIndex: 5 }).push(HISTORY.slice(5));
    const later = b.cycles!;
    const plainLater = plainTable(later);
    const joined = a.append(b).finish();
    expect(plainTable(joined.cycles).range.length).toBe(rainflow(HISTORY).cycles!.length);
    scribbleResult(joined);
    expect(plainTable(later)).toEqual(plainLater);
  });
});

describe('CycleTable views', () => {
  test('table.snapshot(): writing either table\'s columns or rows never changes the other', () => {
    checkProperty(
      'snapshot is a table of its own',
      fc.property(tiedHistory(60), fc.boolean(), fc.boolean(), (h, writeSnapshotFirst, addToOriginal) => {
        const t = rainflow(h).cycles!;
        const before = plainTable(t);
        const s = t.snapshot();
        if (addToOriginal) t.addCycle(1, 2, 1, 0, 0, 0);
        const afterAdd = plainTable(t);
        if (writeSnapshotFirst) {
          scribble(s);
          expect(plainTable(t)).toEqual(afterAdd);
        } else {
          scribble(t);
          expect(plainTable(s)).toEqual(before);
        }
      }),
      { numRuns: 200 },
    );
  });

  test('CycleTable.fromJSON(state) and table.toJSON() share nothing with the table', () => {
    const t = rainflow(HISTORY).cycles!;
    const state = t.toJSON();
    const text = JSON.stringify(state);
    const back = CycleTable.fromJSON(state);
    scribble(back);
    expect(JSON.stringify(state)).toBe(text);
    for (const a of Object.values(state)) (a as unknown[]).fill(-1);
    expect(JSON.stringify(t.toJSON())).toBe(text);
  });

  test('table.row(i) is a plain object: writing it changes nothing', () => {
    const t = rainflow(HISTORY).cycles!;
    const row = t.row(0);
    const copy = { ...row };
    (row as { range: number }).range = -1;
    expect(t.row(0)).toEqual(copy);
  });

  test('a table appended to or replayed into another shares no storage with it', () => {
    const t = rainflow(HISTORY).cycles!;
    const reference = plainTable(t);
    const other = new CycleTable();
    other.appendTable(t);
    const m = new RangeMeanMatrix({ range: { count: 10, min: 0, max: 10 }, mean: { count: 10, min: -5, max: 5 } });
    t.replayInto(m);
    const counts = Array.from(m.counts);
    scribble(other);
    m.counts.fill(-1);
    expect(plainTable(t)).toEqual(reference);
    scribble(t);
    expect(Array.from(other.columns().range)).toEqual(new Array(t.length).fill(-1)); // it was written, not t
    const fresh = new RangeMeanMatrix({ range: { count: 10, min: 0, max: 10 }, mean: { count: 10, min: -5, max: 5 } });
    rainflow(HISTORY, { sink: fresh });
    expect(Array.from(fresh.counts)).toEqual(counts);
  });
});

describe('turningPoints, ReversalFilter, levelCrossings, rangeSpectrum and binEdges results share nothing', () => {
  test('writing turningPoints(history) leaves a second call unchanged', () => {
    checkProperty(
      'turning points are independent',
      fc.property(tiedHistory(60), fc.integer({ min: 0, max: 3 }), (h, gate) => {
        const first = turningPoints(h, { gate });
        const reference = [Array.from(first.values), Array.from(first.indices)];
        const written = turningPoints(h, { gate });
        written.values.fill(-1);
        written.indices.fill(-1);
        expect([Array.from(first.values), Array.from(first.indices)]).toEqual(reference);
        const again = turningPoints(h, { gate });
        expect([Array.from(again.values), Array.from(again.indices)]).toEqual(reference);
      }),
      { numRuns: 200 },
    );
  });

  test('ReversalFilter keeps no reference to its output arrays or its JSON state', () => {
    const f = new ReversalFilter({ gate: 1 });
    const g = new ReversalFilter({ gate: 1 });
    const v = new Float64Array(16);
    const i = new Float64Array(16);
    f.push(HISTORY.slice(0, 6), v, i, 0);
    g.push(HISTORY.slice(0, 6), new Float64Array(16), new Float64Array(16), 0);
    v.fill(-1);
    i.fill(-1);
    const state = f.toJSON();
    (state as unknown as Record<string, unknown>).ext = -1;
    expect(f.toJSON()).toEqual(g.toJSON());
    const out = [new Float64Array(16), new Float64Array(16), new Float64Array(16), new Float64Array(16)];
    const n = f.push(HISTORY.slice(6), out[0], out[1], 0);
    expect(g.push(HISTORY.slice(6), out[2], out[3], 0)).toBe(n);
    expect(Array.from(out[0])).toEqual(Array.from(out[2]));
  });

  test('writing levelCrossings(history, levels) changes neither the caller\'s levels nor a second call', () => {
    const levels = Float64Array.of(-2, 0, 2);
    const first = levelCrossings(HISTORY, levels);
    const reference = [Array.from(first.levels), Array.from(first.up), Array.from(first.down)];
    first.levels.fill(-1);
    first.up.fill(-1);
    first.down.fill(-1);
    expect(Array.from(levels)).toEqual([-2, 0, 2]);
    const again = levelCrossings(HISTORY, levels);
    expect([Array.from(again.levels), Array.from(again.up), Array.from(again.down)]).toEqual(reference);
  });

  test('writing rangeSpectrum(cycles) leaves the table and a second call unchanged', () => {
    const t = rainflow(HISTORY).cycles!;
    const reference = plainTable(t);
    const s = rangeSpectrum(t);
    const plain = [Array.from(s.range), Array.from(s.exceedances)];
    s.range.fill(-1);
    s.exceedances.fill(-1);
    expect(plainTable(t)).toEqual(reference);
    const again = rangeSpectrum(t);
    expect([Array.from(again.range), Array.from(again.exceedances)]).toEqual(plain);
  });

  test('binEdges(spec) is a new array each call, and does not alias spec.edges', () => {
    const edges = Float64Array.of(0, 1, 2);
    const e = binEdges({ edges }, 'x');
    e.fill(-1);
    expect(Array.from(edges)).toEqual([0, 1, 2]);
    expect(Array.from(binEdges({ edges }, 'x'))).toEqual([0, 1, 2]);
  });
});

describe('matrices share nothing', () => {
  const bins = { range: { count: 8, min: 0, max: 16 }, mean: { count: 4, min: -4, max: 4 } };

  test('writing a matrix\'s edges (copies) cannot change how it bins or what it saves', () => {
    const m = new RangeMeanMatrix(bins);
    const twin = new RangeMeanMatrix(bins);
    const text = JSON.stringify(m);
    m.rowEdges.fill(-1);
    m.columnEdges.fill(-1);
    expect(JSON.stringify(m)).toBe(text);
    rainflow(HISTORY, { sink: m });
    rainflow(HISTORY, { sink: twin });
    expect(Array.from(m.counts)).toEqual(Array.from(twin.counts));
    expect(Array.from(m.rowEdges)).toEqual(Array.from(binEdges(bins.range, 'range')));
  });

  test('a matrix made from edges the caller holds does not alias them', () => {
    const edges = Float64Array.of(-4, 0, 4);
    const m = new FromToMatrix({ from: { edges }, to: { edges } });
    edges.fill(100);
    expect(Array.from(m.rowEdges)).toEqual([-4, 0, 4]);
    m.addCycle(-1, 1, 1, 0);
    expect(m.at(0, 1)).toBe(1);
  });

  test('writing one matrix\'s counts changes no matrix added from it, added to it, copied or restored from it', () => {
    for (const make of [() => new RangeMeanMatrix(bins), () => new FromToMatrix({ from: { count: 6, min: -6, max: 6 }, to: { count: 6, min: -6, max: 6 } })]) {
      const a = make();
      rainflow(HISTORY, { sink: a });
      const reference = Array.from(a.counts);
      const json = a.toJSON();
      const restored = a.kind === 'range-mean' ? RangeMeanMatrix.fromJSON(json) : FromToMatrix.fromJSON(json);
      const sum = make().add(a);
      const empty = (a as RangeMeanMatrix).emptyCopy();
      // Act: write the source
      a.counts.fill(-1);
      // Assert
      expect(Array.from(restored.counts)).toEqual(reference);
      expect(Array.from(sum.counts)).toEqual(reference);
      expect(empty.totalCount()).toBe(0);
      expect(json.counts).toEqual(reference);
      // and the other way: writing the copies leaves the JSON
      restored.counts.fill(-2);
      sum.counts.fill(-2);
      expect(json.counts).toEqual(reference);
    }
  });

  test('the outside tally is handed out as a copy', () => {
    const m = new RangeMeanMatrix({ range: { count: 1, min: 0, max: 1 }, mean: { count: 1, min: 0, max: 1 } });
    rainflow(HISTORY, { sink: m });
    const tally = m.outside;
    const copy = { ...tally };
    tally.count = -1;
    expect(m.outside).toEqual(copy);
  });

  test('a counter counting into a matrix shares no storage with its residue', () => {
    const m = new RangeMeanMatrix(bins);
    const r = rainflow(HISTORY, { sink: m });
    const counts = Array.from(m.counts);
    r.residue.values.fill(-1);
    r.residue.indices.fill(-1);
    expect(Array.from(m.counts)).toEqual(counts);
    m.counts.fill(-1);
    expect(Array.from(rainflow(HISTORY).residue.values)).toEqual(Array.from(rainflow(HISTORY, { sink: new RangeMeanMatrix(bins) }).residue.values));
  });
});
