import { LoopwiseError } from '@loopwise/base';

/**
 * Thrown when an iterative solve hits its iteration cap before converging. The solvers in this
 * package are bracketed and converge in a handful of steps for every valid input, so this error
 * means the cap was set too low by the caller (or a bug): it is never silently turned into an
 * approximate value. A {@link LoopwiseError} of `@loopwise/base` with code `'not-converged'`,
 * `field` `'maxIterations'` (the cap at fault) and `value` the cap.
 *
 * @example
 * try { reversalsToFailure(material, 0.01, { maxIterations: 1 }); }
 * catch (e) { [(e as ConvergenceError).code, (e as ConvergenceError).field, (e as ConvergenceError).value]; }
 * // returns ['not-converged', 'maxIterations', 1]
 */
export class ConvergenceError extends LoopwiseError {
  declare readonly code: 'not-converged';
  /** Which solver gave up, e.g. `"solveTwoTermReversals"`. */
  readonly solver: string;
  /** The iteration cap that was reached. */
  readonly maxIterations: number;
  /** The last iterate (in the solver's own variable, documented by the solver). */
  readonly lastIterate: number;

  constructor(solver: string, maxIterations: number, lastIterate: number) {
    super(
      'not-converged',
      'maxIterations',
      maxIterations,
      `${solver} did not converge within ${maxIterations} iterations (last iterate ${lastIterate})`,
    );
    this.name = 'ConvergenceError';
    this.solver = solver;
    this.maxIterations = maxIterations;
    this.lastIterate = lastIterate;
  }
}
