import { mkdtempSync, rmSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, test } from 'vitest';
import { fileKey } from '../src/fileKey';
import type { FleetTask } from '../src/FleetTask';
import { BINS } from './support/makeFleet';

const root = mkdtempSync(join(tmpdir(), 'loopwise-fleet-key-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

describe('fileKey(task, jobFiles)', () => {
  test('fileKey(task) changes when the file or the job changes, and not otherwise', () => {
    const f = join(root, 'data.csv');
    const j = join(root, 'job.json');
    writeFileSync(f, 'x\n1\n2\n');
    writeFileSync(j, '{}');
    utimesSync(f, 1.7e9, 1.7e9); // whole seconds: setting them back below is exact
    const task: FleetTask = { key: '', row: 1, where: 'm row 1', file: f, shown: 'data.csv', asset: 'A', channels: ['x'], usage: 1, job: j, jobShown: 'job.json', anywhere: false, bins: BINS, unit: 'h' };
    const k = fileKey(task, []);
    expect(fileKey({ ...task, row: 7, where: 'other' }, [])).toBe(k);
    expect(fileKey({ ...task, usage: 2 }, [])).not.toBe(k);
    utimesSync(f, 1.7e9, 1.7e9 + 5);
    expect(fileKey(task, [])).not.toBe(k);
    utimesSync(f, 1.7e9, 1.7e9);
    expect(fileKey(task, [])).toBe(k);
    writeFileSync(j, '{ }');
    expect(fileKey(task, [])).not.toBe(k);
  });
});

