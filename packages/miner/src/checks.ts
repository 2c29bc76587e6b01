import { MinerError } from './MinerError';

// Internal validators shared by the package; each throws a MinerError naming field and index.

/** count: finite, >= 0. */
export function checkCount(v: number, field: string, index?: number): void {
  if (!(v >= 0 && v < Infinity)) throw new MinerError('invalid-count', field, v, 'must be a finite number >= 0', index);
}

/** cycles or reversals to failure: > 0 (Infinity allowed), not NaN. */
export function checkLife(v: number, field: string, index?: number): void {
  if (!(v > 0)) throw new MinerError('invalid-life', field, v, 'must be a number > 0 (Infinity for no damage)', index);
}

/** sample index: finite integer >= 0. */
export function checkIndex(v: number, field: string, index?: number): void {
  if (!(v >= 0 && v < Infinity && Math.floor(v) === v)) {
    throw new MinerError('invalid-index', field, v, 'must be a finite integer >= 0 (a sample index)', index);
  }
}

/** range: finite, >= 0. */
export function checkRange(v: number, field: string, index?: number): void {
  if (!(v >= 0 && v < Infinity)) throw new MinerError('invalid-range', field, v, 'must be a finite number >= 0', index);
}

/** Damage of one record under a cut-off limit (cycles); throws if it overflows. */
export function recordDamage(count: number, cycles: number, limit: number, index?: number): number {
  if (cycles > limit) return 0;
  const d = count / cycles + 0; // + 0 turns a -0 count into 0
  if (d === Infinity) {
    throw new MinerError('invalid-life', 'cyclesToFailure', cycles, 'so small that count / cyclesToFailure overflows', index);
  }
  return d;
}

/** Strictly increasing finite edges, at least two. Returns them as a Float64Array. */
export function checkEdges(edges: ArrayLike<number>, field: string): Float64Array {
  if (edges === null || typeof edges !== 'object' || typeof edges.length !== 'number') {
    throw new MinerError('invalid-bins', field, edges, 'must be an array of edges');
  }
  if (edges.length < 2) throw new MinerError('invalid-bins', field, edges.length, 'needs at least two edges');
  const e = Float64Array.from(edges);
  for (let i = 0; i < e.length; i++) {
    if (!Number.isFinite(e[i])) throw new MinerError('invalid-bins', field, e[i], 'edges must be finite', i);
    if (i > 0 && !(e[i] > e[i - 1])) throw new MinerError('invalid-bins', field, e[i], `edges must increase strictly (edge ${i - 1} is ${e[i - 1]})`, i);
  }
  return e;
}

/** Column lengths must agree. */
export function checkLength(column: ArrayLike<number> | undefined, length: number, field: string): void {
  if (column === undefined || column === null || typeof column.length !== 'number') {
    throw new MinerError('invalid-argument', field, column, 'must be an array-like column of numbers');
  }
  if (column.length !== length) {
    throw new MinerError('invalid-argument', `${field}.length`, column.length, `must equal the other columns' length ${length}`);
  }
}
