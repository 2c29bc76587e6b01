import { readFileSync, readdirSync } from 'node:fs';
import { describe, expect, test } from 'vitest';
import * as stressLife from '@loopwise/stress-life';

// Every @example of the package's TSDoc runs: each `// returns value` line asserts that the
// statement before it equals the value. So the doc comments cannot drift from the code.
const dir = new URL('../src/', import.meta.url);
const files = readdirSync(dir).filter((f) => f.endsWith('.ts'));

function examples(text: string): string[] {
  const out: string[] = [];
  const re = /@example\n([\s\S]*?)(?=\n\s*\*\/|\n\s*\* @)/g;
  for (let m = re.exec(text); m; m = re.exec(text)) out.push(m[1].split('\n').map((l) => l.replace(/^\s*\* ?/, '')).join('\n'));
  return out;
}

describe('TSDoc examples of @loopwise/stress-life', () => {
  for (const file of files) {
    examples(readFileSync(new URL(file, dir), 'utf8')).forEach((code, k) => {
      test(`${file} example ${k + 1} returns what it says`, () => {
        const lines = code.split('\n');
        const body: string[] = [];
        let checks = 0;
        for (const line of lines) {
          const ret = /^\/\/ returns (.+)$/.exec(line.trim());
          if (ret) {
            let last = body.pop() ?? '';
            last = last.trim().replace(/;\s*$/, '');
            const caught = /^catch \(e\) \{ (.*); \}$/.exec(last);
            if (caught) body.push(`catch (e) { __check(${caught[1]}, ${ret[1]}); }`);
            else body.push(`__check(${last}, ${ret[1]});`);
            checks++;
          } else if (!line.trim().startsWith('//')) body.push(line);
        }
        const seen: unknown[][] = [];
        const check = (got: unknown, want: unknown) => seen.push([got, want]);
        const names = Object.keys(stressLife);
        const run = new Function('__m', '__check', `const { ${names.join(', ')} } = __m;\n${body.join('\n').replace(/ as [A-Za-z]+\)/g, ')')}`);
        run(stressLife, check);
        expect(seen.length).toBe(checks);
        for (const [got, want] of seen) expect(ArrayBuffer.isView(got) ? Array.from(got as Float64Array) : got).toEqual(want);
      });
    });
  }
});
