import { NeumaierAdder } from '@loopwise/base';
import { FromToMatrix, RangeMeanMatrix } from '@loopwise/rainflow';
import { extrapolateRangeMeanTail, type TailExtrapolation } from './extrapolateRangeMean';
import type { FileResult, FleetTask } from './FleetTask';
import type { FleetSettings } from './planFleet';
import { quantileType7 } from './quantileType7';

/** One file and channel: a row of the per-file table. */
export interface FileChannelRow {
  row: number;
  file: string;
  asset: string;
  channel: string;
  /** The route of the file's assessment: `strain-life` or `stress-life`. */
  route: string;
  usage: number;
  samples: number;
  damagePerRepeat: number;
  damagePerUnit: number;
  lifeRepeats: number;
  lifeService: number;
  designService: number;
  cycles: number;
  warnings: string[];
  key: string;
}

/** One asset and channel: the sums over the asset's files. */
export interface AssetChannelRow {
  asset: string;
  channel: string;
  files: number;
  /** Service of the asset's files added up. */
  usage: number;
  /** Damage of the asset's files added up (each file's damage per repeat: the damage its usage did). */
  damage: number;
  /** damage ÷ usage. */
  damagePerUnit: number;
  /** Service to the critical damage at this rate: criticalDamage · usage ÷ damage. */
  lifeService: number;
}

/** The fleet's figures of one channel. */
export interface FleetChannel {
  channel: string;
  assets: number;
  files: number;
  usage: number;
  damage: number;
  /** The fleet's damage per unit: all damage ÷ all usage (usage-weighted). */
  damagePerUnit: number;
  /** Damage per unit of the assets: the spread across the fleet. */
  distribution: { min: number; p50: number; p90: number; p95: number; p99: number; max: number; mean: number; severeAsset: string };
  /** Cycles of all measured service added up (the usage-weighted combined spectrum). */
  rangeMean: RangeMeanMatrix;
  fromTo: FromToMatrix;
  /** The combined spectrum at the target service: linear scaling and the fitted tail; null without a target. */
  extrapolation: { targetService: number; linear: RangeMeanMatrix; tail: TailExtrapolation; damageLinear: number } | null;
}

/** The merged fleet. */
export interface FleetResult {
  settings: FleetSettings;
  files: FileChannelRow[];
  assets: AssetChannelRow[];
  channels: FleetChannel[];
  failures: { row: number; file: string; message: string; input: boolean }[];
  counts: { rows: number; assessed: number; failed: number };
}

/**
 * Merges the per-file results of a fleet, always in manifest order, so that the same results
 * give the same fleet to the last bit whichever route, worker count or machine produced them.
 * Matrices are added (`CycleMatrix.add`: counts are halves and wholes, so their sums are exact),
 * damages and usages added with Neumaier's compensated adder. Per asset and channel: the sums
 * and the damage per unit; across the fleet: the assets' damage per unit with its percentiles
 * (Hyndman–Fan definition 7), the combined spectrum and its extrapolation to the target service.
 */
export function mergeFleet(settings: FleetSettings, tasks: readonly FleetTask[], results: ReadonlyMap<string, FileResult>, rowFailures: readonly FileResult[]): FleetResult {
  const files: FileChannelRow[] = [];
  const failures: FleetResult['failures'] = rowFailures.map((f) => ({ row: f.row, file: f.file, message: f.failure!.message, input: f.failure!.input }));
  interface Acc { asset: string; channel: string; files: number; usage: NeumaierAdder; damage: NeumaierAdder; critical: number }
  const assets = new Map<string, Acc>();
  const channels = new Map<string, { rangeMean: RangeMeanMatrix | null; fromTo: FromToMatrix | null; files: number }>();
  let assessed = 0;
  for (const t of tasks) {
    const r = results.get(t.key);
    if (r === undefined) {
      failures.push({ row: t.row, file: t.shown, message: `${t.where} (${t.shown}): no result (the run stopped before this file)`, input: false });
      continue;
    }
    if (r.failure !== null) {
      failures.push({ row: t.row, file: t.shown, message: r.failure.message, input: r.failure.input });
      continue;
    }
    assessed++;
    for (const c of r.channels) {
      const rm = RangeMeanMatrix.fromJSON(c.rangeMean);
      const ft = FromToMatrix.fromJSON(c.fromTo);
      files.push({ row: t.row, file: t.shown, asset: t.asset, channel: c.channel, route: c.route, usage: t.usage, samples: r.samples, damagePerRepeat: c.damagePerRepeat, damagePerUnit: c.damagePerUnit, lifeRepeats: c.lifeRepeats, lifeService: c.lifeService, designService: c.designService, cycles: rm.totalCount(), warnings: c.warnings, key: t.key });
      const id = JSON.stringify([t.asset, c.channel]);
      let a = assets.get(id);
      if (a === undefined) assets.set(id, (a = { asset: t.asset, channel: c.channel, files: 0, usage: new NeumaierAdder(), damage: new NeumaierAdder(), critical: c.criticalDamage }));
      a.files++;
      a.usage.add(t.usage);
      a.damage.add(c.damagePerRepeat);
      let ch = channels.get(c.channel);
      if (ch === undefined) channels.set(c.channel, (ch = { rangeMean: null, fromTo: null, files: 0 }));
      ch.files++;
      ch.rangeMean = ch.rangeMean === null ? rm : ch.rangeMean.add(rm);
      ch.fromTo = ch.fromTo === null ? ft : ch.fromTo.add(ft);
    }
  }
  failures.sort((x, y) => x.row - y.row);
  const assetRows: AssetChannelRow[] = [...assets.values()].map((a) => {
    const usage = a.usage.valueOf();
    const damage = a.damage.valueOf();
    return { asset: a.asset, channel: a.channel, files: a.files, usage, damage, damagePerUnit: damage / usage, lifeService: damage > 0 ? (a.critical * usage) / damage : Infinity };
  });
  const fleet: FleetChannel[] = [...channels.entries()].map(([name, ch]) => {
    const mine = assetRows.filter((a) => a.channel === name);
    const usage = new NeumaierAdder();
    const damage = new NeumaierAdder();
    for (const a of mine) {
      usage.add(a.usage);
      damage.add(a.damage);
    }
    const sorted = mine.map((a) => a.damagePerUnit).sort((x, y) => x - y);
    const mean = new NeumaierAdder();
    for (const v of sorted) mean.add(v);
    let severe = mine[0];
    for (const a of mine) if (a.damagePerUnit > severe.damagePerUnit) severe = a;
    const U = usage.valueOf();
    const D = damage.valueOf();
    const rangeMean = ch.rangeMean as RangeMeanMatrix;
    let extrapolation: FleetChannel['extrapolation'] = null;
    if (settings.targetService !== null) {
      const factor = settings.targetService / U;
      const linear = RangeMeanMatrix.fromJSON(rangeMean.toJSON()).scale(factor);
      extrapolation = { targetService: settings.targetService, linear, tail: extrapolateRangeMeanTail(rangeMean, factor), damageLinear: (D / U) * settings.targetService };
    }
    return {
      channel: name,
      assets: mine.length,
      files: ch.files,
      usage: U,
      damage: D,
      damagePerUnit: D / U,
      distribution: {
        min: sorted[0],
        p50: quantileType7(sorted, 0.5),
        p90: quantileType7(sorted, 0.9),
        p95: quantileType7(sorted, 0.95),
        p99: quantileType7(sorted, 0.99),
        max: sorted[sorted.length - 1],
        mean: mean.valueOf() / sorted.length,
        severeAsset: severe.asset,
      },
      rangeMean,
      fromTo: ch.fromTo as FromToMatrix,
      extrapolation,
    };
  });
  return { settings, files, assets: assetRows, channels: fleet, failures, counts: { rows: tasks.length + rowFailures.length, assessed, failed: failures.length } };
}
