import { LifeSession, type LifeJob, type CorrectionResult, type LifeReport, type LifeLoopColumns } from '@loopwise/engine';
import type { IngestChunk, IngestReport, ReaderOptions } from '@loopwise/ingest';
import type { CliChannel, CliCorrection, CliJob } from './CliJob';
import { DisplayHistory } from '../report/displayHistory';
import { correctionOf, correctionsOf, lifeJobOf, mainCorrection, unitLabel } from './lifeJobOf';
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
}

/** Called with the number of samples read so far, for a progress display. */
export type Progress = (samples: number, pass: 1 | 2) => void;

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
}

/**
 * The single-file route of {@link runAssessment}, with no file system of its own: `read` reads the
 * file (twice for a repeating history: the second read goes up to the largest |value|; three
 * times with a gate fraction and no declared full scale, the first read finding the range). Each
 * channel's loops are folded into running totals as they close (one life session per channel and
 * correction, `all` included), and handed to a {@link LoopSpool} on `newLoopStore` when one is
 * given. The command and the browser page both call it, so their results are the same.
 */
export async function assessStream(job: CliJob, read: StreamRead, settings: StreamSettings = {}): Promise<ChannelResult[]> {
  const main = mainCorrection(job);
  const check = settings.check ?? (() => undefined);
  const progress = settings.progress;
  const onChunk = settings.onChunk;
  const spoolOf = settings.newLoopStore ?? null;
  const name = job.fileShown ?? job.file ?? 'the file';
  const options = { channels: job.channels, name, ...(job.time ? { time: job.time } : {}), ...(job.dialect ? { dialect: job.dialect } : {}) };
  const at = (chunk: { firstSample: number; length: number }) => () => `while reading ${name} (sample ${chunk.firstSample + chunk.length})`;
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
  return job.channels.map((c, k) => {
    const reports = sessions[k].map((s) => s.finish());
    const m = corrections.indexOf(main);
    const report = reports[m];
    return {
      name: first.channels[k].name,
      unit: unitLabel(c),
      report,
      corrections: job.meanStress === 'all' ? reports.map(correctionOf) : null,
      sources: [first],
      history: displays[k].points(),
      loops: null,
      curveLabel: job.stressLife?.label ?? null,
      loopStream: spools[k]?.finish(sessions[k][m].reportedLoopRows) ?? null,
    };
  });
}

