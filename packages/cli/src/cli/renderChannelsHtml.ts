import { binIndex } from '@loopwise/base';
import { binEdges } from '@loopwise/rainflow';
import { renderHtmlReport, type HtmlChannel } from '../report';
import type { ChannelResult } from './assessStream';

const BINS = 20;

/**
 * The HTML report of a command's results: one section per channel with its plots. The matrix is
 * the range-mean matrix of the loops the engine counted at the notch root (local strain range
 * against local mean stress, loops per repeat), which is what the damage was computed from.
 */
export async function renderChannelsHtml(results: ChannelResult[], title: string, generatedBy: string): Promise<string> {
  return renderHtmlReport({ title, generatedBy, channels: await htmlChannelsOf(results) });
}

/**
 * What the HTML report draws of each channel (its history, the loop matrix, the loop totals,
 * the signal warnings, the stress-life spectrum); the browser page draws the same matrix.
 */
export async function htmlChannelsOf(results: ChannelResult[]): Promise<HtmlChannel[]> {
  const channels: HtmlChannel[] = [];
  for (const r of results) {
    const loops = await loopSummary(r);
    const spectrum = r.report.damage.route === 'stress-life' && loops !== null ? await spectrumOf(r, loops.rows) : null;
    channels.push({
      spectrum,
      corrections: r.corrections,
      // after a cut the history plotted is the joined one: its axis numbers samples
      timeBase: r.cutOut !== undefined && r.cutOut.length > 0 ? null : (r.timeBase ?? null),
      ...(r.cutOut !== undefined && r.cutOut.length > 0 ? { cutOut: r.cutOut } : {}),
      ...(r.eventStarts ? { eventStarts: r.eventStarts } : {}),
      signalWarnings: signalWarningsOf(r),
      signalCorrections: r.signalCorrections.map((c) => ({ kind: c.kind, summary: c.summary })),
      name: r.name,
      unit: r.unit,
      report: r.report,
      history: r.history,
      matrix: loops?.matrix ?? null,
      loopTotals: loops ? { cycles: loops.cycles, rows: loops.rows } : null,
    });
  }
  return channels;
}

/** The title of the HTML report of a command without a title of its own: `loopwise assess: SG1, SG2`. */
export function reportTitle(command: string, results: readonly ChannelResult[]): string {
  return `loopwise ${command}: ${results.map((r) => r.name).join(', ')}`;
}

/**
 * The signal warnings of a channel: those of its own column, and those of no assessed column
 * (the time column); a source's list holds every channel's.
 */
export function signalWarningsOf(r: ChannelResult): { kind: string; message: string }[] {
  return r.sources.flatMap((s) =>
    s.warnings.filter((w) => w.channel === r.name || !s.channels.some((c) => c.name === w.channel)).map((w) => ({ kind: w.kind, message: w.message })),
  );
}

/**
 * Calls `each(range, meanStress, count, parameter)` for every kept loop (the duty cycle's table,
 * or the spooled stream): the local strain range, or the stress range on the stress-life route.
 */
async function forEachLoop(r: ChannelResult, each: (range: number, mean: number, count: number, parameter: number) => void): Promise<void> {
  if (r.loopStream) return r.loopStream.forEachLoop(each);
  const l = r.loops;
  if (l === null) return;
  const strain = l.strainMax.length > 0;
  for (let i = 0; i < l.count.length; i++) each(strain ? l.strainMax[i] - l.strainMin[i] : l.stressMax[i] - l.stressMin[i], (l.stressMax[i] + l.stressMin[i]) / 2, l.count[i], l.parameter[i]);
}

/** The equivalent stress and count of every kept cycle (stress-life route; for the S-N plot). */
async function spectrumOf(r: ChannelResult, rows: number): Promise<{ stress: Float64Array; count: Float64Array }> {
  const stress = new Float64Array(rows);
  const count = new Float64Array(rows);
  let k = 0;
  await forEachLoop(r, (_range, _mean, c, parameter) => {
    stress[k] = parameter;
    count[k++] = c;
  });
  return { stress, count };
}

/** The loop matrix and totals, in two passes over the kept loops (none kept: null). */
async function loopSummary(r: ChannelResult): Promise<{ matrix: HtmlChannel['matrix']; cycles: number; rows: number } | null> {
  if (r.loops === null && r.loopStream === null) return null;
  let rangeMax = 0;
  let meanLo = Infinity;
  let meanHi = -Infinity;
  let rows = 0;
  let cycles = 0;
  await forEachLoop(r, (range, mean, count) => {
    rangeMax = Math.max(rangeMax, range);
    meanLo = Math.min(meanLo, mean);
    meanHi = Math.max(meanHi, mean);
    rows++;
    cycles += count;
  });
  return { matrix: rows === 0 ? null : await loopMatrix(r, rangeMax, meanLo, meanHi), cycles, rows };
}

async function loopMatrix(r: ChannelResult, rangeMax: number, meanLo: number, meanHi: number): Promise<HtmlChannel['matrix']> {
  if (!(rangeMax > 0)) return null;
  if (!(meanHi > meanLo)) {
    meanLo -= 1;
    meanHi += 1;
  }
  const rowEdges = binEdges({ count: BINS, min: 0, max: rangeMax }, 'range');
  const columnEdges = binEdges({ count: BINS, min: meanLo, max: meanHi }, 'mean');
  const counts = new Float64Array(BINS * BINS);
  await forEachLoop(r, (range, mean, count) => {
    // every loop lies within the edges (they are its own extremes), so none is lost
    counts[binIndex(rowEdges, range) * BINS + binIndex(columnEdges, mean)] += count;
  });
  if (r.report.damage.route === 'stress-life') return { rowEdges, columnEdges, counts, rowLabel: 'stress range on the curve (MPa)', columnLabel: 'mean stress (MPa)' };
  return { rowEdges, columnEdges, counts, rowLabel: 'local strain range', columnLabel: 'local mean stress (MPa)' };
}
