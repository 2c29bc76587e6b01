import { StressLifeError } from './StressLifeError';

// Internal validators shared by the package; each throws a StressLifeError naming the field.

/** finite and > 0 */
export function checkPositive(v: number, field: string, code: 'invalid-curve' | 'invalid-option' | 'invalid-cycles' = 'invalid-option', index?: number): void {
  if (!(v > 0 && v < Infinity)) throw new StressLifeError(code, field, v, 'must be a finite number > 0', index);
}

/** a stress range or amplitude: finite, >= 0 */
export function checkStress(v: number, field: string, index?: number): void {
  if (!(v >= 0 && v < Infinity)) throw new StressLifeError('invalid-stress', field, v, 'must be a finite number >= 0', index);
}

/** a mean stress: finite */
export function checkMean(v: number, field: string, index?: number): void {
  if (!(v > -Infinity && v < Infinity)) throw new StressLifeError('invalid-mean', field, v, 'must be a finite number', index);
}

/** an array-like column of numbers of at least `length` elements (or exactly, with `exact`) */
export function checkColumn(column: ArrayLike<number> | undefined, field: string, length?: number, exact = true): void {
  if (column === null || typeof column !== 'object' || typeof column.length !== 'number') {
    throw new StressLifeError('invalid-argument', field, column, 'must be an array-like column of numbers');
  }
  if (length !== undefined && (exact ? column.length !== length : column.length < length)) {
    throw new StressLifeError('invalid-argument', `${field}.length`, column.length, `must ${exact ? 'equal' : 'be at least'} ${length}`);
  }
}
