/**
 * Thrown when an iterative solve hits its iteration cap before converging. The solvers in this
 * package are bracketed and converge in a handful of steps for every valid input, so this error
 * means the cap was set too low by the caller (or a bug): it is never silently turned into an
 * approximate value.
 */
export class ConvergenceError extends Error {
  /** Stable machine-readable code. */
  readonly code = 'not-converged' as const;
  /** Which solver gave up, e.g. `"solveTwoTermReversals"`. */
  readonly solver: string;
  /** The iteration cap that was reached. */
  readonly maxIterations: number;
  /** The last iterate (in the solver's own variable, documented by the solver). */
  readonly lastIterate: number;

  constructor(solver: string, maxIterations: number, lastIterate: number) {
    super(`${solver} did not converge within ${maxIterations} iterations (last iterate ${lastIterate})`);
    this.name = 'ConvergenceError';
    this.solver = solver;
    this.maxIterations = maxIterations;
    this.lastIterate = lastIterate;
  }
}
