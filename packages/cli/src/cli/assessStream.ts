import { LifeSession, type LifeJob, type CorrectionResult, type LifeReport, type LifeLoopColumns } from '@loopwise/engine';
import type { IngestChunk, IngestReport, ReaderOptions } from '@loopwise/ingest';
import type { CorrectionRecord } from '@loopwise/signal';
import type { CliChannel, CliCorrection, CliJob } from './CliJob';
import { DisplayHistory } from '../report/displayHistory';
import { correctionOf, correctionsOf, inOwnUnit, lifeJobOf, mainCorrection, unitLabel } from './lifeJobOf';
import { ArtefactStudy, FlaggedSamples, type ArtefactFigures } from './artefactStudy';
import { serviceFromTime, timeBaseOf, withHours, type TimeBase } from './timeBase';
import { interpolatedWarning } from './spikeInterpolation';
import { correctedStream } from './correctedStream';
import { LoopSpool } from './LoopSpool';
import type { SpoolStore } from './SpoolStore';

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
  /** The file's time base as a uniform step (a single file with a sample rate or an even time column), in the file's sample numbers. */
  timeBase?: TimeBase | null;
  /**
   * The places cut out of the file (`--exclude-samples`, `--exclude-time`): flat [first, length]
   * in the file's sample numbers. The report's sample numbers then count the samples kept (the
   * history joined across each cut); see report/cutNumbering.ts for the file's numbers.
   */
  cutOut?: Float64Array;
  /**
   * The corrections applied to the channel's samples before counting, in the order applied
   * (@loopwise/signal's records: spikes interpolated, ranges cut out, offset subtracted,
   * low-pass); empty: the samples as measured.
   */
  signalCorrections: CorrectionRecord[];
  /** Where each event of a duty cycle starts in the schedule (sample index), for the history plot. */
  eventStarts?: { name: string; index: number }[];
}

/**
 * Called with the number of samples read so far, for a progress display. Pass 1: the first
 * read; 2: the second read of a repeating history; 3: the reads of the artefact study.
 */
export type Progress = (samples: number, pass: 1 | 2 | 3) => void;

/**
 * Reads the job's one file once through, with these options (channels, name, time, dialect,
 * checks, onChunk, stopAfterSamples), and returns its ingestion report: the command reads from
 * disk (`readDelimited`, `readDelimitedParallel`), the browser page from a `File`.
 */
export type StreamRead = (options: ReaderOptions) => Promise<IngestReport>;

/** Settings of {@link assessStream}; every field documents its default. */
export interface StreamSettings {
  /** Called with the samples read so far and the pass; default none. */
  progress?: Progress;
  /** Called after every chunk with what is being done (the command's memory guard throws there); default none. */
  check?: (where: () => string) => void;
  /** A new store for the loops of one channel (the cycles CSV and the report's loop matrix), or null to keep none; default null. */
  newLoopStore?: (() => SpoolStore) | null;
  /** As {@link AssessmentSettings.onChunk}; default none. */
  onChunk?: (chunk: IngestChunk, gates: readonly number[]) => void;
  /**
   * With no service in the job, a file with a time base gives the service per repeat: the
   * record's duration in hours (an `input:` note on the job says so); default false.
   */
  serviceFromTime?: boolean;
}

/**
 * The single-file route of {@link runAssessment}, with no file system of its own: `read` reads the
 * file (twice for a repeating history: the second read goes up to the largest |value|; three
 * times with a gate fraction and no declared full scale, the first read finding the range). Each
 * channel's loops are folded into running totals as they close (one life session per channel and
 * correction, `all` included), and handed to a {@link LoopSpool} on `newLoopStore` when one is
 * given. The command and the browser page both call it, so their results are the same.
 */
export async function assessStream(job: CliJob, givenRead: StreamRead, settings: StreamSettings = {}): Promise<ChannelResult[]> {
  const main = mainCorrection(job);
  const check = settings.check ?? (() => undefined);
  const progress = settings.progress;
  const onChunk = settings.onChunk;
  const spoolOf = settings.newLoopStore ?? null;
  const name = job.fileShown ?? job.file ?? 'the file';
  const options = { channels: job.channels, name, ...(job.time ? { time: job.time } : {}), ...(job.dialect ? { dialect: job.dialect } : {}) };
  const at = (chunk: { firstSample: number; length: number }) => () => `while reading ${name} (sample ${chunk.firstSample + chunk.length})`;
  // the corrections of the signal the job asks for (spikes, cuts, offset, low-pass): every read
  // after this hands on the corrected samples
  const corrected = await correctedStream(job, givenRead, { options, check, at, ...(progress ? { progress } : {}) });
  const read = corrected.read;
  const spikes = corrected.spikes;
  // a gate fraction without a declared full scale: a first read finds each channel's range
  const fullScales: (number | undefined)[] = job.channels.map(() => job.fullScale);
  if (job.gateFraction !== undefined && job.fullScale === undefined) {
    const lo = job.channels.map(() => Infinity);
    const hi = job.channels.map(() => -Infinity);
    await read({
      ...options,
      checks: false,
      onChunk: (chunk) => {
        chunk.channels.forEach((v, k) => {
          for (let i = 0; i < v.length; i++) {
            if (v[i] < lo[k]) lo[k] = v[i];
            if (v[i] > hi[k]) hi[k] = v[i];
          }
        });
        check(at(chunk));
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
  const spools = job.channels.map(() => (spoolOf !== null ? new LoopSpool(spoolOf()) : null));
  const sessions = job.channels.map((c, k) =>
    corrections.map((ms) => {
      const spool = spools[k];
      return new LifeSession(jobOf(c, k, ms), spool !== null && ms === main ? { onLoops: spool.sink } : { keepLoops: false });
    }),
  );
  const displays = job.channels.map(() => new DisplayHistory());
  const gates = sessions.map((s) => s[0].gateRange);
  // parsing runs on a second core while the sessions assess the chunks here
  const first = await read({
    ...options,
    onChunk: (chunk) => {
      chunk.channels.forEach((values, k) => {
        for (const s of sessions[k]) s.push(values);
        displays[k].push(values, chunk.firstSample);
      });
      onChunk?.(chunk, gates);
      check(at(chunk));
      progress?.(chunk.firstSample + chunk.length, 1);
    },
  });
  const need = Math.max(...sessions.flat().map((s) => s.endFirstPass()));
  if (need > 0) {
    // the stabilised pass needs the samples up to the largest |value| once more: read them again
    await read({
      ...options,
      checks: false,
      onChunk: (chunk) => {
        chunk.channels.forEach((values, k) => {
          for (const s of sessions[k]) {
            const left = s.secondPassSamples - chunk.firstSample;
            if (left > 0) s.pushSecondPass(left >= values.length ? values : values.subarray(0, left));
          }
        });
        check(at(chunk));
        progress?.(chunk.firstSample + chunk.length, 2);
      },
      stopAfterSamples: need,
    });
  }
  const finished = job.channels.map((_, k) => sessions[k].map((s) => s.finish()));
  const m = corrections.indexOf(main);
  // with the spikes interpolated, the study weighs what is left flagged (flat and zero runs), and
  // the source says which samples were corrected
  // (after a cut, the flagged samples are numbered as the corrected history is)
  const interpolated: IngestReport = spikes === null ? first : withInterpolated(first, spikes);
  const measured: IngestReport = corrected.cut && interpolated.artefacts ? { ...interpolated, artefacts: interpolated.artefacts.map((a) => corrected.artefactsAfterCut(a)) } : interpolated;
  const studied = await studyArtefacts(measured, (k) => jobOf(job.channels[k], k, main), (k) => finished[k][m], read, { options, check, at, ...(progress ? { progress } : {}) });
  const results: ChannelResult[] = job.channels.map((c, k) => {
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
      // the file's time base; after a cut the joined samples are no longer evenly spaced in
      // time, so the plots number samples and the worst loops go through the file's numbers
      timeBase: timeBaseOf(first, job.timeSecondsPerUnit),
      ...(corrected.cut ? { cutOut: corrected.cutOut() } : {}),
      signalCorrections: corrected.records(k),
      loops: null,
      curveLabel: job.stressLife?.label ?? null,
      loopStream: spools[k]?.finish(sessions[k][m].reportedLoopRows) ?? null,
    };
  });
  // no service given: a file with a time base gives the service per repeat in hours
  if (settings.serviceFromTime && job.service === undefined) {
    const base = timeBaseOf(first, job.timeSecondsPerUnit);
    for (const r of results) {
      if (!base) continue;
      // a repeat lasts the samples assessed (after a cut: those kept)
      const { perRepeat, note } = serviceFromTime(corrected.cut ? corrected.samples() : r.sources[0].samples, base);
      r.report = { ...r.report, life: withHours(r.report.life, perRepeat) };
      if (r.corrections) r.corrections = r.corrections.map((c) => ({ ...c, life: withHours(c.life, perRepeat) }));
      if (r === results[0]) (job.notes ??= []).push(note);
    }
  }
  return results;
}

/** What {@link studyArtefacts} needs of the single-file run. */
interface StudyContext {
  options: Omit<ReaderOptions, 'onChunk'>;
  check: (where: () => string) => void;
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
  read: StreamRead,
  ctx: StudyContext,
): Promise<{ source: IngestReport; figures: (ArtefactFigures | null)[] }> {
  const studies = first.channels.map((c, k) => {
    const a = first.artefacts?.[k];
    if (a === undefined) return null;
    const flagged = new FlaggedSamples(a);
    return flagged.empty ? null : new ArtefactStudy(c.name, jobOf(k), flagged);
  });
  if (studies.every((s) => s === null)) return { source: first, figures: studies.map(() => null) };
  await read({
    ...ctx.options,
    checks: false,
    onChunk: (chunk) => {
      chunk.channels.forEach((v, k) => studies[k]?.push(v, chunk.firstSample));
      ctx.check(ctx.at(chunk));
      ctx.progress?.(chunk.firstSample + chunk.length, 3);
    },
  });
  const need = Math.max(...studies.map((s) => (s === null ? 0 : s.endFirstPass())));
  if (need > 0) {
    await read({
      ...ctx.options,
      checks: false,
      stopAfterSamples: need,
      onChunk: (chunk) => {
        chunk.channels.forEach((v, k) => studies[k]?.pushSecondPass(v, chunk.firstSample));
        ctx.check(ctx.at(chunk));
        ctx.progress?.(chunk.firstSample + chunk.length, 3);
      },
    });
  }
  const done = studies.map((s, k) => (s === null ? null : s.finish(reportOf(k))));
  const added = done.flatMap((d) => (d === null ? [] : [d.warning]));
  return { source: { ...first, warnings: [...first.warnings, ...added] }, figures: done.map((d) => d?.figures ?? null) };
}

/** The first read's report with the interpolated spikes said (a warning each channel) and no longer flagged for the study. */
function withInterpolated(first: IngestReport, spikes: readonly Float64Array[]): IngestReport {
  const added = first.channels.flatMap((c, k) => (spikes[k].length > 0 ? [interpolatedWarning(c.name, spikes[k])] : []));
  const artefacts = first.artefacts?.map((a) => ({ spikes: new Float64Array(0), runs: a.runs }));
  return { ...first, warnings: [...first.warnings, ...added], ...(artefacts ? { artefacts } : {}) };
}
