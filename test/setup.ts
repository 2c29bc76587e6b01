import fc from 'fast-check';

// fast-check's seed for every property in the run. Pinned by default, with or without CI, so
// `pnpm test` draws the same cases on every machine and a red run is red for everyone.
//   FC_SEED unset or empty  the pinned seed below
//   FC_SEED=<integer>       that seed (replays a failure: fast-check prints its seed and path)
//   FC_SEED=random          a new random seed for each property (fast-check prints it on failure)
// Try a few seeds, and random ones, before pushing a new property.
const PINNED_SEED = 20261201;

function seedFromEnv(value: string | undefined): number | 'random' {
  const text = value?.trim() ?? '';
  if (text === '') return PINNED_SEED;
  if (text.toLowerCase() === 'random') return 'random';
  const seed = Number(text);
  if (!/^-?\d+$/.test(text) || !Number.isSafeInteger(seed)) {
    throw new Error(`FC_SEED must be an integer or "random"; got ${JSON.stringify(value)}`);
  }
  return seed;
}

const seed = seedFromEnv(process.env.FC_SEED);
if (seed !== 'random') fc.configureGlobal({ seed });
