import { HOT_SPOT_RULES, hotSpotStress, hotSpotStressInto, type HotSpotRule } from '@loopwise/stress-life';
import type { EventRead } from './assessEvents';
import type { ChannelArtefacts, IngestChunk, IngestReport, ReaderOptions } from '@loopwise/ingest';
import { UsageError } from './CliError';
import type { CliChannel } from './CliJob';

/** The structural hot-spot stress of a stress-life job: the IIW rule and, for strain gauges, E. */
export interface CliHotSpot {
  rule: HotSpotRule;
  /** Young's modulus (MPa) for gauges that give strain: σ = E·ε (a uniaxial stress state). */
  modulus?: number;
}

/**
 * The one channel a hot-spot job assesses, and the gauges it is made of. The gauges are the
 * job's channels, in the order of the rule's points (0.4t then 1.0t, …); stress gauges in MPa
 * as read, strain gauges times `modulus`.
 */
export function hotSpotPlan(hot: CliHotSpot, gauges: readonly CliChannel[], where: string): { channel: CliChannel; name: string; scales: number[] } {
  const rule = HOT_SPOT_RULES[hot.rule];
  if (rule === undefined) throw new UsageError(`${where}: unknown hot-spot rule "${hot.rule}"; one of ${Object.keys(HOT_SPOT_RULES).join(', ')}`);
  if (gauges.length !== rule.points.length) {
    throw new UsageError(`${where}: the ${hot.rule} rule takes ${rule.points.length} gauges (at ${rule.points.map((p) => `${p} ${rule.pointUnit}`).join(', ')}), in that order; ${gauges.length} channel(s) given`);
  }
  const scales = gauges.map((g, k) => {
    if (g.quantity === 'strain') {
      if (!(hot.modulus !== undefined && hot.modulus > 0 && hot.modulus < Infinity)) throw new UsageError(`${where}: gauge ${k + 1} gives strain; give the modulus E in MPa for σ = E·ε`);
      return hot.modulus;
    }
    if (g.quantity === 'load') throw new UsageError(`${where}: gauge ${k + 1} is a load; the hot-spot rule extrapolates stresses or strains`);
    return 1;
  });
  const term = (c: number, k: number) => `${Math.abs(c)} × ${gauges[k].name ?? String(gauges[k].column)}`;
  const name = `hot spot (${hot.rule}: ${rule.coefficients.map((c, k) => (k === 0 ? (c < 0 ? '−' : '') : c < 0 ? ' − ' : ' + ') + term(c, k)).join('')})`;
  return { channel: { column: gauges[0].column, name, quantity: 'stress', unit: 'MPa' }, name, scales };
}

/**
 * A reader of the gauges that hands on one channel, the hot-spot stress, sample by sample
 * (IIW recommendations 2.2.3, by `hotSpotStressInto`): every chunk's gauge columns (times their
 * scales) become one column, in buffers reused from chunk to chunk. The report names the one
 * channel; the gauges' own signal warnings stay in it (they name their gauge).
 */
export function hotSpotReader(
  read: (options: ReaderOptions) => Promise<IngestReport>,
  hot: CliHotSpot,
  gauges: readonly CliChannel[],
  plan: { name: string; scales: number[] },
): (options: ReaderOptions) => Promise<IngestReport> {
  return async (options) => {
    let out = new Float64Array(0);
    let scaled: Float64Array[] = gauges.map(() => new Float64Array(0));
    const onChunk = options.onChunk;
    const report = await read({
      ...options,
      channels: gauges,
      ...(onChunk
        ? {
            onChunk: (chunk: IngestChunk) => {
              const n = chunk.length;
              if (out.length < n) {
                out = new Float64Array(n);
                scaled = gauges.map(() => new Float64Array(n));
              }
              const inputs = chunk.channels.map((v, k) => {
                if (plan.scales[k] === 1) return v;
                const s = scaled[k];
                for (let i = 0; i < n; i++) s[i] = v[i] * plan.scales[k];
                return s.subarray(0, n);
              });
              const o = out.subarray(0, n);
              hotSpotStressInto(hot.rule, inputs, o);
              onChunk({ firstSample: chunk.firstSample, length: n, channels: [o], time: chunk.time });
            },
          }
        : {}),
    });
    return combinedReport(report, plan.name);
  };
}

/**
 * The report of the gauges as the report of the one hot-spot channel. A sample flagged on any
 * gauge is flagged on the hot-spot channel (it is made of every gauge at that sample): its spikes
 * are the union of the gauges' spikes, its flat and zero runs the union of theirs (overlapping
 * runs merged). So `--interpolate-spikes` and the artefact study see the gauges' artefacts; and
 * since the hot-spot stress is linear in the gauges, interpolating it at a spike is interpolating
 * every gauge there and combining them.
 */
export function combinedReport<R extends IngestReport>(report: R, name: string): R {
  const first = report.channels[0];
  const { artefacts, ...rest } = report as R & { artefacts?: readonly ChannelArtefacts[] };
  return {
    ...rest,
    ...(artefacts !== undefined ? { artefacts: [unionOfArtefacts(artefacts)] } : {}),
    channels: [{ ...first, name, quantity: 'stress', conversion: { engineUnit: 'MPa', multiplier: 1, divisor: 1, statement: `structural hot-spot stress from the gauges ${report.channels.map((c) => c.name).join(', ')} (${report.channels.map((c) => c.conversion.statement).join('; ')})` } }],
  } as unknown as R;
}

/** The samples flagged on any of the gauges: spikes sorted and unique, runs (first, length) sorted and merged where they overlap or touch. */
export function unionOfArtefacts(all: readonly (ChannelArtefacts | undefined)[]): ChannelArtefacts {
  const spikes = new Set<number>();
  const runs: [number, number][] = [];
  for (const a of all) {
    if (a === undefined) continue;
    for (const s of a.spikes) spikes.add(s);
    for (let k = 0; k + 1 < a.runs.length; k += 2) runs.push([a.runs[k], a.runs[k] + a.runs[k + 1]]);
  }
  runs.sort((x, y) => x[0] - y[0]);
  const merged: number[] = [];
  for (const [from, end] of runs) {
    const m = merged.length;
    if (m > 0 && from <= merged[m - 2] + merged[m - 1]) merged[m - 1] = Math.max(merged[m - 1], end - merged[m - 2]);
    else merged.push(from, end - from);
  }
  return { spikes: Float64Array.from([...spikes].sort((x, y) => x - y)), runs: Float64Array.from(merged) };
}

/**
 * The same for a duty cycle's events, each read whole: the gauges of an event's file become its
 * one hot-spot channel (`hotSpotStress`).
 */
export function hotSpotEventReader(read: EventRead, hot: CliHotSpot, gauges: readonly CliChannel[], plan: { name: string; scales: number[] }): EventRead {
  return async (event, options) => {
    const r = await read(event, { ...options, channels: gauges });
    const inputs = r.channels.map((v, k) => (plan.scales[k] === 1 ? v : v.map((x) => x * plan.scales[k])));
    return { ...r, report: combinedReport(r.report, plan.name), channels: [hotSpotStress(hot.rule, inputs)] };
  };
}
