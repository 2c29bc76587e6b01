import type { ChannelResult, HtmlMatrix, JobFile } from '@loopwise/cli/browser';
import type { EnvelopeLevel } from './envelope';

/** Page → worker: assess `files` (one, or a duty cycle's events by their names) with `job` (a job file as the command reads it), or write an export of the last result. */
export type ToWorker = { kind: 'run'; files: File[]; job: JobFile } | { kind: 'export'; what: ExportKind };

/** The exports that the worker writes (the job file is the page's own). */
export type ExportKind = 'json' | 'csv' | 'html';

/** What the page shows of one channel (the rest stays in the worker for the exports). */
export interface ChannelView {
  name: string;
  unit: string;
  report: Omit<ChannelResult['report'], 'loops' | 'inputs'>;
  corrections: ChannelResult['corrections'];
  signalWarnings: { kind: string; message: string }[];
  /** The corrections applied to the signal before counting, in order (kind and one line each); empty: as measured. */
  signalCorrections: { kind: string; summary: string }[];
  matrix: HtmlMatrix | null;
  /** Every sample of the channel in its engine unit, and its envelope pyramid, for the history plot. */
  values: Float32Array;
  levels: EnvelopeLevel[];
  /** Samples per second when the job gives a sample rate (for the time axis; null after a cut, whose joined samples are no longer evenly timed), else null. */
  sampleRate: number | null;
  /** The worst loops drawn from the material model (Masing branches between their corners), by rank; null on the stress-life route or without a cyclic curve. */
  hysteresis: { strain: Float64Array; stress: Float64Array; share: number }[] | null;
  /** On the stress-life route: the HTML report's S-N curve plot of this channel (SVG text, every text in it escaped), else null. */
  snCurve: string | null;
  /** Where each event of a duty cycle starts in `values`, with its name (one event for one file). */
  eventStarts: { name: string; start: number }[];
  /** The time column in seconds, when the job takes one (for the time axis), else null. */
  time: Float64Array | null;
  /** After a cut: each worst loop's start and turn in the file's sample numbers, and whether a cut lies between them; null without a cut. */
  worstInFile: { startIndex: number; turnIndex: number; acrossCut: boolean }[] | null;
}

/** Worker → page. */
export type FromWorker =
  | { kind: 'progress'; what: string; read: number; fraction: number }
  | { kind: 'result'; channels: ChannelView[]; seconds: number }
  | { kind: 'error'; message: string }
  | { kind: 'export'; what: ExportKind; blob: Blob; name: string };
