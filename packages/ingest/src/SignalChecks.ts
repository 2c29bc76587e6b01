import { FINDING_CODES, SignalScanner, type FindingCode, type SignalScan } from '@loopwise/signal';
import { IngestOptionError } from './IngestError.js';

/** Kinds of {@link SignalWarning}. */
export type SignalWarningKind =
  | 'spike'
  | 'spikes-interpolated'
  | 'flat-line'
  | 'dropout'
  | 'clipped-maximum'
  | 'clipped-minimum'
  | 'large-offset'
  | 'time-not-increasing'
  /** Not a check of the reader: the command's study of what the flagged samples do to the damage. */
  | 'artefact-damage';

/** A run of samples, by 0-based sample index, both ends included. */
export interface SampleRange {
  readonly first: number;
  readonly last: number;
}

/** A signal check that found something worth a look. Warnings never stop ingestion. */
export interface SignalWarning {
  readonly kind: SignalWarningKind;
  /** The channel's name. */
  readonly channel: string;
  /** Number of samples concerned. */
  readonly samples: number;
  /** Where: at most `maxRanges` ranges (0-based sample indices, inclusive), in order. */
  readonly ranges: readonly SampleRange[];
  /** Ranges found beyond the ones listed. */
  readonly rangesOmitted: number;
  /** One line for people. */
  readonly message: string;
}

/**
 * The samples the checks flagged in one channel, by 0-based sample index, in order: one-sample
 * spikes, and runs (flat lines and dropouts at zero) as pairs of first index and length. For
 * studies of what the artefacts do (the command's life with them removed); plain typed arrays, so
 * the report crosses threads.
 */
export interface ChannelArtefacts {
  readonly spikes: Float64Array;
  /** Pairs: first sample, number of samples. */
  readonly runs: Float64Array;
}

/**
 * Thresholds of the signal checks. Every default is `common practice, no source`: a rule of
 * thumb for strain-gauge and load records sampled well above their content, to be tuned per
 * acquisition system.
 */
export interface SignalCheckThresholds {
  /** A spike jumps out and back by more than this many times the robust scale of Δx (1.4826 × median |Δx|, @loopwise/signal). Default 6 (> 0). */
  spikeFactor: number;
  /** Identical consecutive samples (at least this many) are a flat line (a dropout at 0). Default 100. */
  flatRunSamples: number;
  /** Clipping: at least this many samples sit exactly at the maximum (or minimum). Default 5. */
  clipMinSamples: number;
  /** …and at least this share of all samples. Default 0.001. */
  clipShare: number;
  /** Large offset: |mean| exceeds this share of the range (max − min). Default 0.5. */
  offsetShare: number;
  /** Ranges listed per warning (the others are counted). Default 20. */
  maxRanges: number;
}

/** Defaults of {@link SignalCheckThresholds} (`common practice, no source`). */
export const DEFAULT_SIGNAL_CHECK_THRESHOLDS: Readonly<SignalCheckThresholds> = Object.freeze({
  spikeFactor: 6,
  flatRunSamples: 100,
  clipMinSamples: 5,
  clipShare: 0.001,
  offsetShare: 0.5,
  maxRanges: 20,
});

/** Fixed-capacity list of sample ranges that merges a range adjacent to the last one. */
class RangeList {
  private readonly bounds: Float64Array;
  count = 0;
  omitted = 0;
  samples = 0;
  constructor(private readonly capacity: number) {
    this.bounds = new Float64Array(2 * capacity);
  }
  add(first: number, last: number): void {
    this.samples += last - first + 1;
    const k = this.count;
    if (k > 0 && k <= this.capacity && this.bounds[2 * k - 1] === first - 1 && this.omitted === 0) {
      this.bounds[2 * k - 1] = last;
      return;
    }
    if (k < this.capacity) {
      this.bounds[2 * k] = first;
      this.bounds[2 * k + 1] = last;
      this.count++;
    } else this.omitted++;
  }
  ranges(): SampleRange[] {
    const out: SampleRange[] = [];
    for (let k = 0; k < this.count; k++) out.push({ first: this.bounds[2 * k], last: this.bounds[2 * k + 1] });
    return out;
  }
}

/**
 * Streaming signal checks of one channel for the command: spikes, flat lines and dropouts, a
 * clipped full scale and a large offset, as warnings for people. Push the channel's samples
 * chunk by chunk, then `finish()`. The checks are `@loopwise/signal`'s {@link SignalScanner}
 * (one pass, nothing allocated per sample; see docs/signal.md for the rules and their sources);
 * this class maps the command's thresholds onto its options and its findings onto warnings
 * with at most `maxRanges` ranges each. Drift is not checked here.
 *
 * Mapping (thresholds in {@link SignalCheckThresholds}, all `common practice, no source`):
 * - Spike: the scanner's spike rule with `factor` = spikeFactor (one-sample spikes whose jump
 *   out and back exceeds spikeFactor × 1.4826 × the median |Δx| of the block before).
 * - Flat line / dropout: the scanner's stuck runs / runs at zero, minimumSamples =
 *   max(2, ⌈flatRunSamples⌉).
 * - Clipped maximum (minimum): the scanner's clipping check with minimumSamples =
 *   max(1, ⌈clipMinSamples⌉) and minimumShare = min(1, clipShare); the range reported runs from
 *   the first to the last sample at the extreme, `samples` counts the samples there.
 * - Large offset: |mean| > offsetShare · (max − min); the range is the whole channel.
 *
 * @example
 * const checks = new SignalChecks('strain');
 * const x = new Float64Array(200).map((_, i) => Math.sin(i / 5));
 * x[100] = 50; // invented: one bad sample
 * checks.push(x);
 * checks.finish()[0].ranges;
 * // returns [{ first: 100, last: 100 }]
 */
export class SignalChecks {
  private readonly t: SignalCheckThresholds;
  private readonly scanner: SignalScanner;
  private n = 0;
  private result: SignalWarning[] | null = null;
  private flaggedSamples: ChannelArtefacts | null = null;

  /**
   * `shown`: how the values in messages are written, as the file gives them: the samples checked
   * (in the engine's unit) times `perEngineUnit` (10^6 for a microstrain channel), then `unit`
   * after the number (' µε'). Default: as checked, no unit.
   */
  constructor(
    readonly channel: string,
    thresholds: Partial<SignalCheckThresholds> = {},
    private readonly shown: { perEngineUnit: number; unit: string } = { perEngineUnit: 1, unit: '' },
  ) {
    this.t = { ...DEFAULT_SIGNAL_CHECK_THRESHOLDS, ...thresholds };
    for (const key of Object.keys(DEFAULT_SIGNAL_CHECK_THRESHOLDS) as (keyof SignalCheckThresholds)[]) {
      const v = this.t[key];
      if (typeof v !== 'number' || !(v >= 0) || !Number.isFinite(v)) throw new IngestOptionError(`checks.${key}`, v, 'must be a finite number >= 0');
    }
    if (!(this.t.spikeFactor > 0)) throw new IngestOptionError('checks.spikeFactor', this.t.spikeFactor, 'must be a finite number > 0');
    this.scanner = new SignalScanner({
      spikes: { factor: this.t.spikeFactor },
      stuckRuns: { minimumSamples: Math.max(2, Math.ceil(this.t.flatRunSamples)) },
      clipping: { minimumSamples: Math.max(1, Math.ceil(this.t.clipMinSamples)), minimumShare: Math.min(1, this.t.clipShare) },
      offset: { share: this.t.offsetShare },
      drift: false,
    });
  }

  /** Adds the next samples; `firstIndex` is the 0-based sample index of `x[0]` (for checking order). */
  push(x: Float64Array, firstIndex = this.n): void {
    if (firstIndex !== this.n) throw new IngestOptionError('firstIndex', firstIndex, `chunks must follow each other: expected ${this.n}`);
    if (this.result !== null) throw new IngestOptionError('firstIndex', firstIndex, 'the checks have finished');
    this.scanner.push(x);
    this.n += x.length;
  }

  /** Samples pushed so far. */
  get length(): number {
    return this.n;
  }

  /** The warnings found, in the order spike, flat line, dropout, clipped max, clipped min, offset (the same list on every call). */
  finish(): SignalWarning[] {
    if (this.result === null) {
      const scan = this.scanner.finish();
      this.flaggedSamples = artefactsOf(scan);
      this.result = this.warnings(scan);
    }
    return this.result.map((w) => ({ ...w, ranges: w.ranges.map((r) => ({ ...r })) }));
  }

  /** The flagged samples (every one, not only the listed ranges); known after {@link finish}. */
  artefacts(): ChannelArtefacts {
    if (this.flaggedSamples === null) throw new IngestOptionError('artefacts', undefined, 'known once the checks have finished: call finish()');
    return { spikes: this.flaggedSamples.spikes.slice(), runs: this.flaggedSamples.runs.slice() };
  }

  /** A value for a message: in the file's unit, to 4 significant digits (no float noise). */
  private value(engine: number): string {
    const x = engine * this.shown.perEngineUnit;
    return `${Number.isFinite(x) ? String(Number(x.toPrecision(4))) : String(x)}${this.shown.unit}`;
  }

  private warnings(scan: SignalScan): SignalWarning[] {
    const out: SignalWarning[] = [];
    const ch = this.channel;
    const n = scan.samples;
    if (n === 0) return out;
    const cap = Math.max(1, Math.floor(this.t.maxRanges));
    const cols = scan.findings.columns();
    const lists = new Map<FindingCode, RangeList>();
    const atExtreme = { 'clipped-maximum': { samples: 0, first: -1, last: -1 }, 'clipped-minimum': { samples: 0, first: -1, last: -1 } };
    for (let k = 0; k < cols.index.length; k++) {
      const code = FINDING_CODES[cols.code[k]];
      const first = cols.index[k];
      const last = first + cols.length[k] - 1;
      if (code === 'clipped-maximum' || code === 'clipped-minimum') {
        const e = atExtreme[code];
        e.samples += cols.length[k];
        if (e.first < 0) e.first = first;
        e.last = last;
        continue;
      }
      let list = lists.get(code);
      if (list === undefined) lists.set(code, (list = new RangeList(cap)));
      list.add(first, last);
    }
    const list = (kind: SignalWarningKind, code: FindingCode, what: string) => {
      const r = lists.get(code);
      if (r === undefined || r.count === 0) return;
      out.push({
        kind,
        channel: ch,
        samples: r.samples,
        ranges: r.ranges(),
        rangesOmitted: r.omitted,
        message: `${ch}: ${r.count + r.omitted} ${what} (${r.samples} samples), first at sample ${r.ranges()[0].first}`,
      });
    };
    list('spike', 'spike', `spike(s) beyond ${this.t.spikeFactor} × the robust scale of Δx (1.4826 × median |Δx|)`);
    list('flat-line', 'stuck-run', `flat line(s) of at least ${this.t.flatRunSamples} identical samples`);
    list('dropout', 'zero-run', `dropout(s) of at least ${this.t.flatRunSamples} samples at exactly 0`);
    for (const [kind, code, name, value] of [
      ['clipped-maximum', 'clipped-maximum', 'maximum', scan.maximum],
      ['clipped-minimum', 'clipped-minimum', 'minimum', scan.minimum],
    ] as const) {
      const e = atExtreme[code];
      if (e.samples === 0) continue;
      out.push({
        kind,
        channel: ch,
        samples: e.samples,
        ranges: [{ first: e.first, last: e.last }],
        rangesOmitted: 0,
        message: `${ch}: ${e.samples} samples sit exactly at the ${name} ${value}: clipped at full scale?`,
      });
    }
    if (cols.code.includes(FINDING_CODES.indexOf('offset')))
      out.push({
        kind: 'large-offset',
        channel: ch,
        samples: n,
        ranges: [{ first: 0, last: n - 1 }],
        rangesOmitted: 0,
        message: `${ch}: mean ${this.value(scan.mean)} is more than ${this.t.offsetShare} × the range ${this.value(scan.maximum - scan.minimum)}: an offset not zeroed?`,
      });
    return out;
  }
}

/** The spikes and the runs (flat lines, dropouts) of a scan as typed arrays, in sample order. */
function artefactsOf(scan: SignalScan): ChannelArtefacts {
  const c = scan.findings.columns();
  const spikes: number[] = [];
  const runs: { first: number; length: number }[] = [];
  for (let k = 0; k < c.index.length; k++) {
    const code = FINDING_CODES[c.code[k]];
    if (code === 'spike') spikes.push(c.index[k]);
    else if (code === 'stuck-run' || code === 'zero-run') runs.push({ first: c.index[k], length: c.length[k] });
  }
  spikes.sort((a, b) => a - b);
  runs.sort((a, b) => a.first - b.first);
  return { spikes: Float64Array.from(spikes), runs: Float64Array.from(runs.flatMap((r) => [r.first, r.length])) };
}
