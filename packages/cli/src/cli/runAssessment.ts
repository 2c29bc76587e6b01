import {
  assessDutyCycle,
  compareCorrections,
  LifeSession,
  type CorrectionResult,
  type DutyEvent,
  type LifeJob,
  type LifeLoopColumns,
  type LifeReport,
} from '@loopwise/engine';
import type { DamageParameterName } from '@loopwise/mean-stress';
import { hotSpotStress, type AmplitudeCorrection, type IiwResidualCategory } from '@loopwise/stress-life';
import { channelConversion, readDelimited, readDelimitedColumns, readDelimitedParallel, type IngestChunk, type IngestOptions, type IngestReport } from '../ingest';
import { timeBaseOf, type TimeBase } from './timeBase';
import { combinedReport, hotSpotPlan, hotSpotReader, type CliHotSpot } from './hotSpotChannel';
import { ArtefactStudy, FlaggedSamples, type ArtefactFigures } from './artefactStudy';
import { UsageError } from './CliError';
import type { CliChannel, CliCorrection, CliJob, CliStressLife } from './CliJob';
import { DisplayHistory } from '../report/displayHistory';
import { LoopSpool } from './LoopSpool';
import { MemoryGuard } from './MemoryGuard';

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
  /** The loop table of the stabilised pass (main correction) of a duty cycle, when it was kept; null otherwise. */
  loops: LifeLoopColumns | null;
  /** The S-N curve as named, on the stress-life route (null on the strain-life route). */
  curveLabel: string | null;
  /** The loops of a streamed file, spooled on disk, when they were kept; null otherwise. */
  loopStream: LoopSpool | null;
  /** What the flagged samples do to the damage (a single file whose signal checks flagged samples). */
  artefactStudy?: ArtefactFigures;
  /** The file's time base as a uniform step (a single file with a sample rate or an even time column). */
  timeBase?: TimeBase | null;
  /** Where each event of a duty cycle starts in the schedule (sample index), for the history plot. */
  eventStarts?: { name: string; index: number }[];
}

/** Called with the number of samples read so far, for a progress display. */
/** Pass 1: the first read; 2: the second read of a repeating history; 3: the reads of the artefact study. */
export type Progress = (samples: number, pass: 1 | 2 | 3) => void;

/** The engine job of one channel of a CLI job, under one mean-stress correction. */
export function lifeJobOf(job: CliJob, channel: CliChannel, meanStress: CliCorrection): LifeJob {
  const s = job.stressLife;
  let out: LifeJob;
  if (s !== undefined) {
    out = { stressLife: { curve: s.curve, meanStress: amplitudeCorrection(job, meanStress) }, repeating: job.repeating, scatterFactor: job.scatterFactor };
    if (s.kf !== undefined) out.stressLife!.kf = s.kf;
    if (s.stressFactor !== undefined) out.stressLife!.stressFactor = s.stressFactor;
    if (job.material !== undefined) out.material = job.material;
  } else {
    const input = channel.input ?? (channel.quantity === 'strain' ? 'local-strain' : 'nominal');
    out = { material: job.material, input, meanStress: meanStress as DamageParameterName, repeating: job.repeating, scatterFactor: job.scatterFactor };
    if (input === 'nominal' && job.notch) out.notch = job.notch;
    if (input === 'pseudo-elastic' && job.notch?.rule) out.rule = job.notch.rule;
    if (job.walkerGamma !== undefined) out.walkerGamma = job.walkerGamma;
  }
  // the gate and the full scale are given in the channel's own unit (µε for a microstrain
  // channel): converted like its samples
  const toEngine = engineRangeOf(channel);
  if (job.gate !== undefined) out.gate = toEngine(job.gate);
  if (job.gateFraction !== undefined) out.gateFraction = job.gateFraction;
  if (job.fullScale !== undefined) out.fullScale = toEngine(job.fullScale);
  if (job.cutoffCycles !== undefined) out.cutoffCycles = job.cutoffCycles;
  if (job.criticalDamage !== undefined) out.criticalDamage = job.criticalDamage;
  if (job.initial !== undefined) out.initial = job.initial;
  if (job.offset !== undefined) out.offset = job.offset;
  if (job.service) out.unit = job.service.perRepeat === undefined ? { label: job.service.unit } : { label: job.service.unit, perRepeat: job.service.perRepeat };
  return out;
}

/** A range in the channel's own unit (the file's) as a range in engine units (MPa or strain), as its samples are converted. */
export function engineRangeOf(c: CliChannel): (x: number) => number {
  const k = channelConversion(c);
  return (x) => Math.abs((x * k.multiplier) / k.divisor);
}

/**
 * The display copy of a history in the channel's own unit where the engine unit differs only by
 * a power of ten (µε for a microstrain channel: the user's numbers stay the user's); stresses
 * and loads stay in MPa (a load channel is shown as the nominal stress it was converted to).
 */
function inOwnUnit(c: CliChannel, h: { index: Float64Array; value: Float64Array } | null): { index: Float64Array; value: Float64Array } | null {
  if (h === null || !(c.quantity === 'strain' && c.unit === 'microstrain')) return h;
  return { index: h.index, value: h.value.map((v) => v * 1e6) };
}

function unitLabel(c: CliChannel): string {
  if (c.quantity === 'load') return 'MPa nominal (from load)';
  if (c.quantity === 'strain') return c.unit === 'microstrain' ? 'µε' : 'strain';
  return 'MPa';
}

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
}

/**
 * The corrections of `--mean-stress all` for a job: on the strain-life route every damage
 * parameter (Walker needs γ or Su); on the stress-life route the amplitude corrections whose
 * constants the job or its material gives (as the engine's compareCorrections).
 */
function correctionsOf(job: CliJob): CliCorrection[] {
  const s = job.stressLife;
  if (s === undefined) {
    const all: CliCorrection[] = ['none', 'morrow', 'modifiedMorrow', 'smithWatsonTopper', 'walker'];
    return all.filter((c) => c !== 'walker' || job.walkerGamma !== undefined || job.material?.Su !== undefined);
  }
  const su = s.ultimateStrength ?? job.material?.Su;
  const sigmaF = s.sigmaF ?? job.material?.sigmaF;
  const out: CliCorrection[] = ['none'];
  if (su !== undefined) out.push('goodman', 'gerber');
  if (sigmaF !== undefined) out.push('morrow');
  out.push('smithWatsonTopper');
  if (job.walkerGamma !== undefined) out.push('walker');
  if (s.iiwCategory !== undefined) out.push('iiw');
  return out;
}

/** The main correction of a job: the one it names, or with `all` the route's usual one (SWT strain-life, none stress-life). */
export function mainCorrection(job: CliJob): CliCorrection {
  if (job.meanStress !== 'all') return job.meanStress;
  return job.stressLife === undefined ? 'smithWatsonTopper' : 'none';
}

/** An amplitude correction of the stress-life route by name, with the job's (or material's) constants (checkRoute ensured them). */
function amplitudeCorrection(job: CliJob, name: CliCorrection): AmplitudeCorrection {
  const s = job.stressLife as CliStressLife;
  switch (name) {
    case 'goodman':
    case 'gerber':
      return { method: name, ultimateStrength: (s.ultimateStrength ?? job.material?.Su) as number };
    case 'morrow':
      return { method: 'morrow', sigmaF: (s.sigmaF ?? job.material?.sigmaF) as number };
    case 'walker':
      return { method: 'walker', gamma: job.walkerGamma as number };
    case 'iiw':
      return { method: 'iiw', category: s.iiwCategory as IiwResidualCategory };
    case 'smithWatsonTopper':
      return { method: 'smithWatsonTopper' };
    default:
      return { method: 'none' };
  }
}

/** The report without its loop table (the loops go to the loop table of the result). */
function withoutLoops(report: LifeReport): LifeReport {
  const empty = Object.fromEntries(Object.entries(report.loops).map(([k, v]) => [k, (v as Float64Array).subarray(0, 0).slice()])) as unknown as LifeLoopColumns;
  return { ...report, loops: empty };
}

function correctionOf(report: LifeReport): CorrectionResult {
  return {
    meanStress: report.damage.meanStress,
    damagePerRepeat: report.damage.perRepeat,
    firstPassDamage: report.damage.firstPass,
    life: report.life,
    warnings: report.warnings.map((w) => w.code),
  };
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
  const plainRead = settings.parseThread === false ? readDelimited : readDelimitedParallel;
  const read: typeof readDelimited = hot && plan ? hotSpotReader(plainRead, hot, gauges, plan) : plainRead;
  const onChunk = settings.onChunk;
  const file = job.file as string;
  const name = job.fileShown ?? file;
  const options = { channels: job.channels, name, ...(job.time ? { time: job.time } : {}), ...(job.dialect ? { dialect: job.dialect } : {}) };
  const at = (chunk: { firstSample: number; length: number }) => () => `while reading ${name} (sample ${chunk.firstSample + chunk.length})`;
  // a gate fraction without a declared full scale: a first read finds each channel's range
  const fullScales: (number | undefined)[] = job.channels.map(() => job.fullScale);
  if (job.gateFraction !== undefined && job.fullScale === undefined) {
    const lo = job.channels.map(() => Infinity);
    const hi = job.channels.map(() => -Infinity);
    await read(file, {
      ...options,
      checks: false,
      onChunk: (chunk) => {
        chunk.channels.forEach((v, k) => {
          for (let i = 0; i < v.length; i++) {
            if (v[i] < lo[k]) lo[k] = v[i];
            if (v[i] > hi[k]) hi[k] = v[i];
          }
        });
        guard.check(at(chunk));
      },
    });
    job.channels.forEach((_, k) => (fullScales[k] = hi[k] > lo[k] ? hi[k] - lo[k] : undefined));
  }
  const jobOf = (c: CliChannel, k: number, ms: CliCorrection): LifeJob => {
    const j = lifeJobOf(job, c, ms);
    if (job.gateFraction !== undefined && job.fullScale === undefined) {
      if (fullScales[k] === undefined) {
        delete j.gateFraction;
        j.gate = 0; // a constant history: no range, nothing to gate
      } else j.fullScale = fullScales[k];
    }
    return j;
  };
  const corrections = job.meanStress === 'all' ? correctionsOf(job) : [main];
  // per channel: one session per correction (loops folded into totals); for --cycles-out the
  // main correction's session hands its evaluated loops to a spool on disk as they close
  const spools = job.channels.map(() => (keepLoops ? new LoopSpool() : null));
  const sessions = job.channels.map((c, k) =>
    corrections.map((ms) => {
      const spool = spools[k];
      return new LifeSession(jobOf(c, k, ms), spool !== null && ms === main ? { onLoops: spool.sink } : { keepLoops: false });
    }),
  );
  const displays = job.channels.map(() => new DisplayHistory());
  const gates = sessions.map((s) => s[0].gateRange);
  // parsing runs on a second core while the sessions assess the chunks here
  const first = await read(file, {
    ...options,
    onChunk: (chunk) => {
      chunk.channels.forEach((values, k) => {
        for (const s of sessions[k]) s.push(values);
        displays[k].push(values, chunk.firstSample);
      });
      onChunk?.(chunk, gates);
      guard.check(at(chunk));
      progress?.(chunk.firstSample + chunk.length, 1);
    },
  });
  const need = Math.max(...sessions.flat().map((s) => s.endFirstPass()));
  if (need > 0) {
    // the stabilised pass needs the samples up to the largest |value| once more: read them again
    await read(file, {
      ...options,
      checks: false,
      onChunk: (chunk) => {
        chunk.channels.forEach((values, k) => {
          for (const s of sessions[k]) {
            const left = s.secondPassSamples - chunk.firstSample;
            if (left > 0) s.pushSecondPass(left >= values.length ? values : values.subarray(0, left));
          }
        });
        guard.check(at(chunk));
        progress?.(chunk.firstSample + chunk.length, 2);
      },
      stopAfterSamples: need,
    });
  }
  const finished = job.channels.map((_, k) => sessions[k].map((s) => s.finish()));
  const m = corrections.indexOf(main);
  const studied = await studyArtefacts(first, (k) => jobOf(job.channels[k], k, main), (k) => finished[k][m], read, { file, options, guard, at, ...(progress ? { progress } : {}) });
  return job.channels.map((c, k) => {
    const reports = finished[k];
    const report = reports[m];
    return {
      name: first.channels[k].name,
      unit: unitLabel(c),
      report,
      corrections: job.meanStress === 'all' ? reports.map(correctionOf) : null,
      sources: [studied.source],
      ...(studied.figures[k] ? { artefactStudy: studied.figures[k] } : {}),
      history: inOwnUnit(c, displays[k].points()),
      timeBase: timeBaseOf(first),
      loops: null,
      curveLabel: job.stressLife?.label ?? null,
      loopStream: spools[k]?.finish(sessions[k][m].reportedLoopRows) ?? null,
    };
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

/** What {@link studyArtefacts} needs of the single-file run. */
interface StudyContext {
  file: string;
  options: Omit<IngestOptions, 'onChunk'>;
  guard: MemoryGuard;
  at: (chunk: { firstSample: number; length: number }) => () => string;
  progress?: Progress;
}

/**
 * Issue 11, item 2: for every channel whose signal checks flagged samples (spikes, flat lines,
 * dropouts), the share of the damage carried by loops that start or turn at a flagged sample,
 * and the life with the flagged samples removed, as one more warning of the channel (so every
 * output lists it beside the others). Costs one more read of the file (two for a repeating
 * history) and only when something was flagged. Returns the source report with the warnings added,
 * and each channel's figures (null: nothing flagged).
 */
async function studyArtefacts(
  first: IngestReport,
  jobOf: (k: number) => LifeJob,
  reportOf: (k: number) => LifeReport,
  read: typeof readDelimited,
  ctx: StudyContext,
): Promise<{ source: IngestReport; figures: (ArtefactFigures | null)[] }> {
  const studies = first.channels.map((c, k) => {
    const a = first.artefacts?.[k];
    if (a === undefined) return null;
    const flagged = new FlaggedSamples(a);
    return flagged.empty ? null : new ArtefactStudy(c.name, jobOf(k), flagged);
  });
  if (studies.every((s) => s === null)) return { source: first, figures: studies.map(() => null) };
  await read(ctx.file, {
    ...ctx.options,
    checks: false,
    onChunk: (chunk) => {
      chunk.channels.forEach((v, k) => studies[k]?.push(v, chunk.firstSample));
      ctx.guard.check(ctx.at(chunk));
      ctx.progress?.(chunk.firstSample + chunk.length, 3);
    },
  });
  const need = Math.max(...studies.map((s) => (s === null ? 0 : s.endFirstPass())));
  if (need > 0) {
    await read(ctx.file, {
      ...ctx.options,
      checks: false,
      stopAfterSamples: need,
      onChunk: (chunk) => {
        chunk.channels.forEach((v, k) => studies[k]?.pushSecondPass(v, chunk.firstSample));
        ctx.guard.check(ctx.at(chunk));
        ctx.progress?.(chunk.firstSample + chunk.length, 3);
      },
    });
  }
  const done = studies.map((s, k) => (s === null ? null : s.finish(reportOf(k))));
  const added = done.flatMap((d) => (d === null ? [] : [d.warning]));
  return { source: { ...first, warnings: [...first.warnings, ...added] }, figures: done.map((d) => d?.figures ?? null) };
}
