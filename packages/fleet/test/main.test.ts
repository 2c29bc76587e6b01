import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, test } from 'vitest';
import { fleetMain, type FleetIo } from '../src/main';
import { BINS, JOB, makeFleet, SETTINGS, writeHistory } from './support/makeFleet';

// The command in this process (from sources, so on one thread: --sequential), with its output
// captured: progress on a terminal, the folder and JSON manifest forms. Invented data.
const root = mkdtempSync(join(tmpdir(), 'loopwise-fleet-main-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

function io(terminal: boolean): FleetIo & { out: string; err: string } {
  const o = { out: '', err: '', stderrIsTerminal: terminal, stdout: (t: string) => void (o.out += t), stderr: (t: string) => void (o.err += t) };
  return o;
}

describe('fleetMain(argv, io)', () => {
  test('run --sequential shows progress over files on a terminal, and none elsewhere or with --quiet', async () => {
    const made = makeFleet(join(root, 'progress'), 3, 2, 500, 800);
    const term = io(true);
    expect(await fleetMain(['run', made.manifest, '--out', join(root, 'p1'), ...SETTINGS, '--sequential'], term)).toBe(0);
    expect(term.err).toContain('\r[##############################] 3/3 files');
    expect(term.err.endsWith('\r\x1b[K')).toBe(true);
    const again = io(true);
    expect(await fleetMain(['run', made.manifest, '--out', join(root, 'p1'), ...SETTINGS, '--sequential'], again)).toBe(0);
    expect(again.err).toContain('3/3 files, 3 from an earlier run');
    const pipe = io(false);
    expect(await fleetMain(['run', made.manifest, '--out', join(root, 'p2'), ...SETTINGS, '--sequential'], pipe)).toBe(0);
    expect(pipe.err).toBe('');
    const quiet = io(true);
    expect(await fleetMain(['run', made.manifest, '--out', join(root, 'p3'), ...SETTINGS, '--sequential', '--quiet'], quiet)).toBe(0);
    expect(quiet.err).toBe('');
    expect(readFileSync(join(root, 'p2', 'fleet.json')).equals(readFileSync(join(root, 'p3', 'fleet.json')))).toBe(true);
  });

  test('run <folder> and run <JSON manifest> of the same files and usages give the same fleet', async () => {
    const d = join(root, 'folder');
    mkdirSync(join(d, 'truck-1'), { recursive: true });
    mkdirSync(join(d, 'truck-2'));
    writeHistory(join(d, 'truck-1', 'a.csv'), 900, 1, 11);
    writeHistory(join(d, 'truck-1', 'b.csv'), 700, 1.2, 12);
    writeHistory(join(d, 'truck-2', 'c.csv'), 800, 0.9, 13);
    writeFileSync(join(d, 'job.json'), JSON.stringify({ ...JOB, file: 'truck-1/a.csv', service: { unit: 'km', perRepeat: 2.5 } }));
    const bins = ['--range-bins', '24:0:720', '--mean-bins', '16:-240:240', '--from-to-bins', '24:-360:360'];
    const a = io(false);
    expect(await fleetMain(['run', d, '--out', join(root, 'f1'), ...bins, '--sequential'], a)).toBe(0);
    expect(a.out).toMatch(/^3 files listed: 3 assessed, 0 failed\nchannel left: 2 assets, 3 files, 7\.5 km/);
    writeFileSync(join(d, 'fleet.json'), JSON.stringify({ format: 'loopwise-fleet', version: 1, unit: 'km', bins: BINS, job: 'job.json', files: [{ file: 'truck-1/a.csv', asset: 'truck-1', usage: 2.5 }, { file: 'truck-1/b.csv', asset: 'truck-1', usage: 2.5 }, { file: 'truck-2/c.csv', asset: 'truck-2', usage: 2.5 }] }));
    const b = io(false);
    expect(await fleetMain(['run', join(d, 'fleet.json'), '--out', join(root, 'f2'), '--sequential'], b)).toBe(0);
    expect(readFileSync(join(root, 'f2', 'spectra.json')).equals(readFileSync(join(root, 'f1', 'spectra.json')))).toBe(true);
    const fa = JSON.parse(readFileSync(join(root, 'f1', 'fleet.json'), 'utf8'));
    const fb = JSON.parse(readFileSync(join(root, 'f2', 'fleet.json'), 'utf8'));
    expect(fb.channels).toEqual(fa.channels);
    expect(fb.assets).toEqual(fa.assets);
  });
});
