import { ArgumentError } from './ArgumentError';
import { checkReversalsOptions } from './checkReversalsOptions';
import { ConvergenceError } from './ConvergenceError';
import type { ReversalsOptions } from './reversalsToFailure';
import { DEFAULT_CUTOFF_REVERSALS, DEFAULT_MAX_ITERATIONS, solveTwoTermReversals } from './solveTwoTermReversals';

/**
 * Number of solves from which the typed-array kernels build a {@link TwoTermReversalsTable}
 * (a call with fewer loops or amplitudes solves each one by {@link solveTwoTermReversals}, with
 * exactly the results it had before). Measured break-even on the benchmark's loops (SWT and
 * none, SAE 1045, table cut to the targets present): about 256 loops; see docs/material.md.
 */
export const REVERSALS_TABLE_MIN_COUNT = 256;

/**
 * Spacing h of the table nodes in ln Y, as a multiple of min(|p|, |q|). The cubic Hermite start
 * error is at most h⁴/384·max|u''''|; with the spacing scaled by the smaller exponent it does not
 * depend on the scale of p and q. At 0.3 the largest start error measured over 900 generated
 * equations (fully reversed, SWT, Walker, realistic metals) was 5.4e-7 in ln x, so C·error² ≤
 * 4.6e-13 and one Newton step passes the stopping rule.
 */
const SPACING = 0.3;

/** Starts closer than this (in ln x) to 0 (one reversal) or to ln cut-off go to the plain solver. */
const END_MARGIN = 1e-4;

/** Most cells a table has (the spacing widens beyond SPACING when the bracket needs more). */
const MAX_CELLS = 4096;

/** Cap of the Newton solves at the table nodes (each starts from its neighbour's tangent). */
const NODE_ITERATIONS = 60;

/** Options of {@link TwoTermReversalsTable}. */
export interface TwoTermReversalsTableOptions extends ReversalsOptions {
  /**
   * Smallest `shift` that {@link TwoTermReversalsTable.solve} will be called with. Default 0.
   * The table covers ln x from 0 to ln cut-off for every shift in [minShift, maxShift].
   */
  minShift?: number;
  /** Largest `shift` that {@link TwoTermReversalsTable.solve} will be called with. Default 0. */
  maxShift?: number;
  /**
   * Smallest ln Y the table needs to cover (the kernels pass the smallest target of the call).
   * Default −∞: the whole bracket. Targets outside the covered range are solved by
   * {@link solveTwoTermReversals} itself; an empty range gives a table without cells.
   */
  lnTargetMin?: number;
  /** Largest ln Y the table needs to cover. Default +∞: the whole bracket. */
  lnTargetMax?: number;
}

/**
 * Many solves of one two-term strain-life equation A·x^p + B·x^q = Y (fixed A, p, B, q,
 * varying Y) with the same results as {@link solveTwoTermReversals}, faster: a table of the
 * solution, built once, gives each solve a start close enough for one Newton step.
 *
 * Method: with u = ln x and t = ln Y, the root u(t) of g(u) = ln(A·e^(pu) + B·e^(qu)) = t is
 * smooth, decreasing and convex in t, with du/dt = 1/g'(u) = (A·e^(pu) + B·e^(qu))/(p·A·e^(pu) +
 * q·B·e^(qu)). The table holds u and du/dt at nodes equally spaced in t (spacing
 * 0.3·min(|p|, |q|)), over the t of the roots from ln x = 0 to ln cut-off (for every shift of
 * the options), cut to the targets the caller says it will solve (`lnTargetMin`,
 * `lnTargetMax`); each node is solved by Newton from the second-order Taylor step of its
 * neighbour. A solve evaluates the cubic Hermite interpolant of its cell,
 * clamps it to the
 * bracket of {@link solveTwoTermReversals} and runs the same Newton iteration with the same
 * stopping rule (C·step² ≤ 1e-12) and the same iteration cap, so the result is certified by
 * the iteration, not by the table: a poor start only costs iterations. From above the root the
 * first Newton step of a convex decreasing function lands at or below it, from where the
 * iteration is monotone as in the plain solver. Near the root ln s is taken from its series
 * (|s − 1| < 1e-3, truncation below 2e-19) instead of Math.log; the step is the same.
 *
 * The iteration cap counts Newton iterations from the table start (usually one). Targets
 * outside the table, starts within 1e-4 (in ln x) of one reversal or of the cut-off, and NaN
 * go to {@link solveTwoTermReversals} itself, so 1, `Infinity` and the errors are exactly the
 * plain solver's. Elsewhere the result agrees with it to the solver's own tolerance
 * (1e-12 in ln x).
 *
 * `shift` solves the scaled equation A·(x·e^s)^p + B·(x·e^s)^q = Y, whose root is the
 * unscaled root divided by e^s (ln x = u(t) − s): modified Morrow is of this form.
 *
 * Cost: building takes two Newton steps per node (150 to 650 nodes over the whole bracket for
 * realistic metals, fewer when cut to the targets; about 40 µs for SWT of SAE 1045); a solve
 * then costs a table lookup, one Newton step (two exp) and the final exp, against three to five
 * steps (two exp and one log each) from the bracket.
 *
 * Reference: equation and Newton iteration as in {@link solveTwoTermReversals}; Hermite
 * interpolation error bound h⁴/384·max|f''''| as in C. de Boor, A Practical Guide to Splines,
 * Springer, 1978, chapter IV.
 *
 * @example
 * const table = new TwoTermReversalsTable(Math.log(0.005), -0.1, Math.log(1), -0.5);
 * table.solve(Math.log(0.01))
 * // returns ≈ 2016.0 (reversals), as solveTwoTermReversals(Math.log(0.005), -0.1, 0, -0.5, Math.log(0.01))
 */
export class TwoTermReversalsTable {
  /** ln A of the equation. */
  readonly lnA: number;
  /** Exponent of the first term (< 0). */
  readonly p: number;
  /** ln B of the equation. */
  readonly lnB: number;
  /** Exponent of the second term (< 0). */
  readonly q: number;
  /** Number of cells (nodes − 1). */
  readonly cells: number;
  private readonly cutoff: number;
  private readonly lnCutoff: number;
  private readonly maxIterations: number;
  private readonly errorConstant: number;
  private readonly tMin: number;
  private readonly invSpacing: number;
  /** Per cell the cubic u = c0 + f·(c1 + f·(c2 + f·c3)), f ∈ [0, 1) the position in the cell. */
  private readonly coefficients: Float64Array;

  /**
   * Builds the table of A·x^p + B·x^q = Y given in logarithms (as {@link solveTwoTermReversals}).
   *
   * @param lnA ln A (finite)
   * @param p exponent of the first term (finite, < 0)
   * @param lnB ln B (finite)
   * @param q exponent of the second term (finite, < 0)
   * @param options cut-off and iteration cap (defaults as {@link solveTwoTermReversals}), the
   *   range of shifts the solves will use (default 0) and the range of ln Y to cover (default all)
   * @throws {ArgumentError} for a bad exponent, NaN or infinite ln A or ln B, a cut-off below 1,
   *   minShift > maxShift, or a NaN target bound.
   */
  constructor(lnA: number, p: number, lnB: number, q: number, options: TwoTermReversalsTableOptions = {}) {
    checkReversalsOptions(options, 'TwoTermReversalsTable options', ['minShift', 'maxShift', 'lnTargetMin', 'lnTargetMax']);
    if (!(p < 0 && p > -Infinity)) throw new ArgumentError('p', p, 'must be a finite number < 0');
    if (!(q < 0 && q > -Infinity)) throw new ArgumentError('q', q, 'must be a finite number < 0');
    if (!Number.isFinite(lnA)) throw new ArgumentError('lnA', lnA, 'must be a finite number');
    if (!Number.isFinite(lnB)) throw new ArgumentError('lnB', lnB, 'must be a finite number');
    const cutoff = options.cutoffReversals ?? DEFAULT_CUTOFF_REVERSALS;
    if (!(cutoff >= 1)) throw new ArgumentError('cutoffReversals', cutoff, 'must be a number >= 1');
    const minShift = options.minShift ?? 0;
    const maxShift = options.maxShift ?? 0;
    if (!Number.isFinite(minShift)) throw new ArgumentError('minShift', minShift, 'must be a finite number');
    if (!Number.isFinite(maxShift)) throw new ArgumentError('maxShift', maxShift, 'must be a finite number');
    if (!(minShift <= maxShift)) throw new ArgumentError('maxShift', maxShift, `must be >= minShift (${minShift})`);
    this.lnA = lnA;
    this.p = p;
    this.lnB = lnB;
    this.q = q;
    this.cutoff = cutoff;
    this.lnCutoff = Math.log(cutoff);
    this.maxIterations = options.maxIterations ?? DEFAULT_MAX_ITERATIONS;
    const d = p - q;
    this.errorConstant = (d * d) / (8 * (p > q ? -p : -q));

    // The unscaled root w = u + shift covers [minShift, ln cut-off + maxShift] (clamped to the
    // exponent range of binary64, beyond which the equation has no representable terms), and
    // only the targets in [lnTargetMin, lnTargetMax].
    const c = this.errorConstant;
    const wLo = Math.max(minShift, -700);
    const wHi = Math.min(this.lnCutoff + maxShift, 700);
    let tLo = g(lnA, p, lnB, q, wHi);
    let tHi = g(lnA, p, lnB, q, wLo);
    let uFirst = wHi;
    let uLast = wLo;
    const yMin = options.lnTargetMin ?? -Infinity;
    const yMax = options.lnTargetMax ?? Infinity;
    if (yMin !== yMin) throw new ArgumentError('lnTargetMin', yMin, 'must not be NaN');
    if (yMax !== yMax) throw new ArgumentError('lnTargetMax', yMax, 'must not be NaN');
    if (yMin > tLo && yMin < tHi) {
      tLo = yMin;
      uFirst = nodeRoot(lnA, p, lnB, q, c, yMin, bracketLow(lnA, p, lnB, q, yMin));
    }
    if (yMax < tHi && yMax > tLo) {
      tHi = yMax;
      uLast = nodeRoot(lnA, p, lnB, q, c, yMax, bracketLow(lnA, p, lnB, q, yMax));
    }
    const target = SPACING * (p > q ? -p : -q);
    // At most MAX_CELLS cells: an exponent near 0 (b or c of −1e-300) would ask for more cells
    // than memory holds; a coarser table only gives a start that needs a few more Newton steps.
    const cells = wHi > wLo && tHi > tLo && yMin < tHi && yMax > tLo ? Math.min(MAX_CELLS, Math.ceil((tHi - tLo) / target)) : 0;
    const h = cells > 0 ? (tHi - tLo) / cells : 1;
    this.cells = cells;
    this.tMin = tLo;
    this.invSpacing = 1 / h;
    const coefficients = new Float64Array(4 * cells);
    // Nodes from t = tLo (root wHi) upwards, u(t) decreasing; each node is solved by Newton
    // from the second-order Taylor step of the previous one.
    const scratch = new Float64Array(2);
    let u0 = uFirst;
    derivatives(lnA, p, lnB, q, u0, h, scratch);
    let m0 = scratch[0];
    for (let j = 0; j < cells; j++) {
      const last = j + 1 === cells;
      // start: second-order Taylor step from the previous node (two Newton steps finish it)
      const u1 = last ? uLast : nodeRoot(lnA, p, lnB, q, c, tLo + (j + 1) * h, u0 + m0 + scratch[1]);
      derivatives(lnA, p, lnB, q, u1, h, scratch);
      const m1 = scratch[0];
      const o = 4 * j;
      coefficients[o] = u0;
      coefficients[o + 1] = m0;
      coefficients[o + 2] = 3 * (u1 - u0) - 2 * m0 - m1;
      coefficients[o + 3] = 2 * (u0 - u1) + m0 + m1;
      u0 = u1;
      m0 = m1;
    }
    this.coefficients = coefficients;
  }

  /**
   * Reversals x = 2Nf solving A·(x·e^shift)^p + B·(x·e^shift)^q = Y, with the results and
   * errors of `solveTwoTermReversals(lnA + p·shift, p, lnB + q·shift, q, lnTarget, cutoff,
   * maxIterations)` (to its tolerance, 1e-12 in ln x): the root, exactly 1, or `Infinity`.
   *
   * @param lnTarget ln Y; −∞ gives Infinity, +∞ gives 1
   * @param shift s of the scaled equation, within the table's [minShift, maxShift]; default 0
   * @throws {ConvergenceError} when the iteration cap is reached.
   * @throws {ArgumentError} when lnTarget or shift is NaN.
   */
  solve(lnTarget: number, shift = 0): number {
    const p = this.p;
    const q = this.q;
    const position = (lnTarget - this.tMin) * this.invSpacing;
    if (!(position >= 0 && position < this.cells)) return this.plain(lnTarget, shift);
    const j = position | 0;
    const f = position - j;
    const cf = this.coefficients;
    const o = 4 * j;
    let u = cf[o] + f * (cf[o + 1] + f * (cf[o + 2] + f * cf[o + 3])) - shift;
    const lnCutoff = this.lnCutoff;
    if (!(u > END_MARGIN && u < lnCutoff - END_MARGIN)) return this.plain(lnTarget, shift);
    // From here on the iteration of solveTwoTermReversals, from the table start.
    const a = this.lnA + p * shift - lnTarget;
    const b = this.lnB + q * shift - lnTarget;
    const ua = -a / p;
    const ub = -b / q;
    const lo = ua > ub ? ua : ub;
    // no root below the cut-off (an exponent near 0 keeps its term above the target): as plain
    if (!(lo < lnCutoff)) return this.plain(lnTarget, shift);
    const ha = ua - Math.LN2 / p;
    const hb = ub - Math.LN2 / q;
    const hi = ha > hb ? ha : hb;
    if (u < lo) u = lo;
    if (u > hi) u = hi;
    const c = this.errorConstant;
    const maxIterations = this.maxIterations;
    for (let k = 0; k < maxIterations; k++) {
      const ta = Math.exp(a + p * u);
      const tb = Math.exp(b + q * u);
      const s = ta + tb;
      // ln s, by its series near the root (|s − 1| < 1e-3: truncation below 2e-19, under the
      // rounding of ln s), else by Math.log
      const e = s - 1;
      const lnS = e > -1e-3 && e < 1e-3 ? e * (1 - e * (0.5 - e * (1 / 3 - e * (0.25 - e * 0.2)))) : Math.log(s);
      const step = (-lnS * s) / (p * ta + q * tb);
      // After the first step every exact step is positive (it lands at or below the root of a
      // convex decreasing function); one that is not is rounding at the root. This stops the
      // solve where C·step² cannot (an exponent near 0 makes C huge).
      if ((k > 0 && !(step > 0)) || u + step === u) return u <= 1e-12 ? 1 : Math.exp(u);
      u += step;
      if (u > hi) u = hi;
      if (u >= lnCutoff) return Infinity;
      if (c * step * step <= 1e-12) return u <= 1e-12 ? 1 : Math.exp(u);
    }
    throw new ConvergenceError('solveTwoTermReversals', maxIterations, u);
  }

  private plain(lnTarget: number, shift: number): number {
    return solveTwoTermReversals(
      this.lnA + this.p * shift, this.p, this.lnB + this.q * shift, this.q, lnTarget, this.cutoff, this.maxIterations,
    );
  }
}

/** g(u) = ln(A·e^(pu) + B·e^(qu)), computed with the larger term factored out. */
function g(lnA: number, p: number, lnB: number, q: number, u: number): number {
  const ea = lnA + p * u;
  const eb = lnB + q * u;
  return ea > eb ? ea + Math.log1p(Math.exp(eb - ea)) : eb + Math.log1p(Math.exp(ea - eb));
}

/** The larger single-term solution, at or below the root of g(u) = t (as in solveTwoTermReversals). */
function bracketLow(lnA: number, p: number, lnB: number, q: number, t: number): number {
  const ua = (t - lnA) / p;
  const ub = (t - lnB) / q;
  return ua > ub ? ua : ub;
}

/**
 * Root of g(u) = t by Newton from `start`. Stops when the error bound C·step² (as in
 * solveTwoTermReversals) is below 1e-20, or at the cap (a node a little off only costs the
 * solves near it an iteration).
 */
function nodeRoot(lnA: number, p: number, lnB: number, q: number, c: number, t: number, start: number): number {
  let u = start;
  for (let k = 0; k < NODE_ITERATIONS; k++) {
    const ea = lnA + p * u - t;
    const eb = lnB + q * u - t;
    const m = ea > eb ? ea : eb;
    const ta = Math.exp(ea - m);
    const tb = Math.exp(eb - m);
    const s = ta + tb;
    const step = (-(m + Math.log(s)) * s) / (p * ta + q * tb);
    u += step;
    if (!(c * step * step > 1e-20)) return u;
  }
  return u;
}

/**
 * Writes h·du/dt and h²/2·d²u/dt² at u into out[0], out[1]: du/dt = 1/g', d²u/dt² = −g''/g'³
 * with g' = (p·a + q·b)/(a + b), g'' = (p − q)²·a·b/(a + b)², a and b the two terms.
 */
function derivatives(lnA: number, p: number, lnB: number, q: number, u: number, h: number, out: Float64Array): void {
  const ea = lnA + p * u;
  const eb = lnB + q * u;
  const m = ea > eb ? ea : eb;
  const ta = Math.exp(ea - m);
  const tb = Math.exp(eb - m);
  const s = ta + tb;
  const g1 = (p * ta + q * tb) / s;
  const d = p - q;
  const g2 = (d * d * ta * tb) / (s * s);
  out[0] = h / g1;
  out[1] = (-0.5 * h * h * g2) / (g1 * g1 * g1);
}
