import { mkdtempSync, readdirSync, readFileSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { makeFleet, SETTINGS } from './support/makeFleet';
import { runFleet, startFleet } from './support/runFleet';

// Issue 14, first test: with no server, 60 generated files (several assets, several channels,
// different lengths; invented data) give the same fleet result on 1 and 2 workers as one
// sequential run. Through the built binary (pnpm test builds first).
let root = '';
let manifest = '';
beforeAll(() => {
  root = mkdtempSync(join(tmpdir(), 'loopwise-fleet-local-'));
  manifest = makeFleet(join(root, 'fleet'), 60, 7, 1500, 12000).manifest;
});
afterAll(() => rmSync(root, { recursive: true, force: true }));

const read = (out: string, name: string) => readFileSync(join(out, name));

describe('loopwise-fleet run on the local pool', () => {
  test('run <manifest> --workers 1 and --workers 2 equal --sequential: fleet.json, spectra.json and the Parquet files byte for byte', () => {
    const outs: Record<string, string> = {};
    for (const [name, args] of [['sequential', ['--sequential']], ['one', ['--workers', '1']], ['two', ['--workers', '2']]] as const) {
      const out = join(root, `out-${name}`);
      const r = runFleet(['run', manifest, '--out', out, ...SETTINGS, ...args], root);
      expect(r.stderr).toBe('');
      expect(r.code).toBe(0);
      expect(r.stdout).toMatch(/^60 files listed: 60 assessed, 0 failed/);
      outs[name] = out;
    }
    const fleet = JSON.parse(read(outs.sequential, 'fleet.json').toString());
    expect(fleet.counts).toEqual({ rows: 60, assessed: 60, failed: 0 });
    expect(fleet.channels.map((c: { channel: string }) => c.channel)).toEqual(['left', 'right']);
    expect(fleet.channels[0].assets).toBe(7);
    expect(fleet.channels[0].files).toBe(60);
    expect(fleet.channels[1].files).toBe(48); // every fifth row lists the left channel only
    for (const other of ['one', 'two']) {
      // exact merge: the matrices bit-identical (spectra.json holds them in the exact encoding),
      // the damages equal (the 1e-12 relative of the issue holds a fortiori: they are equal)
      for (const f of ['fleet.json', 'spectra.json', 'files.parquet', 'assets.parquet', 'fleet.html']) expect(read(outs[other], f).equals(read(outs.sequential, f)), `${other}: ${f}`).toBe(true);
    }
  });

  test('the fleet sums are the sums of the files: asset damage = Σ file damage, fleet damage per unit = Σ damage ÷ Σ usage', () => {
    const out = join(root, 'out-sequential');
    const fleet = JSON.parse(read(out, 'fleet.json').toString());
    const files = readFileSync(manifest, 'utf8').trim().split('\n').slice(1).map((l) => l.split(','));
    const usageOf = new Map<string, number>();
    for (const f of files) usageOf.set(f[1], (usageOf.get(f[1]) ?? 0) + Number(f[3]));
    for (const a of fleet.assets.filter((x: { channel: string }) => x.channel === 'left')) expect(a.usage).toBeCloseTo(usageOf.get(a.asset)!, 9);
    const left = fleet.channels[0];
    const d = fleet.assets.filter((x: { channel: string }) => x.channel === 'left').reduce((s: number, a: { damage: number }) => s + a.damage, 0);
    const u = fleet.assets.filter((x: { channel: string }) => x.channel === 'left').reduce((s: number, a: { usage: number }) => s + a.usage, 0);
    expect(Math.abs(left.damagePerUnit - d / u) / (d / u)).toBeLessThan(1e-12);
    expect(left.distribution.p50).toBeLessThanOrEqual(left.distribution.p95);
    expect(left.distribution.p95).toBeLessThanOrEqual(left.distribution.max);
  });

  test('fleet.html opens with the safety caution and draws the damage distribution and the extrapolated spectrum of each channel', () => {
    const html = read(join(root, 'out-sequential'), 'fleet.html').toString();
    expect(html.indexOf('class="caution"')).toBeLessThan(html.indexOf('<h2>Channel'));
    expect(html).toMatch(/Validate predictions by test, apply scatter factors, and defer to the applicable design codes and licensed engineering review/);
    expect(html.match(/aria-label="damage per km of each asset"/g)).toHaveLength(2);
    expect(html.match(/aria-label="range exceedance spectrum"/g)).toHaveLength(2);
    expect(html).toContain('target, tail fit');
    expect(html).not.toMatch(/<script/);
  });

  test('a rerun into the same folder redoes no file and gives the same result', () => {
    const out = join(root, 'out-two');
    const before = read(out, 'fleet.json');
    const times = readdirSync(join(out, 'results')).map((f) => statSync(join(out, 'results', f)).mtimeMs);
    const r = runFleet(['run', manifest, '--out', out, ...SETTINGS, '--workers', '2'], root);
    expect(r.code).toBe(0);
    expect(read(out, 'fleet.json').equals(before)).toBe(true);
    expect(readdirSync(join(out, 'results')).map((f) => statSync(join(out, 'results', f)).mtimeMs)).toEqual(times);
  });
});

describe('loopwise-fleet run, interrupted and run again', () => {
  test('SIGINT in the middle of a run leaves only whole results and no temporary; the rerun redoes none of them and equals an uninterrupted run', async () => {
    const made = makeFleet(join(root, 'fleet-resume'), 16, 4, 40000, 60000, 5);
    const out = join(root, 'out-resume');
    const run = startFleet(['run', made.manifest, '--out', out, ...SETTINGS, '--workers', '1'], root);
    const results = join(out, 'results');
    const end = Date.now() + 60000;
    while (Date.now() < end) {
      let n = 0;
      try {
        n = readdirSync(results).filter((f) => f.endsWith('.json')).length;
      } catch {
        n = 0;
      }
      if (n >= 3) break;
      await new Promise((r) => setTimeout(r, 20));
    }
    run.child.kill('SIGINT');
    expect(await run.exited).toBe(130);
    const kept = readdirSync(results);
    expect(kept.filter((f) => !f.endsWith('.json'))).toEqual([]); // no temporary left
    expect(kept.length).toBeGreaterThanOrEqual(3);
    expect(kept.length).toBeLessThan(16);
    const times = kept.map((f) => {
      JSON.parse(readFileSync(join(results, f), 'utf8')); // whole
      return statSync(join(results, f)).mtimeMs;
    });
    const again = runFleet(['run', made.manifest, '--out', out, ...SETTINGS, '--workers', '2'], root);
    expect(again.code, again.stderr).toBe(0);
    expect(kept.map((f) => statSync(join(results, f)).mtimeMs)).toEqual(times); // not redone
    expect(readdirSync(results)).toHaveLength(16);
    const fresh = runFleet(['run', made.manifest, '--out', join(root, 'out-resume-fresh'), ...SETTINGS, '--sequential'], root);
    expect(fresh.code).toBe(0);
    for (const f of ['fleet.json', 'spectra.json', 'files.parquet']) expect(readFileSync(join(out, f)).equals(readFileSync(join(root, 'out-resume-fresh', f))), f).toBe(true);
  }, 120000);
});
