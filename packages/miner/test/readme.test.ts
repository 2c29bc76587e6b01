import { readFileSync } from 'node:fs';
import { describe, expect, test } from 'vitest';
import * as material from '@loopwise/material';
import * as rainflow from '@loopwise/rainflow';
import * as miner from '@loopwise/miner';

// The README example, executed from the README text itself so the documentation cannot drift:
// its import lines are replaced by the modules, the rest runs as written (plain JavaScript).
const readme = readFileSync(new URL('../README.md', import.meta.url), 'utf8');

function exampleBlock(): string {
  const section = readme.split('\n## Example\n')[1];
  const block = /```js\n([\s\S]*?)```/.exec(section);
  if (block === null) throw new Error('README.md has no js block under ## Example');
  return block[1];
}

describe('README example', () => {
  test('the example runs as written and its commented values hold', () => {
    const modules: Record<string, object> = { '@loopwise/material': material, '@loopwise/rainflow': rainflow, '@loopwise/miner': miner };
    const body = exampleBlock().replace(/^import \{([^}]*)\} from '([^']+)';$/gm, (_m, names: string, from: string) => {
      expect(modules[from]).toBeDefined();
      return `const {${names}} = modules[${JSON.stringify(from)}];`;
    });
    const run = new Function('modules', `${body}\nreturn { sum, life, timeline, worst };`);
    const { sum, life, timeline, worst } = run(modules) as {
      sum: miner.MinerSum;
      life: miner.LifeEstimate;
      timeline: Float64Array;
      worst: Uint32Array;
    };
    // values computed by the code itself when the example was written (regression, not external)
    expect(life.repeats).toBeCloseTo(14535.6, 1);
    expect(life.service).toBeCloseTo(121.1, 1);
    expect(life.designService).toBeCloseTo(40.4, 1);
    expect(life.unit).toBe('h');
    expect(timeline.length).toBe(3);
    expect(timeline.reduce((a, b) => a + b, 0)).toBeCloseTo(sum.damage(), 18);
    expect(Array.from(worst)).toEqual([4, 3]);
    const range = sum.columns().range;
    expect([range[4], range[3]]).toEqual([0.009000000000000001, 0.007]);
  });
});
