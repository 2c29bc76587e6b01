import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, mkdirSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, test } from 'vitest';
import { formatNumber } from '../../src/report/formatNumber';

// End to end through the built binary (pnpm test builds before it runs the tests).
const bin = new URL('../../dist/bin.js', import.meta.url).pathname;
let dir = '';

function run(args: string[], cwd = dir) {
  const r = spawnSync(process.execPath, [bin, ...args], { cwd, encoding: 'utf8' });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

beforeAll(() => {
  expect(existsSync(bin), 'build the cli first (pnpm test does)').toBe(true);
  dir = mkdtempSync(join(tmpdir(), 'loopwise-cli-'));
  const rows = ['time_s,load_kN,strain_ue'];
  for (let i = 0; i < 4000; i++) {
    const t = i / 100;
    rows.push(`${t.toFixed(2)},${(20 * Math.sin(t * 3.1) + 8 * Math.sin(t * 11.3)).toFixed(3)},${(900 * Math.sin(t * 3.1) + 250 * Math.sin(t * 7.7)).toFixed(1)}`);
  }
  writeFileSync(join(dir, 'rig.csv'), rows.join('\n') + '\n');
});

describe('loopwise (built binary)', () => {
  test('loopwise demo prints the summary of the invented demo with the caution', () => {
    const r = run(['demo']);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/invented/i);
    expect(r.stdout).toMatch(/life\s+[\d.e+]+ repeats = [\d.e+]+ km/);
    expect(r.stdout).toMatch(/Caution: .*licensed engineer/);
  });

  test('loopwise assess writes JSON, cycles and HTML outputs, and the JSON is byte-identical on a second run', () => {
    const args = ['assess', 'rig.csv', '--column', 'load_kN', '--quantity', 'load', '--mpa-per-unit', '12', '--kt', '2.2', '--material', 'SAE 1045', '--service', '0.1 h', '--scatter-factor', '3'];
    const a = run([...args, '--json-out', 'a.json', '--cycles-out', 'a.csv', '--html-out', 'a.html']);
    expect(a.stderr).toBe('');
    expect(a.code).toBe(0);
    const b = run([...args, '--json-out', 'b.json', '--cycles-out', 'b.csv']);
    expect(b.code).toBe(0);
    const ja = readFileSync(join(dir, 'a.json'), 'utf8');
    expect(ja).toBe(readFileSync(join(dir, 'b.json'), 'utf8'));
    const report = JSON.parse(ja);
    expect(report.format).toBe('loopwise-cli-report');
    expect(report.version).toBe(1);
    expect(report.results[0].unit).toBe('h');
    const csv = readFileSync(join(dir, 'a.csv'), 'utf8').trim().split('\n');
    expect(csv[0]).toMatch(/^channel,start_sample/);
    expect(csv.length).toBeGreaterThan(10);
    // the loops go to the CSV only; the report's loop table is empty with or without it
    expect(report.channels[0].report.loops.count).toEqual([]);
    // the CSV's damage column sums to the report's damage (summation order apart)
    const sum = csv.slice(1).reduce((s, line) => s + Number(line.split(',')[13]), 0);
    expect(Math.abs(sum / report.results[0].damagePerRepeat - 1)).toBeLessThan(1e-12);
    expect(readFileSync(join(dir, 'a.html'), 'utf8')).toMatch(/data-plot="history"/);
    // without --cycles-out the report is the same to the last digit
    const c = JSON.parse((run([...args, '--json']).stdout));
    expect(c.channels[0].report.loops.count).toEqual([]);
    expect(c.results[0].damagePerRepeat).toBe(report.results[0].damagePerRepeat);
  });

  test('loopwise assess --mean-stress all lists every correction in one results table, for two channels', () => {
    const r = run(['assess', 'rig.csv', '--column', '2', '--column', '3', '--quantity', 'stress', '--kt', '1.8', '--material', 'SAE 1045', '--mean-stress', 'all', '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(j.results.length).toBe(10);
    expect(new Set(j.results.map((x: { meanStress: string }) => x.meanStress)).size).toBe(5);
  });

  test('--mean-stress all: the HTML results table has the same rows as the JSON, the detailed correction marked', () => {
    const args = ['assess', 'rig.csv', '--column', '2', '--column', '3', '--quantity', 'stress', '--kt', '1.8', '--material', 'SAE 1045', '--mean-stress', 'all'];
    const j = JSON.parse(run([...args, '--json']).stdout);
    expect(run([...args, '--html-out', 'all.html']).code).toBe(0);
    const html = readFileSync(join(dir, 'all.html'), 'utf8');
    const table = /<table class="results">.*?<\/table>/s.exec(html)?.[0] ?? '';
    const rows = [...table.matchAll(/<tr><th>([^<]*)<\/th><td>([^<]*)<\/td><td class="num">[^<]*<\/td><td class="num">([^<]*)<\/td>/g)];
    expect(rows).toHaveLength(10);
    expect(rows.filter((m) => m[2].endsWith(' *'))).toHaveLength(2); // the main correction of each channel
    rows.forEach((m, i) => {
      expect(m[1]).toBe(j.results[i].channel);
      expect(m[3]).toBe(formatNumber(j.results[i].repeats));
    });
  });

  test('loopwise count writes a matrix that sums to the cycle count', () => {
    const r = run(['count', 'rig.csv', '--column', 'strain_ue', '--quantity', 'strain', '--unit', 'microstrain', '--matrix-out', 'm.json', '--json']);
    expect(r.code).toBe(0);
    const s = JSON.parse(r.stdout);
    const m = JSON.parse(readFileSync(join(dir, 'm.json'), 'utf8'));
    expect(m.format).toBe('loopwise-cycle-matrix');
    const total = (m.counts as number[]).reduce((a, b) => a + b, 0);
    expect(total).toBeCloseTo(s.cycles, 9);
    expect(s.spectrum[0].exceedances).toBeCloseTo(s.cycles, 9);
  });

  test('loopwise margin finds the load factor for a target life', () => {
    const r = run(['margin', 'rig.csv', '--column', 'load_kN', '--quantity', 'load', '--mpa-per-unit', '12', '--kt', '2.2', '--material', 'SAE 1045', '--target-repeats', '1000', '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(j.channels[0].factor).toBeGreaterThan(0);
    expect(j.channels[0].repeats).toBeLessThanOrEqual(1000);
  });

  test('loopwise material estimates a steel from Su and lists the handbook table', () => {
    const r = run(['material', '--su', '700', '--out', 'steel.json']);
    expect(r.code).toBe(0);
    const m = JSON.parse(readFileSync(join(dir, 'steel.json'), 'utf8'));
    expect(m.sigmaF).toBeGreaterThan(0);
    expect(m.source).toMatch(/Bäumel|Seeger|Uniform/i);
    const l = run(['material', '--list']);
    expect(l.code).toBe(0);
    expect(l.stdout).toMatch(/not certified design data/);
    // a table for people: one row per handbook entry with its constants, --json for the full records
    const j = JSON.parse(run(['material', '--list', '--json']).stdout);
    expect(j.materials.length).toBeGreaterThan(3);
    for (const m of j.materials) {
      const row = l.stdout.split('\n').find((x) => x.startsWith(m.name + ' '));
      expect(row, m.name).toBeDefined();
      expect(row!.trim().split(/\s{2,}/).slice(1, 9).map(Number)).toEqual([m.E, m.sigmaF, m.b, m.epsilonF, m.c, m.K, m.n, m.Su]);
    }
  });

  test('loopwise help demo says what the demo job sets (service per repeat and its unit, gate, scatter factor)', () => {
    const job = JSON.parse(readFileSync(new URL('../../demo/demo-job.json', import.meta.url), 'utf8'));
    const help = run(['help', 'demo']).stdout.replace(/\s+/g, ' ');
    expect(help).toContain(`${job.service.perRepeat} ${job.service.unit}`);
    expect(help).toContain(`gate of ${job.gate} µε`);
    expect(help).toContain(`scatter factor ${job.scatterFactor}`);
    expect(run(['demo']).stdout).toMatch(new RegExp(`repeats = [0-9.]+ ${job.service.unit}`));
  });

  test('--help on every command shows examples; --version prints the version', () => {
    for (const c of ['assess', 'count', 'margin', 'material']) {
      const r = run([c, '--help']);
      expect(r.code).toBe(0);
      expect(r.stdout).toMatch(/Example/);
    }
    expect(run(['--version']).stdout).toMatch(/^loopwise \d+\.\d+\.\d+/);
  });

  test('outputs never overwrite an input file', () => {
    const r = run(['assess', 'rig.csv', '--column', '2', '--material', 'SAE 1045', '--cycles-out', 'rig.csv']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/rig\.csv: is an input of this run; loopwise never writes over its inputs/);
    expect(readFileSync(join(dir, 'rig.csv'), 'utf8')).toMatch(/^time_s,load_kN/);
  });
});

describe('loopwise bad input: exit 2, one line naming where, no partial output', () => {
  const cases: [string, (d: string) => string[], RegExp][] = [
    ['a missing file', () => ['assess', 'nope.csv', '--material', 'SAE 1045'], /nope\.csv.*no such file/],
    ['a directory', (d) => { mkdirSync(join(d, 'adir'), { recursive: true }); return ['assess', 'adir', '--material', 'SAE 1045']; }, /adir.*directory/],
    ['an empty file', (d) => { writeFileSync(join(d, 'empty.csv'), ''); return ['assess', 'empty.csv', '--material', 'SAE 1045']; }, /empty\.csv.*empty file/],
    ['a header only', (d) => { writeFileSync(join(d, 'header.csv'), 'a,b\n'); return ['assess', 'header.csv', '--material', 'SAE 1045']; }, /header\.csv.*header only/],
    ['a non-numeric cell', (d) => { writeFileSync(join(d, 'text.csv'), 'a,b\n1,2\n3,x\n'); return ['assess', 'text.csv', '--column', 'b', '--material', 'SAE 1045']; }, /text\.csv, line 3, column 2/],
    ['NaN text', (d) => { writeFileSync(join(d, 'nan.csv'), 'a\n1\nNaN\n'); return ['assess', 'nan.csv', '--material', 'SAE 1045']; }, /nan\.csv, line 3, column 1/],
    ['ragged rows', (d) => { writeFileSync(join(d, 'ragged.csv'), 'a,b\n1,2\n3\n'); return ['assess', 'ragged.csv', '--column', 'b', '--material', 'SAE 1045']; }, /ragged\.csv, line 3/],
    ['the wrong delimiter', (d) => { writeFileSync(join(d, 'pipes.csv'), 'a|b\n1|2\n3|4\n'); return ['assess', 'pipes.csv', '--column', '1', '--column', '2', '--material', 'SAE 1045']; }, /pipes\.csv/],
    ['binary garbage', (d) => { writeFileSync(join(d, 'bin.csv'), Buffer.from([0x00, 0xff, 0x13, 0x00, 0x88, 0x0a, 0x01])); return ['assess', 'bin.csv', '--material', 'SAE 1045']; }, /bin\.csv/],
    ['an unknown column', () => ['assess', 'rig.csv', '--column', 'torque', '--material', 'SAE 1045'], /rig\.csv.*torque/],
    ['invalid material JSON', (d) => { writeFileSync(join(d, 'bad-material.json'), '{ "E": 200000, '); return ['assess', 'rig.csv', '--column', '2', '--material', 'bad-material.json']; }, /bad-material\.json: invalid JSON in the material file: it ends too early/],
    ['a material failing validation', (d) => { writeFileSync(join(d, 'neg.json'), JSON.stringify({ E: -1, sigmaF: 900, b: -0.09, epsilonF: 0.3, c: -0.5, K: 1200, n: 0.2 })); return ['assess', 'rig.csv', '--column', '2', '--material', 'neg.json']; }, /E/],
    ['an unknown option', () => ['assess', 'rig.csv', '--colour', 'red'], /--colour/],
    ['an unknown command', () => ['asses', 'rig.csv'], /unknown command "asses"/],
    ['an unknown correction', () => ['assess', 'rig.csv', '--column', '2', '--material', 'SAE 1045', '--mean-stress', 'goodmann'], /--mean-stress: one of none, morrow/],
    ['a stress-life correction on the strain-life route', () => ['assess', 'rig.csv', '--column', '2', '--material', 'SAE 1045', '--mean-stress', 'goodman'], /--mean-stress: 'goodman' corrects the amplitude on the stress-life route/],
    ['an unknown notch rule', () => ['assess', 'rig.csv', '--column', '2', '--material', 'SAE 1045', '--kt', '2', '--rule', 'elastic'], /--rule: one of neuber, glinka, linear/],
  ];
  for (const [name, args, message] of cases) {
    test(`${name}`, () => {
      const outputs = join(dir, `out-${name.replace(/\W+/g, '-')}`);
      mkdirSync(outputs, { recursive: true });
      const r = run([...args(dir), '--json-out', join(outputs, 'r.json'), '--html-out', join(outputs, 'r.html')]);
      expect(r.code, r.stderr).toBe(2);
      expect(r.stderr.trim().split('\n').length).toBe(1);
      expect(r.stderr).toMatch(message);
      expect(readdirSync(outputs)).toEqual([]);
    });
  }
});

describe('readDelimitedParallel (built package, parsing on a worker thread)', () => {
  test('delivers the same chunks and report as readDelimited, and the same errors', async () => {
    const dist = await import(new URL('../../dist/index.js', import.meta.url).href);
    const file = join(dir, 'rig.csv');
    const channels = [{ column: 'strain_ue', quantity: 'strain', unit: 'microstrain' }];
    const collect = async (read: (p: string, o: unknown) => Promise<unknown>) => {
      const parts: number[] = [];
      const report = await read(file, { channels, chunkSamples: 333, onChunk: (c: { firstSample: number; channels: Float64Array[] }) => parts.push(c.firstSample, ...c.channels[0]) });
      return { parts, report };
    };
    const worker = await collect(dist.readDelimitedParallel);
    const local = await collect(dist.readDelimited);
    expect(worker.parts).toEqual(local.parts);
    expect(worker.report).toEqual(local.report);
    await expect(dist.readDelimitedParallel(join(dir, 'text.csv'), { channels: [{ column: 'b', quantity: 'stress', unit: 'MPa' }] })).rejects.toThrow(/text\.csv, line 3, column 2/);
  });
});

describe('progress display', () => {
  test('a progress bar goes to stderr only when stderr is a terminal', async () => {
    const { main } = await import(new URL('../../dist/index.js', import.meta.url).href);
    const args = ['assess', join(dir, 'rig.csv'), '--column', '2', '--material', 'SAE 1045'];
    for (const terminal of [true, false]) {
      let err = '';
      const code = await main(args, { stdout: () => {}, stderr: (t: string) => (err += t), stderrIsTerminal: terminal });
      expect(code).toBe(0);
      if (terminal) expect(err).toMatch(/reading +\[#+\.*\] +\d+ % [\d,]+ samples/);
      else expect(err).toBe('');
    }
  });
});
