import type { DamageParameterName } from '@loopwise/mean-stress';
import type { AmplitudeCorrection } from '@loopwise/stress-life';
import type { LifeEstimate } from '@loopwise/miner';

/** A mean-stress correction by name: a damage parameter (strain-life route) or an amplitude correction (stress-life route). */
export type CorrectionName = DamageParameterName | AmplitudeCorrection['method'];

/**
 * Typed-array columns of the loops that make up the damage of one repeat (stabilised pass). Rows
 * are in closing order; for a repeating history, of the pass that starts just after the largest
 * |value| (the loops from there to the end, then those up to it). The columns belong to this
 * report alone: writing through them changes no other result.
 */
export interface LifeLoopColumns {
  /**
   * Local stresses and strains of the loop at the notch root. On the stress-life route the
   * stresses are those entered on the S-N curve ((x + offset) · loadToStress · Kf · stress
   * factor) and the strain columns are empty (length 0: no local strain is computed).
   */
  stressMax: Float64Array;
  stressMin: Float64Array;
  strainMax: Float64Array;
  strainMin: Float64Array;
  /** The damage parameter's value (see `damage.parameterUnit`; on the stress route the equivalent stress on the curve). */
  parameter: Float64Array;
  /** Reversals to failure 2Nf of one such loop. */
  reversalsToFailure: Float64Array;
  /** Cycles to failure Nf = 2Nf / 2. */
  cyclesToFailure: Float64Array;
  /** How many such loops one repeat holds: 1 per closed loop, 0.5 for a half cycle, more for repeated events. */
  count: Float64Array;
  /** Damage per repeat of this row: count / Nf (0 beyond the cut-off). */
  damage: Float64Array;
  /** Schedule sample index where the loop started (-1: the initial state), turned, and closed. */
  startIndex: Float64Array;
  turnIndex: Float64Array;
  closeIndex: Float64Array;
  /** Event of the start and of the turn (index into `events`; -1 for the initial state). */
  startEvent: Float64Array;
  turnEvent: Float64Array;
}

/** One of the most damaging loops, as a plain object. */
export interface WorstLoop {
  row: number;
  damage: number;
  share: number;
  count: number;
  stressMax: number;
  stressMin: number;
  /** Local strains (null on the stress-life route). */
  strainMax: number | null;
  strainMin: number | null;
  cyclesToFailure: number;
  startIndex: number;
  turnIndex: number;
  startEvent: string | null;
  turnEvent: string | null;
}

/** A warning of the assessment: a stable code, a sentence, and the numbers behind it. */
export interface LifeWarning {
  code:
    | 'gate-removed-damage'
    | 'cutoff-share'
    | 'beyond-material-model'
    | 'incompatible-material'
    | 'first-reversal-failure'
    | 'below-curve-limit'
    | 'beyond-curve-range';
  message: string;
  details: Record<string, number | string>;
}

/** Damage per event of the schedule. */
export interface EventDamage {
  name: string;
  repeats: number;
  samples: number;
  /** Damage per repeat of the schedule attributed to the event (half of each loop to each reversal). */
  damage: number;
  share: number;
}

/** Everything an assessment found, with its inputs and assumptions (format `loopwise-life-report`, version 1). */
export interface LifeReport {
  format: 'loopwise-life-report';
  version: 1;
  /** The job as resolved (defaults filled in) and the schedule. */
  inputs: Record<string, unknown>;
  /** The model's assumptions, in words. */
  assumptions: string[];
  /** The safety caution that goes with every estimate. */
  caution: string;
  damage: {
    /** The route: local strain-life (notch rule, strain-life curve) or stress-life (S-N curve). */
    route: 'strain-life' | 'stress-life';
    /** The mean-stress correction in use: the damage parameter, or the stress route's amplitude correction. */
    meanStress: CorrectionName;
    parameterUnit: string;
    /** Damage per repeat of the schedule, stabilised pass (the basis of life). */
    perRepeat: number;
    /** Damage of the first pass from the unloaded state (or the initial value). */
    firstPass: number;
    /** True when the stabilised pass reused the first pass from the largest |value| on. */
    reusedFirstPass: boolean;
  };
  /** Life in repeats and, with a unit, in service; with and without the scatter factor. */
  life: LifeEstimate;
  loops: LifeLoopColumns;
  worstLoops: WorstLoop[];
  timeline: { binSize: number; samples: number; damage: Float64Array };
  events: EventDamage[];
  gate: { range: number; removedReversals: number };
  warnings: LifeWarning[];
}
