import { assessDutyCycle } from './assessDutyCycle';
import type { LifeJob } from './LifeJob';
import type { LifeReport } from './LifeReport';

/**
 * Assesses the fatigue life of a notched part under one history: by default one block of a
 * service that repeats (life per repeat from the stabilised pass); with `repeating: false` a
 * one-off history whose open loops count as half cycles.
 *
 * Pipeline: turning points → gate → memory-aware notch tracker (Neuber, Glinka or linear; or the
 * measured local strain) → damage parameter (none, Morrow, modified Morrow, Smith-Watson-Topper,
 * Walker) → cycles to failure (Coffin-Manson-Basquin) → Palmgren-Miner sum → life in repeats and
 * in service units, with and without the scatter factor. Units: the history in the job's input
 * unit; stresses in the material's unit (MPa for the handbook table); strain dimensionless.
 *
 * References: U. H. Clormann, T. Seeger, Stahlbau 55(3) (1986) 65-71 (memory model); H. Neuber,
 * J. Appl. Mech. 28 (1961) 544-550; K. N. Smith, P. Watson, T. H. Topper, J. Materials 5 (1970)
 * 767-778; M. A. Miner, J. Appl. Mech. 12 (1945) A159-A164.
 *
 * @example
 * const report = assessLife(history, { material, notch: { Kt: 2.2 }, unit: { label: 'km', perRepeat: 3.1 } });
 * report.life.repeats; // repeats of the history to crack initiation (mean estimate)
 * report.life.designService; // km, with the scatter factor
 */
export function assessLife(history: ArrayLike<number>, job: LifeJob): LifeReport {
  return assessDutyCycle([{ name: 'history', history, repeats: 1 }], job);
}
