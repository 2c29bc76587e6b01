import { checkLife } from './checks';

/**
 * Cycles to failure Nf from reversals to failure 2Nf: Nf = 2Nf / 2. Strain-life solves (e.g.
 * `reversalsToFailure` of `@loopwise/material`) return reversals; the Palmgren-Miner sum counts
 * cycles. Infinity (no failure) stays Infinity.
 *
 * Reference: the strain-life curve εa = σf'/E·(2Nf)^b + εf'·(2Nf)^c is written in reversals
 * 2Nf, ASTM E606/E606M appendix X1; one cycle is two reversals, ASTM E1823 (terminology).
 *
 * @throws {MinerError} `invalid-life` when `reversals` is NaN or ≤ 0.
 * @example
 * cyclesFromReversals(43494.7); // returns 21747.35
 * cyclesFromReversals(Infinity); // returns Infinity
 */
export function cyclesFromReversals(reversals: number): number {
  checkLife(reversals, 'reversals');
  return reversals / 2;
}
