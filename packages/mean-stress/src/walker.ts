import { unknownField } from '@loopwise/base';
import type { Material } from '@loopwise/material';
import type { DamageParameter } from './DamageParameter';
import { estimateWalkerGamma } from './estimateWalkerGamma';
import type { LoopColumns } from './Loop';
import { MeanStressError } from './MeanStressError';
import { TARGET_ONLY, twoTermParameter, type TwoTermTerms } from './twoTermParameter';

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

/** The constants of one material and γ, in the log form of the Walker strain-life equation. */
interface WalkerTerms extends TwoTermTerms {
  readonly k: number; // (1 − γ)/γ
  readonly gamma: number;
  readonly E: number;
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
  if (options === null || typeof options !== 'object') {
    throw new MeanStressError('invalid-gamma', 'options', options, 'must be an object { gamma }');
  }
  const u = unknownField(options, ['gamma'], 'createWalker options');
  if (u !== undefined) throw new MeanStressError('invalid-gamma', u.field, u.value, u.rule);
  const gammaOption = options.gamma;
  checkGamma(gammaOption);
  return twoTermParameter({
    name: 'walker' as const,
    label: gammaOption === 'steel-from-Su' ? 'Walker (gamma from Su, steel)' : `Walker (gamma = ${gammaOption})`,
    valueUnit: 'stress',
    varies: TARGET_ONLY,
    special: { reversals: Infinity, bit: 4 }, // compressive-no-damage: σmax ≤ 0 and γ < 1

    // σmax^k·εa = σf'^(1/γ)/E·x^(b/γ) + σf'^k·εf'·x^(b·k + c),  k = (1 − γ)/γ
    terms(m: Material): WalkerTerms {
      const gamma = resolveGamma(gammaOption, m);
      const k = (1 - gamma) / gamma;
      const lnSigmaF = Math.log(m.sigmaF);
      return {
        lnA: lnSigmaF / gamma - Math.log(m.E),
        p: m.b / gamma,
        lnB: k * lnSigmaF + Math.log(m.epsilonF),
        q: m.b * k + m.c,
        k,
        gamma,
        E: m.E,
      };
    },

    targetsInto(t: WalkerTerms, loops: LoopColumns, count: number, lnTarget: Float64Array): void {
      const { stressMax, strainMax, strainMin } = loops;
      const k = t.k;
      for (let i = 0; i < count; i++) {
        const lnEa = Math.log((strainMax[i] - strainMin[i]) / 2);
        const sMax = stressMax[i];
        lnTarget[i] = k === 0 ? lnEa : sMax > 0 ? k * Math.log(sMax) + lnEa : NaN;
      }
    },

    // σmax^(1−γ)·(E·εa)^γ; E·εa at γ = 1; 0 when σmax ≤ 0 and γ < 1
    valuesInto(t: WalkerTerms, loops: LoopColumns, count: number, out: Float64Array): void {
      const { stressMax, strainMax, strainMin } = loops;
      const { k, gamma, E } = t;
      for (let i = 0; i < count; i++) {
        const ea = (strainMax[i] - strainMin[i]) / 2;
        const sMax = stressMax[i];
        out[i] = k === 0 ? E * ea : sMax > 0 ? Math.pow(sMax, 1 - gamma) * Math.pow(E * ea, gamma) : 0;
      }
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
