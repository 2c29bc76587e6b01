import type { CorrectionKind, CorrectionRecord } from '@loopwise/signal';
import { channelConversion } from '@loopwise/ingest';
import { formatNumber } from '../report/formatNumber.js';
import { UsageError } from './CliError';
import type { CliChannel, CorrectionJob } from './CliJob';

/** Default Butterworth order of each pass of `--low-pass` (as @loopwise/signal's zeroPhaseLowPass). */
export const DEFAULT_LOW_PASS_ORDER = 2;

/**
 * Where a correction's setting came from, for messages: the job file and field
 * (`job.json: excludeSamples[1].first`), or the option (`--exclude-samples`).
 */
export function settingName(job: CorrectionJob, field: string, flag: string): string {
  return job.jobShown ? `${job.jobShown}: ${field}` : `--${flag}`;
}

/** Whether the job asks for a correction of the signal that changes the samples (spikes, cuts, offset, low-pass). */
export function asksSignalCorrections(job: CorrectionJob): boolean {
  return Boolean(job.interpolateSpikes) || Boolean(job.excludeFlatRuns) || (job.excludeSamples?.length ?? 0) > 0 || (job.excludeTimes?.length ?? 0) > 0 || job.subtractOffset !== undefined || job.lowPass !== undefined;
}

/**
 * Checks the corrections of the signal a job asks for, before anything is read: each range in
 * order (first <= last), the ranges of each kind increasing without overlap, a time base for
 * time ranges and the low-pass, the cut-off below half a given sample rate, and what a duty
 * cycle cannot take (cuts and the mean: its events are separate files). Messages name the field
 * of the job file or the option. What needs the record (a range beyond its end, a cut-off above
 * the Nyquist frequency of a time column) is checked as it is read.
 */
export function checkSignalCorrections(job: CorrectionJob): void {
  const samples = job.excludeSamples ?? [];
  samples.forEach((r, k) => {
    const name = settingName(job, `excludeSamples[${k}]`, 'exclude-samples');
    if (!(r.last >= r.first)) throw new UsageError(`${name}: ${r.first}..${r.last} is out of order: the last sample must not come before the first`);
    if (k > 0 && r.first <= samples[k - 1].last) throw new UsageError(`${name}: ${r.first}..${r.last}: the ranges must be in increasing order without overlap (the one before ends at sample ${samples[k - 1].last})`);
  });
  const times = job.excludeTimes ?? [];
  times.forEach((r, k) => {
    const name = settingName(job, `excludeTimes[${k}]`, 'exclude-time');
    if (!(r.endTime >= r.startTime)) throw new UsageError(`${name}: ${r.startTime}..${r.endTime} is out of order: the end must not come before the start`);
    if (k > 0 && r.startTime <= times[k - 1].endTime) throw new UsageError(`${name}: ${r.startTime}..${r.endTime}: the ranges must be in increasing order without overlap (the one before ends at ${times[k - 1].endTime})`);
  });
  if (times.length > 0 && job.time === undefined) {
    throw new UsageError(`${settingName(job, 'excludeTimes', 'exclude-time')}: needs the file's time base: ${job.jobShown ? 'set "time" to a time column or a sample rate' : 'give --time-column or --sample-rate'}`);
  }
  if (job.events !== null) {
    if (samples.length > 0 || times.length > 0 || job.excludeFlatRuns) {
      const name = samples.length > 0 ? settingName(job, 'excludeSamples', 'exclude-samples') : times.length > 0 ? settingName(job, 'excludeTimes', 'exclude-time') : settingName(job, 'excludeFlatRuns', 'exclude-flat-runs');
      throw new UsageError(`${name}: cuts apply to a single file; a duty cycle's events are separate files (cut the event's file, or make its parts two events)`);
    }
    if (job.subtractOffset === 'mean') {
      throw new UsageError(`${settingName(job, 'subtractOffset', 'subtract-offset')}: the mean applies to a single file; a duty cycle's events would each lose their own mean and their levels would no longer agree: give the offset as a number`);
    }
  }
  const lp = job.lowPass;
  if (lp !== undefined) {
    const name = settingName(job, 'lowPass', 'low-pass');
    if (!(lp.cutoffHz > 0 && lp.cutoffHz < Infinity)) throw new UsageError(`${name}: the cut-off must be a number of Hz > 0, got ${lp.cutoffHz}`);
    const order = lp.order ?? DEFAULT_LOW_PASS_ORDER;
    if (!(Number.isInteger(order) && order >= 1 && order <= 16)) throw new UsageError(`${settingName(job, 'lowPass.order', 'low-pass-order')}: a whole number from 1 to 16, got ${order}`);
    if (job.time === undefined) {
      throw new UsageError(`${name}: needs the sample rate: ${job.jobShown ? 'set "time" to a sample rate or a time column with even steps' : 'give --sample-rate, or --time-column with even steps'}`);
    }
    if ('sampleRate' in job.time) checkCutoff(job, job.time.sampleRate);
  }
}

/** Refuses a low-pass cut-off at or above half the sample rate (the Nyquist frequency), naming the setting. */
export function checkCutoff(job: CorrectionJob, sampleRate: number): void {
  const lp = job.lowPass;
  if (lp === undefined) return;
  if (!(lp.cutoffHz < sampleRate / 2)) {
    throw new UsageError(`${settingName(job, 'lowPass.cutoffHz', 'low-pass')}: the cut-off ${lp.cutoffHz} Hz must lie below half the sample rate (the Nyquist frequency, ${sampleRate / 2} Hz at ${sampleRate} Hz)`);
  }
}

/** A given offset (in the channel's own unit) in the engine unit of its samples (MPa or strain), converted like them. */
export function offsetInEngineUnit(c: CliChannel, offset: number): number {
  const k = channelConversion(c);
  return (offset * k.multiplier) / k.divisor;
}

/** An offset in the engine unit back in the channel's own unit (for the record). */
export function offsetInOwnUnit(c: CliChannel, offset: number): number {
  const k = channelConversion(c);
  return (offset * k.divisor) / k.multiplier;
}

/** The channel's own unit for people: µε, strain, MPa, ksi, or "load unit". */
export function ownUnitText(c: CliChannel): string {
  if (c.quantity === 'load') return 'load unit';
  if (c.quantity === 'strain') return c.unit === 'microstrain' ? 'µε' : 'strain';
  return c.unit;
}

/**
 * A correction record in the shape of @loopwise/signal's (kind, places as first sample and
 * length, samples touched, parameters, one line for people), for the corrections the command
 * applies as it streams (the library's functions take whole records).
 */
export function recordOf(kind: CorrectionKind, places: readonly number[], samples: number, parameters: Record<string, number | string>, summary: string): CorrectionRecord {
  const count = places.length / 2;
  const first = new Float64Array(count);
  const length = new Float64Array(count);
  for (let k = 0; k < count; k++) {
    first[k] = places[2 * k];
    length[k] = places[2 * k + 1];
  }
  return Object.freeze({ kind, first, length, samples, parameters: Object.freeze({ ...parameters }), summary });
}

/** The record of spikes interpolated at these sample numbers (adjacent ones as one place), in the words of @loopwise/signal's removeSpikes. */
export function spikeRecord(spikes: Float64Array): CorrectionRecord {
  const places: number[] = [];
  for (const i of spikes) {
    const m = places.length;
    if (m > 0 && places[m - 2] + places[m - 1] === i) places[m - 1]++;
    else places.push(i, 1);
  }
  return recordOf('spikes-interpolated', places, spikes.length, { method: 'linear interpolation' }, `${places.length / 2} spike(s) interpolated (${spikes.length} samples), first at sample ${spikes[0]}`);
}

/** The record of a given or mean offset subtracted from `samples` samples; `own` is the offset in the channel's unit. */
export function offsetRecord(c: CliChannel, own: number, samples: number, mean: boolean): CorrectionRecord {
  const unit = ownUnitText(c);
  return recordOf(
    'offset-removed',
    samples > 0 ? [0, samples] : [],
    samples,
    { offset: own, unit, method: mean ? 'mean' : 'given' },
    `offset ${formatNumber(own, 6)} ${unit} subtracted from ${samples} samples (${mean ? 'the mean of the samples assessed' : 'as given'})`,
  );
}

/** A record said for a duty cycle's event: the event's name before its summary. */
export function ofEvent(record: CorrectionRecord, event: string): CorrectionRecord {
  return Object.freeze({ ...record, summary: `event ${event}: ${record.summary}` });
}
