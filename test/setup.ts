import fc from 'fast-check';

// Property tests run with a pinned seed in CI (CI=true) so a red run is reproducible; locally the
// seed is random unless FC_SEED is set. fast-check prints the seed and path of any failure.
const pinned = 20261201;
const fromEnv = process.env.FC_SEED;
const seed = fromEnv !== undefined ? Number(fromEnv) : process.env.CI ? pinned : undefined;
if (seed !== undefined) fc.configureGlobal({ seed });
