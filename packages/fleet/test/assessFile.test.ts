import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { FromToMatrix, RainflowCounter, RangeMeanMatrix } from '@loopwise/rainflow';
import { afterAll, describe, expect, test } from 'vitest';
import { assessFile } from '../src/assessFile';
import { planFleet } from '../src/planFleet';
import { BINS, JOB, writeHistory } from './support/makeFleet';

// INVENTED files (the seeded sums of sines of support/makeFleet), written once more in a logger's
// layout: semicolons and decimal commas, which the job's dialect names.
const root = mkdtempSync(join(tmpdir(), 'loopwise-fleet-assess-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

/** The file's columns as numbers (the plain CSV written by writeHistory). */
function columnsOf(path: string): { left: number[]; right: number[] } {
  const rows = readFileSync(path, 'utf8').trim().split('\n').slice(1).map((l) => l.split(',').map(Number));
  return { left: rows.map((r) => r[1]), right: rows.map((r) => r[2]) };
}

describe('assessFile(task)', () => {
  test('assessFile counts the matrices from the same read as the life: each channel equals its own rainflow count of the file (repeat residue, the gate the job sets), parseThread true or false alike', async () => {
    const d = join(root, 'dialect');
    mkdirSync(join(d, 'data'), { recursive: true });
    const plain = join(root, 'plain.csv');
    writeHistory(plain, 3000, 1, 11);
    // the same numbers in a semicolon / decimal-comma layout
    const text = readFileSync(plain, 'utf8').replaceAll(',', ';').replaceAll('.', ',');
    writeFileSync(join(d, 'data', 'f000.csv'), text);
    writeFileSync(join(d, 'job.json'), JSON.stringify({ ...JOB, gate: 7.5, dialect: { delimiter: 'semicolon', decimalComma: true } }));
    writeFileSync(join(d, 'fleet.csv'), 'file,asset,usage,job\ndata/f000.csv,A,2,job.json\n');
    const plan = planFleet(join(d, 'fleet.csv'), { unit: 'h', bins: BINS });
    expect(plan.failures).toEqual([]);
    const inline = await assessFile({ ...plan.tasks[0], parseThread: false });
    // from sources the CLI's parse thread falls back to this thread; the built pool (runLocal.test) runs it for real
    const threaded = await assessFile({ ...plan.tasks[0], parseThread: true });
    expect(threaded).toEqual(inline);
    const values = columnsOf(plain);
    for (const [k, name] of (['left', 'right'] as const).entries()) {
      const rangeMean = new RangeMeanMatrix({ range: BINS.range, mean: BINS.mean });
      const fromTo = new FromToMatrix({ from: BINS.fromTo, to: BINS.fromTo });
      const sink = { addCycle: (a: number, b: number, n: number, s: number, t: number, c: number) => (rangeMean.addCycle(a, b, n, s, t, c), fromTo.addCycle(a, b, n, s, t, c)) };
      new RainflowCounter({ residue: 'repeat', gate: 7.5, sink }).push(Float64Array.from(values[name])).finish();
      const got = inline.channels[k];
      expect(got.channel).toBe(name);
      expect(got.gate).toBe(7.5);
      expect(got.rangeMean).toEqual(rangeMean.toJSON());
      expect(got.fromTo).toEqual(fromTo.toJSON());
      expect(got.damagePerUnit).toBe(got.damagePerRepeat / 2);
    }
    expect(inline.samples).toBe(3000);
  });
});
