import type { CliHotSpot } from './hotSpotChannel';
import type { Material } from '@loopwise/material';
import type { DamageParameterName } from '@loopwise/mean-stress';
import type { NotchInputKind, NotchRuleName } from '@loopwise/notch';
import type { IiwResidualCategory, SnCurve, SnCurveInput } from '@loopwise/stress-life';
import type { ChannelSelection, DialectOverride, TimeSource } from '../ingest';
import { FileAccess } from './FileAccess';
import { InputFiles } from './InputFiles';
import { jobOfJobFile } from './jobOfJobFile';
import { parseJsonText } from './parseJsonText';
import type { MaterialSpec } from './resolveMaterial';

export { checkRoute } from './jobOfJobFile';

/** A channel of a job: which column, what it holds, and how it enters the notch model. */
export type CliChannel = ChannelSelection & {
  /**
   * How the channel enters the model; default `'local-strain'` for strain channels (a gauge at
   * the notch root) and `'nominal'` for stress and load channels (times the notch's Kt or Kf).
   */
  input?: NotchInputKind;
};

/** An event of a duty cycle in a job file. */
export interface CliEvent {
  name: string;
  /** Delimited file of the event (relative to the job file). */
  file: string;
  repeats: number;
  /** Service per repeat of the event, in `service.unit`. */
  duration?: number;
  /** The file's name in messages and reports (as the job names it). Default: `file`. */
  shown?: string;
}

/** A mean-stress correction by the CLI's names: a damage parameter (strain-life) or an amplitude correction (stress-life). */
export type CliCorrection = DamageParameterName | 'goodman' | 'gerber' | 'iiw';

/** The stress-life route of a CLI job: the S-N curve and the constants its corrections need. */
export interface CliStressLife {
  curve: SnCurve;
  /** The curve as named (`iiw:90`, …). */
  label: string;
  kf?: number;
  stressFactor?: number;
  /** Ultimate strength for Goodman and Gerber (MPa); default the material's Su. */
  ultimateStrength?: number;
  /** σf′ for Morrow (MPa); default the material's. */
  sigmaF?: number;
  /** IIW residual-stress category for the f(R) enhancement. */
  iiwCategory?: IiwResidualCategory;
  /** The channels are gauges at the hot-spot rule's points: one channel, their hot-spot stress, is assessed. */
  hotSpot?: CliHotSpot;
}

/** A complete assessment request, from flags or from a job file. */
export interface CliJob {
  /** The material (strain-life route; optional on the stress-life route, where it only supplies Su or σf′). */
  material: Material | undefined;
  /** The stress-life route, when chosen (an S-N curve instead of the local strain-life route). */
  stressLife?: CliStressLife;
  notch?: { Kt?: number; Kf?: number; rule?: NotchRuleName };
  meanStress: CliCorrection | 'all';
  walkerGamma?: number;
  gate?: number;
  gateFraction?: number;
  fullScale?: number;
  scatterFactor: number;
  cutoffCycles?: number;
  criticalDamage?: number;
  repeating: boolean;
  service?: { unit: string; perRepeat?: number };
  channels: CliChannel[];
  /** One measured file, or a duty cycle of events. */
  file: string | null;
  events: CliEvent[] | null;
  /** The file's name in messages and reports (as typed, or as the job names it). Default: `file`. */
  fileShown?: string | null;
  /** The job file, when the request came from one (messages name it). */
  jobShown?: string;
  time?: TimeSource;
  /** Parts of the files' layout fixed instead of detected (preamble lines, delimiter, decimal mark, header and units rows, comment prefix). */
  dialect?: DialectOverride;
  /** How the command chose columns, units and the time base from the file (for the summary). */
  notes?: string[];
  initial?: number;
  offset?: number;
  /** Seconds per unit of the time column (its units row said so); default: from the column's name (`t_ms`, `time [min]`), else 1. */
  timeSecondsPerUnit?: number;
  /** Replace the one-sample spikes the signal checks find by the line between their neighbours before assessing (a single file). */
  interpolateSpikes?: boolean;
  /**
   * Cut out the flat runs the signal checks find (identical consecutive samples, e.g. a dropout
   * stuck at a value or at zero) before counting, as sample ranges are cut: every channel's row is
   * cut where any assessed channel is flat, and the history is joined across each cut. A single
   * file only.
   */
  excludeFlatRuns?: boolean;
  /**
   * Sample ranges cut out of every channel before counting (sample numbers from 0 as the reports
   * give them, both ends included, in increasing order without overlap); the history is joined
   * across each cut. A single file only.
   */
  excludeSamples?: SampleCut[];
  /**
   * Time ranges cut out likewise: every sample with startTime <= t <= endTime, t in the time
   * column's own unit (as written in the file: ms for a column in ms), or seconds with a sample
   * rate. A single file only.
   */
  excludeTimes?: TimeCut[];
  /**
   * Subtracted from every sample of every channel before counting, in the channel's own unit
   * (µε for a microstrain channel), or `'mean'`: each channel's mean (of the samples kept, a first
   * read finds it; a single file only). Unlike `offset`, which is added.
   */
  subtractOffset?: number | 'mean';
  /** A zero-phase Butterworth low-pass of every channel (forward and backward; the whole channel is held in memory). */
  lowPass?: LowPassAsked;
}

/**
 * What the corrections of the signal need of a job: the channels (their own units, for the
 * records), the time base, where the settings came from (for messages), and the corrections
 * themselves. A {@link CliJob} is one; `loopwise count`, which has no model, makes one of its own.
 */
export type CorrectionJob = Pick<CliJob, 'channels' | 'events' | 'time' | 'timeSecondsPerUnit' | 'jobShown' | 'interpolateSpikes' | 'excludeFlatRuns' | 'excludeSamples' | 'excludeTimes' | 'subtractOffset' | 'lowPass'>;

/** A range of samples to cut out: sample numbers from 0, both ends included. */
export interface SampleCut {
  first: number;
  last: number;
}

/** A range of time to cut out: both ends included, in the time column's unit (seconds with a sample rate). */
export interface TimeCut {
  startTime: number;
  endTime: number;
}

/** The low-pass a job asks for. */
export interface LowPassAsked {
  /** Cut-off frequency, Hz; below half the sample rate. */
  cutoffHz: number;
  /** Butterworth order of each pass, a whole number 1 … 16; default 2. */
  order?: number;
}

/** The job file format (JSON). Relative paths are read from the job file's folder. */
export interface JobFile {
  format: 'loopwise-job';
  version: 1;
  material?: MaterialSpec;
  stressLife?: Omit<CliStressLife, 'curve' | 'label'> & { curve: string | SnCurveInput };
  notch?: CliJob['notch'];
  meanStress?: CliJob['meanStress'];
  walkerGamma?: number;
  gate?: number;
  gateFraction?: number;
  fullScale?: number;
  scatterFactor?: number;
  cutoffCycles?: number;
  criticalDamage?: number;
  repeating?: boolean;
  service?: CliJob['service'];
  channels: CliChannel[];
  file?: string;
  events?: CliEvent[];
  time?: TimeSource;
  dialect?: DialectOverride;
  initial?: number;
  offset?: number;
  interpolateSpikes?: boolean;
  excludeFlatRuns?: boolean;
  excludeSamples?: SampleCut[];
  excludeTimes?: TimeCut[];
  subtractOffset?: number | 'mean';
  lowPass?: LowPassAsked;
}

/**
 * Reads and checks a job file strictly: every field known (an unknown one is an error that
 * suggests the nearest known name) and of its type, each message naming the job file and the
 * field path (`job.json: channels[0].colum: …`). The files it names (data, events, material)
 * resolve relative to its folder and must lie inside it unless `anywhere` (the command's
 * `--job-may-read-anywhere`); each is noted in `inputs`.
 *
 * @param path - the job file, as typed (messages show it so)
 */
export function readJobFile(path: string, inputs: InputFiles = new InputFiles(), anywhere = false): CliJob {
  const access = FileAccess.forJob(inputs, path, anywhere);
  const own = new FileAccess(inputs, null, true);
  const { text } = own.readText(path, '--job');
  const json = parseJsonText(text, path, 'job file');
  return jobOfJobFile(json, path, access);
}
