import { existsSync, readFileSync } from 'node:fs';
import { dirname, join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, test } from 'vitest';

// The browser page bundles `@loopwise/cli/browser`; a `node:` module (or an npm library of the
// command, csv-parse) anywhere in its imports would break the page or drag Node code into it.
// This follows every import and re-export from src/browser.ts through the workspace's sources.
const packagesDir = fileURLToPath(new URL('../../', import.meta.url));
const IMPORT = /(?:^|\n)\s*(?:import|export)\s+(?:type\s+)?(?:[^'";]*?\sfrom\s+)?['"]([^'"]+)['"]/g;

function resolveLocal(from: string, spec: string): string {
  const base = join(dirname(from), spec).replace(/\.js$/, '');
  for (const candidate of [`${base}.ts`, join(base, 'index.ts')]) if (existsSync(candidate)) return candidate;
  throw new Error(`${relative(packagesDir, from)}: cannot resolve ${spec}`);
}

/** Every source file reached from `entry`, and every import that is neither relative nor a workspace package. */
function importGraph(entry: string): { files: Set<string>; outside: string[] } {
  const files = new Set<string>();
  const outside: string[] = [];
  const todo = [entry];
  while (todo.length > 0) {
    const file = todo.pop() as string;
    if (files.has(file)) continue;
    files.add(file);
    const text = readFileSync(file, 'utf8');
    for (const m of text.matchAll(IMPORT)) {
      const spec = m[1];
      // a type-only import is erased from the bundle
      if (/^\s*(?:import|export)\s+type\s/.test(m[0].trim() + ' ')) continue;
      if (spec.startsWith('.')) todo.push(resolveLocal(file, spec));
      else if (spec.startsWith('@loopwise/')) todo.push(join(packagesDir, spec.slice('@loopwise/'.length), 'src', 'index.ts'));
      else outside.push(`${relative(packagesDir, file)}: ${spec}`);
    }
  }
  return { files, outside };
}

describe('@loopwise/cli/browser', () => {
  test('src/browser.ts reaches no node: module and no npm library', () => {
    const { files, outside } = importGraph(fileURLToPath(new URL('../src/browser.ts', import.meta.url)));
    // it does reach the report builders and the engine (the walk follows imports)
    expect([...files].map((f) => relative(packagesDir, f))).toEqual(expect.arrayContaining(['cli/src/cli/outputs.ts', 'cli/src/cli/assessStream.ts', 'engine/src/index.ts', 'ingest/src/index.ts']));
    expect(outside).toEqual([]);
  });

  test('the command entry does reach node: modules (the walk sees them)', () => {
    const { outside } = importGraph(fileURLToPath(new URL('../src/index.ts', import.meta.url)));
    expect(outside.some((o) => o.endsWith(': node:fs'))).toBe(true);
  });
});
