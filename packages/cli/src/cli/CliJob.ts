import type { Material } from '@loopwise/material';
import type { DamageParameterName } from '@loopwise/mean-stress';
import type { NotchInputKind, NotchRuleName } from '@loopwise/notch';
import type { ChannelSelection, TimeSource } from '../ingest';
import { UsageError } from './CliError';
import { checkJobFields, JobFieldError } from './checkJobFields';
import { FileAccess, parseJsonText } from './FileAccess';
import { InputFiles } from './InputFiles';
import { resolveMaterial, type MaterialSpec } from './resolveMaterial';

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

/** A complete assessment request, from flags or from a job file. */
export interface CliJob {
  material: Material;
  notch?: { Kt?: number; Kf?: number; rule?: NotchRuleName };
  meanStress: DamageParameterName | 'all';
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
  initial?: number;
  offset?: number;
}

/** The job file format (JSON). Relative paths are read from the job file's folder. */
export interface JobFile {
  format: 'loopwise-job';
  version: 1;
  material: MaterialSpec;
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
  initial?: number;
  offset?: number;
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
  const json = parseJsonText(text, path, 'job file') as JobFile;
  try {
    checkJobFields(json);
  } catch (error) {
    if (error instanceof JobFieldError) throw new UsageError(`${path}: ${error.message}`);
    throw error;
  }
  let material: Material;
  try {
    material = resolveMaterial(json.material, access);
  } catch (error) {
    if (error instanceof Error && (error.name === 'MaterialError' || error.name === 'ArgumentError')) error.message = `${path}: material: ${error.message}`;
    throw error;
  }
  const file = json.file === undefined ? null : access.resolve(json.file, 'file');
  const events = json.events?.map((e, k) => {
    const f = access.resolve(e.file, `events[${k}].file`);
    return { ...e, file: f.path, shown: f.shown };
  });
  const job: CliJob = {
    material,
    meanStress: json.meanStress ?? 'smithWatsonTopper',
    scatterFactor: json.scatterFactor ?? 1,
    repeating: json.repeating ?? true,
    channels: json.channels,
    file: file?.path ?? null,
    fileShown: file?.shown ?? null,
    events: events ?? null,
    jobShown: path,
  };
  for (const k of ['notch', 'walkerGamma', 'gate', 'gateFraction', 'fullScale', 'cutoffCycles', 'criticalDamage', 'service', 'time', 'initial', 'offset'] as const) {
    if (json[k] !== undefined) (job as unknown as Record<string, unknown>)[k] = json[k];
  }
  return job;
}
