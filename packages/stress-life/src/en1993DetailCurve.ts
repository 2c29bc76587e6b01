import { defineSnCurve } from './defineSnCurve';
import type { SnCurve } from './SnCurve';
import { StressLifeError } from './StressLifeError';

/**
 * Detail categories Δσc (MPa at 2·10^6 cycles) of EN 1993-1-9:2005, Figure 7.1 and Tables
 * 8.1-8.10, for direct (normal) stress ranges. Values as listed in the standard's Figure 7.1
 * (value from memory).
 */
export const EN1993_NORMAL_CATEGORIES: readonly number[] = Object.freeze([160, 140, 125, 112, 100, 90, 80, 71, 63, 56, 50, 45, 40, 36]);

/** Detail categories Δτc (MPa at 2·10^6 cycles) for shear stress ranges, EN 1993-1-9:2005 Figure 7.2 (value from memory). */
export const EN1993_SHEAR_CATEGORIES: readonly number[] = Object.freeze([100, 80]);

/**
 * Recommended partial factors γMf for fatigue strength, EN 1993-1-9:2005 Table 3.1 (value
 * from memory): by assessment method and consequence of failure.
 */
export const EN1993_GAMMA_MF = Object.freeze({
  damageTolerantLowConsequence: 1.0,
  damageTolerantHighConsequence: 1.15,
  safeLifeLowConsequence: 1.15,
  safeLifeHighConsequence: 1.35,
});

/** Options of {@link en1993DetailCurve}. */
export interface En1993CurveOptions {
  /** `'normal'` (Δσ, slopes 3 and 5) or `'shear'` (Δτ, slope 5). Default `'normal'`. */
  stress?: 'normal' | 'shear';
  /**
   * `'variable'` (the full curve: 3 to ND = 5·10^6, 5 to NL = 10^8, cut-off ΔσL) or
   * `'constant'` (constant amplitude: no damage below ΔσD at 5·10^6). Default `'variable'`.
   * Shear has one curve for both.
   */
  loading?: 'variable' | 'constant';
  /** Partial factor γFf on the fatigue stress ranges. Default 1.0 (EN 1993-1-9:2005, 6.2; value from memory). */
  gammaFf?: number;
  /**
   * Partial factor γMf on the fatigue strength. Default 1.35, the largest recommended value
   * (safe life, high consequence, Table 3.1); see {@link EN1993_GAMMA_MF}.
   */
  gammaMf?: number;
  /** Size reduction factor ks (7.2.2, e.g. {@link en1993SizeFactor}) multiplying Δσc. Default 1. */
  sizeFactor?: number;
}

/**
 * The design S-N curve of an EN 1993-1-9 detail category, in stress ranges and cycles:
 *
 *     normal:  Δσ^3·N = Δσc^3·2·10^6            N <= 5·10^6     (eq. 7.1)
 *              Δσ^5·N = ΔσD^5·5·10^6            5·10^6 <= N <= 10^8 (eq. 7.2)
 *              ΔσD = (2/5)^(1/3)·Δσc = 0.737·Δσc,   ΔσL = (5/100)^(1/5)·ΔσD = 0.549·ΔσD
 *     shear:   Δτ^5·N = Δτc^5·2·10^6            N <= 10^8,  ΔτL = (2/100)^(1/5)·Δτc = 0.457·Δτc
 *
 * Below ΔσL (ΔτL) the ranges do no damage. For `loading: 'constant'` the normal curve stops at
 * ΔσD (the constant-amplitude fatigue limit). The partial factors enter as the assessment
 * γFf·Δσ against Δσ_R/γMf, which is the same as this curve with every stress divided by
 * γFf·γMf; the size factor reduces Δσc to ks·Δσc.
 *
 * Reference: EN 1993-1-9:2005, Eurocode 3: Design of steel structures, Part 1-9: Fatigue,
 * 7.1 (equations 7.1-7.3, Figures 7.1 and 7.2), 7.2.2 (size effect), Table 3.1 (γMf) (clause
 * numbers value from memory). The standard, its national annex, local codes and licensed
 * review govern a design; this curve is a computation aid.
 *
 * @throws {StressLifeError} `unknown-detail` (field `category`) for a category the standard does
 *   not list; `invalid-option` for bad options.
 * @example
 * const c = en1993DetailCurve(80, { gammaMf: 1 });
 * c.kneeStresses[0].toFixed(2);
 * // returns '58.94'
 */
export function en1993DetailCurve(category: number, options: En1993CurveOptions = {}): SnCurve {
  const stress = options.stress ?? 'normal';
  if (stress !== 'normal' && stress !== 'shear') throw new StressLifeError('invalid-option', 'stress', stress, "must be 'normal' or 'shear'");
  const loading = options.loading ?? 'variable';
  if (loading !== 'variable' && loading !== 'constant') throw new StressLifeError('invalid-option', 'loading', loading, "must be 'variable' or 'constant'");
  const list = stress === 'normal' ? EN1993_NORMAL_CATEGORIES : EN1993_SHEAR_CATEGORIES;
  if (!list.includes(category)) {
    throw new StressLifeError('unknown-detail', 'category', category, `EN 1993-1-9 lists ${stress} stress categories ${list.join(', ')}`);
  }
  const gammaFf = options.gammaFf ?? 1.0;
  const gammaMf = options.gammaMf ?? EN1993_GAMMA_MF.safeLifeHighConsequence;
  const ks = options.sizeFactor ?? 1;
  if (!(gammaFf >= 1 && gammaFf < Infinity)) throw new StressLifeError('invalid-option', 'gammaFf', gammaFf, 'must be a finite number >= 1');
  if (!(gammaMf >= 1 && gammaMf < Infinity)) throw new StressLifeError('invalid-option', 'gammaMf', gammaMf, 'must be a finite number >= 1');
  if (!(ks > 0 && ks <= 1)) throw new StressLifeError('invalid-option', 'sizeFactor', ks, 'must be a number in (0, 1]');
  const s = (category * ks) / (gammaFf * gammaMf);
  if (stress === 'shear') return defineSnCurve({ measure: 'range', stress: s, cycles: 2e6, slope: 5, cutoffCycles: 1e8 });
  if (loading === 'constant') return defineSnCurve({ measure: 'range', stress: s, cycles: 2e6, slope: 3, cutoffCycles: 5e6 });
  return defineSnCurve({ measure: 'range', stress: s, cycles: 2e6, slope: 3, knees: [{ cycles: 5e6, slope: 5 }], cutoffCycles: 1e8 });
}
