import type { Material } from '@loopwise/material';
import { UsageError } from './CliError';
import type { CliJob, CliStressLife, JobFile } from './CliJob';
import { checkJobFields, JobFieldError } from './checkJobFields';
import { resolveMaterial, type TextAccess } from './resolveMaterial';
import { parseSnCurveSpec } from './snCurveSpec';
import { checkSignalCorrections } from './signalCorrections';

/** How {@link jobOfJobFile} reaches the files a job names: the command's `FileAccess` (relative to the job's folder), or the browser page's own. */
export interface JobFileAccess extends TextAccess {
  resolve(path: string, field: string): { path: string; shown: string };
}

/**
 * The job of a parsed job file (the JSON value of `path`), checked strictly as
 * {@link readJobFile} describes; `access` resolves the files it names. The command's
 * `readJobFile` and the browser page both take their jobs through here, so a job file the page
 * writes is read by the command as the page ran it.
 */
export function jobOfJobFile(value: unknown, path: string, access: JobFileAccess): CliJob {
  const json = value as JobFile;
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
  for (const k of ['notch', 'walkerGamma', 'gate', 'gateFraction', 'fullScale', 'cutoffCycles', 'criticalDamage', 'service', 'time', 'dialect', 'initial', 'offset', 'interpolateSpikes', 'excludeFlatRuns', 'excludeSamples', 'excludeTimes', 'subtractOffset', 'lowPass'] as const) {
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
  checkSignalCorrections(job);
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
