import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, test } from 'vitest';

// Issue 11, item 3: the signal warnings reach the HTML (a section at the top, and each channel's
// own) and the top level of the JSON, each channel with its own warnings only. Two channels
// invented for the test: channel a has one spike at sample 1234, channel b none.
const bin = new URL('../../dist/bin.js', import.meta.url).pathname;
let dir = '';

beforeAll(() => {
  expect(existsSync(bin), 'build the cli first (pnpm test does)').toBe(true);
  dir = mkdtempSync(join(tmpdir(), 'loopwise-warn-'));
  const rows = ['time_s,a_MPa,b_MPa'];
  for (let i = 0; i < 5000; i++) rows.push(`${(i / 100).toFixed(2)},${(100 * Math.sin(i / 10.3) + (i === 1234 ? 900 : 0)).toFixed(4)},${(80 * Math.sin(i / 7.1)).toFixed(4)}`);
  writeFileSync(join(dir, 'two.csv'), rows.join('\n') + '\n');
});

describe('warnings everywhere (built binary)', () => {
  test('a spike on one channel is in the HTML top section, in its channel section only, and in the JSON top level', () => {
    const r = spawnSync(process.execPath, [bin, 'assess', 'two.csv', '--column', 'a_MPa', '--column', 'b_MPa', '--material', 'SAE 1045', '--html-out', 'r.html', '--json-out', 'r.json'], { cwd: dir, encoding: 'utf8' });
    expect(r.status).toBe(0);
    const html = readFileSync(join(dir, 'r.html'), 'utf8');
    const top = /<section class="warnings-all" id="warnings">(.*?)<\/section>/s.exec(html)?.[1] ?? '';
    expect(top).toMatch(/<strong>a_MPa<\/strong>: <code>signal: spike<\/code>.*first at sample 1234/);
    const sections = html.split('<section class="channel"').slice(1);
    expect(sections).toHaveLength(2);
    expect(sections[0]).toMatch(/data-code="signal-spike"/);
    expect(sections[1]).not.toMatch(/spike/);
    expect(sections[0]).not.toMatch(/No warnings\./); // channel a's section has its warnings
    const json = JSON.parse(readFileSync(join(dir, 'r.json'), 'utf8'));
    const spikes = json.warnings.filter((w: { code: string }) => w.code === 'spike');
    expect(spikes).toEqual([expect.objectContaining({ channel: 'a_MPa', source: 'signal' })]);
    // the summary lists channel a's spike under channel a only
    const b = r.stdout.split('channel b_MPa')[1];
    expect(b).not.toMatch(/spike/);
  });
});
