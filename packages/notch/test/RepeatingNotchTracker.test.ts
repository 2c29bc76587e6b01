import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { turningPoints } from '@loopwise/rainflow';
import {
  LoopTable,
  NotchSampleError,
  NotchStateError,
  NotchTracker,
  RepeatingNotchTracker,
  ReversalTable,
  trackNotchRepeating,
  type LoopRow,
  type NotchRepeatingResult,
  type NotchTrackerOptions,
  type PassRows,
  type RepeatingTrackResult,
} from '@loopwise/notch';
import { TrackerCore } from '../src/TrackerCore';
import { checkProperty } from '../../../test/property';
import { gridHistory, sae1045 } from './support';

// SAE 1045 (support.ts: Dowling, Mechanical Behavior of Materials, Table 14.1) at Kt 2.5; the
// integer grid histories are scaled by S into the plastic range, as in trackNotch.test.ts.
const S = 60;
const opts: NotchTrackerOptions = { material: sae1045, Kt: 2.5 };

/** Tracker options with an initial value and an offset on the grid, and reversals kept or not. */
const optionsArb: fc.Arbitrary<NotchTrackerOptions> = fc
  .record({ init: fc.integer({ min: -9, max: 9 }), off: fc.integer({ min: -2, max: 2 }), rev: fc.boolean() })
  .map(({ init, off, rev }) => ({ ...opts, initial: init * S, offset: off * S, recordReversals: rev }));

/** A grid history scaled into plasticity. */
const historyArb = (maxLength = 40): fc.Arbitrary<number[]> => gridHistory(maxLength).map((h) => h.map((x) => x * S));

/** Chunk sizes 1 … 7, used in turn. */
const sizesArb = fc.array(fc.integer({ min: 1, max: 7 }), { minLength: 1, maxLength: 8 });

/** [from, to) ranges covering 0 … n − 1 with the sizes taken in turn. */
function chunks(n: number, sizes: readonly number[]): [number, number][] {
  const out: [number, number][] = [];
  for (let s = 0, k = 0; s < n; k++) {
    const e = Math.min(n, s + sizes[k % sizes.length]);
    out.push([s, e]);
    s = e;
  }
  return out;
}

/** Rows `from` … `to − 1` (numbered from the start of the tracking) of a result's loop table. */
const loopRows = (r: RepeatingTrackResult, p: PassRows): LoopRow[] => r.loops.toRows().slice(p.loopFrom - r.loopRowOffset, p.loopTo - r.loopRowOffset);
const reversalRows = (r: RepeatingTrackResult, p: PassRows) => r.reversals.toRows().slice(p.reversalFrom, p.reversalTo);

/** Everything a result says, as plain data (for equality of two routes). */
function summary(r: RepeatingTrackResult) {
  const pass = (p: PassRows | null) =>
    p === null ? null : { loopFrom: p.loopFrom, loopTo: p.loopTo, reversalFrom: p.reversalFrom, reversalTo: p.reversalTo, residue: p.residue.toRows() };
  return {
    loops: r.loops.toRows(),
    loopRowOffset: r.loopRowOffset,
    reversals: r.reversals.toRows(),
    first: pass(r.first),
    stabilised: pass(r.stabilised),
    largestIndex: r.largestIndex,
    reusedFirstPass: r.reusedFirstPass,
    points: r.points,
    beyondStrainLimit: r.beyondStrainLimit,
    firstBeyondIndex: r.firstBeyondIndex,
  };
}

/** Both passes of a block in one call each. */
function trackTwice(block: readonly number[], o: NotchTrackerOptions): RepeatingTrackResult {
  const t = new RepeatingNotchTracker(o);
  t.push(block);
  t.endFirstPass();
  t.pushAgain(block);
  return t.finish();
}

/** The damage-relevant multiset of loops: σmax, σmin, εmax, εmin with their counts summed. */
function loopMultiset(rows: readonly LoopRow[]): [string, number][] {
  const m = new Map<string, number>();
  for (const l of rows) {
    const key = `${l.stressMax}/${l.stressMin}/${l.strainMax}/${l.strainMin}`;
    m.set(key, (m.get(key) ?? 0) + l.count);
  }
  return [...m.entries()].sort((a, b) => (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0));
}

/** Residue rows without their indices (a repeated block keeps its own indices). */
const residueValues = (t: ReversalTable) => t.toRows().map(({ value, stress, strain }) => ({ value, stress, strain }));

/** Index of the first sample of largest |x + offset| among the first `count` samples when it exceeds |initial|, else -1. */
function largestSoFar(hist: readonly number[], count: number, o: NotchTrackerOptions): number {
  let best = Math.abs(o.initial ?? 0);
  let at = -1;
  for (let i = 0; i < count; i++) {
    const a = Math.abs(hist[i] + (o.offset ?? 0));
    if (a > best) {
      best = a;
      at = i;
    }
  }
  return at;
}

/** Catches what `f` throws. */
function thrown(f: () => unknown): unknown {
  try {
    f();
  } catch (e) {
    return e;
  }
  throw new Error('expected a throw');
}

describe('RepeatingNotchTracker: first pass', () => {
  it('push(history).finish().first == new NotchTracker(options).push(history).end(): loops, reversals, residue', () => {
    checkProperty(
      'first pass == NotchTracker',
      fc.property(historyArb(), optionsArb, fc.boolean(), (hist, o, second) => {
        // Arrange
        const expected = new NotchTracker(o).push(hist).end();
        // Act: a one-off history, and the same history with its second pass
        const t = new RepeatingNotchTracker(o);
        t.push(hist);
        if (second) {
          t.endFirstPass();
          t.pushAgain(hist);
        }
        const r = t.finish();
        // Assert
        expect(r.loopRowOffset).toBe(0);
        expect(r.first.loopFrom).toBe(0);
        expect(r.first.reversalFrom).toBe(0);
        expect(loopRows(r, r.first)).toEqual(expected.loops.toRows());
        expect(reversalRows(r, r.first)).toEqual(expected.reversals.toRows());
        if (!o.recordReversals) expect(r.reversals.length).toBe(0);
        expect(r.first.residue.toRows()).toEqual(expected.residue.toRows());
        expect(r.points).toBe(hist.length);
        if (!second) {
          expect(r.stabilised).toBeNull();
          expect(r.loops.length).toBe(expected.loops.length);
        }
      }),
      { numRuns: 150 },
    );
  });
});

describe('RepeatingNotchTracker: stabilised pass', () => {
  it('push(block), pushAgain(block): stabilised rows == a full second pass, rotated to start after the largest |value| when reusedFirstPass', () => {
    checkProperty(
      'stabilised == full second pass',
      fc.property(historyArb(), optionsArb, (block, o) => {
        // Arrange: the block tracked twice in full
        const c = new TrackerCore(o);
        c.push(block);
        c.restartIndex(0);
        const nLoops = c.loops.length;
        const nRev = c.reversals.length;
        // Act
        const r = trackTwice(block, o);
        const m = r.largestIndex;
        c.push(block.slice(0, Math.max(0, m + 1)));
        const splitLoops = c.loops.length - nLoops;
        const splitRev = c.reversals.length - nRev;
        c.push(block.slice(Math.max(0, m + 1)));
        const full = c.end();
        // Assert
        const s = r.stabilised!;
        expect(s).not.toBeNull();
        const secondLoops = full.loops.toRows().slice(nLoops);
        const secondRev = full.reversals.toRows().slice(nRev);
        const rotate = <T>(rows: T[], k: number) => (r.reusedFirstPass ? [...rows.slice(k), ...rows.slice(0, k)] : rows);
        expect(loopRows(r, s)).toEqual(rotate(secondLoops, splitLoops));
        expect(reversalRows(r, s)).toEqual(rotate(secondRev, splitRev));
        expect(s.residue.toRows()).toEqual(full.residue.toRows());
        // the rows form one run: after the first pass, or from the first pass's rows after the largest |value|
        if (r.reusedFirstPass) {
          expect(s.loopFrom).toBeLessThanOrEqual(r.first.loopTo);
          expect(s.loopTo - s.loopFrom).toBe(secondLoops.length);
        } else {
          expect(s.loopFrom).toBe(r.first.loopTo);
          expect(s.reversalFrom).toBe(r.first.reversalTo);
        }
        expect(r.loops.length).toBe(Math.max(r.first.loopTo, s.loopTo));
        // largestIndex: the first sample of largest |value| (after offset) when it exceeds |initial|
        const at = largestSoFar(block, block.length, o);
        if (at >= 0) expect(m).toBe(at);
      }),
      { numRuns: 200 },
    );
  });
});

describe('RepeatingNotchTracker: chunking and the second-pass need', () => {
  it('push and pushAgain in any chunks (sizes 1…7, slices or ranges) == one call each', () => {
    checkProperty(
      'chunking',
      fc.property(historyArb(), optionsArb, sizesArb, sizesArb, fc.boolean(), (block, o, sizes1, sizes2, slices) => {
        // Arrange
        const expected = summary(trackTwice(block, o));
        // Act
        const t = new RepeatingNotchTracker(o);
        for (const [s, e] of chunks(block.length, sizes1)) {
          if (slices) t.push(block.slice(s, e));
          else t.push(block, null, s, e);
        }
        t.endFirstPass();
        for (const [s, e] of chunks(block.length, sizes2)) {
          if (slices) t.pushAgain(block.slice(s, e));
          else t.pushAgain(block, null, s, e);
        }
        // Assert
        expect(summary(t.finish())).toEqual(expected);
      }),
      { numRuns: 150 },
    );
  });

  it('push(values, indices, from, to) and pushAgain in any chunks of turning points == one call each', () => {
    checkProperty(
      'chunking with indices',
      fc.property(historyArb(), optionsArb, sizesArb, sizesArb, (block, o, sizes1, sizes2) => {
        // Arrange
        const tp = turningPoints(block);
        const n = tp.values.length;
        const one = new RepeatingNotchTracker(o);
        one.push(tp.values, tp.indices);
        one.endFirstPass();
        one.pushAgain(tp.values, tp.indices);
        const expected = summary(one.finish());
        // Act
        const t = new RepeatingNotchTracker(o);
        for (const [s, e] of chunks(n, sizes1)) t.push(tp.values, tp.indices, s, e);
        t.endFirstPass();
        for (const [s, e] of chunks(n, sizes2)) t.pushAgain(tp.values, tp.indices, s, e);
        // Assert
        expect(summary(t.finish())).toEqual(expected);
      }),
      { numRuns: 100 },
    );
  });

  it('endFirstPass() says whole exactly when no sample exceeds |initial| or the block starts at its largest |value| and ends on it', () => {
    checkProperty(
      'whole',
      fc.property(historyArb(), optionsArb, (block, o) => {
        // Arrange: the seam plateau, read off the samples
        const n = block.length;
        const m = largestSoFar(block, n, o);
        const seam = m === 0 && block[n - 1] === block[0] && block.some((x) => x !== block[0]);
        // Act
        const t = new RepeatingNotchTracker(o).push(block);
        const need = t.endFirstPass();
        t.pushAgain(block);
        const r = t.finish();
        // Assert
        expect(need.whole).toBe(m < 0 || seam);
        expect(need.throughIndex).toBe(need.whole ? n - 1 : m);
        expect(r.reusedFirstPass).toBe(!need.whole);
      }),
      { numRuns: 200 },
    );
  });

  it('pushAgain(points through endFirstPass().throughIndex) == pushAgain(whole block), raw or turning points; with whole, fewer points make finish() throw', () => {
    checkProperty(
      'second-pass need',
      fc.property(historyArb(), optionsArb, fc.nat(), fc.boolean(), (block, o, cut, thin) => {
        // Arrange: raw samples (consecutive indices) or turning points with their indices
        const tp = turningPoints(block);
        const values = thin ? tp.values : Float64Array.from(block);
        const indices = thin ? tp.indices : null;
        const n = values.length;
        const at = (i: number) => (indices === null ? i : indices[i]);
        const start = () => new RepeatingNotchTracker(o).push(values, indices);
        const one = start();
        one.endFirstPass();
        one.pushAgain(values, indices);
        const expected = summary(one.finish());
        const t = start();
        // Act
        const need = t.endFirstPass();
        // Assert: asking again gives the same answer
        expect(t.endFirstPass()).toEqual(need);
        if (need.whole) {
          expect(need.throughIndex).toBe(at(n - 1));
          // any strict prefix of the points is not enough
          const k = cut % n;
          if (k > 0) t.pushAgain(values, indices, 0, k);
          expect(() => t.finish()).toThrow(NotchStateError);
          return;
        }
        expect(need.throughIndex).toBe(expected.largestIndex);
        let through = 0;
        while (at(through) < need.throughIndex) through++;
        expect(at(through)).toBe(need.throughIndex);
        t.pushAgain(values, indices, 0, through + 1);
        expect(summary(t.finish())).toEqual(expected);
        expect(expected.reusedFirstPass).toBe(true);
      }),
      { numRuns: 200 },
    );
  });
});

describe('RepeatingNotchTracker.push(values, indices): turning points', () => {
  const closeless = (rows: LoopRow[]) => rows.map(({ closeIndex: _, ...rest }) => rest);

  it('turning points (gate 0, and gate 1e-300 with keepLeadingExtremes) == raw samples in σ, ε, startIndex, turnIndex; closeIndex equal between the gates', () => {
    checkProperty(
      'turning points == raw',
      fc.property(historyArb(), optionsArb, (block, o) => {
        // Arrange
        const raw = trackTwice(block, o);
        const route = (gate: number) => {
          const tp = turningPoints(block, gate > 0 ? { gate, keepLeadingExtremes: true } : {});
          const t = new RepeatingNotchTracker(o);
          t.push(tp.values, tp.indices);
          t.endFirstPass();
          t.pushAgain(tp.values, tp.indices);
          return { r: t.finish(), indices: Array.from(tp.indices) };
        };
        // Act
        const plain = route(0);
        const gated = route(1e-300);
        // Assert
        for (const { r, indices } of [plain, gated]) {
          expect(closeless(r.loops.toRows())).toEqual(closeless(raw.loops.toRows()));
          expect(r.reversals.toRows()).toEqual(raw.reversals.toRows());
          expect(r.first.residue.toRows()).toEqual(raw.first.residue.toRows());
          expect(r.stabilised!.residue.toRows()).toEqual(raw.stabilised!.residue.toRows());
          const { residue: _a, ...pr } = r.stabilised!;
          const { residue: _b, ...pw } = raw.stabilised!;
          expect(pr).toEqual(pw);
          expect(r.first.loopTo).toBe(raw.first.loopTo);
          expect(r.largestIndex).toBe(raw.largestIndex);
          expect(r.reusedFirstPass).toBe(raw.reusedFirstPass);
          // a loop closes at the point that reached the memory point: a turning point, not before the raw sample
          const rc = raw.loops.columns().closeIndex;
          const tc = r.loops.columns().closeIndex;
          for (let i = 0; i < rc.length; i++) {
            expect(tc[i]).toBeGreaterThanOrEqual(rc[i]);
            expect(indices).toContain(tc[i]);
          }
        }
        expect(Array.from(gated.r.loops.columns().closeIndex)).toEqual(Array.from(plain.r.loops.columns().closeIndex));
      }),
      { numRuns: 150 },
    );
  });
});

describe('RepeatingNotchTracker.push(block, null, 0, n, repeats): duty cycles', () => {
  const dutyArb = fc.array(fc.record({ block: historyArb(12), repeats: fc.integer({ min: 1, max: 6 }) }), { minLength: 1, maxLength: 4 });
  const materialise = (duty: { block: number[]; repeats: number }[]) => duty.flatMap(({ block, repeats }) => Array.from({ length: repeats }, () => block).flat());

  it('first pass: the loop multiset (σmax, σmin, εmax, εmin, counts summed) == the materialised history', () => {
    checkProperty(
      'repeats, first pass == materialised',
      fc.property(dutyArb, optionsArb, (duty, o) => {
        // Arrange
        const hist = materialise(duty);
        const expected = new NotchTracker(o).push(hist).end();
        // Act
        const t = new RepeatingNotchTracker(o);
        for (const { block, repeats } of duty) t.push(block, null, 0, block.length, repeats);
        const r = t.finish();
        // Assert
        expect(loopMultiset(loopRows(r, r.first))).toEqual(loopMultiset(expected.loops.toRows()));
        expect(r.loops.totalCount()).toBe(expected.loops.length);
        expect(residueValues(r.first.residue)).toEqual(residueValues(expected.residue));
        // a repeated block counts once
        expect(r.points).toBe(duty.reduce((a, d) => a + d.block.length, 0));
      }),
      { numRuns: 150 },
    );
  });

  it('stabilised pass: the loop multiset == the materialised history tracked twice', () => {
    checkProperty(
      'repeats, stabilised == materialised twice',
      fc.property(dutyArb, optionsArb, (duty, o) => {
        // Arrange
        const hist = materialise(duty);
        const c = new TrackerCore(o);
        c.push(hist);
        const first = c.end();
        c.restartIndex(0);
        c.push(hist);
        const full = c.end();
        const second = full.loops.toRows().slice(first.loops.length);
        // Act: the duty cycle's events with their repeats, in both passes
        const t = new RepeatingNotchTracker(o);
        for (const { block, repeats } of duty) t.push(block, null, 0, block.length, repeats);
        t.endFirstPass();
        for (const { block, repeats } of duty) t.pushAgain(block, null, 0, block.length, repeats);
        const r = t.finish();
        // Assert
        expect(loopMultiset(loopRows(r, r.first))).toEqual(loopMultiset(first.loops.toRows()));
        expect(loopMultiset(loopRows(r, r.stabilised!))).toEqual(loopMultiset(second));
        expect(residueValues(r.stabilised!.residue)).toEqual(residueValues(full.residue));
        // the events through the one that holds endFirstPass().throughIndex are enough; with whole, every event is needed
        const again = new RepeatingNotchTracker(o);
        for (const { block, repeats } of duty) again.push(block, null, 0, block.length, repeats);
        const need = again.endFirstPass();
        let base = 0;
        let k = 0;
        while (k < duty.length - 1 && (need.whole || base + duty[k].block.length <= need.throughIndex)) base += duty[k++].block.length;
        if (need.whole && duty.length > 1) {
          for (const { block, repeats } of duty.slice(0, -1)) again.pushAgain(block, null, 0, block.length, repeats);
          expect(() => again.finish()).toThrow(NotchStateError);
          return;
        }
        for (const { block, repeats } of duty.slice(0, k + 1)) again.pushAgain(block, null, 0, block.length, repeats);
        expect(summary(again.finish())).toEqual(summary(r));
      }),
      { numRuns: 150 },
    );
  });
});

describe('RepeatingNotchTracker.takeLoops()', () => {
  it('taking after every chunk, then finish(), gives the rows of never taking; numbering and largestRow are consistent', () => {
    checkProperty(
      'takeLoops',
      fc.property(historyArb(), optionsArb, sizesArb, sizesArb, (block, o, sizes1, sizes2) => {
        // Arrange
        const never = trackTwice(block, o);
        const taken: LoopRow[] = [];
        const t = new RepeatingNotchTracker(o);
        let lastLargest = -Infinity;
        // Act and assert as the passes go
        for (const [s, e] of chunks(block.length, sizes1)) {
          t.push(block, null, s, e);
          const k = t.takeLoops();
          expect(k.secondPass).toBe(false);
          expect(k.firstRow).toBe(taken.length);
          taken.push(...k.loops.toRows());
          expect(k.largestRow).toBeGreaterThanOrEqual(lastLargest);
          lastLargest = k.largestRow;
          // the rows closed up to the largest |value| so far
          const m = largestSoFar(block, e, o);
          expect(k.largestRow).toBe(m < 0 ? -1 : new NotchTracker(o).push(block.slice(0, m + 1)).end().loops.length);
          expect(k.largestRow).toBeLessThanOrEqual(taken.length);
        }
        t.endFirstPass();
        for (const [s, e] of chunks(block.length, sizes2)) {
          t.pushAgain(block, null, s, e);
          const k = t.takeLoops();
          expect(k.secondPass).toBe(true);
          expect(k.firstRow).toBe(taken.length);
          expect(k.largestRow).toBe(lastLargest);
          taken.push(...k.loops.toRows());
        }
        const r = t.finish();
        // Assert
        expect(r.loopRowOffset).toBe(taken.length);
        expect([...taken, ...r.loops.toRows()]).toEqual(never.loops.toRows());
        expect(r.first).toEqual(never.first);
        expect(r.stabilised).toEqual(never.stabilised);
        expect(r.reversals.toRows()).toEqual(never.reversals.toRows());
        if (r.reusedFirstPass) expect(r.stabilised!.loopFrom).toBe(lastLargest);
      }),
      { numRuns: 150 },
    );
  });
});

describe('RepeatingNotchTracker: state errors and bad samples', () => {
  const block = [0, 5 * S, -4 * S, 6 * S, -2 * S, 3 * S];

  it('push after endFirstPass or finish, pushAgain before endFirstPass throw NotchStateError', () => {
    const t = new RepeatingNotchTracker(opts);
    expect(() => t.pushAgain(block)).toThrow(NotchStateError);
    t.push(block);
    t.endFirstPass();
    expect(thrown(() => t.push(block))).toMatchObject({ code: 'invalid-state', field: 'push' });
    t.pushAgain(block);
    t.finish();
    expect(() => t.push(block)).toThrow(NotchStateError);
  });

  it('push(…, repeats) and pushAgain(…, repeats) with repeats 0, 0.5, -1, NaN, Infinity throw NotchStateError naming repeats', () => {
    for (const repeats of [0, 0.5, -1, NaN, Infinity]) {
      expect(thrown(() => new RepeatingNotchTracker(opts).push(block, null, 0, block.length, repeats))).toMatchObject({ field: 'repeats' });
      const t = new RepeatingNotchTracker(opts).push(block);
      t.endFirstPass();
      expect(thrown(() => t.pushAgain(block, null, 0, block.length, repeats))).toBeInstanceOf(NotchStateError);
    }
  });

  it('pushAgain skipping the largest |value| throws; finish() before the second pass reaches its need throws', () => {
    const tp = turningPoints(block);
    const t = new RepeatingNotchTracker(opts).push(tp.values, tp.indices);
    const need = t.endFirstPass();
    expect(need).toEqual({ throughIndex: 3, whole: false });
    // the points after the largest |value| only
    const after = tp.indices.indexOf(4);
    expect(thrown(() => t.pushAgain(tp.values, tp.indices, after))).toMatchObject({ code: 'invalid-state', field: 'pushAgain' });
    // nothing pushed again
    const u = new RepeatingNotchTracker(opts).push(block);
    u.endFirstPass();
    expect(() => u.finish()).toThrow(NotchStateError);
    // stopped short of the largest |value|
    const v = new RepeatingNotchTracker(opts).push(block);
    v.endFirstPass();
    v.pushAgain(block.slice(0, 3));
    expect(() => v.finish()).toThrow(NotchStateError);
  });

  it('NaN or ±Infinity in a sample throws NotchSampleError with the sample index (raw, indexed, repeated, second pass)', () => {
    checkProperty(
      'bad samples',
      fc.property(historyArb(20), fc.nat(), fc.constantFrom(NaN, Infinity, -Infinity), fc.integer({ min: 1, max: 7 }), (h, k, bad, size) => {
        const at = k % h.length;
        const hist = h.slice();
        hist[at] = bad;
        // raw samples in chunks: the index counts across chunks
        const t = new RepeatingNotchTracker(opts);
        const e1 = thrown(() => {
          for (const [s, e] of chunks(hist.length, [size])) t.push(hist, null, s, e);
        });
        expect(e1).toBeInstanceOf(NotchSampleError);
        expect(e1).toMatchObject({ index: at, code: 'non-finite-sample' });
        expect(Object.is((e1 as NotchSampleError).value, bad)).toBe(true);
        // with indices: the given index
        const indices = hist.map((_, i) => 10 + 3 * i);
        expect(thrown(() => new RepeatingNotchTracker(opts).push(hist, indices))).toMatchObject({ index: 10 + 3 * at });
        // a repeated block: its own index
        expect(thrown(() => new RepeatingNotchTracker(opts).push(h).push(hist, null, 0, hist.length, 3))).toMatchObject({ index: h.length + at });
        // the second pass (when it reaches the sample)
        const u = new RepeatingNotchTracker(opts).push(h);
        const need = u.endFirstPass();
        if (at <= need.throughIndex) expect(thrown(() => u.pushAgain(hist))).toMatchObject({ index: at });
      }),
      { numRuns: 100 },
    );
  });

  it('an empty history and a constant one: defined results', () => {
    const empty = new RepeatingNotchTracker(opts);
    empty.push([]);
    expect(empty.endFirstPass()).toEqual({ throughIndex: -1, whole: true });
    const r = empty.finish();
    expect(r.loops.length).toBe(0);
    expect(r.largestIndex).toBe(-1);
    const flat = trackTwice([0, 0, 0], opts);
    expect(flat.loops.length).toBe(0);
    expect(flat.stabilised!.residue.toRows()).toEqual([{ index: -1, value: 0, stress: 0, strain: 0 }]);
  });

  it('expectedPoints sizes the tables after 65,536 points and changes no result', () => {
    // common practice, no source: a long deterministic grid history from a small linear congruential generator
    let seed = 12345;
    const long = Array.from({ length: 70_001 }, () => {
      seed = (seed * 1103515245 + 12345) % 2147483648;
      return ((seed >> 16) % 17 - 8) * S;
    });
    const run = (expectedPoints?: number) => {
      const t = new RepeatingNotchTracker({ ...opts, ...(expectedPoints !== undefined ? { expectedPoints } : {}) });
      for (const [s, e] of chunks(long.length, [40_000, 20_000])) t.push(long, null, s, e);
      t.endFirstPass();
      for (const [s, e] of chunks(long.length, [30_000])) t.pushAgain(long, null, s, e);
      return summary(t.finish());
    };
    expect(run(long.length)).toEqual(run());
  });
});

describe('trackNotchRepeating(block, options): honest tables', () => {
  type Tables = [LoopTable, ReversalTable, ReversalTable];
  const tablesOf = (p: NotchRepeatingResult['first']): Tables => [p.loops, p.reversals, p.residue];
  const rowsOf = (ts: Tables) => ts.map((t) => t.toRows());
  const fill = (ts: Tables) => {
    for (const c of Object.values(ts[0].columns())) c.fill(-1);
    for (const c of Object.values(ts[1].columns())) c.fill(-1);
    for (const c of Object.values(ts[2].columns())) c.fill(-1);
  };
  const allMinusOne = (ts: Tables) => {
    for (const rows of rowsOf(ts)) for (const row of rows) for (const v of Object.values(row)) expect(v).toBe(-1);
  };
  const buffers = (r: NotchRepeatingResult) =>
    [...tablesOf(r.first), ...tablesOf(r.stabilised)].flatMap((t) => Object.values(t.columns()).map((c: Float64Array) => c.buffer));

  it('filling every column of one pass leaves the other pass unchanged, whichever is accessed first', () => {
    checkProperty(
      'honest passes',
      fc.property(historyArb(), optionsArb, fc.boolean(), (block, o, firstFirst) => {
        // Arrange
        const r = trackNotchRepeating(block, o);
        const [a, b] = firstFirst ? [tablesOf(r.first), tablesOf(r.stabilised)] : [tablesOf(r.stabilised), tablesOf(r.first)];
        const before = rowsOf(b);
        // Act and assert: one pass's columns first
        fill(a);
        expect(rowsOf(b)).toEqual(before);
        // then the other's
        fill(b);
        allMinusOne(a);
        allMinusOne(b);
        // the block's first sample of largest |value| (after offset), found without a scan of its own when it exceeds |initial|
        const mags = block.map((x) => Math.abs(x + (o.offset ?? 0)));
        expect(r.largestIndex).toBe(mags.indexOf(Math.max(...mags)));
        // no column shares storage with another
        const bufs = buffers(r);
        expect(new Set(bufs).size).toBe(bufs.length);
      }),
      { numRuns: 150 },
    );
  });

  it('two calls never share storage', () => {
    checkProperty(
      'honest calls',
      fc.property(historyArb(), optionsArb, (block, o) => {
        // Arrange
        const r1 = trackNotchRepeating(block, o);
        const r2 = trackNotchRepeating(block, o);
        const before = [rowsOf(tablesOf(r2.first)), rowsOf(tablesOf(r2.stabilised))];
        // Act
        fill(tablesOf(r1.first));
        fill(tablesOf(r1.stabilised));
        // Assert
        expect([rowsOf(tablesOf(r2.first)), rowsOf(tablesOf(r2.stabilised))]).toEqual(before);
        const b1 = new Set(buffers(r1));
        for (const b of buffers(r2)) expect(b1.has(b)).toBe(false);
      }),
      { numRuns: 100 },
    );
  });
});

describe('RepeatingNotchTracker: after finish()', () => {
  it('finish() twice, push and pushAgain after finish() throw NotchStateError', () => {
    const t = new RepeatingNotchTracker(opts);
    t.push([300, -240, 360, -100]);
    t.endFirstPass();
    t.pushAgain([300, -240, 360, -100]);
    t.finish();
    expect(() => t.finish()).toThrow(NotchStateError);
    expect(() => t.pushAgain([300])).toThrow(NotchStateError);
    expect(() => t.push([300])).toThrow(NotchStateError);
    const u = new RepeatingNotchTracker(opts).push([300, -240, 360, -100]);
    u.finish();
    expect(() => u.finish()).toThrow(NotchStateError);
  });

  it('finish(): the stabilised residue is a table of its own when the first pass was reused', () => {
    const t = new RepeatingNotchTracker(opts);
    t.push([300, -240, 360, -100]);
    t.endFirstPass();
    t.pushAgain([300, -240, 360, -100]);
    const r = t.finish();
    expect(r.reusedFirstPass).toBe(true);
    const before = r.stabilised!.residue.toRows();
    expect(r.first.residue.toRows()).toEqual(before);
    for (const c of Object.values(r.first.residue.columns())) c.fill(-1);
    expect(r.stabilised!.residue.toRows()).toEqual(before);
  });
});
