import { CAUTION, EngineError, findLoadMargin, servicePerRepeat, type DutyEvent, type MarginResult } from '@loopwise/engine';
import { readDelimited, readDelimitedColumns } from '../ingest';
import { correctedStream } from './correctedStream';
import { asksSignalCorrections } from './signalCorrections';
import { formatNumber } from '../report/formatNumber.js';
import { UsageError } from './CliError';
import type { CliChannel, CliEvent, CliJob } from './CliJob';
import { correctedEvent, type EventRead } from './assessEvents';
import { hotSpotEventReader, hotSpotPlan, hotSpotReader } from './hotSpotChannel';
import type { MemoryGuard } from './MemoryGuard';
import { correctionJson, stableJson } from './outputs';
import type { CorrectionRecord } from '@loopwise/signal';
import { lifeJobOf, mainCorrection } from './runAssessment';

/** Which life the target of `loopwise margin` is: the design life (mean life ÷ scatter factor) or the mean life. */
export type MarginTargetOf = 'design' | 'mean';

/** What `loopwise margin` was asked, from its options. */
export interface MarginRequest {
  /** Target in repeats of the history or schedule (exactly one of this and `targetLife`). */
  targetRepeats?: number;
  /** Target in the service unit (`--service`, or the job's service and event durations). */
  targetLife?: number;
  /** Default 'design'. */
  targetOf?: MarginTargetOf;
  json: boolean;
  /** The tool and version named in the JSON. */
  tool: string;
  /** Progress on the terminal (false with --quiet or when stderr is no terminal). */
  progress: boolean;
}

/** The output hooks the margin command writes to (a subset of the CLI's Io). */
export interface MarginIo {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
}

/** The target as the search uses it: the mean life in repeats, and what it was given as. */
interface MarginTarget {
  of: MarginTargetOf;
  /** The target as given, in repeats (a target life divided by the service per repeat). */
  repeats: number;
  /** The mean life in repeats the search looks for: × the scatter factor for a design target. */
  meanRepeats: number;
  scatterFactor: number;
  service: { life: number; unit: string; perRepeat: number } | null;
}

/**
 * `loopwise margin`: the load factor at which the life falls to a target, per channel, on every
 * event of the job (a duty cycle or one file). The target is a design life by default (the mean
 * life ÷ the scatter factor must reach it, so the search looks for a mean life of target × scatter
 * factor), or the mean life with `targetOf: 'mean'`; given in repeats or in the service unit, whose
 * amount per repeat comes from `--service`, the job's `service.perRepeat` or its events' durations.
 * Progress (assessments done of the most the search takes) goes to stderr when asked.
 */
export async function runMargin(job: CliJob, request: MarginRequest, io: MarginIo, guard: MemoryGuard): Promise<number> {
  const files = job.events ? job.events.map((e) => ({ path: e.file, shown: e.shown ?? e.file })) : [{ path: job.file as string, shown: job.fileShown ?? (job.file as string) }];
  guard.checkInMemory(files, job.channels.length, 'the margin search');
  if ((request.targetRepeats === undefined) === (request.targetLife === undefined)) throw new UsageError('--target-repeats or --target-life: give exactly one');
  for (const [name, v] of [['--target-repeats', request.targetRepeats], ['--target-life', request.targetLife]] as const) {
    if (v !== undefined && !(v > 0)) throw new UsageError(`${name}: must be > 0, got ${v}`);
  }
  const main = mainCorrection(job);
  const lines: string[] = [];
  const rows: unknown[] = [];
  let target: MarginTarget | null = null;
  // a hot-spot job searches its one hot-spot channel, made of the gauges as assess makes it
  const hot = job.stressLife?.hotSpot;
  const plan = hot ? hotSpotPlan(hot, job.channels, job.jobShown ? `${job.jobShown}: stressLife.hotSpot` : '--hot-spot') : null;
  const plain: EventRead = (e, o) => readDelimitedColumns(e.file, o);
  const reader = hot && plan ? hotSpotEventReader(plain, hot, job.channels, plan) : plain;
  for (const channel of plan ? [plan.channel] : job.channels) {
    const name = channel.name ?? String(channel.column);
    const { events, records } = job.events === null && asksSignalCorrections(job) ? await correctedFileOf(job, channel, plan ? job.channels : null, guard) : await eventsOf(job, channel, reader);
    const lifeJob = lifeJobOf(job, channel, main);
    target ??= targetOf(job, request, events, lifeJob);
    const t = target;
    const m = findLoadMargin(events, lifeJob, {
      targetRepeats: t.meanRepeats,
      ...(request.progress ? { onProgress: (done: number, most: number) => io.stderr(`\rmargin: ${name}: assessment ${done} of at most ${most}`) } : {}),
    });
    if (request.progress) io.stderr('\r\x1b[K');
    rows.push({ channel: name, ...m, designRepeats: m.repeats / t.scatterFactor, signalCorrections: records.map(correctionJson) });
    lines.push(channelLine(name, m, t));
    // the corrections of the signal the factor scaled, as assess lists them
    if (asksSignalCorrections(job)) lines.push(...(records.length > 0 ? records.map((c) => `  corrected ${c.summary}`) : ['  corrected none: the samples as measured']));
  }
  const t = target as MarginTarget;
  if (request.json) {
    const targetJson = { of: t.of, repeats: t.repeats, meanRepeats: t.meanRepeats, scatterFactor: t.scatterFactor, service: t.service };
    io.stdout(stableJson({ format: 'loopwise-cli-margin', version: 3, tool: request.tool, targetRepeats: t.meanRepeats, target: targetJson, channels: rows, caution: CAUTION }) + '\n');
  } else {
    io.stdout([targetLine(t), ...lines, '', `Caution: ${CAUTION}`].join('\n') + '\n');
  }
  return 0;
}

function targetOf(job: CliJob, request: MarginRequest, events: DutyEvent[], lifeJob: ReturnType<typeof lifeJobOf>): MarginTarget {
  const of = request.targetOf ?? 'design';
  const scatterFactor = job.scatterFactor ?? 1;
  let service: MarginTarget['service'] = null;
  let repeats = request.targetRepeats as number;
  if (request.targetLife !== undefined) {
    const unit = job.service?.unit;
    // the schedule's service per repeat: the job's (or --service's) amount, or the events' durations
    let perRepeat: number | undefined;
    try {
      perRepeat = unit === undefined ? undefined : servicePerRepeat(lifeJob, events);
    } catch (error) {
      if (!(error instanceof EngineError)) throw error;
      perRepeat = undefined; // a unit without an amount per repeat: said below
    }
    if (unit === undefined || perRepeat === undefined) {
      throw new UsageError(
        job.events
          ? '--target-life: the job gives no service per repeat; set service.perRepeat or a duration on every event (or use --target-repeats)'
          : '--target-life: needs the service one repeat stands for: --service "<amount> <unit>" (in a job file: service.perRepeat)',
      );
    }
    repeats = request.targetLife / perRepeat;
    service = { life: request.targetLife, unit, perRepeat };
  }
  return { of, repeats, meanRepeats: of === 'design' ? repeats * scatterFactor : repeats, scatterFactor, service };
}

/** The target in words: which life, in which unit, and the mean life in repeats the search looks for. */
function targetLine(t: MarginTarget): string {
  const given = t.service ? `${formatNumber(t.service.life)} ${t.service.unit} (${formatNumber(t.repeats)} repeats of ${formatNumber(t.service.perRepeat)} ${t.service.unit})` : `${formatNumber(t.repeats)} repeats`;
  if (t.of === 'mean') return `target: mean life ${given}; no scatter factor applied (--target-of design divides the mean life by it)`;
  return `target: design life ${given} = mean life ÷ scatter factor ${formatNumber(t.scatterFactor)}, so a mean life of ${formatNumber(t.meanRepeats)} repeats`;
}

function channelLine(name: string, m: MarginResult, t: MarginTarget): string {
  const life = `mean life ${formatNumber(m.repeats)} repeats, design life ${formatNumber(m.repeats / t.scatterFactor)} repeats` + (t.service ? ` (${formatNumber((m.repeats / t.scatterFactor) * t.service.perRepeat)} ${t.service.unit})` : '');
  if (m.factor === Infinity) return `channel ${name}: the target is not reached up to a load factor of ${formatNumber(m.bracket[0])} (${life} there)`;
  return (
    `channel ${name}: load factor ${formatNumber(m.factor, 6)} gives ${life}` +
    (m.nonMonotone ? '; damage was seen to fall with a growing load somewhere on the scan: check the scan in --json' : '') +
    (m.belowScan ? `; already reached at the smallest factor scanned (${formatNumber(m.factor)})` : '')
  );
}

/**
 * The one file of a job with corrections of the signal as one event, read and corrected as assess
 * reads it (`correctedStream`: the same cuts, offset and low-pass), the corrected samples
 * collected in memory (the margin search holds them anyway). `gauges`: a hot-spot job's gauges.
 */
async function correctedFileOf(job: CliJob, channel: CliChannel, gauges: CliChannel[] | null, guard: MemoryGuard): Promise<ChannelEvents> {
  const file = job.file as string;
  const name = job.fileShown ?? file;
  // every channel of a plain job is read as assess reads them, together (a flat run on any
  // channel cuts the row from all); a hot-spot job reads its one channel from the gauges
  const all = gauges === null ? job.channels : [channel];
  const k = gauges === null ? job.channels.indexOf(channel) : 0;
  const one = { ...job, channels: all };
  const options = { channels: all, name, ...(job.time ? { time: job.time } : {}), ...(job.dialect ? { dialect: job.dialect } : {}) };
  const plain = (o: Parameters<typeof readDelimited>[1]) => readDelimited(file, o);
  const hot = job.stressLife?.hotSpot;
  const read = hot && gauges ? hotSpotReader(plain, hot, gauges, hotSpotPlan(hot, gauges, '--hot-spot')) : plain;
  const check = (where: () => string) => guard.check(where);
  const at = (c: { firstSample: number; length: number }) => () => `while reading ${name} (sample ${c.firstSample + c.length})`;
  const corrected = await correctedStream(one, read, { options, check, at });
  const parts: Float64Array[] = [];
  let n = 0;
  await corrected.read({ ...options, checks: false, onChunk: (c) => { parts.push(c.channels[k].slice(0, c.length)); n += c.length; check(at(c)); } });
  const history = new Float64Array(n);
  let at0 = 0;
  for (const p of parts) {
    history.set(p, at0);
    at0 += p.length;
  }
  return { events: [{ name: 'history', history, repeats: 1 }], records: corrected.records(k) };
}

/** A channel's events for the search, and the corrections of the signal applied to them (in order; per event for a duty cycle). */
interface ChannelEvents {
  events: DutyEvent[];
  records: CorrectionRecord[];
}

/**
 * The channel's events as the engine takes them: the job's duty cycle, or its one file as one
 * event, read as assess reads them (the hot-spot channel from its gauges, the spikes interpolated
 * when the job asks).
 */
async function eventsOf(job: CliJob, channel: CliChannel, read: EventRead): Promise<ChannelEvents> {
  const opts = { channels: [channel], ...(job.time ? { time: job.time } : {}), ...(job.dialect ? { dialect: job.dialect } : {}) };
  const records: CorrectionRecord[] = [];
  // the event holds this one channel: its corrections (an offset in its unit) are this channel's,
  // the hot-spot channel's for a hot-spot job (MPa), as assess corrects it
  const alone = { ...job, channels: [channel] };
  const one = async (e: CliEvent) => {
    const r = await read(e, { ...opts, name: e.shown ?? e.file });
    const c = correctedEvent(r, alone, e.name);
    records.push(...c.records[0]);
    return c.channels[0];
  };
  if (job.events) {
    const out: DutyEvent[] = [];
    for (const e of job.events) {
      const d: DutyEvent = { name: e.name, history: await one(e), repeats: e.repeats };
      if (e.duration !== undefined) d.duration = e.duration;
      out.push(d);
    }
    return { events: out, records };
  }
  const file = job.file as string;
  const events = [{ name: 'history', history: await one({ name: 'history', file, shown: job.fileShown ?? file, repeats: 1 }), repeats: 1 }];
  return { events, records };
}
