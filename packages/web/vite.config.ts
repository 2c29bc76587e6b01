import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vite';

// The page is built from the workspace's sources (no package needs building first); the browser
// entry of the cli is `@loopwise/cli/browser` (src/browser.ts), which imports no Node module.
const packages = ['base', 'material', 'rainflow', 'signal', 'ingest', 'notch', 'mean-stress', 'miner', 'stress-life', 'engine'];
const src = (path: string) => fileURLToPath(new URL(`../${path}`, import.meta.url));

export default defineConfig({
  // relative asset paths: the built folder works from any folder of any static server, offline
  base: './',
  resolve: {
    alias: [
      { find: /^@loopwise\/cli\/browser$/, replacement: src('cli/src/browser.ts') },
      ...packages.map((name) => ({ find: new RegExp(`^@loopwise/${name}$`), replacement: src(`${name}/src/index.ts`) })),
    ],
  },
  worker: { format: 'es' },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    target: 'es2022',
    // no inline data: URLs for assets (the Content-Security-Policy allows none for scripts)
    assetsInlineLimit: 0,
    modulePreload: { polyfill: false },
  },
});
