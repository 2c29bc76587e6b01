import { readDelimited, readDelimitedColumns, readDelimitedParallel, type IngestChunk } from '../ingest';
import { UsageError } from './CliError';
import type { CliJob } from './CliJob';
import { assessEvents, type EventRead } from './assessEvents';
import { assessStream, type ChannelResult, type Progress, type StreamRead, type StreamSettings } from './assessStream';
import { hotSpotEventReader, hotSpotPlan, hotSpotReader } from './hotSpotChannel';
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
  const guard = settings.guard ?? new MemoryGuard();
  const keepLoops = settings.keepLoops ?? true;
  // a hot-spot job reads its gauges and assesses one channel, their hot-spot stress
  const hot = job.stressLife?.hotSpot;
  const plan = hot ? hotSpotPlan(hot, job.channels, job.jobShown ? `${job.jobShown}: stressLife.hotSpot` : '--hot-spot') : null;
  const gauges = job.channels;
  if (plan) job = { ...job, channels: [plan.channel] };
  if (job.events !== null) {
    const plain: EventRead = (event, options) => readDelimitedColumns(event.file, options);
    return runDutyCycle(job, guard, keepLoops, hot && plan ? hotSpotEventReader(plain, hot, gauges, plan) : plain);
  }
  checkLowPassMemory(job, guard);
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

/**
 * The low-pass holds a single file's channels (and its time column) in memory: refused up front
 * when they would pass half the memory limit (MemoryGuard.checkHeld), naming the setting. Nothing
 * without a low-pass. Assess and count both ask here.
 */
export function checkLowPassMemory(job: Pick<CliJob, 'lowPass' | 'file' | 'fileShown' | 'channels' | 'time' | 'jobShown'>, guard: MemoryGuard): void {
  if (job.lowPass === undefined) return;
  guard.checkHeld({ path: job.file as string, shown: job.fileShown ?? (job.file as string) }, job.channels.length + (job.time !== undefined && 'column' in job.time ? 1 : 0), job.jobShown ? `${job.jobShown}: lowPass` : '--low-pass');
}

async function runDutyCycle(job: CliJob, guard: MemoryGuard, keepLoops: boolean, read: EventRead): Promise<ChannelResult[]> {
  const events = job.events!;
  if (events.length === 0) throw new UsageError('events: a duty cycle needs at least one event');
  guard.checkInMemory(events.map((e) => ({ path: e.file, shown: e.shown ?? e.file })), job.channels.length, 'a duty cycle');
  return assessEvents(job, read, { keepLoops, check: (where) => guard.check(where) });
}
