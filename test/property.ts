import fc from 'fast-check';

/** Largest share of generated cases a property may discard with fc.pre before it fails. */
export const MAX_DISCARD_RATIO = 0.5;

/**
 * Runs a fast-check property, fails with fast-check's report (seed and counterexample) when it
 * does not hold, prints the property's discard ratio, and fails when too many cases were
 * discarded by preconditions (a property that discards most inputs checks little).
 */
export function checkProperty<Ts extends [unknown, ...unknown[]]>(
  name: string,
  property: fc.IProperty<Ts> | fc.IAsyncProperty<Ts>,
  parameters: fc.Parameters<Ts> = {},
): void {
  const details = fc.check(property as fc.IProperty<Ts>, parameters) as fc.RunDetails<Ts>;
  if (details.failed) throw new Error(`${name}: ${fc.defaultReportMessage(details)}`);
  const total = details.numRuns + details.numSkips;
  const ratio = total === 0 ? 0 : details.numSkips / total;
  console.log(`property "${name}": ${details.numRuns} runs, ${details.numSkips} discarded (ratio ${ratio.toFixed(3)})`);
  if (ratio > MAX_DISCARD_RATIO) {
    throw new Error(`${name}: discard ratio ${ratio.toFixed(3)} exceeds ${MAX_DISCARD_RATIO}`);
  }
}
