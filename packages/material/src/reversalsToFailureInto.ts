import { ArgumentError } from './ArgumentError';
import { assertMaterial } from './assertMaterial';
import { checkReversalsOptions } from './checkReversalsOptions';
import type { Material } from './Material';
import type { ReversalsOptions } from './reversalsToFailure';
import { DEFAULT_CUTOFF_REVERSALS, DEFAULT_MAX_ITERATIONS, solveTwoTermReversals } from './solveTwoTermReversals';
import { REVERSALS_TABLE_MIN_COUNT, TwoTermReversalsTable } from './TwoTermReversalsTable';

/**
 * Bit values of the optional flags column of the typed-array kernels: `below-cutoff` = 1,
 * `at-or-above-first-reversal` = 2 (mean-stress kernels add their own bits from 4 up).
 */
export const STRAIN_LIFE_FLAG_BITS = Object.freeze({
  'below-cutoff': 1,
  'at-or-above-first-reversal': 2,
} as const);

/**
 * Typed-array kernel of {@link reversalsToFailure}: reversals to failure 2Nf for a column of
 * strain amplitudes, written into the caller-owned `out` (returned). No allocation per element.
 * When `flags` is given, each element gets the OR of {@link STRAIN_LIFE_FLAG_BITS} (0 for an
 * ordinary root).
 *
 * Method and special cases as in {@link reversalsToFailure}; the result is reversals (2Nf), not
 * cycles. From {@link REVERSALS_TABLE_MIN_COUNT} (256) amplitudes on, every amplitude is checked
 * first (a bad one throws before anything is written), then one {@link TwoTermReversalsTable}
 * over the range of amplitudes present gives each Newton iteration its start (usually one step
 * then passes the same stopping rule); results agree with {@link reversalsToFailure} to the
 * solver's tolerance (1e-12 in ln 2Nf; 1 and Infinity exactly). Fewer amplitudes are solved one
 * by one exactly as {@link reversalsToFailure} does. The iteration cap counts iterations from
 * the start used.
 *
 * @throws {ArgumentError} when `out` (or `flags`) is shorter than `strainAmplitudes`, or an
 *   amplitude is NaN, ±Infinity or negative (naming its index).
 * @example
 * reversalsToFailureInto(material, Float64Array.of(0, 0.0131548, 10), new Float64Array(3))
 * // returns Float64Array [Infinity, ≈1e4, 1]
 */
export function reversalsToFailureInto(
  material: Material,
  strainAmplitudes: ArrayLike<number>,
  out: Float64Array,
  flags?: Uint8Array,
  options: ReversalsOptions = {},
): Float64Array {
  assertMaterial(material);
  checkReversalsOptions(options, 'reversalsToFailureInto options');
  if (strainAmplitudes === null || typeof strainAmplitudes !== 'object' || typeof strainAmplitudes.length !== 'number') {
    throw new ArgumentError('strainAmplitudes', strainAmplitudes, 'must be an array or typed array of numbers');
  }
  if (!(out instanceof Float64Array)) throw new ArgumentError('out', out, 'must be a Float64Array');
  const count = strainAmplitudes.length;
  if (out.length < count) throw new ArgumentError('out.length', out.length, `length must be >= ${count}`);
  if (flags !== undefined && flags.length < count) {
    throw new ArgumentError('flags.length', flags.length, `length must be >= ${count}`);
  }
  const cutoff = options.cutoffReversals ?? DEFAULT_CUTOFF_REVERSALS;
  const maxIterations = options.maxIterations ?? DEFAULT_MAX_ITERATIONS;
  const lnA = Math.log(material.sigmaF / material.E);
  const lnB = Math.log(material.epsilonF);
  const b = material.b;
  const c = material.c;
  if (count < REVERSALS_TABLE_MIN_COUNT) {
    for (let i = 0; i < count; i++) {
      const ea = strainAmplitudes[i];
      if (!(ea >= 0 && ea < Infinity)) {
        throw new ArgumentError('strainAmplitudes', ea, 'must be a finite number >= 0', i);
      }
      const r = solveTwoTermReversals(lnA, b, lnB, c, Math.log(ea), cutoff, maxIterations);
      out[i] = r;
      if (flags !== undefined) flags[i] = r === Infinity ? 1 : r === 1 ? 2 : 0;
    }
    return out;
  }
  // Many amplitudes: check them all and find their range, then solve from a table start.
  let yMin = Infinity;
  let yMax = 0;
  for (let i = 0; i < count; i++) {
    const ea = strainAmplitudes[i];
    if (!(ea >= 0 && ea < Infinity)) {
      throw new ArgumentError('strainAmplitudes', ea, 'must be a finite number >= 0', i);
    }
    if (ea > 0 && ea < yMin) yMin = ea;
    if (ea > yMax) yMax = ea;
  }
  const table = new TwoTermReversalsTable(lnA, b, lnB, c, {
    cutoffReversals: cutoff, maxIterations, lnTargetMin: Math.log(yMin), lnTargetMax: Math.log(yMax),
  });
  for (let i = 0; i < count; i++) {
    const r = table.solve(Math.log(strainAmplitudes[i]));
    out[i] = r;
    if (flags !== undefined) flags[i] = r === Infinity ? 1 : r === 1 ? 2 : 0;
  }
  return out;
}
