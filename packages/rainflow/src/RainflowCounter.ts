import { decodeArray, encodeArray, type EncodedNumber } from '@loopwise/base';
import type { CycleSink } from './CycleSink';
import { CycleTable, type CycleTableState } from './CycleTable';
import { checkHistory, checkOptionFields } from './checkHistory';
import { CounterStateError, InvalidOptionError, RangeOverflowError } from './errors';
import { closeRepeatingResidue } from './closeRepeatingResidue';
import { ReversalFilter, type ReversalFilterState } from './ReversalFilter';

/**
 * What happens to the residue (the turning points left open when the history ends):
 * - `half`: each of its ranges counts as a half cycle (ASTM E1049-85, 5.4.4 step 6);
 * - `repeat`: the history is one block of a repeating signal; the residue is closed across the
 *   seam from the last sample to the first, so every range belongs to a full cycle
 *   (the repeating-history counting of ASTM E1049-85, 5.4.5, gives the same cycles);
 * - `none`: the residue is not counted (it is still returned).
 */
export type ResiduePolicy = 'half' | 'repeat' | 'none';

/** Options of {@link RainflowCounter}. */
export interface RainflowCounterOptions {
  /** Residue policy; default `'half'`. */
  residue?: ResiduePolicy;
  /** Absolute gate range (hysteresis filter) in the history's unit; default 0 (no gate). */
  gate?: number;
  /** Sample index of the first sample pushed; default 0. Used to count a segment of a longer history. */
  startIndex?: number;
  /**
   * Where counted cycles go; default a new {@link CycleTable} owned by the counter. Pass a
   * matrix to count a long stream into bins without keeping its cycles.
   */
  sink?: CycleSink;
}

/** Turning points left open at the end of a history, with their sample indices. */
export interface Residue {
  values: Float64Array;
  indices: Float64Array;
}

/** What a finished count returns. */
export interface RainflowResult {
  /** The cycle table, or null when cycles went to a caller's sink. */
  cycles: CycleTable | null;
  /** The residue before the residue policy was applied. */
  residue: Residue;
  /** Residue policy that was applied. */
  residuePolicy: ResiduePolicy;
  /** Gate range in effect. */
  gate: number;
  /** Reversals the gate removed (0 without a gate). */
  removedReversals: number;
  /** Turning points counted: the first sample, every kept reversal and the last extreme. */
  turningPointCount: number;
  /** Number of samples pushed. */
  sampleCount: number;
}

/**
 * Serialised {@link RainflowCounter} (format `loopwise-rainflow-state`, version 2; version 1,
 * whose cycle table called `turnIndex` `endIndex`, is still read).
 */
export interface RainflowCounterState {
  format: 'loopwise-rainflow-state';
  version: 2;
  residue: ResiduePolicy;
  startIndex: number;
  filter: ReversalFilterState;
  stackValues: EncodedNumber[];
  stackIndices: number[];
  cycles: CycleTableState | null;
}

const BLOCK = 65536;
/** Half the largest double: a difference of two values below it in magnitude never overflows. */
const HALF_MAX = Number.MAX_VALUE / 2;
const POLICIES: readonly ResiduePolicy[] = ['half', 'repeat', 'none'];

/**
 * Streaming four-point rainflow counter. Push chunks of any size; `finish()` applies the residue
 * policy and returns the result. For any chunking the cycles equal those of one batch count
 * ({@link rainflowFourPoint} is this counter fed the whole history).
 *
 * Method: turning points (gated by {@link ReversalFilter}) go on a stack; whenever the four
 * newest points a, b, c, d satisfy |c − b| <= |b − a| and |c − b| <= |d − c| (ties close), the
 * pair (b, c) is a full cycle: it is recorded and removed, and the test repeats. This four-point
 * rule counts the same cycles as the three-point procedure of ASTM E1049-85, section 5.4.4, and
 * leaves the same residue.
 *
 * Work per sample is a few comparisons; work per turning point is amortised O(1); nothing is
 * allocated per sample. State is the gate's O(1) state plus the residue stack.
 *
 * References: ASTM E1049-85 (reapproved 2017), Standard Practices for Cycle Counting in Fatigue
 * Analysis, 5.4.4 and 5.4.5; S. D. Downing and D. F. Socie, Simple rainflow counting algorithms,
 * International Journal of Fatigue 4(1) (1982) 31-40.
 */
export class RainflowCounter {
  readonly residuePolicy: ResiduePolicy;
  readonly startIndex: number;
  private filter: ReversalFilter;
  private sink: CycleSink;
  private readonly table: CycleTable | null;
  private sv: Float64Array;
  private si: Float64Array;
  private top = 0; // number of points on the stack
  private readonly bufV = new Float64Array(BLOCK + 2);
  private readonly bufI = new Float64Array(BLOCK + 2);
  private finished = false;
  /** Whether a point with |value| above HALF_MAX was ever stacked (then ranges can overflow). */
  private huge = false;
  /**
   * True for a count that starts the history (startIndex 0) with the 'half' or 'none' policy:
   * ranges from the starting point that the next range reaches are final and leave the stack at
   * once. 'repeat' needs them at the seam, and a later segment needs them to be appended.
   */
  private readonly trimStart: boolean;

  constructor(options: RainflowCounterOptions = {}) {
    checkOptionFields(options, ['residue', 'gate', 'startIndex', 'sink'], 'RainflowCounter options');
    const residue = options.residue ?? 'half';
    if (!POLICIES.includes(residue)) {
      throw new InvalidOptionError('residue', residue, "must be 'half', 'repeat' or 'none'");
    }
    this.residuePolicy = residue;
    this.filter = new ReversalFilter({ gate: options.gate ?? 0, startIndex: options.startIndex ?? 0 });
    this.startIndex = options.startIndex ?? 0;
    this.trimStart = residue !== 'repeat' && this.startIndex === 0;
    this.table = options.sink ? null : new CycleTable();
    this.sink = options.sink ?? (this.table as CycleTable);
    this.sv = new Float64Array(256);
    this.si = new Float64Array(256);
  }

  /** Gate range in effect. */
  get gate(): number {
    return this.filter.gate;
  }

  /** Sample index the next pushed sample gets. */
  get nextIndex(): number {
    return this.filter.nextIndex;
  }

  /**
   * The cycles counted so far, in closing order, as a snapshot of the counter's table (null when
   * a sink was given): a table of its own, made without a copy (see {@link CycleTable.snapshot}),
   * so writing it never changes the counter's later results, and later rows are not in it.
   * After `finish()` the table belongs to the result and this throws `CounterStateError`.
   */
  get cycles(): CycleTable | null {
    this.assertOpen();
    return this.table === null ? null : this.table.snapshot();
  }

  /** Reversals the gate has removed so far (as `removedReversals` of the result). */
  get removedCount(): number {
    return this.filter.removedCount;
  }

  /** Number of turning points on the residue stack now (pending extreme excluded). */
  get stackLength(): number {
    return this.top;
  }

  /** Pushes the next samples of the history. NaN or ±Infinity throws with the sample index. */
  push(chunk: ArrayLike<number>): this {
    this.assertOpen();
    checkHistory(chunk, this.filter.nextIndex);
    const n = chunk.length;
    for (let s = 0; s < n; s += BLOCK) {
      const e = Math.min(n, s + BLOCK);
      const k = this.filter.pushRange(chunk, s, e, this.bufV, this.bufI, 0);
      if (k > 0) this.stackPoints(this.bufV, this.bufI, k);
    }
    return this;
  }

  private residueOnStack(): Residue {
    return { values: this.sv.slice(0, this.top), indices: this.si.slice(0, this.top) };
  }

  /**
   * Ends the history: applies the residue policy, returns the result. The counter's table is
   * handed to the result (no copy); the counter cannot be used afterwards (serialise it before
   * finishing to resume later).
   */
  finish(): RainflowResult {
    this.assertOpen();
    this.finished = true;
    const removedReversals = this.filter.removedCount;
    const sampleCount = this.filter.nextIndex - this.startIndex;
    // The last extreme is a turning point like any other: it closes what it closes (ASTM
    // E1049-85 5.4.4 reads it in step 1 before counting the rest as half cycles).
    const pending = this.filter.pendingInto(this.bufV, this.bufI, 0);
    if (pending > 0) this.stackPoints(this.bufV, this.bufI, 1);
    const turningPointCount = this.filter.confirmedCount + pending;
    const residue = this.residueOnStack();
    const r = residue.values;
    const ri = residue.indices;
    if (this.residuePolicy === 'half') {
      for (let k = 0; k + 1 < r.length; k++) this.sink.addCycle(r[k], r[k + 1], 0.5, ri[k], ri[k + 1], ri[k + 1]);
    } else if (this.residuePolicy === 'repeat') {
      closeRepeatingResidue(r, ri, this.filter.gate, this.sink);
    }
    return {
      cycles: this.table,
      residue,
      residuePolicy: this.residuePolicy,
      gate: this.filter.gate,
      removedReversals,
      turningPointCount,
      sampleCount,
    };
  }

  /**
   * Appends a counter that counted the samples right after this one's (its `startIndex` equals
   * this counter's `nextIndex`, same gate), so that a long channel split into segments and
   * counted apart (in workers) combines into the result of counting it whole: the same cycles
   * (values, counts, start and turn samples), the same residue, turning-point and gate counts, and
   * a state that continues exactly. The cycles that close across the junction are found from the
   * two residues; such a cycle may be closed by a later turning point than in the single count
   * (the one that closed it there was used up inside `later`), so its close index can be later.
   * When both counters keep their own tables, `later`'s rows and the junction's are merged into
   * this table in closing order; with caller sinks, the junction cycles go to this counter's
   * sink and the caller combines the two sinks (e.g. `matrix.add`). `later` must not be used
   * afterwards.
   */
  append(later: RainflowCounter): this {
    this.assertOpen();
    later.assertOpen();
    if (later.filter.gate !== this.filter.gate) {
      throw new CounterStateError('gate', later.filter.gate, `cannot append a segment counted with gate ${later.filter.gate} to one with gate ${this.filter.gate}`);
    }
    if (later.startIndex !== this.filter.nextIndex) {
      throw new CounterStateError(
        'startIndex',
        later.startIndex,
        `the appended segment starts at sample ${later.startIndex}, but this one ends before sample ${this.filter.nextIndex}`,
      );
    }
    if (!this.filter.hasSamples) {
      this.adopt(later);
      return this;
    }
    const junction = new CycleTable();
    const keepSink = this.sink;
    this.sink = junction;
    this.feedIndexed(later.sv, later.si, later.top);
    const pv = new Float64Array(2);
    const pi = new Float64Array(2);
    this.feedIndexed(pv, pi, later.filter.pendingSamplesInto(pv, pi, 0));
    this.sink = keepSink;
    this.filter.adoptEnd(later.filter, later.filter.confirmedCount - later.top);
    if (this.table && later.table) {
      mergeByCloseIndex(this.table, later.table, junction);
    } else {
      junction.replayInto(this.sink);
    }
    later.finished = true;
    return this;
  }

  /** The state as JSON-safe data; `fromJSON` resumes it exactly. */
  toJSON(): RainflowCounterState {
    this.assertOpen();
    return {
      format: 'loopwise-rainflow-state',
      version: 2,
      residue: this.residuePolicy,
      startIndex: this.startIndex,
      filter: this.filter.toJSON(),
      stackValues: encodeArray(this.sv, this.top),
      stackIndices: Array.from(this.si.subarray(0, this.top)),
      cycles: this.table ? this.table.toJSON() : null,
    };
  }

  /**
   * Resumes a counter from {@link toJSON} output. A state saved with the counter's own table
   * restores it; a state saved while counting into a caller's sink needs that sink again.
   */
  static fromJSON(state: RainflowCounterState, options: { sink?: CycleSink } = {}): RainflowCounter {
    if (state === null || typeof state !== 'object' || state.format !== 'loopwise-rainflow-state') {
      throw new CounterStateError('format', state?.format, 'not a loopwise-rainflow-state object');
    }
    const version = state.version as number;
    if (version !== 2 && version !== 1) throw new CounterStateError('version', version, `unsupported rainflow state version ${String(version)}`);
    if (state.cycles === null && !options.sink) {
      throw new CounterStateError('options.sink', options.sink, 'this state counted into a caller sink: pass options.sink to resume it');
    }
    const c = new RainflowCounter({
      residue: state.residue,
      startIndex: state.startIndex,
      ...(state.cycles === null ? { sink: options.sink } : {}),
    });
    c.filter = ReversalFilter.fromJSON(state.filter);
    if (state.cycles !== null && c.table) {
      // version 1 wrote the turn index column as `endIndex`
      const cycles = version === 1 ? { ...state.cycles, turnIndex: (state.cycles as unknown as { endIndex: number[] }).endIndex } : state.cycles;
      c.table.appendTable(CycleTable.fromJSON(cycles));
    }
    const v = decodeArray(state.stackValues, 'stackValues');
    const i = decodeArray(state.stackIndices, 'stackIndices');
    if (v.length !== i.length) {
      throw new CounterStateError('stackIndices', i.length, `stackValues and stackIndices differ in length (${v.length} and ${i.length})`);
    }
    c.reserve(v.length);
    c.sv.set(v);
    c.si.set(i);
    c.top = v.length;
    for (let k = 0; k < v.length; k++) if (v[k] > HALF_MAX || v[k] < -HALF_MAX) c.huge = true;
    return c;
  }

  /** Pushes `count` points that carry their own sample indices through the gate onto the stack. */
  private feedIndexed(values: Float64Array, indices: Float64Array, count: number): void {
    for (let s = 0; s < count; s += BLOCK) {
      const k = this.filter.pushIndexed(values, indices, s, Math.min(count, s + BLOCK), this.bufV, this.bufI, 0);
      if (k > 0) this.stackPoints(this.bufV, this.bufI, k);
    }
  }

  private stackPoints(values: Float64Array, indices: Float64Array, k: number): void {
    this.reserve(this.top + k);
    const sv = this.sv;
    const si = this.si;
    const sink = this.sink;
    let top = this.top;
    // A range overflows only if one of its ends has |value| above half the largest double: until
    // such a value reaches the stack (sticky, rare) the per-point checks below are skipped.
    let huge = this.huge;
    if (!huge) {
      for (let j = 0; j < k; j++) {
        const v = values[j];
        if (v > HALF_MAX || v < -HALF_MAX) {
          huge = this.huge = true;
          break;
        }
      }
    }
    for (let j = 0; j < k; j++) {
      const v = values[j];
      // Every pair of neighbours on the stack has a finite range (checked where a pair forms: here
      // and after a close), so every cycle and every residue half cycle does.
      if (huge && top > 0 && !(v - sv[top - 1] - (v - sv[top - 1]) === 0)) throw new RangeOverflowError(si[top - 1], indices[j], sv[top - 1], v);
      sv[top] = v;
      si[top] = indices[j];
      top++;
      while (top >= 4) {
        const a = sv[top - 4];
        const b = sv[top - 3];
        const c = sv[top - 2];
        const d = sv[top - 1];
        const x = c > b ? c - b : b - c;
        if (x < (b > a ? b - a : a - b) && x <= (d > c ? d - c : c - d)) {
          sink.addCycle(b, c, 1, si[top - 3], si[top - 2], si[top - 1]);
          sv[top - 3] = d;
          si[top - 3] = si[top - 1];
          top -= 2;
          if (huge && !(d - a - (d - a) === 0)) throw new RangeOverflowError(si[top - 2], si[top - 1], a, d);
        } else break;
      }
      if (top === 3 && this.trimStart) {
        // ASTM E1049-85 5.4.4 step 5: the range from the starting point is exceeded (or tied) by
        // the next; it can never close, so it is final now: a half cycle under 'half', dropped
        // under 'none'. The stack then holds exactly the standard's list and stays small.
        const s0 = sv[0];
        const s1 = sv[1];
        const s2 = sv[2];
        if ((s2 > s1 ? s2 - s1 : s1 - s2) >= (s1 > s0 ? s1 - s0 : s0 - s1)) {
          if (this.residuePolicy === 'half') sink.addCycle(s0, s1, 0.5, si[0], si[1], si[1]);
          sv[0] = s1;
          si[0] = si[1];
          sv[1] = s2;
          si[1] = si[2];
          top = 2;
        }
      }
    }
    this.top = top;
  }

  private reserve(size: number): void {
    if (size <= this.sv.length) return;
    let cap = this.sv.length;
    while (cap < size) cap *= 2;
    const v = new Float64Array(cap);
    const i = new Float64Array(cap);
    v.set(this.sv.subarray(0, this.top));
    i.set(this.si.subarray(0, this.top));
    this.sv = v;
    this.si = i;
  }

  private adopt(later: RainflowCounter): void {
    this.filter = later.filter;
    this.reserve(later.top);
    this.sv.set(later.sv.subarray(0, later.top));
    this.si.set(later.si.subarray(0, later.top));
    this.top = later.top;
    this.huge = this.huge || later.huge;
    if (this.table && later.table) this.table.appendTable(later.table);
    later.finished = true;
  }

  private assertOpen(): void {
    if (this.finished) {
      throw new CounterStateError('counter', 'finished', 'this counter has finished (or was appended to another); start a new one');
    }
  }
}

/** Appends `a` and `b` (each in closing order) to `into`, merged by close index; ties keep `a` first. */
function mergeByCloseIndex(into: CycleTable, a: CycleTable, b: CycleTable): void {
  const ka = a.columns().closeIndex;
  const kb = b.columns().closeIndex;
  let i = 0;
  let j = 0;
  while (i < ka.length || j < kb.length) {
    if (j >= kb.length || (i < ka.length && ka[i] <= kb[j])) into.copyRow(a, i++);
    else into.copyRow(b, j++);
  }
}
