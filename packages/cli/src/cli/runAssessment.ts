import { assessDutyCycle, compareCorrections, type DutyEvent } from '@loopwise/engine';
import { hotSpotStress } from '@loopwise/stress-life';
import { readDelimited, readDelimitedColumns, readDelimitedParallel, type IngestChunk } from '../ingest';
import { UsageError } from './CliError';
import type { CliChannel, CliCorrection, CliJob } from './CliJob';
import { DisplayHistory } from '../report/displayHistory';
import { assessStream, type ChannelResult, type Progress, type StreamRead, type StreamSettings } from './assessStream';
import { combinedReport, hotSpotPlan, hotSpotReader, type CliHotSpot } from './hotSpotChannel';
import { inOwnUnit, lifeJobOf, mainCorrection, unitLabel, withoutLoops } from './lifeJobOf';
import { MemoryGuard } from './MemoryGuard';
import { SpoolFile } from './SpoolFile';

export { lifeJobOf, mainCorrection } from './lifeJobOf';
export type { ChannelResult, Progress } from './assessStream';

/** Settings of {@link runAssessment}. */
export interface AssessmentSettings {
  /** Keep the loop table of each channel (for `--cycles-out` and the HTML matrix); default true. */
  keepLoops?: boolean;
  /** The memory limit to keep; default: {@link MemoryGuard}'s default. */
  guard?: MemoryGuard;
  /**
   * Parse the file on a thread of its own while this thread assesses (default true). A caller
   * that already keeps every core busy (a pool of assessments) sets false: the file is then read
   * on the calling thread.
   */
  parseThread?: boolean;
  /**
   * Called with every chunk of a single file's first read, after the life sessions took it, and
   * the gate range each channel's session applies (in the chunk's unit), so a caller can fold the
   * samples into counts of its own without reading the file again. Not called for a duty cycle.
   */
  onChunk?: (chunk: IngestChunk, gates: readonly number[]) => void;
  /** As {@link StreamSettings.serviceFromTime} (the command sets it; a fleet has its own usage); default false. */
  serviceFromTime?: boolean;
}

/**
 * Runs a job. One file is streamed (twice for a repeating history: the second read goes up to
 * the largest |value|; three times with a gate fraction and no declared full scale, the first
 * read finding the range): each channel's loops are folded into running totals as they close
 * (one life session per channel and correction, `--mean-stress all` included), so the report's
 * damage does not depend on whether the loop table is kept, and memory does not grow with the
 * file except by the loop table when `keepLoops` (about 120 bytes per loop). A duty cycle of
 * event files is read whole (refused up front when its estimate exceeds the memory limit).
 * Reports come without their loop table; it is the result's `loops`.
 */
export async function runAssessment(job: CliJob, progress?: Progress, settings: AssessmentSettings = {}): Promise<ChannelResult[]> {
  const main = mainCorrection(job);
  const guard = settings.guard ?? new MemoryGuard();
  const keepLoops = settings.keepLoops ?? true;
  // a hot-spot job reads its gauges and assesses one channel, their hot-spot stress
  const hot = job.stressLife?.hotSpot;
  const plan = hot ? hotSpotPlan(hot, job.channels, job.jobShown ? `${job.jobShown}: stressLife.hotSpot` : '--hot-spot') : null;
  const gauges = job.channels;
  if (plan) job = { ...job, channels: [plan.channel] };
  if (job.events !== null) return runDutyCycle(job, main, guard, keepLoops, hot && plan ? { hot, gauges, plan } : null);
  const read = settings.parseThread === false ? readDelimited : readDelimitedParallel;
  const file: StreamRead = (options) => read(job.file as string, options);
  return assessStream(job, hot && plan ? hotSpotReader(file, hot, gauges, plan) : file, {
    ...(progress ? { progress } : {}),
    check: (where) => guard.check(where),
    newLoopStore: keepLoops ? () => new SpoolFile('the loops of --cycles-out') : null,
    ...(settings.onChunk ? { onChunk: settings.onChunk } : {}),
    ...(settings.serviceFromTime ? { serviceFromTime: true } : {}),
  });
}

async function runDutyCycle(
  job: CliJob,
  main: CliCorrection,
  guard: MemoryGuard,
  keepLoops: boolean,
  hotSpot: { hot: CliHotSpot; gauges: CliChannel[]; plan: ReturnType<typeof hotSpotPlan> } | null,
): Promise<ChannelResult[]> {
  const events = job.events!;
  if (events.length === 0) throw new UsageError('events: a duty cycle needs at least one event');
  guard.checkInMemory(events.map((e) => ({ path: e.file, shown: e.shown ?? e.file })), job.channels.length, 'a duty cycle');
  const read: Awaited<ReturnType<typeof readDelimitedColumns>>[] = [];
  for (const e of events) {
    const options = { channels: hotSpot ? hotSpot.gauges : job.channels, name: e.shown ?? e.file, ...(job.time ? { time: job.time } : {}), ...(job.dialect ? { dialect: job.dialect } : {}) };
    const r = await readDelimitedColumns(e.file, options);
    if (hotSpot) {
      // the gauges become one channel, their hot-spot stress (IIW recommendations 2.2.3)
      const { hot, plan } = hotSpot;
      const inputs = r.channels.map((v, k) => (plan.scales[k] === 1 ? v : v.map((x) => x * plan.scales[k])));
      read.push({ ...r, report: combinedReport(r.report, plan.name), channels: [hotSpotStress(hot.rule, inputs)] });
    } else read.push(r);
  }
  guard.check(() => 'after reading the events');
  return job.channels.map((c, k) => {
    const duty: DutyEvent[] = events.map((e, j) => {
      const d: DutyEvent = { name: e.name, history: read[j].channels[k], repeats: e.repeats };
      if (e.duration !== undefined) d.duration = e.duration;
      return d;
    });
    const display = new DisplayHistory();
    let at = 0;
    for (const d of duty) {
      display.push(d.history as Float64Array, at);
      at += d.history.length;
    }
    const full = assessDutyCycle(duty, lifeJobOf(job, c, main));
    return {
      name: read[0].report.channels[k].name,
      unit: unitLabel(c),
      report: withoutLoops(full),
      corrections: job.meanStress === 'all' ? compareCorrections(duty, lifeJobOf(job, c, main)) : null,
      sources: read.map((r) => r.report),
      history: inOwnUnit(c, display.points()),
      eventStarts: duty.map((d, j) => ({ name: d.name, index: duty.slice(0, j).reduce((a, e) => a + e.history.length, 0) })),
      loops: keepLoops ? full.loops : null,
      curveLabel: job.stressLife?.label ?? null,
      loopStream: null,
    };
  });
}
