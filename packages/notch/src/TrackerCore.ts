import { BranchSolver } from './BranchSolver';
import { LoopTable } from './LoopTable';
import { NotchSampleError } from './NotchSampleError';
import { NotchStateError } from './NotchStateError';
import {
  materialFields,
  materialFromFields,
  resolveTrackerOptions,
  type NotchTrackerOptions,
  type ResolvedTrackerOptions,
} from './NotchTrackerOptions';
import { NotchValidityError } from './NotchValidityError';
import { decodeNumber, encodeNumber, type EncodedNumber } from '@loopwise/base';
import { ReversalTable } from './ReversalTable';

/** What {@link NotchTracker.end} and {@link trackNotch} return. */
export interface NotchTrackResult {
  /** Every reversal of the local path, in order: source index, history value, local σ and ε. */
  reversals: ReversalTable;
  /** Every closed hysteresis loop, in the order it closed. */
  loops: LoopTable;
  /**
   * The open loops left at the end: the reversal points still in memory (oldest first), then
   * the end point of the path (the last extreme, or the initial value when the path never moved).
   */
  residue: ReversalTable;
  /** Number of samples pushed. */
  samples: number;
  /** True when some local strain amplitude exceeded `strainLimit` (the model is then extrapolating). */
  beyondStrainLimit: boolean;
  /** Sample index of the first such point, or -1. */
  firstBeyondIndex: number;
}

/** Serialised state of a {@link NotchTracker} (plain JSON; -0 and non-finite numbers encoded). */
export interface NotchTrackerState {
  format: 'loopwise-notch-tracker';
  version: 1;
  options: Record<string, unknown>;
  next: number;
  samples: number;
  dir: number;
  ext: EncodedNumber;
  extIndex: number;
  memory: { value: EncodedNumber[]; index: number[]; stress: EncodedNumber[]; strain: EncodedNumber[] };
  beyondStrainLimit: boolean;
  firstBeyondIndex: number;
}

/** A frozen copy of the memory. */
export interface TrackerSnapshot {
  k: number;
  dir: number;
  ext: number;
  extIndex: number;
  sv: Float64Array;
  si: Float64Array;
  ss: Float64Array;
  se: Float64Array;
}

/** The first point of largest |value| a tracker has seen, and the state right after it. */
export interface LargestPoint {
  /** Sample index of the point (the first sample of its plateau). */
  index: number;
  /** Its value, offset applied. */
  value: number;
  /** Rows of the reversal table recorded before the point was reached (when reversals are recorded). */
  reversalRow: number;
  /** Rows of the loop table closed up to and including the point. */
  loopRow: number;
  /** The memory right after the point: empty, on the first-loading curve towards the point. */
  after: TrackerSnapshot;
}

/**
 * The state machine of the memory-aware notch tracker (see {@link NotchTracker} for the model
 * and its references). Not exported from the package: {@link NotchTracker} (one history,
 * streaming) and {@link RepeatingNotchTracker} (a history that repeats, events with repeat
 * counts) are its two public faces, and the recipe of the repeating pass lives next to it, in
 * this package, because it needs the memory itself (a copy, a comparison, the largest point).
 */
export class TrackerCore {
  /** The checked options. */
  readonly options: Readonly<ResolvedTrackerOptions>;
  private readonly solver: BranchSolver;
  // Numeric fields get a number where they are declared: a field that starts as undefined (the
  // define semantics of class fields) stays a tagged field, and every double stored into it is
  // a fresh heap allocation (tens of MB of garbage per million samples).
  private readonly scale: number = 0;
  private readonly offset: number = 0;
  private readonly strainLimit: number = 0;
  private readonly recordReversals: boolean = true;
  revs = new ReversalTable();
  loopTable = new LoopTable();
  private next = 0;
  private samples = 0;
  private dir = 0;
  private ext = 0;
  private extIndex = -1;
  private thr = 0;
  private k = 0;
  private sv = new Float64Array(64);
  private si = new Float64Array(64);
  private ss = new Float64Array(64);
  private se = new Float64Array(64);
  private beyond = false;
  private firstBeyond = -1;
  // The first reversal point of largest |value| since construction, with the table rows at
  // the time (for largestPoint); unknown for a tracker restored from JSON.
  private peakAbs = -1;
  private peakValue = 0;
  private peakIndex = -1;
  private peakReversalRow = 0;
  private peakLoopRow = 0;
  // Rows handed over by takeLoops / takeResult so far: the rows of the largest point count from
  // the start of the tracking, whatever was taken since.
  private reversalsTaken = 0;
  private loopsTaken = 0;
  private peakKnown = true;
  // Output of computeAtExtreme.
  private outStress = 0;
  private outStrain = 0;

  constructor(options: NotchTrackerOptions) {
    const o = resolveTrackerOptions(options);
    this.options = Object.freeze(o);
    this.solver = new BranchSolver(o.material, o.kind, o.tolerance, o.maxIterations);
    this.scale = o.scale;
    this.offset = o.offset;
    this.strainLimit = o.strainLimit;
    this.recordReversals = o.recordReversals;
    this.ext = o.initial;
  }

  /** Index the next pushed sample gets. */
  get nextIndex(): number {
    return this.next;
  }

  /** Samples (or points) pushed so far. */
  get sampleCount(): number {
    return this.samples;
  }

  /** Events so far (the live tables). */
  get reversals(): ReversalTable {
    return this.revs;
  }

  /** Closed loops so far (the live table). */
  get loops(): LoopTable {
    return this.loopTable;
  }

  /** Pushes a chunk of samples; returns this. */
  push(chunk: ArrayLike<number>): this {
    this.run(chunk, null, 0, chunk.length);
    return this;
  }

  /** Pushes `chunk[from]` … `chunk[to − 1]` as consecutive samples from `nextIndex` on. */
  pushRange(chunk: ArrayLike<number>, from: number, to: number): void {
    this.run(chunk, null, from, to);
  }

  /** Pushes points with their source sample indices (see {@link NotchTracker.pushIndexed}). */
  pushIndexed(values: ArrayLike<number>, indices: ArrayLike<number>, from: number, to: number): this {
    this.run(values, indices, from, to);
    return this;
  }

  /**
   * The per-sample loop: one comparison with the running extreme, one with the closure level;
   * reversals and closures leave it. Sample indices count up from `next`, or come from `indices`.
   */
  private run(chunk: ArrayLike<number>, indices: ArrayLike<number> | null, from: number, to: number): void {
    const off = this.offset;
    const base = this.next - from;
    let dir = this.dir;
    let ext = this.ext;
    let thr = this.thr;
    let extIndex = this.extIndex;
    let i = from;
    for (; i < to; i++) {
      const idx = indices === null ? base + i : indices[i];
      const x = chunk[i] + off;
      if (x - x !== 0) {
        this.dir = dir;
        this.ext = ext;
        this.thr = thr;
        this.extIndex = extIndex;
        this.samples += i - from;
        this.next = idx;
        throw new NotchSampleError(idx, chunk[i]);
      }
      // Events are handled by methods without number arguments: a double passed to a call
      // that is not inlined is boxed, a heap allocation per event. They read and write the
      // extreme through the fields instead.
      if (dir > 0) {
        if (x > ext) {
          ext = x;
          extIndex = idx;
          if (x >= thr) {
            this.ext = x;
            this.extIndex = idx;
            this.close(idx);
            thr = this.thr;
          }
        } else if (x < ext) {
          this.ext = ext;
          this.extIndex = extIndex;
          this.reverse();
          dir = -1;
          ext = x;
          extIndex = idx;
          thr = this.thr;
          if (x <= thr) {
            this.ext = x;
            this.extIndex = idx;
            this.close(idx);
            thr = this.thr;
          }
        }
      } else if (dir < 0) {
        if (x < ext) {
          ext = x;
          extIndex = idx;
          if (x <= thr) {
            this.ext = x;
            this.extIndex = idx;
            this.close(idx);
            thr = this.thr;
          }
        } else if (x > ext) {
          this.ext = ext;
          this.extIndex = extIndex;
          this.reverse();
          dir = 1;
          ext = x;
          extIndex = idx;
          thr = this.thr;
          if (x >= thr) {
            this.ext = x;
            this.extIndex = idx;
            this.close(idx);
            thr = this.thr;
          }
        }
      } else if (x !== ext) {
        this.start(x, idx);
        dir = this.dir;
        ext = this.ext;
        extIndex = idx;
        thr = this.thr;
      }
    }
    this.dir = dir;
    this.ext = ext;
    this.extIndex = extIndex;
    this.thr = thr;
    this.samples += to - from;
    if (to > from) this.next = indices === null ? base + to : indices[to - 1] + 1;
  }

  /** First movement away from the initial value (once per history: may take numbers). */
  private start(x: number, idx: number): void {
    const v0 = this.ext;
    const d = x > v0 ? 1 : -1;
    if (this.k === 0 && (v0 === 0 || (v0 > 0) === (d > 0))) {
      this.dir = d;
      this.thr = d * Infinity;
      this.ext = x;
      this.extIndex = idx;
      return;
    }
    this.dir = -d; // the initial value is a reversal of the path
    this.reverse();
    this.ext = x;
    this.extIndex = idx;
    if (d > 0 ? x >= this.thr : x <= this.thr) this.close(idx);
  }

  /**
   * A reversal at the pending extreme `ext` (at `extIndex`): records it, pushes it onto the
   * memory, turns the direction and sets the closure level. The caller moves the extreme on.
   */
  private reverse(): void {
    const v = this.ext;
    const index = this.extIndex;
    this.computeAtExtreme(true);
    const stress = this.outStress;
    const strain = this.outStrain;
    const av = v < 0 ? -v : v;
    if (av > this.peakAbs) {
      // nothing closes between reaching a new largest |value| and turning from it, so the
      // table lengths now are those right after the point
      this.peakAbs = av;
      this.peakValue = v;
      this.peakIndex = index;
      this.peakReversalRow = this.reversalsTaken + this.revs.length;
      this.peakLoopRow = this.loopsTaken + this.loopTable.length;
    }
    if (this.recordReversals) this.revs.add(index, v, stress, strain);
    if (this.k === this.sv.length) this.growMemory();
    const k = this.k++;
    this.sv[k] = v;
    this.si[k] = index;
    this.ss[k] = stress;
    this.se[k] = strain;
    this.dir = -this.dir;
    this.setThreshold();
  }

  /** Closes every loop (memory 1, 2) and mirror rejoin (memory 3) that the extreme `ext` reaches; `idx` closes them. */
  private close(idx: number): void {
    const x = this.ext;
    const up = this.dir > 0;
    while (up ? x >= this.thr : x <= this.thr) {
      const k = this.k;
      if (k >= 2) {
        this.loopTable.add(this.ss[k - 2], this.se[k - 2], this.ss[k - 1], this.se[k - 1], this.si[k - 2], this.si[k - 1], idx, 1);
        this.k = k - 2;
      } else if (k === 1) {
        // Memory 3 needs the mirror exceeded: a branch that turns exactly at the mirror keeps its
        // start in memory, so the loop closes at the next return (ties close, as in memory 1).
        if (x === this.thr) break;
        this.k = 0;
      } else {
        break;
      }
      this.setThreshold();
    }
  }

  private setThreshold(): void {
    const k = this.k;
    this.thr = k >= 2 ? this.sv[k - 2] : k === 1 ? -this.sv[0] : this.dir * Infinity;
  }

  /** Local state at the extreme `ext` on the current branch (direction `dir`) into out*; `flag` marks a reversal. */
  private computeAtExtreme(flag: boolean): void {
    const v = this.ext;
    const index = this.extIndex;
    const k = this.k;
    const solver = this.solver;
    let a: number;
    if (k === 0) {
      a = this.scale * (v < 0 ? -v : v);
    } else {
      const d = v - this.sv[k - 1];
      a = this.scale * (d < 0 ? -d : d) * 0.5;
    }
    if (a === Infinity) throw new NotchValidityError(index, 'pseudoElastic', a);
    solver.amplitude = a;
    solver.solve();
    const s = solver.stress;
    const e = solver.strain;
    if (!(s < Infinity)) throw new NotchValidityError(index, 'stress', s);
    if (!(e < Infinity)) throw new NotchValidityError(index, 'strain', e);
    if (flag && e > this.strainLimit && !this.beyond) {
      this.beyond = true;
      this.firstBeyond = index;
    }
    if (k === 0) {
      this.outStress = v < 0 ? -s : s;
      this.outStrain = v < 0 ? -e : e;
    } else {
      // The branch's end from its origin: finite parts can still add up to ±Infinity.
      const os = this.dir > 0 ? this.ss[k - 1] + 2 * s : this.ss[k - 1] - 2 * s;
      const oe = this.dir > 0 ? this.se[k - 1] + 2 * e : this.se[k - 1] - 2 * e;
      if (!(os - os === 0)) throw new NotchValidityError(index, 'stress', os);
      if (!(oe - oe === 0)) throw new NotchValidityError(index, 'strain', oe);
      this.outStress = os;
      this.outStrain = oe;
    }
  }

  private growMemory(): void {
    const g = (a: Float64Array) => {
      const b = new Float64Array(a.length * 2);
      b.set(a);
      return b;
    };
    this.sv = g(this.sv);
    this.si = g(this.si);
    this.ss = g(this.ss);
    this.se = g(this.se);
  }

  /** The residue (memory points, then the end point of the path) as a new table. */
  residue(): ReversalTable {
    const r = new ReversalTable(this.k + 1);
    for (let i = 0; i < this.k; i++) r.add(this.si[i], this.sv[i], this.ss[i], this.se[i]);
    this.computeAtExtreme(false);
    r.add(this.extIndex, this.ext, this.outStress, this.outStrain);
    return r;
  }

  /**
   * Ends the history here: returns copies of the events so far and the residue. Does not change
   * the state, so pushing may continue (the history is then longer).
   */
  end(): NotchTrackResult {
    const reversals = new ReversalTable(this.revs.length);
    reversals.appendRange(this.revs, 0, this.revs.length);
    const loops = new LoopTable(this.loopTable.length);
    loops.appendRange(this.loopTable, 0, this.loopTable.length);
    return this.resultWith(reversals, loops);
  }

  /**
   * Like {@link end}, but hands the live event tables over instead of copying them, and
   * continues with empty tables of the given capacities (copying millions of rows costs more
   * than the solves). The state is unchanged.
   */
  takeResult(reversalCapacity = 256, loopCapacity = 256): NotchTrackResult {
    const out = this.resultWith(this.revs, this.loopTable);
    this.reversalsTaken += this.revs.length;
    this.loopsTaken += this.loopTable.length;
    this.revs = new ReversalTable(reversalCapacity);
    this.loopTable = new LoopTable(loopCapacity);
    return out;
  }

  /** Hands the loops closed since the last take over (no residue, no copy); the state is unchanged. */
  takeLoops(capacity = 256): LoopTable {
    const out = this.loopTable;
    this.loopsTaken += out.length;
    this.loopTable = new LoopTable(capacity);
    return out;
  }

  /** Loop rows closed since the start of the tracking (taken or not). */
  get loopRows(): number {
    return this.loopsTaken + this.loopTable.length;
  }

  /** Reversal rows recorded since the start of the tracking (taken or not). */
  get reversalRows(): number {
    return this.reversalsTaken + this.revs.length;
  }

  /**
   * Reserves table room for `total` samples in all at the reversal rate seen so far, with a
   * quarter to spare (called after a first piece of the history,
   * so that tables of millions of rows are not copied at every doubling). Each loop takes two
   * reversals, so half as many loops fit.
   */
  reserveFor(total: number): void {
    if (this.samples === 0) return;
    // the reversal rate, from the reversal table or, when it is not kept, from the loops (two
    // reversals each)
    const seen = this.recordReversals ? this.revs.length : 2 * this.loopTable.length;
    const rows = Math.min(total + 1, Math.ceil((1.25 * seen * total) / this.samples) + 64);
    if (this.recordReversals) this.revs.reserve(rows);
    this.loopTable.reserve((rows >> 1) + 1);
  }

  resultWith(reversals: ReversalTable, loops: LoopTable): NotchTrackResult {
    return {
      reversals,
      loops,
      residue: this.residue(),
      samples: this.samples,
      beyondStrainLimit: this.beyond,
      firstBeyondIndex: this.firstBeyond,
    };
  }

  /** The memory as a frozen copy. */
  snapshot(): TrackerSnapshot {
    const k = this.k;
    return {
      k,
      dir: this.dir,
      ext: this.ext,
      extIndex: this.extIndex,
      sv: this.sv.slice(0, k),
      si: this.si.slice(0, k),
      ss: this.ss.slice(0, k),
      se: this.se.slice(0, k),
    };
  }

  /**
   * The first sample of largest |value| pushed so far (a reversal point or the pending extreme),
   * the event-table rows up to it and the memory right after it (the repeating pass needs no
   * scan of its own). Null when no sample exceeds |initial| in magnitude,
   * when nothing was pushed, or for a tracker restored from JSON.
   *
   * Why the memory after it is known: every point in memory then is an earlier sample or the
   * initial value, all strictly smaller in magnitude, so reaching the point closes every loop
   * (memory 1, 2) and passes the mirror of the oldest point strictly (memory 3). The path is on
   * the first-loading curve with an empty memory, moving towards the point.
   */
  largestPoint(): LargestPoint | null {
    if (!this.peakKnown || this.dir === 0) return null;
    let abs = this.peakAbs;
    let value = this.peakValue;
    let index = this.peakIndex;
    let reversalRow = this.peakReversalRow;
    let loopRow = this.peakLoopRow;
    const e = this.ext;
    if ((e < 0 ? -e : e) > abs) {
      abs = e < 0 ? -e : e;
      value = e;
      index = this.extIndex;
      reversalRow = this.reversalsTaken + this.revs.length;
      loopRow = this.loopsTaken + this.loopTable.length;
    }
    const init = this.options.initial;
    if (index < 0 || !((init < 0 ? -init : init) < abs)) return null;
    const none = new Float64Array(0);
    const after: TrackerSnapshot = { k: 0, dir: value > 0 ? 1 : -1, ext: value, extIndex: index, sv: none, si: none, ss: none, se: none };
    return { index, value, reversalRow, loopRow, after };
  }

  /** True when the memory equals a snapshot exactly. */
  matches(s: TrackerSnapshot): boolean {
    if (s.k !== this.k || s.dir !== this.dir || s.ext !== this.ext || s.extIndex !== this.extIndex) return false;
    for (let i = 0; i < s.k; i++) {
      if (s.sv[i] !== this.sv[i] || s.si[i] !== this.si[i] || s.ss[i] !== this.ss[i] || s.se[i] !== this.se[i]) return false;
    }
    return true;
  }

  /** Sets the index of the next sample (a repeated block keeps its own indices). */
  restartIndex(next: number): void {
    this.next = next;
  }

  /** The state as JSON-safe data. Events already emitted are not part of it. */
  toJSON(): NotchTrackerState {
    const o = this.options;
    const options: Record<string, unknown> = {
      material: materialFields(o.material),
      input: o.input,
      rule: o.rule,
      loadToStress: o.loadToStress,
      initial: encodeNumber(o.initial),
      offset: encodeNumber(o.offset),
      strainLimit: encodeNumber(o.strainLimit),
      recordReversals: o.recordReversals,
      tolerance: o.tolerance,
      maxIterations: o.maxIterations,
    };
    if (o.Kt !== undefined) options.Kt = o.Kt;
    if (o.Kf !== undefined) options.Kf = o.Kf;
    const k = this.k;
    const enc = (a: Float64Array) => Array.from(a.subarray(0, k), encodeNumber);
    return {
      format: 'loopwise-notch-tracker',
      version: 1,
      options,
      next: this.next,
      samples: this.samples,
      dir: this.dir,
      ext: encodeNumber(this.ext),
      extIndex: this.extIndex,
      memory: { value: enc(this.sv), index: Array.from(this.si.subarray(0, k)), stress: enc(this.ss), strain: enc(this.se) },
      beyondStrainLimit: this.beyond,
      firstBeyondIndex: this.firstBeyond,
    };
  }

  /** Rebuilds a tracker from {@link toJSON} output; it continues exactly (with empty event tables). */
  static fromJSON(state: NotchTrackerState): TrackerCore {
    if (state == null || typeof state !== 'object' || state.format !== 'loopwise-notch-tracker') {
      throw new NotchStateError('format', "must be 'loopwise-notch-tracker'");
    }
    if (state.version !== 1) throw new NotchStateError('version', 'must be 1');
    const o = state.options as Record<string, unknown>;
    if (o == null || typeof o !== 'object') throw new NotchStateError('options', 'must be an object');
    const num = (field: string, v: unknown): number => {
      try {
        return decodeNumber(v);
      } catch {
        throw new NotchStateError(field, 'must be an encoded number');
      }
    };
    const t = new TrackerCore({
      material: materialFromFields(o.material as Record<string, unknown>),
      input: o.input as NotchTrackerOptions['input'],
      rule: o.rule as NotchTrackerOptions['rule'],
      ...(o.Kt !== undefined ? { Kt: o.Kt as number } : {}),
      ...(o.Kf !== undefined ? { Kf: o.Kf as number } : {}),
      loadToStress: o.loadToStress as number,
      initial: num('options.initial', o.initial),
      offset: num('options.offset', o.offset),
      strainLimit: num('options.strainLimit', o.strainLimit),
      ...(o.recordReversals === false ? { recordReversals: false } : {}),
      tolerance: o.tolerance as number,
      maxIterations: o.maxIterations as number,
    });
    const mem = state.memory;
    if (mem == null || !Array.isArray(mem.value) || !Array.isArray(mem.index) || !Array.isArray(mem.stress) || !Array.isArray(mem.strain)) {
      throw new NotchStateError('memory', 'must hold value, index, stress and strain arrays');
    }
    const k = mem.value.length;
    if (mem.index.length !== k || mem.stress.length !== k || mem.strain.length !== k) throw new NotchStateError('memory', 'arrays must have equal lengths');
    if (![-1, 0, 1].includes(state.dir)) throw new NotchStateError('dir', 'must be -1, 0 or 1');
    if (!Number.isSafeInteger(state.next) || state.next < 0) throw new NotchStateError('next', 'must be a safe integer >= 0');
    while (t.sv.length < k) t.growMemory();
    for (let i = 0; i < k; i++) {
      t.sv[i] = num(`memory.value[${i}]`, mem.value[i]);
      t.si[i] = mem.index[i];
      t.ss[i] = num(`memory.stress[${i}]`, mem.stress[i]);
      t.se[i] = num(`memory.strain[${i}]`, mem.strain[i]);
    }
    t.k = k;
    t.next = state.next;
    t.samples = state.samples;
    t.dir = state.dir;
    t.ext = num('ext', state.ext);
    t.extIndex = state.extIndex;
    t.beyond = state.beyondStrainLimit === true;
    t.peakKnown = false;
    t.firstBeyond = state.firstBeyondIndex;
    t.setThreshold();
    if (t.dir === 0) t.thr = 0;
    return t;
  }
}
