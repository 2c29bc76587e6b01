import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, test } from 'vitest';
import { cli } from './runCli';

// `loopwise margin` reads and corrects the samples as `assess` does (issue 11, item 7 with the
// corrections of item 1): asked for the life assess gives at the load as measured, the factor it
// finds is 1 (to its bisection's 1e-6), whatever the corrections. The files are INVENTED for the
// test (sums of sines), not measurements.
let dir = '';
const n = 6000;
const a = Array.from({ length: n }, (_, i) => 180 * Math.sin(i / 23.1) + 70 * Math.sin(i / 4.7) + 40);
// channel b is stuck at one value over samples 1000..1299 (a flat run only on b)
const b = Array.from({ length: n }, (_, i) => (i >= 1000 && i < 1300 ? 55 : 150 * Math.sin(i / 31.7) + 60 * Math.sin(i / 3.3)));
// two strain gauges in front of a weld toe (µε), for the hot-spot stress
const g1 = Array.from({ length: n }, (_, i) => 700 + 500 * Math.sin(i / 19.3) + 150 * Math.sin(i / 3.9));
const g2 = g1.map((v, i) => 0.85 * v + 20 * Math.sin(i / 7.7));

async function json(args: string[]): Promise<any> {
  const r = await cli(args);
  expect(r.stderr).toBe('');
  expect(r.code).toBe(0);
  return JSON.parse(r.stdout);
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'loopwise-margin-corrections-'));
  writeFileSync(join(dir, 'two.csv'), 'a_MPa,b_MPa\n' + a.map((v, i) => `${v.toFixed(3)},${b[i].toFixed(3)}`).join('\n') + '\n');
  writeFileSync(join(dir, 'weld_ue.csv'), 'a_ue,b_ue\n' + g1.map((v, i) => `${v.toFixed(2)},${g2[i].toFixed(2)}`).join('\n') + '\n');
  writeFileSync(
    join(dir, 'hot.json'),
    JSON.stringify({
      format: 'loopwise-job',
      version: 1,
      subtractOffset: 100,
      // SWT: the mean matters (so the offset does) and the search may scale far up without an Su
      meanStress: 'smithWatsonTopper',
      stressLife: { curve: 'iiw:71', hotSpot: { rule: 'typeALinear', modulus: 206000 } },
      channels: [
        { column: 'a_ue', quantity: 'strain', unit: 'microstrain' },
        { column: 'b_ue', quantity: 'strain', unit: 'microstrain' },
      ],
      events: [{ name: 'site', file: 'weld_ue.csv', repeats: 2 }],
    }),
  );
});

describe('margin corrects as assess does', () => {
  test('--exclude-flat-runs on two channels: the row cut where b is flat is cut from a too, and margin lists the cut', async () => {
    const route = ['--sn-curve', 'iiw:71', '--column', 'a_MPa', '--column', 'b_MPa', '--quantity', 'stress', '--exclude-flat-runs'];
    const assessed = await json(['assess', join(dir, 'two.csv'), ...route, '--json']);
    const life = assessed.channels[0].report.life.repeats;
    expect(assessed.channels[0].signalCorrections[0].places).toEqual([{ first: 1000, length: 300 }]);
    const m = await json(['margin', join(dir, 'two.csv'), ...route, '--target-repeats', String(life), '--target-of', 'mean', '--json']);
    expect(m.format).toBe('loopwise-cli-margin');
    expect(m.version).toBe(3);
    expect(Math.abs(m.channels[0].factor - 1)).toBeLessThanOrEqual(1e-5);
    expect(m.channels[0].signalCorrections.map((c: { kind: string; places: unknown }) => [c.kind, c.places])).toEqual([['ranges-excluded', [{ first: 1000, length: 300 }]]]);
    // and the text says it, under the channel's line
    const text = await cli(['margin', join(dir, 'two.csv'), ...route, '--target-repeats', String(life), '--target-of', 'mean']);
    expect(text.stdout).toMatch(/channel a_MPa: load factor 1(\.0+)? gives[^\n]*\n  corrected 1 range\(s\) cut out \(300 of 6000 samples: samples 1000\.\.1299; they hold the 1 flat run\(s\)/);
  });

  test('a hot-spot duty cycle with an offset: the offset is in MPa of the hot-spot stress, as assess takes it', async () => {
    const assessed = await json(['assess', '--job', join(dir, 'hot.json'), '--json']);
    const life = assessed.channels[0].report.life.repeats;
    const offset = assessed.channels[0].signalCorrections.find((c: { kind: string }) => c.kind === 'offset-removed');
    expect(offset.summary).toMatch(/100 MPa/);
    const m = await json(['margin', '--job', join(dir, 'hot.json'), '--target-repeats', String(life), '--target-of', 'mean', '--json']);
    expect(Math.abs(m.channels[0].factor - 1)).toBeLessThanOrEqual(1e-5);
    expect(m.channels[0].signalCorrections.map((c: { summary: string }) => c.summary)).toEqual(assessed.channels[0].signalCorrections.map((c: { summary: string }) => c.summary));
  });

  test('without corrections asked, the margin text has no corrected line and the JSON an empty list', async () => {
    const m = await json(['margin', join(dir, 'two.csv'), '--sn-curve', 'iiw:71', '--column', 'a_MPa', '--quantity', 'stress', '--target-repeats', '1000', '--json']);
    expect(m.channels[0].signalCorrections).toEqual([]);
    const text = await cli(['margin', join(dir, 'two.csv'), '--sn-curve', 'iiw:71', '--column', 'a_MPa', '--quantity', 'stress', '--target-repeats', '1000']);
    expect(text.stdout).not.toMatch(/corrected/);
  });
});
