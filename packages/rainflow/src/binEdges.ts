import { BinError } from './errors';

/** Bins given by their edges (strictly increasing, finite), or by a count and limits. */
export type BinSpec = { edges: ArrayLike<number> } | { count: number; min: number; max: number };

/**
 * Resolves a bin specification to its edges (a new array). Bin i holds values v with edges[i]
 * <= v < edges[i + 1]; the last bin also holds its upper edge. Values below the first edge or
 * above the last are outside (the matrices tally them, or throw, as chosen; nothing is dropped
 * silently). The bin of a value is `binIndex(edges, v)` of `@loopwise/base`.
 *
 * A bad specification throws {@link BinError} (code `'invalid-bins'`) with `field` = `field`,
 * the bad value and, for an edge, its index.
 *
 * @example
 * binEdges({ count: 4, min: 0, max: 100 }, 'range'); // returns Float64Array [0, 25, 50, 75, 100]
 */
export function binEdges(spec: BinSpec, field: string): Float64Array {
  if (spec === null || typeof spec !== 'object') throw new BinError(field, spec, 'bins must be { edges } or { count, min, max }');
  if ('edges' in spec) {
    const e = Float64Array.from(spec.edges);
    if (e.length < 2) throw new BinError(field, spec.edges, `needs at least two edges, got ${e.length}`);
    for (let i = 0; i < e.length; i++) {
      if (!Number.isFinite(e[i])) throw new BinError(field, e[i], `edge ${i} is ${e[i]}: edges must be finite`, i);
      if (i > 0 && !(e[i] > e[i - 1])) {
        throw new BinError(field, e[i], `edges must increase strictly: edge ${i} (${e[i]}) is not above edge ${i - 1} (${e[i - 1]})`, i);
      }
    }
    return e;
  }
  const { count, min, max } = spec;
  if (!Number.isInteger(count) || count < 1) throw new BinError(field, count, `count must be an integer >= 1, got ${count}`);
  if (!Number.isFinite(min) || !Number.isFinite(max) || !(max > min)) {
    throw new BinError(field, spec, `needs finite min < max, got min ${min}, max ${max}`);
  }
  const e = new Float64Array(count + 1);
  const w = (max - min) / count;
  for (let i = 0; i <= count; i++) e[i] = min + i * w;
  e[count] = max;
  for (let i = 1; i <= count; i++) {
    if (!(e[i] > e[i - 1])) throw new BinError(field, spec, `bins of width ${w} are too narrow to represent at ${e[i]}`, i);
  }
  return e;
}
