import { CycleTable, NonFiniteSampleError, RainflowCounter } from '@loopwise/rainflow';
import { EngineError } from './EngineError';
import type { ResolvedJob } from './LifeJob';
import type { LifeLoopColumns, LifeReport } from './LifeReport';
import { LoopAggregate } from './LoopAggregate';
import { reportHead, stressReportFromCounted, type ReportEvent } from './reportAssembly';
import { emptyColumns } from './reportColumns';
import { residueHalfRows, stressLoopColumns, stressTallies, stressWarnings, type StressWarningFacts } from './stressLifeRoute';
import type { RowRange } from './trackHistory';
import { cutoffWarning } from './warnings';

type Tallies = Pick<StressWarningFacts, 'infiniteCycles' | 'cycles' | 'lowCycles' | 'lowCycleDamage'>;

/**
 * The stress-life route of a life session (internal): the streaming rainflow counter over the
 * samples with the gate, the residue closed at the end (a repeating history needs no second
 * read: its residue closes as the history repeats, ASTM E1049-85 5.4.5), the cycles evaluated on
 * the S-N curve as they close (kept, folded into running totals, or handed to a loop sink).
 */
export class StressCycleStream {
  private readonly counter: RainflowCounter;
  private table = new CycleTable();
  private largest = 0;
  private rows = 0;
  // running totals (loops not kept): closed cycles, the residue's closure, and the tallies
  private readonly closed: LoopAggregate | null;
  private readonly closure: LoopAggregate | null;
  private tallies: Tallies = { infiniteCycles: 0, cycles: 0, lowCycles: 0, lowCycleDamage: 0 };
  reported: RowRange[] | null = null;

  constructor(
    private readonly job: ResolvedJob,
    private readonly gate: number,
    private readonly keepLoops: boolean,
    private readonly binSize: number,
    private readonly onLoops: ((loops: LifeLoopColumns, firstRow: number) => void) | null,
  ) {
    this.counter = new RainflowCounter({ gate, residue: job.repeating ? 'repeat' : 'half', sink: { addCycle: (...a) => this.table.addCycle(...a) } });
    this.closed = keepLoops ? null : this.aggregate();
    this.closure = keepLoops ? null : this.aggregate();
  }

  private aggregate(): LoopAggregate {
    return new LoopAggregate(this.binSize, this.job.worstLoopCount, this.job.cutoffCycles ?? Infinity);
  }

  /** The next samples (checked: a non-finite sample throws with its index). */
  push(chunk: ArrayLike<number>): void {
    try {
      this.counter.push(chunk);
    } catch (err) {
      if (err instanceof NonFiniteSampleError) {
        throw new EngineError('non-finite-sample', 'history', err.value, `sample ${err.index} of event 'history' is ${err.value}`, err.index as number);
      }
      throw err;
    }
    const off = this.job.offset;
    for (let i = 0; i < chunk.length; i++) {
      const a = Math.abs(chunk[i] + off);
      if (a > this.largest) this.largest = a;
    }
    if (!this.keepLoops) this.fold(this.closed as LoopAggregate);
  }

  /** Evaluates the cycles counted since the last fold and adds them to `into`. */
  private fold(into: LoopAggregate): LifeLoopColumns | null {
    if (this.table.length === 0) return null;
    const rows = stressLoopColumns(this.table.columns(), this.job, [0]);
    this.table = new CycleTable();
    into.add(rows);
    const t = stressTallies(rows);
    this.tallies = {
      infiniteCycles: this.tallies.infiniteCycles + t.infiniteCycles,
      cycles: this.tallies.cycles + t.cycles,
      lowCycles: this.tallies.lowCycles + t.lowCycles,
      lowCycleDamage: this.tallies.lowCycleDamage + t.lowCycleDamage,
    };
    this.onLoops?.(rows, this.rows);
    this.rows += rows.count.length;
    return rows;
  }

  /** Ends the count and returns the report of the history (`samples` long). */
  finish(samples: number, events: ReportEvent[]): LifeReport {
    const removed = this.counter.removedCount;
    if (this.keepLoops) {
      const closedRows = this.table.length;
      const r = this.counter.finish();
      return stressReportFromCounted(
        { cycles: this.table.columns(), closedRows, residueHalves: residueHalfRows(r.residue.values, r.residue.indices), eventStarts: [0], totalSamples: samples, gate: this.gate, removed, largest: this.largest },
        events,
        this.job,
      );
    }
    const r = this.counter.finish();
    this.fold(this.closure as LoopAggregate);
    this.reported = [{ from: 0, to: this.rows }];
    const job = this.job;
    const stab = this.aggregate();
    stab.merge(this.closed as LoopAggregate);
    stab.merge(this.closure as LoopAggregate);
    let firstPass = stab.total();
    if (job.repeating) {
      const first = this.aggregate();
      first.merge(this.closed as LoopAggregate);
      first.add(stressLoopColumns(residueHalfRows(r.residue.values, r.residue.indices), job, [0]));
      firstPass = first.total();
    }
    const damage = stab.total();
    const bins = Math.max(1, Math.ceil(samples / this.binSize));
    const timeline = new Float64Array(bins);
    timeline.set(stab.timeline.subarray(0, Math.min(bins, stab.timeline.length)));
    return {
      ...reportHead(job, events, this.gate, { perRepeat: damage, firstPass, reusedFirstPass: false }),
      loops: emptyColumns(0),
      worstLoops: stab.worst.map((w) => ({ ...w, share: damage > 0 ? w.damage / damage : 0 })),
      timeline: { binSize: this.binSize, samples, damage: timeline },
      events: [{ name: 'history', repeats: 1, samples, damage, share: damage > 0 ? 1 : 0 }],
      gate: { range: this.gate, removedReversals: removed },
      warnings: stressWarnings(
        job,
        { damage, gate: this.gate, removed, largest: this.largest, ...this.tallies },
        job.cutoffCycles === undefined ? null : cutoffWarning(job.cutoffCycles, stab.cutoff.value()),
      ),
    };
  }
}
