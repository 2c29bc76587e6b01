import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { assessLife } from '@loopwise/engine';
import { iiwFatCurve } from '@loopwise/stress-life';
import { beforeAll, describe, expect, test } from 'vitest';
import { mulberry32 } from '../../../../fixtures/generate.mjs';

// The stress-life route through the built binary (pnpm test builds first): a hot-spot stress
// history of a welded detail, invented for the test (seeded generator), by flags and by a job
// file, against the engine's result for the same inputs.
const bin = new URL('../../dist/bin.js', import.meta.url).pathname;
let dir = '';
const N = 6000;
const history = new Float64Array(N);

function run(args: string[]) {
  const r = spawnSync(process.execPath, [bin, ...args], { cwd: dir, encoding: 'utf8', timeout: 60000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

beforeAll(() => {
  expect(existsSync(bin), 'build the cli first (pnpm test does)').toBe(true);
  dir = mkdtempSync(join(tmpdir(), 'loopwise-sn-'));
  const next = mulberry32(12);
  let x = 0;
  const rows = ['time_s,hotspot_MPa'];
  for (let i = 0; i < N; i++) {
    x = 0.95 * x + (next() - 0.5) * 30;
    // rounded as written, so the engine sees the same numbers as the CLI
    history[i] = Number((40 + x + 25 * Math.sin(i / 40)).toFixed(3));
    rows.push(`${(i / 100).toFixed(2)},${history[i].toFixed(3)}`);
  }
  writeFileSync(join(dir, 'weld.csv'), rows.join('\n') + '\n');
  writeFileSync(
    join(dir, 'weld-job.json'),
    JSON.stringify({
      format: 'loopwise-job',
      version: 1,
      stressLife: { curve: 'iiw:71', ultimateStrength: 510 },
      meanStress: 'goodman',
      criticalDamage: 0.5,
      channels: [{ column: 'hotspot_MPa', quantity: 'stress', unit: 'MPa' }],
      file: 'weld.csv',
    }),
  );
});

describe('loopwise assess on the stress-life route (built binary)', () => {
  test('by flags: the life equals the engine\'s for the same curve and correction; the outputs say which route', () => {
    const r = run(['assess', 'weld.csv', '--column', 'hotspot_MPa', '--sn-curve', 'iiw:71', '--mean-stress', 'goodman', '--ultimate-strength', '510', '--json-out', 'a.json', '--cycles-out', 'a.csv', '--html-out', 'a.html']);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/route\s+stress-life, S-N curve iiw:71/);
    const report = JSON.parse(readFileSync(join(dir, 'a.json'), 'utf8')).channels[0].report;
    const want = assessLife(history, { stressLife: { curve: iiwFatCurve(71), meanStress: { method: 'goodman', ultimateStrength: 510 } } });
    expect(Math.abs(report.damage.perRepeat / want.damage.perRepeat - 1)).toBeLessThan(1e-12);
    expect(report.damage.route).toBe('stress-life');
    // the cycles CSV: strain fields empty, damage column summing to the report's damage
    const csv = readFileSync(join(dir, 'a.csv'), 'utf8').trim().split('\n');
    const f = csv[1].split(',');
    expect([f[9], f[10]]).toEqual(['', '']);
    const sum = csv.slice(1).reduce((s, line) => s + Number(line.split(',')[13]), 0);
    expect(Math.abs(sum / report.damage.perRepeat - 1)).toBeLessThan(1e-12);
    // the HTML draws the S-N curve with the counted spectrum, and no hysteresis loops
    const html = readFileSync(join(dir, 'a.html'), 'utf8');
    expect(html).toMatch(/data-plot="sn"/);
    expect(html).toMatch(/class="sn-spectrum"/);
    expect(html).not.toMatch(/data-plot="loops"/);
  });

  test('by job file: the IIW damage sum 0.5 halves the life; the job file equals the flags', () => {
    const job = run(['assess', '--job', 'weld-job.json', '--json']);
    expect(job.code).toBe(0);
    const flags = run(['assess', 'weld.csv', '--column', 'hotspot_MPa', '--sn-curve', 'iiw:71', '--mean-stress', 'goodman', '--ultimate-strength', '510', '--critical-damage', '0.5', '--json']);
    const a = JSON.parse(job.stdout).channels[0].report;
    const b = JSON.parse(flags.stdout).channels[0].report;
    expect(a.life.repeats).toBe(b.life.repeats);
    expect(a.life.repeats).toBeCloseTo(0.5 / a.damage.perRepeat, 6);
  });

  test('--mean-stress all lists the corrections whose constants are given', () => {
    const r = run(['assess', 'weld.csv', '--column', 'hotspot_MPa', '--sn-curve', 'en1993:71,gamma-mf=1.15', '--mean-stress', 'all', '--ultimate-strength', '510', '--iiw-category', 'II', '--json']);
    expect(r.code).toBe(0);
    expect(JSON.parse(r.stdout).channels[0].corrections.map((c: { meanStress: string }) => c.meanStress)).toEqual(['none', 'goodman', 'gerber', 'smithWatsonTopper', 'iiw']);
  });

  const bad: [string, string[], RegExp][] = [
    ['an unknown detail class', ['--sn-curve', 'iiw:72'], /^loopwise assess: --sn-curve: FAT 72 is not an IIW normal-stress class \(known: 160, .*36\)$/],
    ['an unknown curve kind', ['--sn-curve', 'fat:90'], /--sn-curve: unknown curve "fat"; expected iiw:<FAT>/],
    ['a non-positive slope', ['--sn-curve', 'basquin:stress=100,cycles=2e6,slope=-3'], /--sn-curve: .*slope/],
    ['knees out of order', ['--sn-curve', 'basquin:stress=100,cycles=2e6,slope=3,knee=1e7/5,knee=5e6/9'], /--sn-curve: .*knee/],
    ['Kt on the stress route', ['--sn-curve', 'iiw:90', '--kt', '2'], /--kt: the stress-life route \(--sn-curve\) takes the notch as --kf/],
    ['Goodman without a strength', ['--sn-curve', 'iiw:90', '--mean-stress', 'goodman'], /--ultimate-strength: the goodman correction needs the ultimate strength/],
    ['a strain-life parameter on the stress route', ['--sn-curve', 'iiw:90', '--mean-stress', 'modifiedMorrow'], /--mean-stress: 'modifiedMorrow' is a strain-life damage parameter/],
    ['a strain channel on the stress route', ['--sn-curve', 'iiw:90', '--quantity', 'strain', '--unit', 'microstrain'], /--quantity: the stress-life route assesses stress or load channels/],
    ['a stress-route constant without a curve', ['--material', 'SAE 1045', '--ultimate-strength', '500'], /--ultimate-strength: applies to the stress-life route; give --sn-curve/],
  ];
  for (const [name, extra, message] of bad) {
    test(`bad input, exit 2 and one line, nothing written: ${name}`, () => {
      const before = readdirSync(dir).sort();
      const r = run(['assess', 'weld.csv', '--column', 'hotspot_MPa', ...extra, '--json-out', 'bad.json']);
      expect(r.code).toBe(2);
      expect(r.stderr.trim()).toMatch(message);
      expect(r.stderr.trim().split('\n')).toHaveLength(1);
      expect(readdirSync(dir).sort()).toEqual(before);
    });
  }

  test('bad job files name the job file and the field', () => {
    writeFileSync(join(dir, 'bad-job.json'), JSON.stringify({ format: 'loopwise-job', version: 1, stressLife: { curve: 'iiw:90', kfactor: 2 }, channels: [{ column: 'hotspot_MPa', quantity: 'stress', unit: 'MPa' }], file: 'weld.csv' }));
    const r = run(['assess', '--job', 'bad-job.json']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/bad-job\.json: stressLife\.kfactor: unknown field 'kfactor' in stressLife; the fields are curve, kf, stressFactor/);
    writeFileSync(join(dir, 'bad-job2.json'), JSON.stringify({ format: 'loopwise-job', version: 1, stressLife: { curve: 'en1993:72' }, channels: [{ column: 'hotspot_MPa', quantity: 'stress', unit: 'MPa' }], file: 'weld.csv' }));
    const r2 = run(['assess', '--job', 'bad-job2.json']);
    expect(r2.code).toBe(2);
    expect(r2.stderr).toMatch(/bad-job2\.json: stressLife\.curve: 72 is not an EN 1993-1-9 normal-stress detail category/);
  });
});
