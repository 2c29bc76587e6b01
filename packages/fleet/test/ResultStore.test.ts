import { mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, test } from 'vitest';
import type { FileResult } from '../src/FleetTask';
import { ResultStore } from '../src/ResultStore';

const root = mkdtempSync(join(tmpdir(), 'loopwise-fleet-store-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

const result = (key: string, failure: FileResult['failure'] = null): FileResult => ({ format: 'loopwise-fleet-file', version: 1, key, row: 1, file: 'a.csv', asset: 'A', usage: 1, unit: 'h', samples: 3, channels: [], failure });

describe('ResultStore', () => {
  test('ResultStore.put then get returns the result; failures are not kept; a damaged file reads as absent', () => {
    const s = new ResultStore(join(root, 'r'));
    s.put(result('k1'));
    expect(s.get('k1')).toEqual(result('k1'));
    s.put(result('k2', { message: 'bad', input: true }));
    expect(s.get('k2')).toBeNull();
    writeFileSync(join(root, 'r', 'k3.json'), '{"format": "loopwise-fleet-file", "ke');
    expect(s.get('k3')).toBeNull();
    expect(readdirSync(join(root, 'r')).sort()).toEqual(['k1.json', 'k3.json']);
  });

});
