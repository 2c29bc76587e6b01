import { checkColumn } from './checks';
import { StressLifeError } from './StressLifeError';

/** Extrapolation rules of the IIW recommendations for the structural hot-spot stress. */
export type HotSpotRule = 'typeALinear' | 'typeAQuadratic' | 'typeBLinear' | 'typeBQuadratic';

/** One hot-spot rule: where the gauges sit and the coefficients of σhs = Σ cᵢ·σᵢ. */
export interface HotSpotRuleDefinition {
  /** Gauge positions from the weld toe: multiples of the plate thickness t (type a) or mm (type b). */
  readonly points: readonly number[];
  /** `'t'` for multiples of the plate thickness, `'mm'` for fixed distances. */
  readonly pointUnit: 't' | 'mm';
  /** Coefficients, one per gauge, in the order of `points`. */
  readonly coefficients: readonly number[];
}

/**
 * The rules, as the IIW recommendations publish them (A. Hobbacher, IIW Recommendations for
 * Fatigue Design of Welded Joints and Components, 2016, 2.2.3 structural hot-spot stress,
 * equations for strain gauge measurements; coefficients value from memory). The quadratic and
 * type-b coefficients are exactly the Lagrange extrapolation to the toe from the stated points;
 * the linear type-a ones are the published rounding of 5/3 and 2/3.
 */
export const HOT_SPOT_RULES: Readonly<Record<HotSpotRule, HotSpotRuleDefinition>> = Object.freeze({
  typeALinear: Object.freeze({ points: Object.freeze([0.4, 1.0]), pointUnit: 't' as const, coefficients: Object.freeze([1.67, -0.67]) }),
  typeAQuadratic: Object.freeze({ points: Object.freeze([0.4, 0.9, 1.4]), pointUnit: 't' as const, coefficients: Object.freeze([2.52, -2.24, 0.72]) }),
  typeBLinear: Object.freeze({ points: Object.freeze([5, 15]), pointUnit: 'mm' as const, coefficients: Object.freeze([1.5, -0.5]) }),
  typeBQuadratic: Object.freeze({ points: Object.freeze([4, 8, 12]), pointUnit: 'mm' as const, coefficients: Object.freeze([3, -3, 1]) }),
});

function ruleOf(rule: HotSpotRule): HotSpotRuleDefinition {
  if (typeof rule !== 'string' || !Object.prototype.hasOwnProperty.call(HOT_SPOT_RULES, rule)) {
    throw new StressLifeError('invalid-option', 'rule', rule, `must be one of ${Object.keys(HOT_SPOT_RULES).join(', ')}`);
  }
  return HOT_SPOT_RULES[rule];
}

/**
 * Kernel of {@link hotSpotStress}: the structural hot-spot stress history from two or three
 * gauge histories, sample by sample, into caller-owned `out` (no allocation):
 *
 *     typeALinear     σhs = 1.67·σ(0.4t) − 0.67·σ(1.0t)
 *     typeAQuadratic  σhs = 2.52·σ(0.4t) − 2.24·σ(0.9t) + 0.72·σ(1.4t)
 *     typeBLinear     σhs = 1.5·σ(5 mm) − 0.5·σ(15 mm)
 *     typeBQuadratic  σhs = 3·σ(4 mm) − 3·σ(8 mm) + σ(12 mm)
 *
 * `gauges[i]` is the history of the gauge at `HOT_SPOT_RULES[rule].points[i]`; all have the
 * same length. Gauges give strain: convert to stress first (σ = E·ε for a uniaxial stress
 * state, or E/(1 − ν²)·(εx + ν·εy) for a biaxial one, as the recommendations say).
 *
 * Reference: A. Hobbacher, IIW Recommendations, 2016, 2.2.3 (type a: plate-thickness-related
 * points, type b: fixed points on a plate edge; value from memory).
 *
 * @throws {StressLifeError} `invalid-option` for an unknown rule; `invalid-argument` for the
 *   wrong number of gauges, different lengths or a short `out`; `non-finite-sample` naming the
 *   gauge (`gauges[1]`) and the sample index.
 * @example
 * Array.from(hotSpotStressInto('typeBQuadratic', [[100], [80], [70]], new Float64Array(1)));
 * // returns [130]
 */
export function hotSpotStressInto(rule: HotSpotRule, gauges: readonly ArrayLike<number>[], out: Float64Array): Float64Array {
  const def = ruleOf(rule);
  const k = def.coefficients.length;
  if (!Array.isArray(gauges) || gauges.length !== k) {
    throw new StressLifeError('invalid-argument', 'gauges', Array.isArray(gauges) ? gauges.length : gauges, `must be ${k} gauge histories for ${rule}`);
  }
  checkColumn(gauges[0], 'gauges[0]');
  const n = gauges[0].length;
  for (let g = 1; g < k; g++) checkColumn(gauges[g], `gauges[${g}]`, n);
  checkColumn(out, 'out', n, false);
  for (let g = 0; g < k; g++) {
    const x = gauges[g];
    for (let i = 0; i < n; i++) {
      const v = x[i];
      if (!(v > -Infinity && v < Infinity)) throw new StressLifeError('non-finite-sample', `gauges[${g}]`, v, 'samples must be finite', i);
    }
  }
  const c = def.coefficients;
  // two loops written out (two or three gauges) so the per-sample work is one fused expression
  if (k === 2) {
    const a = gauges[0];
    const b = gauges[1];
    const ca = c[0];
    const cb = c[1];
    for (let i = 0; i < n; i++) out[i] = ca * a[i] + cb * b[i];
  } else {
    const a = gauges[0];
    const b = gauges[1];
    const d = gauges[2];
    const ca = c[0];
    const cb = c[1];
    const cd = c[2];
    for (let i = 0; i < n; i++) out[i] = ca * a[i] + cb * b[i] + cd * d[i];
  }
  return out;
}

/**
 * The structural hot-spot stress history from two or three gauge histories (a new
 * Float64Array); see {@link hotSpotStressInto} for the rules, units and references.
 *
 * @example
 * Array.from(hotSpotStress('typeALinear', [[100, 0], [70, 0]]));
 * // returns [120.1, 0]
 */
export function hotSpotStress(rule: HotSpotRule, gauges: readonly ArrayLike<number>[]): Float64Array {
  const n = Array.isArray(gauges) && gauges.length > 0 && gauges[0] != null ? gauges[0].length : 0;
  return hotSpotStressInto(rule, gauges, new Float64Array(n));
}
