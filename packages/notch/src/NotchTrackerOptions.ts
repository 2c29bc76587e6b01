import { unknownField } from '@loopwise/base';
import { assertMaterial, defineMaterial, type Material } from '@loopwise/material';
import type { BranchKind } from './BranchSolver';
import { NotchOptionError } from './NotchOptionError';

/** What the history holds. */
export type NotchInputKind = 'nominal' | 'pseudo-elastic' | 'local-strain';
/** Which notch rule maps pseudo-elastic ranges to local ones. */
export type NotchRuleName = 'neuber' | 'glinka' | 'linear';

/** Options of {@link NotchTracker}, {@link trackNotch} and {@link trackNotchRepeating}. */
export interface NotchTrackerOptions {
  /** The material (cyclic curve E, K', n'; strain-life constants for the default strain limit). */
  material: Material;
  /**
   * What the samples are; default `'nominal'`:
   * - `'nominal'`: nominal stress or load; pseudo-elastic local stress = Kt (or Kf) × loadToStress × sample;
   * - `'pseudo-elastic'`: the local stress of a linear-elastic model (Kt already in it);
   * - `'local-strain'`: strain measured at the notch root; no notch rule, stress from the cyclic curve and Masing branches.
   */
  input?: NotchInputKind;
  /** Notch rule for `nominal` and `pseudo-elastic` input; default `'neuber'`. Ignored for `local-strain`. */
  rule?: NotchRuleName;
  /** Elastic stress concentration factor (>= 1). Nominal input needs exactly one of Kt and Kf. */
  Kt?: number;
  /** Fatigue notch factor (>= 1), used in place of Kt when given. */
  Kf?: number;
  /** Nominal stress per unit of the history (e.g. MPa per kN) for nominal input; default 1. */
  loadToStress?: number;
  /**
   * Value of the history (after `offset`) at which the part sits when the history starts,
   * reached by first loading from the unloaded state; default 0 (unloaded). The path from it to
   * the first sample is part of the history.
   */
  initial?: number;
  /**
   * Added to every sample before anything else; default 0. For a gauge zeroed while the part
   * carried a load, the true value at zeroing (and usually `initial` too).
   */
  offset?: number;
  /**
   * Local strain amplitude above which the result is flagged `beyondStrainLimit` (first-loading
   * |ε|, or half the strain range of a branch); default σf'/E + εf', the strain amplitude of the
   * strain-life curve at one reversal.
   */
  strainLimit?: number;
  /**
   * Whether to keep every reversal in the `reversals` table; default true. A caller that needs
   * only the closed loops (the life pipeline) saves the table's memory and writes with false.
   */
  recordReversals?: boolean;
  /**
   * Relative tolerance of every branch solve, in [1e-15, 1e-10]; default 1e-10. At the default
   * the solves read a per-material answer table whose error was verified against the exact
   * solve to be at most a tenth of the tolerance (local σ and ε within 1e-10 relative); tighter
   * tolerances use Newton steps and cost about 1.5× per reversal.
   */
  tolerance?: number;
  /** Iteration cap of every branch solve; default 60. Reaching it throws `ConvergenceError`. */
  maxIterations?: number;
}

/** Tracker options after checking and defaulting (what a tracker's `options` holds). */
export interface ResolvedTrackerOptions {
  material: Material;
  input: NotchInputKind;
  rule: NotchRuleName;
  Kt: number | undefined;
  Kf: number | undefined;
  loadToStress: number;
  initial: number;
  offset: number;
  strainLimit: number;
  recordReversals: boolean;
  tolerance: number;
  maxIterations: number;
  /** Factor from a history difference to a pseudo-elastic (or strain) difference. */
  scale: number;
  kind: BranchKind;
}

function finite(field: string, v: unknown): number {
  if (typeof v !== 'number' || !Number.isFinite(v)) throw new NotchOptionError(field, v, 'must be a finite number');
  return v;
}

/** The fields of {@link NotchTrackerOptions}; any other is an error naming the nearest of these. */
const TRACKER_FIELDS: readonly string[] = [
  'material', 'input', 'rule', 'Kt', 'Kf', 'loadToStress', 'initial', 'offset', 'strainLimit', 'recordReversals', 'tolerance', 'maxIterations',
];

/** Default relative tolerance of the tracker's branch solves (the verified answer-table path). */
export const DEFAULT_TRACKER_TOLERANCE = 1e-10;

/** Checks and defaults tracker options; every error names its field (internal). */
export function resolveTrackerOptions(options: NotchTrackerOptions): ResolvedTrackerOptions {
  if (options == null || typeof options !== 'object') throw new NotchOptionError('options', options, 'must be an object');
  const u = unknownField(options, TRACKER_FIELDS, 'notch tracker options');
  if (u !== undefined) throw new NotchOptionError(u.field, u.value, u.rule);
  const material = options.material;
  if (material == null) throw new NotchOptionError('material', material, 'is required');
  assertMaterial(material);
  const input = options.input ?? 'nominal';
  if (input !== 'nominal' && input !== 'pseudo-elastic' && input !== 'local-strain') {
    throw new NotchOptionError('input', input, "must be 'nominal', 'pseudo-elastic' or 'local-strain'");
  }
  const rule = options.rule ?? 'neuber';
  if (rule !== 'neuber' && rule !== 'glinka' && rule !== 'linear') {
    throw new NotchOptionError('rule', rule, "must be 'neuber', 'glinka' or 'linear'");
  }
  const { Kt, Kf } = options;
  for (const [field, v] of [['Kt', Kt], ['Kf', Kf]] as const) {
    if (v !== undefined && !(typeof v === 'number' && v >= 1 && v < Infinity)) {
      throw new NotchOptionError(field, v, 'must be a finite number >= 1');
    }
  }
  if (input === 'nominal') {
    if (Kt === undefined && Kf === undefined) throw new NotchOptionError('Kt', Kt, 'nominal input needs Kt or Kf');
    if (Kt !== undefined && Kf !== undefined) throw new NotchOptionError('Kf', Kf, 'give Kt or Kf, not both');
  } else if (Kt !== undefined || Kf !== undefined) {
    throw new NotchOptionError(Kt !== undefined ? 'Kt' : 'Kf', Kt ?? Kf, `is for nominal input only (input is '${input}')`);
  }
  const loadToStress = finite('loadToStress', options.loadToStress ?? 1);
  if (!(loadToStress > 0)) throw new NotchOptionError('loadToStress', loadToStress, 'must be > 0');
  const initial = finite('initial', options.initial ?? 0);
  const offset = finite('offset', options.offset ?? 0);
  const strainLimit = options.strainLimit ?? material.sigmaF / material.E + material.epsilonF;
  if (!(typeof strainLimit === 'number' && strainLimit > 0)) throw new NotchOptionError('strainLimit', strainLimit, 'must be a number > 0');
  const recordReversals = options.recordReversals ?? true;
  if (typeof recordReversals !== 'boolean') throw new NotchOptionError('recordReversals', recordReversals, 'must be true or false');
  const tolerance = options.tolerance ?? DEFAULT_TRACKER_TOLERANCE;
  if (!(typeof tolerance === 'number' && tolerance >= 1e-15 && tolerance <= 1e-10)) {
    throw new NotchOptionError('tolerance', tolerance, 'must be a number in [1e-15, 1e-10]');
  }
  const maxIterations = options.maxIterations ?? 60;
  if (!Number.isInteger(maxIterations) || maxIterations < 1) throw new NotchOptionError('maxIterations', maxIterations, 'must be an integer >= 1');
  const factor = input === 'nominal' ? (Kf ?? Kt!) * loadToStress : 1;
  const kind: BranchKind = input === 'local-strain' ? 'local-strain' : rule;
  return { material, input, rule, Kt, Kf, loadToStress, initial, offset, strainLimit, recordReversals, tolerance, maxIterations, scale: factor, kind };
}

/** The plain fields of a material, for JSON state (internal). */
export function materialFields(m: Material): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const key of ['name', 'E', 'sigmaF', 'b', 'epsilonF', 'c', 'K', 'n', 'Su', 'hardnessHB', 'source', 'note'] as const) {
    if (m[key] !== undefined) out[key] = m[key];
  }
  return out;
}

/** Rebuilds a material from {@link materialFields} (internal). */
export function materialFromFields(fields: Record<string, unknown>): Material {
  return defineMaterial(fields as unknown as Parameters<typeof defineMaterial>[0]);
}
