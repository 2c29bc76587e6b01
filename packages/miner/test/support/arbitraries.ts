import fc from 'fast-check';

/** One generated loop record: count, cycles to failure, two reversal indices, a range. */
export interface LoopRecord {
  count: number;
  cyclesToFailure: number;
  startIndex: number;
  turnIndex: number;
  range: number;
}

/**
 * Loop records of a history of `samples` samples: counts of 0.5 or 1 (sometimes a repeat
 * count), lives from 1 to 1e12 cycles or Infinity, reversal indices in [0, samples).
 * Damage ties are frequent (few distinct lives), to exercise tie rules.
 */
export const loopRecords = (samples = 200, maxLength = 80): fc.Arbitrary<LoopRecord[]> =>
  fc.array(
    fc.record({
      count: fc.oneof(fc.constantFrom(0.5, 1), fc.integer({ min: 0, max: 1000 })),
      cyclesToFailure: fc.oneof(
        { weight: 3, arbitrary: fc.constantFrom(1, 10, 1e3, 1e6) },
        { weight: 6, arbitrary: fc.double({ min: 1, max: 1e12, noNaN: true }) },
        { weight: 1, arbitrary: fc.constant(Infinity) },
      ),
      startIndex: fc.integer({ min: 0, max: samples - 1 }),
      turnIndex: fc.integer({ min: 0, max: samples - 1 }),
      range: fc.double({ min: 0, max: 1000, noNaN: true }),
    }),
    { maxLength },
  );

/** Columns of records, as Float64Arrays. */
export function toColumns(loops: LoopRecord[]) {
  return {
    count: Float64Array.from(loops, (l) => l.count),
    cyclesToFailure: Float64Array.from(loops, (l) => l.cyclesToFailure),
    startIndex: Float64Array.from(loops, (l) => l.startIndex),
    turnIndex: Float64Array.from(loops, (l) => l.turnIndex),
    range: Float64Array.from(loops, (l) => l.range),
  };
}

/** |a - b| <= tol · max(|a|, |b|, tiny): relative comparison that accepts two zeros. */
export function closeRelative(a: number, b: number, tol = 1e-12): boolean {
  return Math.abs(a - b) <= tol * Math.max(Math.abs(a), Math.abs(b), 1e-300);
}
