import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parquetReadObjects } from 'hyparquet';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { makeFleet, SETTINGS, writeHistory } from './support/makeFleet';
import { freePort } from './support/redisServer';
import { runFleet } from './support/runFleet';

// Issue 14, bad input: a manifest row naming a missing file, a channel that isn't there (not in
// the job; in the job but not in the file), negative usage, an unreachable queue: exit 2 with the
// row or the address named; the other files still finish and the summary lists the failures.
// Through the built binary; invented data.
let root = '';
let dir = '';
beforeAll(() => {
  root = mkdtempSync(join(tmpdir(), 'loopwise-fleet-bad-'));
  dir = makeFleet(join(root, 'fleet'), 4, 2, 2000, 3000).folder;
  // a file without the 'right' column
  writeHistory(join(dir, 'data', 'two.csv'), 2000, 1, 99);
  const text = readFileSync(join(dir, 'data', 'two.csv'), 'utf8').split('\n').map((l) => l.split(',').slice(0, 2).join(',')).join('\n');
  writeFileSync(join(dir, 'data', 'left-only.csv'), text);
  const rows = readFileSync(join(dir, 'fleet.csv'), 'utf8').trim().split('\n');
  rows.push('data/missing.csv,asset-00,left,1.5,job.json');
  rows.push('data/f001.csv,asset-09,left;middle,1.5,job.json');
  rows.push('data/left-only.csv,asset-09,left;right,1.5,job.json');
  rows.push('data/f002.csv,asset-08,left,-2,job.json');
  writeFileSync(join(dir, 'bad.csv'), rows.join('\n') + '\n');
});
afterAll(() => rmSync(root, { recursive: true, force: true }));

describe('loopwise-fleet run with bad rows', () => {
  test('run bad.csv exits 2, names each bad row on stderr and in the summary, and assesses the other files', async () => {
    const out = join(root, 'out');
    const r = runFleet(['run', join(dir, 'bad.csv'), '--out', out, ...SETTINGS, '--workers', '2'], root);
    expect(r.code).toBe(2);
    const lines = r.stderr.trim().split('\n');
    expect(lines).toHaveLength(4);
    expect(lines[0]).toMatch(/bad\.csv row 5 \(line 6\).*missing\.csv: no such file/);
    expect(lines[1]).toMatch(/bad\.csv row 6 \(line 7\): channels: 'middle' is not a channel of .*job\.json \(its channels: left, right\)/);
    expect(lines[2]).toMatch(/bad\.csv row 7 \(line 8\) \(.*left-only\.csv\): .*right/);
    expect(lines[3]).toMatch(/bad\.csv row 8 \(line 9\): usage: .* > 0 \(in km\), got "-2"/);
    expect(r.stdout).toMatch(/^8 files listed: 4 assessed, 4 failed/);
    expect(r.stdout).toMatch(/failures:\n {2}.*row 5/);
    const fleet = JSON.parse(readFileSync(join(out, 'fleet.json'), 'utf8'));
    expect(fleet.failures.map((f: { row: number }) => f.row)).toEqual([5, 6, 7, 8]);
    expect(fleet.counts).toEqual({ rows: 8, assessed: 4, failed: 4 });
    expect(readFileSync(join(out, 'fleet.html'), 'utf8')).toContain('row 8 (line 9): usage');
    // the per-file table read back with hyparquet (an independent reader): the four good files, two channels each but the fifth-row rule
    const buffer = readFileSync(join(out, 'files.parquet'));
    const rows = await parquetReadObjects({ file: buffer.buffer.slice(buffer.byteOffset, buffer.byteOffset + buffer.byteLength) });
    expect(rows.map((x) => x.row)).toEqual([1, 1, 2, 2, 3, 3, 4, 4]);
    expect(new Set(rows.map((x) => x.channel))).toEqual(new Set(['left', 'right']));
    const summary = fleet.assets.find((a: { asset: string; channel: string }) => a.asset === 'asset-00' && a.channel === 'left');
    const fromParquet = rows.filter((x) => x.asset === 'asset-00' && x.channel === 'left').reduce((s, x) => s + (x.damage_per_repeat as number), 0);
    expect(Math.abs(summary.damage - fromParquet) / summary.damage).toBeLessThan(1e-12);
  });

  test('run --queue redis://127.0.0.1:<a closed port> exits 2 naming the address, before any work', async () => {
    const port = await freePort();
    const out = join(root, 'out-queue');
    const r = runFleet(['run', join(dir, 'fleet.csv'), '--out', out, ...SETTINGS, '--queue', `redis://127.0.0.1:${port}`], root, 30000);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(new RegExp(`^loopwise-fleet run: --queue redis://127\\.0\\.0\\.1:${port}: the queue cannot be reached \\(.*ECONNREFUSED.*\\)\\n$`));
    expect(existsSync(out)).toBe(false);
    const w = runFleet(['worker', '--queue', `redis://127.0.0.1:${port}`], root, 30000);
    expect(w.code).toBe(2);
    expect(w.stderr).toMatch(/--queue redis:\/\/127\.0\.0\.1:\d+: the queue cannot be reached/);
  });

  test('manifest errors exit 2 naming the place: a missing manifest, missing bins, an unknown column', () => {
    const missing = runFleet(['run', join(dir, 'nope.csv'), '--out', join(root, 'o1'), ...SETTINGS], root);
    expect(missing.code).toBe(2);
    expect(missing.stderr).toMatch(/nope\.csv: no such manifest file or folder/);
    const noBins = runFleet(['run', join(dir, 'fleet.csv'), '--out', join(root, 'o2'), '--unit', 'km'], root);
    expect(noBins.code).toBe(2);
    expect(noBins.stderr).toMatch(/fleet\.csv: bins\.range: .*--range-bins count:min:max/);
    writeFileSync(join(dir, 'odd.csv'), 'file,asset,usage,colour\n');
    const odd = runFleet(['run', join(dir, 'odd.csv'), '--out', join(root, 'o3'), ...SETTINGS], root);
    expect(odd.code).toBe(2);
    expect(odd.stderr).toMatch(/odd\.csv line 1: unknown column 'colour'/);
    expect(readdirSync(root).filter((f) => /^o\d$/.test(f))).toEqual([]);
  });

  test('an output over an input is refused before any work: --out the fleet folder, whose fleet.json is the material file the job reads', () => {
    // the job's material file is an input; an output of that name in --out is refused
    const d = join(root, 'clash');
    const made = makeFleet(d, 2, 1, 1000, 1500);
    writeFileSync(join(d, 'fleet.json'), JSON.stringify({ E: 206000, sigmaF: 948, b: -0.092, epsilonF: 0.26, c: -0.445, K: 1258, n: 0.208 }));
    const job = JSON.parse(readFileSync(join(d, 'job.json'), 'utf8'));
    writeFileSync(join(d, 'job.json'), JSON.stringify({ ...job, material: { file: 'fleet.json' } }));
    const before = readFileSync(join(d, 'fleet.json'));
    const r = runFleet(['run', made.manifest, '--out', d, ...SETTINGS], root);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/fleet\.json: is an input of this run/);
    expect(readFileSync(join(d, 'fleet.json')).equals(before)).toBe(true);
    expect(readdirSync(d).filter((f) => f.endsWith('.loopwise-tmp'))).toEqual([]);
    expect(existsSync(join(d, 'results'))).toBe(false); // refused before any work
  });

  test('option errors exit 2 naming the option; help exits 0; no command exits 2 with the help', () => {
    const m = join(dir, 'fleet.csv');
    const cases: [string[], RegExp][] = [
      [['run', m, '--out', join(root, 'x'), ...SETTINGS, '--workers=-1'], /--workers: expected an integer >= 0, got "-1"/],
      [['run', m, '--out', join(root, 'x'), ...SETTINGS, '--workers', '2', '--sequential'], /--sequential and --workers: give one of them/],
      [['run', m, ...SETTINGS], /--out: the output folder is needed/],
      [['run', m, '--out', join(root, 'x'), ...SETTINGS, '--colour'], /Unknown option '--colour'/],
      [['run', m, '--out', join(root, 'x'), '--unit', 'km', '--range-bins', '0:0:1', '--mean-bins', '2:0:1', '--from-to-bins', '2:0:1'], /--range-bins: expected count:min:max .* got "0:0:1"/],
      [['run', m, '--out', join(root, 'x'), ...SETTINGS, '--queue', 'http://127.0.0.1:1'], /--queue http:\/\/127\.0\.0\.1:1: expected a redis:\/\/ or rediss:\/\/ address/],
      [['worker'], /--queue: the address of the Redis server .* is needed/],
      [['survey'], /unknown command "survey"; commands: run, worker/],
    ];
    for (const [args, message] of cases) {
      const r = runFleet(args, root);
      expect(r.code, args.join(' ')).toBe(2);
      expect(r.stderr).toMatch(message);
    }
    expect(existsSync(join(root, 'x'))).toBe(false);
    const help = runFleet(['--help'], root);
    expect(help.code).toBe(0);
    expect(help.stdout).toMatch(/loopwise-fleet run <manifest\.csv \| manifest\.json \| folder> --out <folder>/);
    expect(runFleet([], root).code).toBe(2);
  });
});
