import {
  assessDutyCycle,
  compareCorrections,
  LifeSession,
  type CorrectionResult,
  type DutyEvent,
  type LifeJob,
  type LifeReport,
} from '@loopwise/engine';
import type { DamageParameterName } from '@loopwise/mean-stress';
import { readDelimitedColumns, readDelimitedParallel, type IngestReport } from '../ingest';
import { UsageError } from './CliError';
import type { CliChannel, CliJob } from './CliJob';
import { DisplayHistory } from '../report/displayHistory';

/** The result of one channel. */
export interface ChannelResult {
  name: string;
  unit: string;
  report: LifeReport;
  /** Every correction side by side, when the job asked for all. */
  corrections: CorrectionResult[] | null;
  /** What was read: one ingestion report per file (one, or one per event). */
  sources: IngestReport[];
  history: { index: Float64Array; value: Float64Array } | null;
}

/** Called with the number of samples read so far, for a progress display. */
export type Progress = (samples: number, pass: 1 | 2) => void;

/** The engine job of one channel of a CLI job. */
export function lifeJobOf(job: CliJob, channel: CliChannel, meanStress: DamageParameterName): LifeJob {
  const input = channel.input ?? (channel.quantity === 'strain' ? 'local-strain' : 'nominal');
  const out: LifeJob = {
    material: job.material,
    input,
    meanStress,
    repeating: job.repeating,
    scatterFactor: job.scatterFactor,
  };
  if (input === 'nominal' && job.notch) out.notch = job.notch;
  if (input === 'pseudo-elastic' && job.notch?.rule) out.rule = job.notch.rule;
  if (job.walkerGamma !== undefined) out.walkerGamma = job.walkerGamma;
  if (job.gate !== undefined) out.gate = job.gate;
  if (job.gateFraction !== undefined) out.gateFraction = job.gateFraction;
  if (job.fullScale !== undefined) out.fullScale = job.fullScale;
  if (job.cutoffCycles !== undefined) out.cutoffCycles = job.cutoffCycles;
  if (job.criticalDamage !== undefined) out.criticalDamage = job.criticalDamage;
  if (job.initial !== undefined) out.initial = job.initial;
  if (job.offset !== undefined) out.offset = job.offset;
  if (job.service) out.unit = job.service.perRepeat === undefined ? { label: job.service.unit } : { label: job.service.unit, perRepeat: job.service.perRepeat };
  return out;
}

function unitLabel(c: CliChannel): string {
  if (c.quantity === 'load') return 'MPa nominal (from load)';
  return c.quantity === 'strain' ? 'strain' : 'MPa';
}

/**
 * Runs a job: one file streamed through one life session per channel (two reads of the file
 * for a repeating history; with `keepLoops: false` memory does not grow with the file, and the
 * reports list the worst loops but no loop table), or a duty cycle of event files
 * (each event read whole). With `meanStress: 'all'` the histories are held in memory and every
 * correction is assessed side by side.
 */
export async function runAssessment(job: CliJob, progress?: Progress, settings: { keepLoops?: boolean } = {}): Promise<ChannelResult[]> {
  const main: DamageParameterName = job.meanStress === 'all' ? 'smithWatsonTopper' : job.meanStress;
  if (job.events !== null) return runDutyCycle(job, main);
  const file = job.file as string;
  if (job.meanStress === 'all' || !job.repeating || job.gateFraction !== undefined && job.fullScale === undefined) {
    return runInMemory(job, file, main);
  }
  // without a loop table to write, loops are folded into running totals: memory stays flat
  const keepLoops = settings.keepLoops ?? true;
  const sessions = job.channels.map((c) => new LifeSession(lifeJobOf(job, c, main), { keepLoops }));
  const displays = job.channels.map(() => new DisplayHistory());
  const options = { channels: job.channels, ...(job.time ? { time: job.time } : {}) };
  // parsing runs on a second core while the sessions assess the chunks here
  const first = await readDelimitedParallel(file, {
    ...options,
    onChunk: (chunk) => {
      chunk.channels.forEach((values, k) => {
        sessions[k].push(values);
        displays[k].push(values, chunk.firstSample);
      });
      progress?.(chunk.firstSample + chunk.length, 1);
    },
  });
  const need = Math.max(...sessions.map((s) => s.endFirstPass()));
  if (need > 0) {
    // the stabilised pass needs the samples up to the largest |value| once more: read them again
    await readDelimitedParallel(file, {
      ...options,
      checks: false,
      onChunk: (chunk) => {
        chunk.channels.forEach((values, k) => {
          const left = sessions[k].secondPassSamples - chunk.firstSample;
          if (left > 0) sessions[k].pushSecondPass(left >= values.length ? values : values.subarray(0, left));
        });
        progress?.(chunk.firstSample + chunk.length, 2);
      },
      stopAfterSamples: need,
    });
  }
  return job.channels.map((c, k) => ({
    name: first.channels[k].name,
    unit: unitLabel(c),
    report: sessions[k].finish(),
    corrections: null,
    sources: [first],
    history: displays[k].points(),
  }));
}

async function runInMemory(job: CliJob, file: string, main: DamageParameterName): Promise<ChannelResult[]> {
  const { report: source, channels } = await readDelimitedColumns(file, { channels: job.channels, ...(job.time ? { time: job.time } : {}) });
  return job.channels.map((c, k) => {
    const events: DutyEvent[] = [{ name: 'history', history: channels[k], repeats: 1 }];
    const display = new DisplayHistory();
    display.push(channels[k], 0);
    return {
      name: source.channels[k].name,
      unit: unitLabel(c),
      report: assessDutyCycle(events, lifeJobOf(job, c, main)),
      corrections: job.meanStress === 'all' ? compareCorrections(events, lifeJobOf(job, c, main)) : null,
      sources: [source],
      history: display.points(),
    };
  });
}

async function runDutyCycle(job: CliJob, main: DamageParameterName): Promise<ChannelResult[]> {
  const events = job.events!;
  if (events.length === 0) throw new UsageError('events: a duty cycle needs at least one event');
  const read: Awaited<ReturnType<typeof readDelimitedColumns>>[] = [];
  for (const e of events) read.push(await readDelimitedColumns(e.file, { channels: job.channels, ...(job.time ? { time: job.time } : {}) }));
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
    return {
      name: read[0].report.channels[k].name,
      unit: unitLabel(c),
      report: assessDutyCycle(duty, lifeJobOf(job, c, main)),
      corrections: job.meanStress === 'all' ? compareCorrections(duty, lifeJobOf(job, c, main)) : null,
      sources: read.map((r) => r.report),
      history: display.points(),
    };
  });
}
