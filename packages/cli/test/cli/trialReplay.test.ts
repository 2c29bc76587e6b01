import { mkdtempSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, test } from 'vitest';
import { cli } from './runCli';

// Issue 11, "Done means": the trial of a new analyst replayed on a generated logger file, point
// by point. The file is INVENTED for the test: semicolon-delimited with decimal commas, a header
// and a units row, a time column Zeit_s at 500 Hz, two gauges in µε, three single-sample spikes
// on SG1_ue and a 0.8 s dropout to zero on both gauges.
let dir = '';
const n = 60000;
const spikes = [4321, 23456, 45001];
const dropout = { first: 30000, length: 400 };


beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'loopwise-trial-'));
  let seed = 11;
  const rnd = () => (seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648;
  const rows = ['Zeit_s;SG1_ue;SG2_ue', 's;µε;µε'];
  let a = 0;
  for (let i = 0; i < n; i++) {
    a = 0.97 * a + (rnd() - 0.5) * 60;
    let v1 = 400 * Math.sin(i / 35) + 6 * a;
    let v2 = 250 * Math.sin(i / 22) + 3 * a;
    if (spikes.includes(i)) v1 = 5200;
    if (i >= dropout.first && i < dropout.first + dropout.length) v1 = v2 = 0;
    const c = (x: number, d: number) => x.toFixed(d).replace('.', ',');
    rows.push(`${c(i / 500, 3)};${c(v1, 1)};${c(v2, 1)}`);
  }
  writeFileSync(join(dir, 'bracket_run.csv'), rows.join('\n') + '\n');
});

const file = () => join(dir, 'bracket_run.csv');

describe('the new analyst\'s trial, replayed', () => {
  test('no --column: it refuses to guess between the two gauges, lists them with their units, and never offers the time column', async () => {
    const r = await cli(['assess', file(), '--material', 'SAE 1045']);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('2 "SG1_ue" (µε), 3 "SG2_ue" (µε)');
    expect(r.stderr).not.toContain('Zeit_s');
  });

  test('--column SG1_ue: units from the units row, the time base from Zeit_s, the material named, µε kept, the artefacts and their damage side by side', async () => {
    const r = await cli(['assess', file(), '--column', 'SG1_ue', '--material', 'SAE 1045', '--html-out', join(dir, 'r.html'), '--json-out', join(dir, 'r.json')]);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('input: column 2 "SG1_ue" (µε): strain in microstrain, from the file\'s unit "µε"');
    expect(r.stdout).toContain('input: time base: column 1 "Zeit_s" (s)');
    expect(r.stdout).toContain('semicolon-delimited, decimal comma, header on line 1, units row on line 2');
    expect(r.stdout).toContain('channel SG1_ue (µε)');
    expect(r.stdout).toContain('material               SAE 1045 (hot rolled and normalized)');
    const j = JSON.parse(readFileSync(join(dir, 'r.json'), 'utf8'));
    const codes = j.warnings.map((w: { code: string }) => w.code);
    expect(codes).toEqual(expect.arrayContaining(['spike', 'dropout', 'artefact-damage']));
    expect(j.warnings.find((w: { code: string }) => w.code === 'spike').message).toContain(`first at sample ${spikes[0]}`);
    // the worst loops start at the spikes, and the report says what they do
    const worst = j.channels[0].report.worstLoops.slice(0, 3);
    for (const w of worst) expect(spikes.includes(w.startIndex) || spikes.includes(w.turnIndex)).toBe(true);
    const study = j.channels[0].artefactStudy;
    expect(study.spikes).toBe(3);
    expect(study.shareOfDamage).toBeGreaterThan(0.9);
    expect(study.repeatsCleaned).toBeGreaterThan(study.repeatsAsMeasured);
    // the service per repeat from the time base: 120 s
    expect(j.channels[0].report.life.perRepeat).toBeCloseTo(120 / 3600, 12);
    // the HTML has the warnings at the top and never says "No warnings." beside them
    const html = readFileSync(join(dir, 'r.html'), 'utf8');
    const top = /<section class="warnings-all" id="warnings">(.*?)<\/section>/s.exec(html)?.[1] ?? '';
    expect(top).toContain('artefact-damage');
    expect(html).not.toContain('No warnings.');
    expect(html).toContain('>time (s)<');
    // warnings print numbers one way: no float noise (at most 4 significant digits in a row)
    for (const w of j.warnings) expect(w.message, w.message).not.toMatch(/\d\.\d{6,}/);
    // --json-out stays small: no loop table inlined
    expect(statSync(join(dir, 'r.json')).size).toBeLessThan(64 * 1024);
  });

  test('count --gate 20 is 20 µε: it keeps the cycles and says µε', async () => {
    const r = await cli(['count', file(), '--column', 'SG1_ue', '--gate', '20', '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(j.unit).toBe('µε');
    expect(j.cycles).toBeGreaterThan(1000);
    expect(j.removedReversals).toBeLessThan(j.turningPoints);
    // counts are not rounded in the text
    const text = (await cli(['count', file(), '--column', 'SG1_ue', '--gate', '20'])).stdout;
    expect(text).toContain(`cycles ${j.cycles};`);
    expect(Number.isInteger(j.cycles)).toBe(false); // the half cycles of the residue are there
  });

  test('a job file with "time": "Zeit_s" is bad input (exit 2) naming the field; a value of 1e-200 with --kt 2 assesses', async () => {
    writeFileSync(join(dir, 'job.json'), JSON.stringify({ format: 'loopwise-job', version: 1, material: 'SAE 1045 (hot rolled and normalized)', file: 'bracket_run.csv', time: 'Zeit_s', channels: [{ column: 'SG1_ue', quantity: 'strain', unit: 'microstrain' }] }));
    const bad = await cli(['assess', '--job', join(dir, 'job.json')]);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toMatch(/job\.json: time: /);
    writeFileSync(join(dir, 'tiny.csv'), 'stress\n100\n1e-200\n-120\n80\n');
    const tiny = await cli(['assess', join(dir, 'tiny.csv'), '--kt', '2', '--material', 'SAE 1045', '--json']);
    expect(tiny.stderr).toBe('');
    expect(tiny.code).toBe(0);
    expect(Number.isFinite(JSON.parse(tiny.stdout).channels[0].report.damage.perRepeat)).toBe(true);
  });

  test('the cycles CSVs of count and assess share their column names and write an infinite life as Infinity', async () => {
    expect((await cli(['count', file(), '--column', 'SG1_ue', '--cycles-out', join(dir, 'c.csv')])).code).toBe(0);
    expect((await cli(['assess', file(), '--column', 'SG1_ue', '--material', 'SAE 1045', '--cycles-out', join(dir, 'a.csv')])).code).toBe(0);
    const head = (f: string) => readFileSync(join(dir, f), 'utf8').split('\n', 1)[0].split(',');
    for (const name of ['start_sample', 'turn_sample', 'close_sample', 'count']) {
      expect(head('c.csv')).toContain(name);
      expect(head('a.csv')).toContain(name);
    }
    const a = readFileSync(join(dir, 'a.csv'), 'utf8');
    expect(a).not.toMatch(/,inf,/);
    expect(a).toMatch(/,Infinity,/); // the gated small loops below the fatigue limit
  });
});
