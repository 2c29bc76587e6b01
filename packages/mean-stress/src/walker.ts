import {
  assertMaterial,
  DEFAULT_CUTOFF_REVERSALS,
  DEFAULT_MAX_ITERATIONS,
  REVERSALS_TABLE_MIN_COUNT,
  solveTwoTermReversals,
  TwoTermReversalsTable,
  type Material,
  type ReversalsOptions,
} from '@loopwise/material';
import { checkColumns, checkLoop, flagNames } from './checkLoop';
import { DAMAGE_FLAG_BITS, type DamageParameter, type DamageResult } from './DamageParameter';
import { estimateWalkerGamma } from './estimateWalkerGamma';
import type { Loop, LoopColumns } from './Loop';
import { MeanStressError } from './MeanStressError';

/** Options of {@link createWalker}. */
export interface WalkerOptions {
  /**
   * The Walker exponent, 0 < γ ≤ 1, or `'steel-from-Su'` to estimate it per material from
   * `material.Su` (which must then be in MPa) by {@link estimateWalkerGamma} for steels.
   */
  gamma: number | 'steel-from-Su';
}

function resolveGamma(gamma: WalkerOptions['gamma'], material: Material): number {
  if (gamma === 'steel-from-Su') {
    if (material.Su === undefined) {
      throw new MeanStressError(
        'missing-tensile-strength', 'material.Su', undefined,
        "Walker with gamma 'steel-from-Su' needs the material's Su in MPa; give it or create the parameter with a gamma",
      );
    }
    return estimateWalkerGamma({ SuMPa: material.Su, metal: 'steel' });
  }
  return gamma;
}

function checkGamma(gamma: unknown): void {
  if (gamma === 'steel-from-Su') return;
  if (typeof gamma !== 'number' || !(gamma > 0 && gamma <= 1)) {
    throw new MeanStressError('invalid-gamma', 'gamma', gamma, "must be a number with 0 < gamma <= 1, or 'steel-from-Su'");
  }
}

/** Internal constants of one material and γ, in the log form of the Walker strain-life equation. */
interface WalkerTerms {
  k: number; // (1 − γ)/γ
  lnA: number;
  p: number;
  lnB: number;
  q: number;
}

function terms(material: Material, gamma: number): WalkerTerms {
  const k = (1 - gamma) / gamma;
  const lnSigmaF = Math.log(material.sigmaF);
  return {
    k,
    lnA: lnSigmaF / gamma - Math.log(material.E),
    p: material.b / gamma,
    lnB: k * lnSigmaF + Math.log(material.epsilonF),
    q: material.b * k + material.c,
  };
}

function walkerReversals(t: WalkerTerms, sMax: number, ea: number, cutoff: number, maxIt: number): number {
  if (t.k === 0) return solveTwoTermReversals(t.lnA, t.p, t.lnB, t.q, Math.log(ea), cutoff, maxIt);
  if (!(sMax > 0)) return Infinity;
  return solveTwoTermReversals(t.lnA, t.p, t.lnB, t.q, t.k * Math.log(sMax) + Math.log(ea), cutoff, maxIt);
}

function flagBits(t: WalkerTerms, sMax: number, r: number): number {
  if (t.k !== 0 && !(sMax > 0)) return 4;
  return r === Infinity ? 1 : r === 1 ? 2 : 0;
}

/**
 * Creates the Walker damage parameter with a given exponent γ (or γ estimated per material
 * from Su for steels), in the strain-life form of Dowling:
 *
 *     σmax^(1−γ)·(E·εa)^γ = (σf'(2Nf)^b)^(1−γ)·(σf'(2Nf)^b + E·εf'(2Nf)^c)^γ
 *
 * which is SWT (times E) at γ = 0.5 and no correction at γ = 1. Raised to the power 1/γ it is
 * the two-term law σmax^((1−γ)/γ)·εa = σf'^(1/γ)/E·(2Nf)^(b/γ) + σf'^((1−γ)/γ)·εf'·(2Nf)^(b(1−γ)/γ + c),
 * solved in logarithms (no overflow for small γ).
 *
 * Returns reversals 2Nf (cycles Nf = 2Nf/2). `value` is the Walker stress
 * σmax^(1−γ)·(E·εa)^γ (stress unit); 0 when σmax ≤ 0 and γ < 1. Special cases: γ < 1 and
 * σmax ≤ 0 → Infinity with `compressive-no-damage` (as SWT); otherwise as `none`.
 *
 * Reference: K. Walker, "The effect of stress ratio during crack propagation and fatigue for
 * 2024-T3 and 7075-T6 aluminum", in Effects of Environment and Complex Load History on Fatigue
 * Life, ASTM STP 462, 1970, pp. 1-14; strain-life form: N. E. Dowling, "Mean stress effects in
 * strain-life fatigue", Fatigue Fract. Eng. Mater. Struct. 32 (2009) 1004-1019,
 * doi:10.1111/j.1460-2695.2009.01404.x.
 *
 * @throws {MeanStressError} `invalid-gamma` for γ outside (0, 1].
 * @example
 * createWalker({ gamma: 0.6474 }).reversalsToFailure(aisi4340, { stressMax: 800, stressMin: -400, strainMax: 0.006, strainMin: -0.004 })
 * // returns { reversals: 9209.21..., value: ..., flags: [] }
 */
export function createWalker(options: WalkerOptions): DamageParameter<'walker'> {
  const gammaOption = options.gamma;
  checkGamma(gammaOption);
  return Object.freeze({
    name: 'walker' as const,
    label: gammaOption === 'steel-from-Su' ? 'Walker (gamma from Su, steel)' : `Walker (gamma = ${gammaOption})`,
    valueUnit: 'stress' as const,

    reversalsToFailure(material: Material, loop: Loop, opts: ReversalsOptions = {}): DamageResult {
      assertMaterial(material);
      const { stressMax: sMax, stressMin: sMin, strainMax: eMax, strainMin: eMin } = loop;
      checkLoop(sMax, sMin, eMax, eMin, undefined);
      const gamma = resolveGamma(gammaOption, material);
      const t = terms(material, gamma);
      const ea = (eMax - eMin) / 2;
      const r = walkerReversals(
        t, sMax, ea, opts.cutoffReversals ?? DEFAULT_CUTOFF_REVERSALS, opts.maxIterations ?? DEFAULT_MAX_ITERATIONS,
      );
      const value = t.k === 0 ? material.E * ea : sMax > 0 ? Math.pow(sMax, 1 - gamma) * Math.pow(material.E * ea, gamma) : 0;
      return { reversals: r, value, flags: flagNames(flagBits(t, sMax, r), DAMAGE_FLAG_BITS) };
    },

    reversalsToFailureInto(
      material: Material, loops: LoopColumns, out: Float64Array, flags?: Uint8Array, opts: ReversalsOptions = {},
    ): Float64Array {
      assertMaterial(material);
      const count = checkColumns(loops, out, flags);
      const t = terms(material, resolveGamma(gammaOption, material));
      const cutoff = opts.cutoffReversals ?? DEFAULT_CUTOFF_REVERSALS;
      const maxIt = opts.maxIterations ?? DEFAULT_MAX_ITERATIONS;
      const { stressMax, stressMin, strainMax, strainMin } = loops;
      if (count < REVERSALS_TABLE_MIN_COUNT) {
        for (let i = 0; i < count; i++) {
          const sMax = stressMax[i];
          const eMax = strainMax[i];
          const eMin = strainMin[i];
          checkLoop(sMax, stressMin[i], eMax, eMin, i);
          const r = walkerReversals(t, sMax, (eMax - eMin) / 2, cutoff, maxIt);
          out[i] = r;
          if (flags !== undefined) flags[i] = flagBits(t, sMax, r);
        }
        return out;
      }
      // Many loops: check them all and bound ln Y = k·ln σmax + ln εa by the ranges of σmax and
      // εa (k ≥ 0), then solve from a table start.
      const k = t.k;
      let sLo = Infinity;
      let sHi = 0;
      let eLo = Infinity;
      let eHi = 0;
      for (let i = 0; i < count; i++) {
        const sMax = stressMax[i];
        const eMax = strainMax[i];
        const eMin = strainMin[i];
        checkLoop(sMax, stressMin[i], eMax, eMin, i);
        if (k === 0 || sMax > 0) {
          const ea = (eMax - eMin) / 2;
          if (ea > 0 && ea < eLo) eLo = ea;
          if (ea > eHi) eHi = ea;
          if (sMax > 0 && sMax < sLo) sLo = sMax;
          if (sMax > sHi) sHi = sMax;
        }
      }
      const table = new TwoTermReversalsTable(t.lnA, t.p, t.lnB, t.q, {
        cutoffReversals: cutoff,
        maxIterations: maxIt,
        lnTargetMin: k === 0 ? Math.log(eLo) : k * Math.log(sLo) + Math.log(eLo),
        lnTargetMax: k === 0 ? Math.log(eHi) : k * Math.log(sHi) + Math.log(eHi),
      });
      for (let i = 0; i < count; i++) {
        const sMax = stressMax[i];
        const ea = (strainMax[i] - strainMin[i]) / 2;
        const r = k === 0 ? table.solve(Math.log(ea)) : sMax > 0 ? table.solve(k * Math.log(sMax) + Math.log(ea)) : Infinity;
        out[i] = r;
        if (flags !== undefined) flags[i] = flagBits(t, sMax, r);
      }
      return out;
    },
  });
}

/**
 * The Walker damage parameter with γ estimated per material from `material.Su` (in MPa) by
 * the steel relation of {@link estimateWalkerGamma}: `createWalker({ gamma: 'steel-from-Su' })`.
 * Throws `missing-tensile-strength` for a material without Su. For aluminium alloys and other
 * metals use `createWalker({ gamma: 0.5 })` or a fitted γ.
 *
 * @example
 * walker.reversalsToFailure(handbookSteels[5], loop)   // AISI 4340, Su = 1172 MPa → γ = 0.6474
 * // returns the same as createWalker({ gamma: 0.6474 }).reversalsToFailure(handbookSteels[5], loop)
 */
export const walker: DamageParameter<'walker'> = createWalker({ gamma: 'steel-from-Su' });
