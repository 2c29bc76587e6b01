import { readFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import type { Material } from '@loopwise/material';
import type { DamageParameterName } from '@loopwise/mean-stress';
import type { NotchInputKind, NotchRuleName } from '@loopwise/notch';
import type { ChannelSelection, TimeSource } from '../ingest';
import { UsageError } from './CliError';
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

const KNOWN = new Set([
  'format', 'version', 'material', 'notch', 'meanStress', 'walkerGamma', 'gate', 'gateFraction', 'fullScale', 'scatterFactor',
  'cutoffCycles', 'criticalDamage', 'repeating', 'service', 'channels', 'file', 'events', 'time', 'initial', 'offset', 'description',
]);

/** Reads and checks a job file; every error names the file and the field. */
export function readJobFile(path: string): CliJob {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch {
    throw new UsageError(`${path}: cannot read the job file`);
  }
  let json: JobFile;
  try {
    json = JSON.parse(text);
  } catch (error) {
    throw new UsageError(`${path}: invalid JSON: ${(error as Error).message}`);
  }
  const at = (field: string) => `${path}: ${field}`;
  if (json === null || typeof json !== 'object' || Array.isArray(json)) throw new UsageError(`${path}: a job file holds one JSON object`);
  if (json.format !== 'loopwise-job') throw new UsageError(at(`format must be "loopwise-job", got ${JSON.stringify(json.format)}`));
  if (json.version !== 1) throw new UsageError(at(`version must be 1, got ${JSON.stringify(json.version)}`));
  for (const key of Object.keys(json)) if (!KNOWN.has(key)) throw new UsageError(at(`unknown field "${key}"`));
  const base = dirname(resolve(path));
  let material: Material;
  try {
    material = resolveMaterial(json.material, base);
  } catch (error) {
    if (error instanceof Error) error.message = `${path}: material: ${error.message}`;
    throw error;
  }
  if (!Array.isArray(json.channels) || json.channels.length === 0) throw new UsageError(at('channels must list at least one channel'));
  if ((json.file === undefined) === (json.events === undefined)) throw new UsageError(at('give either "file" or "events"'));
  const events = json.events?.map((e, k) => {
    if (e === null || typeof e !== 'object' || typeof e.file !== 'string' || typeof e.name !== 'string') {
      throw new UsageError(at(`events[${k}] must be { name, file, repeats, duration? }`));
    }
    return { ...e, file: resolve(base, e.file) };
  });
  return {
    material,
    notch: json.notch,
    meanStress: json.meanStress ?? 'smithWatsonTopper',
    walkerGamma: json.walkerGamma,
    gate: json.gate,
    gateFraction: json.gateFraction,
    fullScale: json.fullScale,
    scatterFactor: json.scatterFactor ?? 1,
    cutoffCycles: json.cutoffCycles,
    criticalDamage: json.criticalDamage,
    repeating: json.repeating ?? true,
    service: json.service,
    channels: json.channels,
    file: json.file === undefined ? null : resolve(base, json.file),
    events: events ?? null,
    time: json.time,
    initial: json.initial,
    offset: json.offset,
  };
}
