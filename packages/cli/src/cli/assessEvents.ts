import { assessDutyCycle, compareCorrections, type DutyEvent } from '@loopwise/engine';
import type { IngestReport, ReaderOptions } from '@loopwise/ingest';
import { removeSpikes } from '@loopwise/signal';
import { UsageError } from './CliError';
import type { CliEvent, CliJob } from './CliJob';
import { DisplayHistory } from '../report/displayHistory';
import type { ChannelResult } from './assessStream';
import { inOwnUnit, lifeJobOf, mainCorrection, unitLabel, withoutLoops } from './lifeJobOf';
import { interpolatedWarning } from './spikeInterpolation';

/**
 * Reads one event's file whole, with these options (channels, name, time, dialect), into one
 * Float64Array per channel: the command reads from disk (`readDelimitedColumns`), the browser
 * page from a `File`.
 */
export type EventRead = (event: CliEvent, options: Omit<ReaderOptions, 'onChunk'> & { name: string }) => Promise<{ report: IngestReport; channels: Float64Array[] }>;

/** Settings of {@link assessEvents}; every field documents its default. */
export interface EventSettings {
  /** Keep each channel's loop table (the cycles CSV and the report's loop matrix); default true. */
  keepLoops?: boolean;
  /** Called once the events are read, with what was being done (the command's memory guard throws there); default none. */
  check?: (where: () => string) => void;
}

/**
 * The duty-cycle route of {@link runAssessment} (a job with `events`), with no file system of its
 * own: `read` reads each event's file whole, then each channel's schedule is assessed in memory
 * (`assessDutyCycle`, and with `all` every correction by `compareCorrections`). The command and
 * the browser page both call it, so their results are the same.
 */
export async function assessEvents(job: CliJob, read: EventRead, settings: EventSettings = {}): Promise<ChannelResult[]> {
  const events = job.events;
  if (events === null || events.length === 0) throw new UsageError('events: a duty cycle needs at least one event');
  const main = mainCorrection(job);
  const keepLoops = settings.keepLoops ?? true;
  const got: Awaited<ReturnType<EventRead>>[] = [];
  for (const e of events) {
    const r = await read(e, { channels: job.channels, name: e.shown ?? e.file, ...(job.time ? { time: job.time } : {}), ...(job.dialect ? { dialect: job.dialect } : {}) });
    got.push(job.interpolateSpikes ? interpolatedEvent(r) : r);
  }
  settings.check?.(() => 'after reading the events');
  return job.channels.map((c, k) => {
    const duty: DutyEvent[] = events.map((e, j) => {
      const d: DutyEvent = { name: e.name, history: got[j].channels[k], repeats: e.repeats };
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
      name: got[0].report.channels[k].name,
      unit: unitLabel(c),
      report: withoutLoops(full),
      corrections: job.meanStress === 'all' ? compareCorrections(duty, lifeJobOf(job, c, main)) : null,
      sources: got.map((r) => r.report),
      history: inOwnUnit(c, display.points()),
      eventStarts: duty.map((d, j) => ({ name: d.name, index: duty.slice(0, j).reduce((a, e) => a + e.history.length, 0) })),
      loops: keepLoops ? full.loops : null,
      curveLabel: job.stressLife?.label ?? null,
      loopStream: null,
    };
  });
}

/**
 * An event read whole with its flagged one-sample spikes on the line between their neighbours
 * (`removeSpikes` of @loopwise/signal, the library's correction), and a warning saying so.
 */
export function interpolatedEvent(r: Awaited<ReturnType<EventRead>>): Awaited<ReturnType<EventRead>> {
  const warnings = [...r.report.warnings];
  const channels = r.channels.map((v, k) => {
    const s = r.report.artefacts?.[k]?.spikes;
    if (s === undefined || s.length === 0) return v;
    warnings.push(interpolatedWarning(r.report.channels[k].name, s));
    return removeSpikes(v, s).values;
  });
  return { ...r, channels, report: { ...r.report, warnings } };
}
