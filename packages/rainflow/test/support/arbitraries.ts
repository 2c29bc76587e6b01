import fc from 'fast-check';

/**
 * Histories on a coarse integer grid (many ties, equal ranges and plateaus), with -0 mixed in.
 * Integer values keep every sum and difference exact, so results can be compared exactly.
 */
export const tiedHistory = (maxLength = 60): fc.Arbitrary<number[]> =>
  fc.array(fc.oneof({ weight: 12, arbitrary: fc.integer({ min: -6, max: 6 }) }, { weight: 1, arbitrary: fc.constant(-0) }), {
    maxLength,
  });

/** Histories of arbitrary finite doubles in a moderate range. */
export const realHistory = (maxLength = 60): fc.Arbitrary<number[]> =>
  fc.array(fc.double({ min: -1000, max: 1000, noNaN: true, noDefaultInfinity: true }), { maxLength });

/** Either kind. */
export const anyHistory = (maxLength = 60): fc.Arbitrary<number[]> => fc.oneof(tiedHistory(maxLength), realHistory(maxLength));

/** Split points that cut `length` samples into chunks (chunk size 1 included). */
export const chunking = (length: number): fc.Arbitrary<number[]> =>
  fc.oneof(
    fc.constant(Array.from({ length: Math.max(0, length - 1) }, (_, i) => i + 1)), // size 1
    fc.uniqueArray(fc.integer({ min: 0, max: length }), { maxLength: 8 }).map((a) => a.sort((x, y) => x - y)),
  );

/** Cuts `history` at the given sorted points. */
export function cut(history: number[], points: number[]): number[][] {
  const out: number[][] = [];
  let s = 0;
  for (const p of points) {
    out.push(history.slice(s, p));
    s = p;
  }
  out.push(history.slice(s));
  return out;
}
