import { execFileSync } from 'node:child_process';
import { existsSync, readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, test } from 'vitest';

// The published output is what users get: each package's built dist/ is loaded through its
// `exports` map by plain Node, once with `import` and once with `require`, from the workspace
// root (where every package is linked by name). `pnpm test` builds before it runs this.

const root = new URL('..', import.meta.url).pathname;
const packages = readdirSync(join(root, 'packages'))
  .map((dir) => ({ dir, pkg: JSON.parse(readFileSync(join(root, 'packages', dir, 'package.json'), 'utf8')) }))
  .filter(({ pkg }) => !pkg.private);

function exportsOf(kind: 'import' | 'require', name: string): string[] {
  const script =
    kind === 'import'
      ? `const m = await import(${JSON.stringify(name)}); console.log(JSON.stringify(Object.keys(m).filter((k) => k !== 'default').sort()));`
      : `const m = require(${JSON.stringify(name)}); console.log(JSON.stringify(Object.keys(m).sort()));`;
  const args = kind === 'import' ? ['--input-type=module', '-e', script] : ['-e', script];
  return JSON.parse(execFileSync(process.execPath, args, { cwd: root, encoding: 'utf8' }));
}

describe('built packages', () => {
  test('@loopwise/cli/browser (the browser entry of the cli) loads from dist/ through import and require with the same exports', () => {
    const esm = exportsOf('import', '@loopwise/cli/browser');
    expect(esm).toEqual(expect.arrayContaining(['assessStream', 'jsonReport', 'writeCyclesCsv', 'renderChannelsHtml', 'MemorySpool', 'jobOfJobFile']));
    expect(exportsOf('require', '@loopwise/cli/browser')).toEqual(esm);
  });

  for (const { dir, pkg } of packages) {
    test(`${pkg.name} loads from dist/ through import and require with the same exports`, () => {
      expect(existsSync(join(root, 'packages', dir, 'dist', 'index.js')), 'run pnpm build first').toBe(true);
      expect(pkg.exports['.'].import.types).toBe('./dist/index.d.ts');
      expect(Object.keys(pkg.exports['.'].import)[0]).toBe('types');
      expect(Object.keys(pkg.exports['.'].require)[0]).toBe('types');
      expect(pkg.sideEffects).toBe(false);
      expect(pkg.files[0]).toBe('dist');
      expect(pkg.files.every((f: string) => f === 'dist' || pkg.name === '@loopwise/cli')).toBe(true);
      const esm = exportsOf('import', pkg.name);
      const cjs = exportsOf('require', pkg.name);
      expect(esm.length).toBeGreaterThan(0);
      expect(cjs).toEqual(esm);
      for (const f of ['index.d.ts', 'index.d.cts', 'index.cjs']) expect(existsSync(join(root, 'packages', dir, 'dist', f))).toBe(true);
    });
  }

  test('@loopwise/rainflow from dist counts the ASTM E1049 5.4.4 example through both module systems', () => {
    // ASTM E1049-85 5.4.4 example: 4 cycles in all (values from memory, see shared reference README)
    const esm = execFileSync(
      process.execPath,
      ['--input-type=module', '-e', "import { rainflow } from '@loopwise/rainflow'; console.log(rainflow([-2, 1, -3, 5, -1, 3, -4, 4, -2]).cycles.totalCount());"],
      { cwd: root, encoding: 'utf8' },
    );
    const cjs = execFileSync(
      process.execPath,
      ['-e', "const { rainflow } = require('@loopwise/rainflow'); console.log(rainflow([-2, 1, -3, 5, -1, 3, -4, 4, -2]).cycles.totalCount());"],
      { cwd: root, encoding: 'utf8' },
    );
    expect(esm.trim()).toBe('4');
    expect(cjs.trim()).toBe('4');
  });
});
