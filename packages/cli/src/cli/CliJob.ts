import type { CliHotSpot } from './hotSpotChannel';
import type { Material } from '@loopwise/material';
import type { DamageParameterName } from '@loopwise/mean-stress';
import type { NotchInputKind, NotchRuleName } from '@loopwise/notch';
import type { IiwResidualCategory, SnCurve, SnCurveInput } from '@loopwise/stress-life';
import type { ChannelSelection, DialectOverride, TimeSource } from '../ingest';
import { UsageError } from './CliError';
import { checkJobFields, JobFieldError } from './checkJobFields';
import { FileAccess, parseJsonText } from './FileAccess';
import { InputFiles } from './InputFiles';
import { resolveMaterial, type MaterialSpec } from './resolveMaterial';
import { parseSnCurveSpec } from './snCurveSpec';

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
  let material: Material | undefined;
  try {
    material = json.material === undefined ? undefined : resolveMaterial(json.material, access);
  } catch (error) {
    if (error instanceof Error && (error.name === 'MaterialError' || error.name === 'ArgumentError')) error.message = `${path}: material: ${error.message}`;
    throw error;
  }
  let stress: CliStressLife | undefined;
  if (json.stressLife !== undefined) {
    try {
      const { curve, ...rest } = json.stressLife;
      stress = { ...parseSnCurveSpec(curve, 'stressLife.curve'), ...rest };
    } catch (error) {
      if (error instanceof UsageError) throw new UsageError(`${path}: ${error.message}`);
      throw error;
    }
  }
  const file = json.file === undefined ? null : access.resolve(json.file, 'file');
  const events = json.events?.map((e, k) => {
    const f = access.resolve(e.file, `events[${k}].file`);
    return { ...e, file: f.path, shown: f.shown };
  });
  const job: CliJob = {
    material,
    ...(stress ? { stressLife: stress } : {}),
    meanStress: json.meanStress ?? (stress ? 'none' : 'smithWatsonTopper'),
    scatterFactor: json.scatterFactor ?? 1,
    repeating: json.repeating ?? true,
    channels: json.channels,
    file: file?.path ?? null,
    fileShown: file?.shown ?? null,
    events: events ?? null,
    jobShown: path,
  };
  for (const k of ['notch', 'walkerGamma', 'gate', 'gateFraction', 'fullScale', 'cutoffCycles', 'criticalDamage', 'service', 'time', 'dialect', 'initial', 'offset'] as const) {
    if (json[k] !== undefined) (job as unknown as Record<string, unknown>)[k] = json[k];
  }
  checkRoute(job, path);
  return job;
}

const STRESS_CORRECTIONS: readonly string[] = ['none', 'goodman', 'gerber', 'morrow', 'smithWatsonTopper', 'walker', 'iiw', 'all'];
const STRAIN_CORRECTIONS: readonly string[] = ['none', 'morrow', 'modifiedMorrow', 'smithWatsonTopper', 'walker', 'all'];

/**
 * Checks that the job's correction, channels and constants fit its route (a job file or flags;
 * `where` prefixes messages: the job file, or '' for flags, whose messages name the option).
 */
export function checkRoute(job: CliJob, where: string | null): void {
  const at = (field: string, flag: string) => (where ? `${where}: ${field}` : `--${flag}`);
  const s = job.stressLife;
  if (s === undefined) {
    if (job.material === undefined) throw new UsageError(where ? `${where}: material: missing` : '--material, --su or --hardness: give exactly one');
    if (!STRAIN_CORRECTIONS.includes(job.meanStress)) {
      throw new UsageError(`${at('meanStress', 'mean-stress')}: '${job.meanStress}' corrects the amplitude on the stress-life route (an S-N curve); the strain-life route takes ${STRAIN_CORRECTIONS.join(', ')}`);
    }
    return;
  }
  if (!STRESS_CORRECTIONS.includes(job.meanStress)) {
    throw new UsageError(`${at('meanStress', 'mean-stress')}: '${job.meanStress}' is a strain-life damage parameter; the stress-life route takes ${STRESS_CORRECTIONS.join(', ')}`);
  }
  for (const c of job.channels) {
    // strain gauges at the hot-spot rule's points are converted to stress (σ = E·ε) first
    if (c.quantity === 'strain' && s.hotSpot !== undefined && (c.input === undefined || c.input === 'nominal')) continue;
    if (c.quantity === 'strain' || (c.input !== undefined && c.input !== 'nominal')) {
      throw new UsageError(`${where ? `${where}: channels` : '--quantity'}: the stress-life route assesses stress or load channels (nominal or hot-spot stress); a strain gauge at the notch root takes the strain-life route`);
    }
  }
  const need = (ok: boolean, what: string, field: string, flag: string) => {
    if (!ok) throw new UsageError(`${at(`stressLife.${field}`, flag)}: the ${job.meanStress} correction needs ${what}`);
  };
  if (job.meanStress === 'goodman' || job.meanStress === 'gerber') need(s.ultimateStrength !== undefined || job.material?.Su !== undefined, 'the ultimate strength (or a material with Su)', 'ultimateStrength', 'ultimate-strength');
  if (job.meanStress === 'morrow') need(s.sigmaF !== undefined || job.material !== undefined, "σf′ (or a material)", 'sigmaF', 'sigma-f');
  if (job.meanStress === 'walker') need(job.walkerGamma !== undefined, 'the Walker exponent γ', 'walkerGamma', 'walker-gamma');
  if (job.meanStress === 'iiw') need(s.iiwCategory !== undefined, 'the IIW residual-stress category (I, II or III)', 'iiwCategory', 'iiw-category');
}
