import { readFileSync, readdirSync, existsSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, test } from 'vitest';
import * as base from '@loopwise/base';
import * as rainflow from '@loopwise/rainflow';
import * as signal from '@loopwise/signal';
import * as ingest from '@loopwise/ingest';
import * as material from '@loopwise/material';
import * as meanStress from '@loopwise/mean-stress';
import * as miner from '@loopwise/miner';
import * as engine from '@loopwise/engine';
import * as notch from '@loopwise/notch';
import * as stressLife from '@loopwise/stress-life';
import * as fleet from '@loopwise/fleet';

// Runs every ```js block of the package READMEs: imports of @loopwise packages are bound to the
// sources, and each line `expression; // returns value` becomes an assertion that the expression
// equals the value (typed arrays compared as arrays). A README therefore cannot drift from code.

const modules: Record<string, unknown> = {
  '@loopwise/base': base,
  '@loopwise/rainflow': rainflow,
  '@loopwise/signal': signal,
  '@loopwise/ingest': ingest,
  '@loopwise/material': material,
  '@loopwise/mean-stress': meanStress,
  '@loopwise/miner': miner,
  '@loopwise/engine': engine,
  '@loopwise/notch': notch,
  '@loopwise/stress-life': stressLife,
  '@loopwise/fleet': fleet,
};

const root = new URL('..', import.meta.url).pathname;
const readmes = [
  'README.md',
  ...readdirSync(join(root, 'packages')).map((p) => join('packages', p, 'README.md')),
].filter((p) => existsSync(join(root, p)));

function blocks(markdown: string): string[] {
  const out: string[] = [];
  const re = /```js\n([\s\S]*?)```/g;
  for (let m = re.exec(markdown); m; m = re.exec(markdown)) out.push(m[1]);
  return out;
}

function plain(v: unknown): unknown {
  if (ArrayBuffer.isView(v) && !(v instanceof DataView)) return Array.from(v as unknown as ArrayLike<number>);
  return v;
}

function translate(code: string): string {
  return code
    .split('\n')
    .map((line, i) => {
      const imp = /^import \{([^}]+)\} from '(@loopwise\/[a-z-]+)';$/.exec(line.trim());
      if (imp) return `const {${imp[1]}} = __modules[${JSON.stringify(imp[2])}];`;
      const ret = /^(.*?);\s*\/\/ returns (.+)$/.exec(line);
      if (ret) return `__check(${ret[1]}, (${ret[2]}), ${i + 1});`;
      return line;
    })
    .join('\n');
}

describe('README examples', () => {
  for (const file of readmes) {
    const examples = blocks(readFileSync(join(root, file), 'utf8'));
    examples.forEach((code, k) => {
      test(`${file} example ${k + 1} runs and returns what it says`, () => {
        let checks = 0;
        const check = (got: unknown, want: unknown, line: number) => {
          checks++;
          expect(plain(got), `${file} example ${k + 1}, line ${line}`).toEqual(plain(want));
        };
        // a block without `// returns` lines must still run without throwing
        expect(() => new Function('__modules', '__check', translate(code))(modules, check)).not.toThrow();
        expect(checks).toBe((code.match(/; *\/\/ returns /g) ?? []).length);
      });
    });
  }
});
