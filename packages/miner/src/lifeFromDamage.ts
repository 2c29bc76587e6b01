import { MinerError } from './MinerError';

/** Default critical damage sum Dcrit of Miner (1945). See {@link lifeFromDamage} for lower published values. */
export const DEFAULT_CRITICAL_DAMAGE = 1;

/** The user's unit of service per repeat of the history: hours, km, laps, flights. */
export interface ServiceUnit {
  /** Label of the unit, e.g. `'h'`, `'km'`, `'laps'`, `'flights'`. Non-empty. */
  label: string;
  /** Amount of the unit one repeat of the history stands for (finite, > 0), e.g. 0.5 (h). */
  perRepeat: number;
}

/** Options of {@link lifeFromDamage} and `MinerSum.life`. */
export interface LifeOptions {
  /** Critical damage sum Dcrit > 0 at which failure is predicted. Default 1 ({@link DEFAULT_CRITICAL_DAMAGE}). */
  criticalDamage?: number;
  /** Scatter factor j ≥ 1 on life: design life = mean life / j. Default 1 (no factor). */
  scatterFactor?: number;
  /** Unit of service per repeat; when given, the result also has `service` and `designService` in it. Default none. */
  unit?: ServiceUnit;
}

/**
 * Result of {@link lifeFromDamage}: life in repeats of the history (mean and design), and with a
 * service unit also in that unit (`service`, `designService`), so that a report reads
 * `report.life.repeats` and `report.life.service` (in `report.life.unit`).
 */
export interface LifeEstimate {
  /** Damage per repeat D (input echoed). */
  readonly damagePerRepeat: number;
  /** Dcrit used. */
  readonly criticalDamage: number;
  /** Scatter factor used. */
  readonly scatterFactor: number;
  /** Mean estimate of life in repeats, Dcrit / D (Infinity when D = 0). */
  readonly repeats: number;
  /** Design life in repeats, repeats / scatterFactor. */
  readonly designRepeats: number;
  /** Mean life in the service unit, repeats · perRepeat (e.g. hours), when a unit was given. */
  readonly service?: number;
  /** Design life in the service unit, designRepeats · perRepeat, when a unit was given. */
  readonly designService?: number;
  /** Label of the service unit (e.g. `'h'`), when a unit was given. */
  readonly unit?: string;
  /** Amount of the service unit one repeat stands for, when a unit was given. */
  readonly perRepeat?: number;
}

/**
 * Life from a Palmgren-Miner damage per repeat of a history (block, duty cycle):
 *
 *     L = Dcrit / D  repeats,     L_design = L / j,     life in the unit = L · u
 *
 * with D the damage of one repeat, Dcrit the critical damage sum, j the scatter factor and u the
 * amount of the user's unit (hours, km, laps, flights) one repeat stands for.
 *
 * Dcrit: Miner (1945) predicts failure at D = 1, the default here. Damage sums at failure in
 * variable-amplitude tests scatter over almost three decades, about 90 % of them below 1
 * (Sonsino 2007, section 1), and published guidance often uses lower values, e.g. D = 0.3 for
 * steels and aluminium alloys (Sonsino 2007; the FKM guideline gives similar values) and D = 0.5
 * in the IIW recommendations for welded joints (Hobbacher 2016); these three values are from
 * memory: check the cited document before using one. The scatter
 * factor j is separate: it turns the mean estimate into a design life (values of 3 to 5 on life
 * are common in practice, no source). Neither replaces test validation.
 *
 * References: A. Palmgren, Z. VDI 68 (1924) 339-341; M. A. Miner, J. Appl. Mech. 12 (1945)
 * A159-A164; C. M. Sonsino, "Fatigue testing under variable amplitude loading", Int. J.
 * Fatigue 29 (2007) 1080-1089 (doi 10.1016/j.ijfatigue.2006.10.011 from memory); A. Hobbacher,
 * Recommendations for Fatigue Design of Welded Joints and Components, 2nd ed., Springer, 2016
 * (IIW document XIII-2460-13; edition details from memory); FKM guideline "Analytical Strength Assessment of Components",
 * 6th ed., VDMA, 2012; A. Fatemi and L. Yang, "Cumulative fatigue damage and life prediction
 * theories", Int. J. Fatigue 20 (1998) 9-34, doi:10.1016/S0142-1123(97)00081-9.
 *
 * Special cases: D = 0 gives Infinity repeats (and Infinity service); never NaN.
 *
 * @throws {MinerError} `invalid-argument` for D NaN, ±Infinity or negative; `invalid-critical-damage`
 *   for Dcrit ≤ 0 or not finite, or so small that a positive life underflows to 0;
 *   `invalid-scatter-factor` for j < 1 or not finite, or so large that the design life
 *   underflows to 0; `invalid-amount` for a unit amount that is ≤ 0 or not finite, an empty
 *   label, or an amount so small that the design service underflows to 0.
 * @example
 * lifeFromDamage(0.002, { criticalDamage: 0.5, scatterFactor: 2, unit: { label: 'h', perRepeat: 0.25 } });
 * // returns { damagePerRepeat: 0.002, criticalDamage: 0.5, scatterFactor: 2, repeats: 250,
 * //           designRepeats: 125, service: 62.5, designService: 31.25, unit: 'h', perRepeat: 0.25 }
 */
export function lifeFromDamage(damagePerRepeat: number, options: LifeOptions = {}): LifeEstimate {
  if (!(damagePerRepeat >= 0 && damagePerRepeat < Infinity)) {
    throw new MinerError('invalid-argument', 'damagePerRepeat', damagePerRepeat, 'must be a finite number >= 0');
  }
  const criticalDamage = options.criticalDamage ?? DEFAULT_CRITICAL_DAMAGE;
  if (!(criticalDamage > 0 && criticalDamage < Infinity)) {
    throw new MinerError('invalid-critical-damage', 'criticalDamage', criticalDamage, 'must be a finite number > 0');
  }
  const scatterFactor = options.scatterFactor ?? 1;
  if (!(scatterFactor >= 1 && scatterFactor < Infinity)) {
    throw new MinerError('invalid-scatter-factor', 'scatterFactor', scatterFactor, 'must be a finite number >= 1');
  }
  const repeats = damagePerRepeat === 0 ? Infinity : criticalDamage / damagePerRepeat;
  const designRepeats = repeats / scatterFactor;
  // A positive life that underflows to 0 would read as "fails at once": an input error instead.
  if (repeats === 0) {
    throw new MinerError('invalid-critical-damage', 'criticalDamage', criticalDamage, `is so small against the damage per repeat (${damagePerRepeat}) that the life underflows a double`);
  }
  if (designRepeats === 0) {
    throw new MinerError('invalid-scatter-factor', 'scatterFactor', scatterFactor, `is so large against the life (${repeats} repeats) that the design life underflows a double`);
  }
  const base = { damagePerRepeat, criticalDamage, scatterFactor, repeats, designRepeats };
  const unit = options.unit;
  if (unit === undefined) return base;
  if (unit === null || typeof unit !== 'object') throw new MinerError('invalid-amount', 'unit', unit, 'must be { label, perRepeat }');
  if (typeof unit.label !== 'string' || unit.label === '') {
    throw new MinerError('invalid-amount', 'unit.label', unit.label, 'must be a non-empty string');
  }
  const perRepeat = unit.perRepeat;
  if (!(perRepeat > 0 && perRepeat < Infinity)) {
    throw new MinerError('invalid-amount', 'unit.perRepeat', perRepeat, 'must be a finite number > 0 (the duration of one repeat)');
  }
  const designService = designRepeats * perRepeat;
  if (designService === 0) {
    throw new MinerError('invalid-amount', 'unit.perRepeat', perRepeat, 'is so small that the design life in service units underflows a double');
  }
  return { ...base, service: repeats * perRepeat, designService, unit: unit.label, perRepeat };
}
