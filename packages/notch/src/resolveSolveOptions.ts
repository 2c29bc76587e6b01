import { unknownField } from '@loopwise/base';
import { NotchOptionError } from './NotchOptionError';
import type { NotchSolveOptions } from './LocalResponse';
import { DEFAULT_NOTCH_MAX_ITERATIONS, DEFAULT_NOTCH_TOLERANCE } from './solveEnergyEquation';

/** Checks and defaults the solve options (internal). */
export function resolveSolveOptions(options: NotchSolveOptions | undefined): { tolerance: number; maxIterations: number } {
  if (options !== undefined) {
    if (options === null || typeof options !== 'object') throw new NotchOptionError('options', options, 'must be an object { tolerance?, maxIterations? }');
    const u = unknownField(options, ['tolerance', 'maxIterations'], 'notch solve options');
    if (u !== undefined) throw new NotchOptionError(u.field, u.value, u.rule);
  }
  const tolerance = options?.tolerance ?? DEFAULT_NOTCH_TOLERANCE;
  const maxIterations = options?.maxIterations ?? DEFAULT_NOTCH_MAX_ITERATIONS;
  if (!(typeof tolerance === 'number' && tolerance > 0 && tolerance < 1)) throw new NotchOptionError('tolerance', tolerance, 'must be a number in (0, 1)');
  if (!Number.isInteger(maxIterations) || maxIterations < 1) {
    throw new NotchOptionError('maxIterations', maxIterations, 'must be an integer >= 1');
  }
  return { tolerance, maxIterations };
}

/** Checks a pseudo-elastic input (internal). */
export function checkFinite(field: string, value: number): void {
  if (typeof value !== 'number' || !Number.isFinite(value)) throw new NotchOptionError(field, value, 'must be a finite number');
}
