import { unknownField } from '@loopwise/base';
import { defineMaterial, type Material, type MaterialInput } from '@loopwise/material';
import { damageParameters, DEFAULT_DAMAGE_PARAMETER, type DamageParameterName } from '@loopwise/mean-stress';
import type { ServiceUnit } from '@loopwise/miner';
import { DEFAULT_TRACKER_TOLERANCE, type NotchInputKind, type NotchRuleName } from '@loopwise/notch';
import { defineSnCurve, resolveCycleOptions, type AmplitudeCorrection, type SnCurve, type SnCurveInput } from '@loopwise/stress-life';
import { EngineError } from './EngineError';

/**
 * The stress-life route of a job: rainflow cycles of the nominal (or hot-spot) stress history on
 * an S-N curve, instead of the local strain-life route. Cycles, not reversals, throughout.
 */
export interface StressLifeSpec {
  /** The S-N curve: from `@loopwise/stress-life` (a detail class, a material) or its parameters. */
  curve: SnCurve | SnCurveInput;
  /** Mean-stress correction of the amplitude; default `{ method: 'none' }` (the weld standards' as-welded case). */
  meanStress?: AmplitudeCorrection;
  /** Fatigue notch factor Kf on the nominal range and mean; default 1. */
  kf?: number;
  /** A factor on every stress (e.g. a load partial factor γFf); default 1. */
  stressFactor?: number;
}

/** A checked stress-life route. */
export interface ResolvedStressLife {
  curve: SnCurve;
  meanStress: AmplitudeCorrection;
  kf: number;
  stressFactor: number;
}

/**
 * The job's unit of service: miner's {@link ServiceUnit} (a label and the amount one repeat
 * stands for), with the amount optional because a duty cycle takes it from its events' durations.
 */
export type JobServiceUnit = Omit<ServiceUnit, 'perRepeat'> & { perRepeat?: number };

/** What to assess and how. Every field but `material` has a documented default. */
export interface LifeJob {
  /**
   * Strain-life material (validated by `defineMaterial` when not already a material). Required
   * on the strain-life route; optional with `stressLife` (echoed in the report when given).
   */
  material?: Material | MaterialInput;
  /**
   * The stress-life route (S-N curve, amplitude correction, Kf). When given, `input`, `notch`,
   * `rule`, `meanStress`, `walkerGamma`, `tolerance` and a non-zero `initial` do not apply and
   * are refused; `loadToStress`, `offset`, the gate, `repeating`, `cutoffCycles`,
   * `criticalDamage`, `scatterFactor` and `unit` apply as on the strain-life route.
   */
  stressLife?: StressLifeSpec;
  /**
   * What the history holds; default `'nominal'`:
   * `'nominal'` nominal stress or load (times `loadToStress`, times Kt or Kf at the notch);
   * `'pseudo-elastic'` the local stress of a linear-elastic model;
   * `'local-strain'` strain measured at the notch root (no notch rule).
   */
  input?: NotchInputKind;
  /**
   * The notch, for nominal input: `Kt` (elastic stress concentration factor) or `Kf` (fatigue
   * notch factor), and the notch rule (default `'neuber'`). Default: no notch (Kt = 1), the
   * nominal-stress route.
   */
  notch?: { Kt?: number; Kf?: number; rule?: NotchRuleName };
  /** Rule for pseudo-elastic input; default `'neuber'`. */
  rule?: NotchRuleName;
  /** Nominal stress per unit of the history (e.g. MPa per kN); default 1. */
  loadToStress?: number;
  /** Mean-stress correction (damage parameter); default `'smithWatsonTopper'`. */
  meanStress?: DamageParameterName;
  /** Walker exponent γ for `meanStress: 'walker'`; default estimated from Su (steels). */
  walkerGamma?: number;
  /** Gate range in history units; default 0 (no gate). Exclusive with `gateFraction`. */
  gate?: number;
  /** Gate as a fraction of the largest range of the history (or of `fullScale`). */
  gateFraction?: number;
  /** Declared full-scale range for `gateFraction` (needed to stream). */
  fullScale?: number;
  /**
   * True (default) when the history is one block of a service that repeats: life per repeat
   * comes from the stabilised pass. False for a one-off history: its residue counts as half
   * cycles.
   */
  repeating?: boolean;
  /** Cut-off life in cycles above which a loop does no damage; default none. */
  cutoffCycles?: number;
  /** Critical damage sum; default 1 (lower values are often used; see the miner docs). */
  criticalDamage?: number;
  /** Scatter factor on life, >= 1; default 1. */
  scatterFactor?: number;
  /** Service per repeat, for life in hours, km, laps or flights. */
  unit?: JobServiceUnit;
  /** History value at which the part sits when the history starts; default 0 (unloaded). */
  initial?: number;
  /** Added to every sample first (a gauge zeroed under load); default 0. */
  offset?: number;
  /** Number of bins of the damage timeline; default 100. */
  timelineBins?: number;
  /** Number of most damaging loops listed in the report; default 10. */
  worstLoopCount?: number;
  /**
   * Relative tolerance of the notch-rule solves, in [1e-15, 1e-10]; default 1e-10 (the tracker's
   * default: a verified answer table, local σ and ε within 1e-10 relative; tighter costs about
   * 1.5× per reversal).
   */
  tolerance?: number;
}

/** A job after checking and defaulting: what {@link resolveLifeJob} returns and every stage reads. */
export interface ResolvedJob {
  /** Which route assesses the job. */
  route: 'strain-life' | 'stress-life';
  /** The material (on the stress-life route, undefined unless the job gave one: see {@link strainLifeMaterial}). */
  material: Material | undefined;
  /** The stress-life route's curve and options (undefined on the strain-life route). */
  stressLife: ResolvedStressLife | undefined;
  input: NotchInputKind;
  rule: NotchRuleName;
  Kt: number | undefined;
  Kf: number | undefined;
  loadToStress: number;
  meanStress: DamageParameterName;
  walkerGamma: number | undefined;
  gate: number | undefined;
  gateFraction: number | undefined;
  fullScale: number | undefined;
  repeating: boolean;
  cutoffCycles: number | undefined;
  criticalDamage: number;
  scatterFactor: number;
  unit: JobServiceUnit | undefined;
  initial: number;
  offset: number;
  timelineBins: number;
  worstLoopCount: number;
  tolerance: number;
}

/** Every field a job may have (an unknown one is an error with the nearest name). */
const JOB_FIELDS: readonly (keyof LifeJob)[] = [
  'material',
  'stressLife',
  'input',
  'notch',
  'rule',
  'loadToStress',
  'meanStress',
  'walkerGamma',
  'gate',
  'gateFraction',
  'fullScale',
  'repeating',
  'cutoffCycles',
  'criticalDamage',
  'scatterFactor',
  'unit',
  'initial',
  'offset',
  'timelineBins',
  'worstLoopCount',
  'tolerance',
];

function bad(field: string, value: unknown, rule: string): never {
  throw new EngineError('invalid-job', field, value, `${describe(value)} is invalid: ${rule}`);
}

function describe(v: unknown): string {
  if (typeof v === 'bigint') return `${v}n (a BigInt)`;
  try {
    return typeof v === 'number' ? String(v) : JSON.stringify(v) ?? String(v);
  } catch {
    return String(v); // an object holding a BigInt or a cycle
  }
}

function finite(field: string, v: unknown, fallback: number): number {
  if (v === undefined) return fallback;
  if (typeof v !== 'number' || !Number.isFinite(v)) bad(field, v, 'must be a finite number');
  return v;
}

function positive(field: string, v: unknown, fallback: number): number {
  const x = finite(field, v, fallback);
  if (!(x > 0)) bad(field, v, 'must be > 0');
  return x;
}

/**
 * Checks a job and fills in its defaults; every error names the job field. Useful to validate a
 * job (a job file, a form) before any history is read.
 */
export function resolveLifeJob(job: LifeJob): ResolvedJob {
  if (job === null || typeof job !== 'object' || Array.isArray(job)) bad('job', job, 'must be an object');
  const unknown = unknownField(job, JOB_FIELDS, 'the job');
  if (unknown !== undefined) throw new EngineError('invalid-job', unknown.field, unknown.value, unknown.rule);
  for (const k of JOB_FIELDS) {
    if (job[k] === null) bad(k, null, 'must not be null (leave the field out for its default)');
    if (typeof job[k] === 'bigint') bad(k, job[k], 'must be a number, not a BigInt');
  }
  if (job.notch !== undefined && job.notch !== null && typeof job.notch === 'object') {
    const u = unknownField(job.notch, ['Kt', 'Kf', 'rule'], 'notch');
    if (u !== undefined) throw new EngineError('invalid-job', `notch.${u.field}`, u.value, u.rule);
  }
  if (job.unit !== undefined && job.unit !== null && typeof job.unit === 'object') {
    const u = unknownField(job.unit, ['label', 'perRepeat'], 'unit');
    if (u !== undefined) throw new EngineError('invalid-job', `unit.${u.field}`, u.value, u.rule);
  }
  if (job.stressLife !== undefined) return resolveStressLifeJob(job);
  if (job.material === undefined || job.material === null) bad('material', job.material, 'is required (or give stressLife for the stress-life route)');
  const material = materialOf(job.material);
  const input = job.input ?? 'nominal';
  if (!['nominal', 'pseudo-elastic', 'local-strain'].includes(input)) {
    bad('input', input, "must be 'nominal', 'pseudo-elastic' or 'local-strain'");
  }
  const notch = job.notch ?? {};
  if (typeof notch !== 'object') bad('notch', notch, 'must be an object { Kt | Kf, rule }');
  if (input !== 'nominal' && (notch.Kt !== undefined || notch.Kf !== undefined)) {
    bad('notch', notch, `Kt and Kf apply to nominal input only (input is '${input}')`);
  }
  if (notch.Kt !== undefined && notch.Kf !== undefined) bad('notch.Kf', notch.Kf, 'give Kt or Kf, not both');
  for (const k of ['Kt', 'Kf'] as const) {
    const v = notch[k];
    if (v !== undefined && !(typeof v === 'number' && v >= 1 && v < Infinity)) bad(`notch.${k}`, v, 'must be a finite number >= 1');
  }
  const rule = notch.rule ?? job.rule ?? 'neuber';
  if (!['neuber', 'glinka', 'linear'].includes(rule)) bad('notch.rule', rule, "must be 'neuber', 'glinka' or 'linear'");
  const Kt = input === 'nominal' && notch.Kf === undefined ? (notch.Kt ?? 1) : undefined;
  const Kf = input === 'nominal' ? notch.Kf : undefined;
  const meanStress = job.meanStress ?? DEFAULT_DAMAGE_PARAMETER;
  if (!Object.prototype.hasOwnProperty.call(damageParameters, meanStress)) {
    bad('meanStress', meanStress, `must be one of ${Object.keys(damageParameters).join(', ')}`);
  }
  let walkerGamma: number | undefined;
  if (job.walkerGamma !== undefined) {
    walkerGamma = finite('walkerGamma', job.walkerGamma, 0.5);
    if (!(walkerGamma > 0 && walkerGamma <= 1)) bad('walkerGamma', job.walkerGamma, 'must be in (0, 1]');
  }
  const tolerance = finite('tolerance', job.tolerance, DEFAULT_TRACKER_TOLERANCE);
  if (!(tolerance >= 1e-15 && tolerance <= 1e-10)) bad('tolerance', tolerance, 'must be in [1e-15, 1e-10]');
  return {
    route: 'strain-life',
    material,
    stressLife: undefined,
    input,
    rule,
    Kt,
    Kf,
    meanStress,
    walkerGamma,
    tolerance,
    initial: finite('initial', job.initial, 0),
    ...sharedFields(job),
  };
}

/** The fields both routes read, checked and defaulted. */
function sharedFields(job: LifeJob): Omit<ResolvedJob, 'route' | 'material' | 'stressLife' | 'input' | 'rule' | 'Kt' | 'Kf' | 'meanStress' | 'walkerGamma' | 'tolerance' | 'initial'> {
  if (job.gate !== undefined && job.gateFraction !== undefined) bad('gateFraction', job.gateFraction, 'give gate or gateFraction, not both');
  const gate = job.gate === undefined ? undefined : finite('gate', job.gate, 0);
  if (gate !== undefined && gate < 0) bad('gate', gate, 'must be >= 0');
  const gateFraction = job.gateFraction === undefined ? undefined : finite('gateFraction', job.gateFraction, 0);
  if (gateFraction !== undefined && !(gateFraction >= 0 && gateFraction <= 1)) bad('gateFraction', gateFraction, 'must be from 0 to 1');
  const fullScale = job.fullScale === undefined ? undefined : positive('fullScale', job.fullScale, 1);
  const repeating = job.repeating ?? true;
  if (typeof repeating !== 'boolean') bad('repeating', repeating, 'must be true or false');
  const cutoffCycles = job.cutoffCycles === undefined ? undefined : positive('cutoffCycles', job.cutoffCycles, 1);
  const criticalDamage = positive('criticalDamage', job.criticalDamage, 1);
  const scatterFactor = finite('scatterFactor', job.scatterFactor, 1);
  if (!(scatterFactor >= 1)) bad('scatterFactor', scatterFactor, 'must be >= 1');
  let unit: JobServiceUnit | undefined;
  if (job.unit !== undefined) {
    if (job.unit === null || typeof job.unit !== 'object' || typeof job.unit.label !== 'string' || job.unit.label === '') {
      bad('unit', job.unit, 'must be { label, perRepeat } with a non-empty label');
    }
    unit = { label: job.unit.label };
    if (job.unit.perRepeat !== undefined) unit.perRepeat = positive('unit.perRepeat', job.unit.perRepeat, 1);
  }
  const timelineBins = job.timelineBins ?? 100;
  if (!Number.isInteger(timelineBins) || timelineBins < 1) bad('timelineBins', timelineBins, 'must be an integer >= 1');
  const worstLoopCount = job.worstLoopCount ?? 10;
  if (!Number.isInteger(worstLoopCount) || worstLoopCount < 0) bad('worstLoopCount', worstLoopCount, 'must be an integer >= 0');
  return {
    loadToStress: positive('loadToStress', job.loadToStress, 1),
    gate,
    gateFraction,
    fullScale,
    repeating,
    cutoffCycles,
    criticalDamage,
    scatterFactor,
    unit,
    offset: finite('offset', job.offset, 0),
    timelineBins,
    worstLoopCount,
  };
}

/** The material of a strain-life job (every strain-life stage reads it; resolveLifeJob guarantees it there). */
export function strainLifeMaterial(job: ResolvedJob): Material {
  if (job.material === undefined) throw new EngineError('invalid-job', 'material', undefined, 'the strain-life route needs a material');
  return job.material;
}

function materialOf(m: Material | MaterialInput): Material {
  if (typeof m !== 'object') {
    bad('material', m, typeof m === 'string' ? 'must be a material object: look a handbook name up in handbookSteels of @loopwise/material' : 'must be a material object');
  }
  return Object.isFrozen(m) && 'warnings' in m ? (m as Material) : defineMaterial(m);
}

/** Fields of the strain-life route only. */
const STRAIN_ONLY = ['input', 'notch', 'rule', 'meanStress', 'walkerGamma', 'tolerance'] as const;

/**
 * The stress-life route: checks the curve (`defineSnCurve` when given by its parameters) and the
 * options (errors of the stress-life package renamed to the job field), refuses the strain-life
 * fields, and checks the shared ones as the strain route does.
 */
function resolveStressLifeJob(job: LifeJob): ResolvedJob {
  const spec = job.stressLife as StressLifeSpec;
  if (spec === null || typeof spec !== 'object') bad('stressLife', spec, 'must be { curve, meanStress, kf, stressFactor }');
  for (const k of STRAIN_ONLY) {
    if (job[k] !== undefined) {
      const instead = k === 'meanStress' ? 'the correction is stressLife.meanStress' : k === 'notch' ? 'the notch enters as stressLife.kf' : 'remove it';
      bad(k, job[k], `applies to the strain-life route only (this job gives stressLife: ${instead})`);
    }
  }
  if (job.initial !== undefined && job.initial !== 0) bad('initial', job.initial, 'the stress-life route counts cycles from the first sample; an initial value applies to the strain-life route only');
  const u = unknownField(spec, ['curve', 'meanStress', 'kf', 'stressFactor'], 'stressLife');
  if (u !== undefined) throw new EngineError('invalid-job', `stressLife.${u.field}`, u.value, u.rule);
  const c = spec.curve as SnCurve & SnCurveInput;
  if (c === null || typeof c !== 'object') bad('stressLife.curve', c, 'must be an S-N curve or { stress, cycles, slope, knees, cutoffCycles, measure }');
  let curve: SnCurve;
  let meanStress: AmplitudeCorrection;
  try {
    curve = Object.isFrozen(c) && Array.isArray(c.slopes) ? c : defineSnCurve(c);
  } catch (err) {
    throw renamed(err, 'stressLife.curve');
  }
  try {
    [meanStress] = resolveCycleOptions({ meanStress: spec.meanStress, kf: spec.kf, stressFactor: spec.stressFactor });
  } catch (err) {
    throw renamed(err, 'stressLife');
  }
  return {
    route: 'stress-life',
    material: job.material === undefined || job.material === null ? undefined : materialOf(job.material),
    stressLife: { curve, meanStress, kf: spec.kf ?? 1, stressFactor: spec.stressFactor ?? 1 },
    input: 'nominal',
    rule: 'neuber',
    Kt: undefined,
    Kf: undefined,
    meanStress: DEFAULT_DAMAGE_PARAMETER,
    walkerGamma: undefined,
    tolerance: DEFAULT_TRACKER_TOLERANCE,
    initial: 0,
    ...sharedFields(job),
  };
}

/** A stress-life package error as an engine job error under `prefix` (its field and sentence kept). */
function renamed(err: unknown, prefix: string): unknown {
  if (!(err instanceof Error) || err instanceof EngineError || !('field' in err)) return err;
  const e = err as Error & { field: string; value?: unknown };
  const field = e.field.startsWith('curve') || e.field.startsWith('options') ? e.field.replace(/^[a-z]+\.?/, '') : e.field;
  return new EngineError('invalid-job', field === '' ? prefix : `${prefix}.${field}`, e.value, e.message);
}
