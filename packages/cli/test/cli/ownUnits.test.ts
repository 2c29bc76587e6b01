import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { assessLife } from '@loopwise/engine';
import { handbookSteels } from '@loopwise/material';
import { FromToMatrix, RainflowCounter, RangeMeanMatrix } from '@loopwise/rainflow';
import { beforeAll, describe, expect, test } from 'vitest';
import { cli } from './runCli';

// Issue 11, item 5: the gate is given in the channel's own unit (µε for a microstrain channel)
// and count reports in that unit. The gauge file is INVENTED for the test (sums of sines in µε).
let dir = '';
const values = Array.from({ length: 6000 }, (_, i) => Number((900 * Math.sin(i / 23.7) + 60 * Math.sin(i / 1.9) + 15 * Math.sin(i / 0.7)).toFixed(2)));
const sae1045 = handbookSteels.find((m) => m.name === 'SAE 1045 (hot rolled and normalized)')!;


beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'loopwise-units-'));
  writeFileSync(join(dir, 'g.csv'), 'gauge_ue\n' + values.map((v) => v.toFixed(2)).join('\n') + '\n');
});

describe('the channel keeps its unit', () => {
  test('count --gate 40 on a microstrain channel gates at 40 µε and reports µε: the same cycles as a rainflow count of the file values with gate 40', async () => {
    const r = await cli(['count', join(dir, 'g.csv'), '--quantity', 'strain', '--unit', 'microstrain', '--gate', '40', '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(j.unit).toBe('µε');
    const lo = Math.min(...values);
    const hi = Math.max(...values);
    const m = new RangeMeanMatrix({ range: { count: 32, min: 0, max: hi - lo }, mean: { count: 32, min: lo, max: hi } });
    const own = new RainflowCounter({ residue: 'half', gate: 40, sink: m }).push(Float64Array.from(values)).finish();
    expect(j.removedReversals).toBe(own.removedReversals);
    expect(j.removedReversals).toBeGreaterThan(0); // the gate of 40 µε does remove the small ripple
    expect(j.cycles).toBe(m.totalCount());
    expect(j.largestRange).toBe(hi - lo);
    expect(r.stdout).not.toMatch(/"strain"/);
  });

  test('assess --gate 40 on a microstrain channel equals the engine with a gate of 40e-6 strain', async () => {
    const r = await cli(['assess', join(dir, 'g.csv'), '--quantity', 'strain', '--unit', 'microstrain', '--material', 'SAE 1045', '--gate', '40', '--json']);
    expect(r.code).toBe(0);
    const rep = JSON.parse(r.stdout).channels[0].report;
    const want = assessLife(values.map((v) => v / 1e6), { material: sae1045, input: 'local-strain', meanStress: 'smithWatsonTopper', gate: 40 / 1e6 });
    expect(rep.gate.removedReversals).toBe(want.gate.removedReversals);
    expect(rep.gate.removedReversals).toBeGreaterThan(0);
    expect(Math.abs(rep.life.repeats / want.life.repeats - 1)).toBeLessThanOrEqual(1e-12);
  });
});

describe('count writes its matrices as CSV', () => {
  test('--matrix-format csv: both matrices, one row per bin, equal to the matrices of a rainflow count of the file values', async () => {
    const out = (f: string) => join(dir, f);
    const r = await cli(['count', out('g.csv'), '--quantity', 'strain', '--unit', 'microstrain', '--range-bins', '8', '--mean-bins', '5', '--matrix-out', out('rm.csv'), '--from-to-out', out('ft.csv'), '--matrix-format', 'csv', '--json']);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const lo = Math.min(...values);
    const hi = Math.max(...values);
    const rm = new RangeMeanMatrix({ range: { count: 8, min: 0, max: hi - lo }, mean: { count: 5, min: lo, max: hi } });
    const ft = new FromToMatrix({ from: { count: 8, min: lo, max: hi }, to: { count: 8, min: lo, max: hi } });
    new RainflowCounter({ residue: 'half', sink: { addCycle: (a, b, c, d, e, f) => (rm.addCycle(a, b, c, d, e, f), ft.addCycle(a, b, c, d, e, f)) } }).push(Float64Array.from(values)).finish();
    for (const [file, m, head] of [['rm.csv', rm, 'range_low,range_high,mean_low,mean_high,cycles'], ['ft.csv', ft, 'from_low,from_high,to_low,to_high,cycles']] as const) {
      const lines = readFileSync(out(file), 'utf8').trimEnd().split('\n');
      expect(lines[0]).toBe(head);
      expect(lines).toHaveLength(1 + m.rows * m.columns);
      const re = m.rowEdges;
      const ce = m.columnEdges;
      lines.slice(1).forEach((line, k) => {
        const i = Math.floor(k / m.columns);
        const j = k % m.columns;
        expect(line.split(',').map(Number)).toEqual([re[i], re[i + 1], ce[j], ce[j + 1], m.at(i, j)]);
      });
    }
    expect(ft.totalCount()).toBe(JSON.parse(r.stdout).cycles);
  });
});
