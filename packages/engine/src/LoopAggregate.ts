import { NeumaierAdder } from '@loopwise/base';
import { CutoffTally } from '@loopwise/miner';
import type { LifeLoopColumns, WorstLoop } from './LifeReport';

/**
 * Running totals of a stream of closed loops, for a life session that does not keep its loops
 * (internal): compensated damage sum, miner's cut-off tally, the damage timeline in bins of a fixed number of samples,
 * the most damaging loops, the cut-off and first-reversal counts and the highest local stress.
 * Memory is O(bins + worst loops), whatever the number of loops.
 */
export class LoopAggregate {
  private readonly sum = new NeumaierAdder();
  loops = 0;
  firstReversal = 0;
  /** What the cut-off removed and the damage near it (miner's tally). */
  readonly cutoff: CutoffTally;
  timeline: Float64Array;
  readonly worst: WorstLoop[] = [];

  constructor(
    private readonly binSize: number,
    private readonly worstCount: number,
    cutoffCycles: number,
  ) {
    this.timeline = new Float64Array(64);
    this.cutoff = new CutoffTally(cutoffCycles === Infinity ? 'none' : { cycles: cutoffCycles });
  }

  /** Adds evaluated loops (their damage already with the job's cut-off, see evaluatedColumns). */
  add(rows: LifeLoopColumns): void {
    const n = rows.count.length;
    if (n === 0) return;
    this.cutoff.addColumns({ count: rows.count, cyclesToFailure: rows.cyclesToFailure });
    for (let i = 0; i < n; i++) {
      const d = rows.damage[i];
      this.loops++;
      if (rows.reversalsToFailure[i] <= 1) this.firstReversal++;
      this.sum.add(d);
      const start = rows.startIndex[i] < 0 ? 0 : rows.startIndex[i];
      const turn = rows.turnIndex[i] < 0 ? 0 : rows.turnIndex[i];
      this.bin(start, d / 2);
      this.bin(turn, d / 2);
      this.offerWorst(d, rows, i);
    }
  }

  /** The compensated damage total. */
  total(): number {
    return this.sum.valueOf();
  }

  /** Adds another aggregate (a later part of the same pass). */
  merge(other: LoopAggregate): void {
    this.sum.add(other.total());
    this.loops += other.loops;
    this.firstReversal += other.firstReversal;
    this.cutoff.merge(other.cutoff);
    this.ensureBins(other.timeline.length);
    for (let k = 0; k < other.timeline.length; k++) this.timeline[k] += other.timeline[k];
    for (const w of other.worst) this.insertWorst(w);
  }

  private bin(index: number, d: number): void {
    const k = Math.floor(index / this.binSize);
    this.ensureBins(k + 1);
    this.timeline[k] += d;
  }

  private ensureBins(n: number): void {
    if (n <= this.timeline.length) return;
    let cap = this.timeline.length;
    while (cap < n) cap *= 2;
    const t = new Float64Array(cap);
    t.set(this.timeline);
    this.timeline = t;
  }

  private offerWorst(d: number, c: LifeLoopColumns, i: number): void {
    if (this.worstCount === 0) return;
    if (this.worst.length === this.worstCount && d <= this.worst[this.worst.length - 1].damage) return;
    this.insertWorst({
      row: -1,
      damage: d,
      share: 0,
      count: c.count[i],
      stressMax: c.stressMax[i],
      stressMin: c.stressMin[i],
      strainMax: c.strainMax.length > 0 ? c.strainMax[i] : null,
      strainMin: c.strainMin.length > 0 ? c.strainMin[i] : null,
      cyclesToFailure: c.cyclesToFailure[i],
      startIndex: c.startIndex[i],
      turnIndex: c.turnIndex[i],
      startEvent: c.startIndex[i] < 0 ? null : 'history',
      turnEvent: c.turnIndex[i] < 0 ? null : 'history',
    });
  }

  private insertWorst(w: WorstLoop): void {
    const list = this.worst;
    let k = list.length;
    while (k > 0 && list[k - 1].damage < w.damage) k--;
    if (k >= this.worstCount) return;
    list.splice(k, 0, w);
    if (list.length > this.worstCount) list.pop();
  }
}
