import { readFileSync } from 'node:fs';
import { describe, expect, test } from 'vitest';
import * as base from '@loopwise/base';

// Runs the ```js blocks of this package's README against the sources, with the rules of the
// workspace's test/readme-examples.test.ts: import lines bind the module, and every line
// `expression; // returns value` asserts that the expression equals the value.
const readme = readFileSync(new URL('../README.md', import.meta.url), 'utf8');
const blocks = [...readme.matchAll(/```js\n([\s\S]*?)```/g)].map((m) => m[1]);

function translate(code: string): string {
  return code
    .split('\n')
    .map((line, i) => {
      const imp = /^import \{([^}]+)\} from '@loopwise\/base';$/.exec(line.trim());
      if (imp) return `const {${imp[1]}} = __base;`;
      const ret = /^(.*?);\s*\/\/ returns (.+)$/.exec(line);
      return ret ? `__check(${ret[1]}, (${ret[2]}), ${i + 1});` : line;
    })
    .join('\n');
}

const plain = (v: unknown): unknown => (ArrayBuffer.isView(v) ? Array.from(v as unknown as ArrayLike<number>) : v);

describe('packages/base/README.md', () => {
  test('the README has an executed example', () => {
    expect(blocks.length).toBeGreaterThan(0);
  });

  blocks.forEach((code, k) => {
    test(`example ${k + 1} runs and returns what it says`, () => {
      let checks = 0;
      const check = (got: unknown, want: unknown, line: number) => {
        checks++;
        expect(plain(got), `example ${k + 1}, line ${line}`).toEqual(plain(want));
      };
      new Function('__base', '__check', translate(code))(base, check);
      expect(checks).toBe((code.match(/; *\/\/ returns /g) ?? []).length);
    });
  });
});
