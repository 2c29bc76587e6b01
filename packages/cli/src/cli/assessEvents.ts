import { assessDutyCycle, compareCorrections, type DutyEvent } from '@loopwise/engine';
import type { IngestReport, ReaderOptions } from '@loopwise/ingest';
import { removeOffset, removeSpikes, zeroPhaseLowPass, type CorrectionRecord } from '@loopwise/signal';
import { UsageError } from './CliError';
import type { CliEvent, CliJob } from './CliJob';
import { DisplayHistory } from '../report/displayHistory';
import type { ChannelResult } from './assessStream';
import { inOwnUnit, lifeJobOf, mainCorrection, unitLabel, withoutLoops } from './lifeJobOf';
import { interpolatedWarning } from './spikeInterpolation';
import { checkCutoff, DEFAULT_LOW_PASS_ORDER, ofEvent, offsetInEngineUnit, offsetRecord, settingName } from './signalCorrections';
import { rateOfStep, timeBaseOf } from './timeBase';

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
  const got: CorrectedEvent[] = [];
  for (const e of events) {
    const r = await read(e, { channels: job.channels, name: e.shown ?? e.file, ...(job.time ? { time: job.time } : {}), ...(job.dialect ? { dialect: job.dialect } : {}) });
    got.push(correctedEvent(r, job, e.name));
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
      signalCorrections: got.flatMap((g) => g.records[k]),
    };
  });
}

/** An event read whole, its channels corrected as the job asks, and the records of each channel's corrections (said for the event). */
export type CorrectedEvent = Awaited<ReturnType<EventRead>> & { records: CorrectionRecord[][] };

/**
 * An event read whole with the corrections a duty cycle takes, each by @loopwise/signal's function
 * on the whole channel: the flagged spikes interpolated ({@link interpolatedEvent}), a given offset
 * subtracted (`removeOffset`), the zero-phase low-pass (`zeroPhaseLowPass`, at the sample rate
 * given or of the event's evenly stepped time column). Cuts and the mean are refused for duty
 * cycles before anything is read (checkSignalCorrections).
 */
export function correctedEvent(r: Awaited<ReturnType<EventRead>>, job: CliJob, event: string): CorrectedEvent {
  const spiked = job.interpolateSpikes ? interpolatedEvent(r) : { ...r, records: r.channels.map(() => []) };
  const records = spiked.records.map((list) => list.map((c) => ofEvent(c, event)));
  let channels = spiked.channels;
  const given = job.subtractOffset;
  if (typeof given === 'number') {
    channels = channels.map((v, k) => {
      const c = job.channels[k];
      records[k].push(ofEvent(offsetRecord(c, given, v.length, false), event));
      return removeOffset(v, { offset: offsetInEngineUnit(c, given) }).values;
    });
  }
  const lp = job.lowPass;
  if (lp !== undefined) {
    const base = job.time !== undefined && 'sampleRate' in job.time ? null : timeBaseOf(r.report, job.timeSecondsPerUnit);
    const rate = job.time !== undefined && 'sampleRate' in job.time ? job.time.sampleRate : base !== null && base.step > 0 ? rateOfStep(base.step) : null;
    if (rate === null) throw new UsageError(`${settingName(job, 'lowPass', 'low-pass')}: needs the sample rate, and the time column of event ${event} does not give one (its steps are not even, or time does not increase)`);
    checkCutoff(job, rate);
    channels = channels.map((v, k) => {
      const f = zeroPhaseLowPass(v, { cutoff: lp.cutoffHz, sampleRate: rate, order: lp.order ?? DEFAULT_LOW_PASS_ORDER });
      records[k].push(ofEvent(f.correction, event));
      return f.values;
    });
  }
  return { ...spiked, channels, records };
}

/**
 * An event read whole with its flagged one-sample spikes on the line between their neighbours
 * (`removeSpikes` of @loopwise/signal, the library's correction), a warning saying so, and the
 * library's record of each channel's correction.
 */
export function interpolatedEvent(r: Awaited<ReturnType<EventRead>>): CorrectedEvent {
  const warnings = [...r.report.warnings];
  const records: CorrectionRecord[][] = r.channels.map(() => []);
  const channels = r.channels.map((v, k) => {
    const s = r.report.artefacts?.[k]?.spikes;
    if (s === undefined || s.length === 0) return v;
    warnings.push(interpolatedWarning(r.report.channels[k].name, s));
    const fixed = removeSpikes(v, s);
    records[k].push(fixed.correction);
    return fixed.values;
  });
  return { ...r, channels, report: { ...r.report, warnings }, records };
}
