import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

const packages = ['base', 'material', 'rainflow', 'signal', 'ingest', 'notch', 'mean-stress', 'miner', 'stress-life', 'engine', 'cli', 'fleet'];

export default defineConfig({
  resolve: {
    // Tests run against src/ without a build; test/dist-smoke.test.ts checks the built output.
    // (exact names: `@loopwise/cli/browser` is the cli's second entry)
    alias: [
      { find: /^@loopwise\/cli\/browser$/, replacement: fileURLToPath(new URL('./packages/cli/src/browser.ts', import.meta.url)) },
      ...packages.map((name) => ({
        find: new RegExp(`^@loopwise/${name}$`),
        replacement: fileURLToPath(new URL(`./packages/${name}/src/index.ts`, import.meta.url)),
      })),
    ],
  },
  test: {
    include: ['packages/*/test/**/*.test.ts', 'test/**/*.test.ts'],
    setupFiles: ['./test/setup.ts'],
    testTimeout: 60_000,
  },
});
