import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, test } from 'vitest';
import { FleetError } from '../src/FleetError';
import { planFleet } from '../src/planFleet';
import { BINS, JOB, writeHistory } from './support/makeFleet';

// Manifests and folders: invented files for the tests.
const root = mkdtempSync(join(tmpdir(), 'loopwise-fleet-plan-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

function folder(name: string): string {
  const d = join(root, name);
  mkdirSync(join(d, 'data'), { recursive: true });
  writeHistory(join(d, 'data', 'f000.csv'), 200, 1, 1);
  writeHistory(join(d, 'data', 'b.csv'), 300, 1, 2);
  writeFileSync(join(d, 'job.json'), JSON.stringify(JOB));
  return d;
}

describe('planFleet(path, options)', () => {
  test('planFleet(<JSON manifest>) reads its settings and rows; channels default to the job\'s; the key ignores the row', () => {
    const d = folder('json');
    const manifest = { format: 'loopwise-fleet', version: 1, unit: 'h', targetService: 5000, bins: BINS, job: 'job.json', files: [{ file: 'data/f000.csv', asset: 'A', usage: 2 }, { file: 'data/b.csv', asset: 'B', channels: ['right'], usage: 1.5 }] };
    writeFileSync(join(d, 'fleet.json'), JSON.stringify(manifest));
    const plan = planFleet(join(d, 'fleet.json'));
    expect(plan.failures).toEqual([]);
    expect(plan.settings).toEqual({ unit: 'h', targetService: 5000, bins: BINS });
    expect(plan.tasks.map((t) => [t.row, t.asset, t.channels, t.usage])).toEqual([[1, 'A', ['left', 'right'], 2], [2, 'B', ['right'], 1.5]]);
    expect(plan.tasks[0].key).toMatch(/^[0-9a-f]{32}$/);
    writeFileSync(join(d, 'swapped.json'), JSON.stringify({ ...manifest, files: [manifest.files[1], manifest.files[0]] }));
    const swapped = planFleet(join(d, 'swapped.json'));
    expect(swapped.tasks.map((t) => t.key)).toEqual([plan.tasks[1].key, plan.tasks[0].key]);
  });

  test('planFleet(<folder>) takes each file as an asset, each sub-folder as one, and the usage from the job\'s service', () => {
    const d = folder('folder');
    mkdirSync(join(d, 'truck-7'));
    writeHistory(join(d, 'truck-7', 'x.csv'), 200, 1, 3);
    writeFileSync(join(d, 'job.json'), JSON.stringify({ ...JOB, file: 'data/f000.csv', service: { unit: 'km', perRepeat: 0.5 } }));
    writeFileSync(join(d, 'top.csv'), 'time,left,right\n0,1,2\n1,3,1\n');
    const plan = planFleet(d, { bins: BINS });
    expect(plan.tasks.map((t) => [t.shown.replace(d + '/', ''), t.asset, t.usage])).toEqual([['data/b.csv', 'data', 0.5], ['data/f000.csv', 'data', 0.5], ['top.csv', 'top', 0.5], ['truck-7/x.csv', 'truck-7', 0.5]]);
    expect(plan.settings.unit).toBe('km');
  });

  test('planFleet: a row listed twice counts once; the second is a failure naming the first', () => {
    const d = folder('twice');
    writeFileSync(join(d, 'm.csv'), 'file,asset,usage,job\ndata/b.csv,A,1,job.json\ndata/b.csv,A,1,job.json\n');
    const plan = planFleet(join(d, 'm.csv'), { unit: 'h', bins: BINS });
    expect(plan.tasks).toHaveLength(1);
    expect(plan.failures[0].failure!.message).toMatch(/m\.csv row 2 \(line 3\): the same file, asset, channels, usage and job as row 1; a file counts once/);
  });

  test('planFleet: manifest errors name the manifest and the field', () => {
    const d = folder('errors');
    writeFileSync(join(d, 'a.json'), JSON.stringify({ format: 'loopwise-fleet', version: 1, unit: 'h', bins: BINS, files: [], colour: 1 }));
    expect(() => planFleet(join(d, 'a.json'))).toThrow(/a\.json: unknown field 'colour'/);
    writeFileSync(join(d, 'b.json'), JSON.stringify({ format: 'loopwise-fleet', version: 1, unit: 'h', bins: BINS, files: [] }));
    expect(() => planFleet(join(d, 'b.json'))).toThrow(/lists no files/);
    expect(() => planFleet(join(d, 'b.json'), { unit: 'km' })).toThrow(/unit: the manifest sets it; --unit cannot be given too/);
    writeFileSync(join(d, 'c.json'), JSON.stringify({ format: 'loopwise-fleet', version: 1, unit: 'h', bins: { ...BINS, range: { count: 0, min: 0, max: 1 } }, files: [{ file: 'data/b.csv', asset: 'A', usage: 1, job: 'job.json' }] }));
    expect(() => planFleet(join(d, 'c.json'))).toThrow(/c\.json: bins\.range: .*count must be an integer >= 1/);
    writeFileSync(join(d, 'd.json'), '{ "format": ');
    expect(() => planFleet(join(d, 'd.json'))).toThrow(FleetError);
    writeFileSync(join(d, 'e.json'), JSON.stringify({ format: 'loopwise-fleet', version: 1, unit: 'h', targetService: -3, bins: BINS, files: [{ file: 'data/b.csv', asset: 'A', usage: 1, job: 'job.json' }] }));
    expect(() => planFleet(join(d, 'e.json'))).toThrow(/targetService: a finite number > 0 of h, got -3/);
  });

  test('planFleet: a row naming a file outside the manifest\'s folder fails unless anywhere; NaN, Infinity, 0 and text usages fail', () => {
    const d = folder('outside');
    writeHistory(join(root, 'elsewhere.csv'), 100, 1, 4);
    writeFileSync(join(d, 'm.csv'), ['file,asset,usage,job', '../elsewhere.csv,A,1,job.json', 'data/b.csv,A,NaN,job.json', 'data/b.csv,B,Infinity,job.json', 'data/b.csv,C,0,job.json', 'data/b.csv,D,two,job.json', 'data/b.csv,E,,job.json'].join('\n'));
    const plan = planFleet(join(d, 'm.csv'), { unit: 'h', bins: BINS });
    expect(plan.tasks).toHaveLength(0);
    expect(plan.failures[0].failure!.message).toMatch(/row 1: file: "\.\.\/elsewhere\.csv" lies outside/);
    for (let k = 1; k < 6; k++) expect(plan.failures[k].failure!.message).toMatch(new RegExp(`row ${k + 1} \\(line ${k + 2}\\): usage: the service the file stands for must be a finite number > 0`));
    expect(planFleet(join(d, 'm.csv'), { unit: 'h', bins: BINS, anywhere: true }).tasks).toHaveLength(1);
  });
});
