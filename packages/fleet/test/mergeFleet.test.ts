import fc from 'fast-check';
import { FromToMatrix, RangeMeanMatrix } from '@loopwise/rainflow';
import { describe, expect, test } from 'vitest';
import { checkProperty } from '../../../test/property';
import type { FileResult, FleetTask } from '../src/FleetTask';
import { mergeFleet } from '../src/mergeFleet';
import type { FleetSettings } from '../src/planFleet';
import { seeded } from './support/makeFleet';

const BINS = { range: { count: 8, min: 0, max: 80 }, mean: { count: 4, min: -40, max: 40 }, fromTo: { count: 8, min: -40, max: 40 } };
const SETTINGS: FleetSettings = { unit: 'h', targetService: 1000, bins: BINS };

/** Invented per-file results: a few random cycles per file, a damage, one or two channels. */
function fleetOf(n: number, seed: number): { tasks: FleetTask[]; results: FileResult[] } {
  const rnd = seeded(seed);
  const tasks: FleetTask[] = [];
  const results: FileResult[] = [];
  for (let k = 0; k < n; k++) {
    const key = `k${k}`;
    const asset = `a${k % 3}`;
    const usage = 0.5 + rnd();
    const t: FleetTask = { key, row: k + 1, where: `m.csv row ${k + 1}`, file: `/f${k}.csv`, shown: `f${k}.csv`, asset, channels: ['x'], usage, job: '/job.json', jobShown: 'job.json', anywhere: false, bins: BINS, unit: 'h' };
    const rm = new RangeMeanMatrix({ range: BINS.range, mean: BINS.mean });
    const ft = new FromToMatrix({ from: BINS.fromTo, to: BINS.fromTo });
    for (let c = 0; c < 40; c++) {
      const a = -35 + 70 * rnd();
      const b = -35 + 70 * rnd();
      const count = rnd() < 0.3 ? 0.5 : 1;
      rm.addCycle(a, b, count, c);
      ft.addCycle(a, b, count, c);
    }
    const d = 1e-6 * (1 + 10 * rnd());
    tasks.push(t);
    results.push({ format: 'loopwise-fleet-file', version: 1, key, row: k + 1, file: t.shown, asset, usage, unit: 'h', samples: 100, channels: [{ channel: 'x', route: 'strain-life', meanStress: 'smithWatsonTopper', damagePerRepeat: d, damagePerUnit: d / usage, criticalDamage: 1, lifeRepeats: 1 / d, lifeService: usage / d, designService: usage / d, rangeMean: rm.toJSON(), fromTo: ft.toJSON(), gate: 0, warnings: [] }], failure: null });
  }
  return { tasks, results };
}

describe('mergeFleet(settings, tasks, results, rowFailures)', () => {
  test('mergeFleet gives the same fleet, to the last bit, whatever order the results arrived in', () => {
    checkProperty(
      'merge independent of arrival order',
      fc.property(fc.integer({ min: 1, max: 30 }), fc.integer({ min: 1, max: 1e6 }), fc.integer({ min: 0, max: 1e6 }), (n, seed, shuffleSeed) => {
        // Arrange
        const { tasks, results } = fleetOf(n, seed);
        const rnd = seeded(shuffleSeed);
        const shuffled = [...results].sort(() => rnd() - 0.5);
        // Act
        const a = mergeFleet(SETTINGS, tasks, new Map(results.map((r) => [r.key, r])), []);
        const b = mergeFleet(SETTINGS, tasks, new Map(shuffled.map((r) => [r.key, r])), []);
        // Assert
        return JSON.stringify(a.channels.map((c) => [c.rangeMean.toJSON(), c.fromTo.toJSON(), c.damage, c.distribution])) === JSON.stringify(b.channels.map((c) => [c.rangeMean.toJSON(), c.fromTo.toJSON(), c.damage, c.distribution])) && JSON.stringify(a.assets) === JSON.stringify(b.assets);
      }),
      { numRuns: 60 },
    );
  });

  test('mergeFleet sums per asset, weights the fleet by usage and adds the matrices', () => {
    const { tasks, results } = fleetOf(9, 4);
    const f = mergeFleet(SETTINGS, tasks, new Map(results.map((r) => [r.key, r])), []);
    expect(f.assets.map((a) => a.asset)).toEqual(['a0', 'a1', 'a2']);
    const a0 = results.filter((r) => r.asset === 'a0');
    const d = a0.reduce((s, r) => s + r.channels[0].damagePerRepeat, 0);
    const u = a0.reduce((s, r) => s + r.usage, 0);
    expect(Math.abs(f.assets[0].damage - d) / d).toBeLessThan(1e-14);
    expect(Math.abs(f.assets[0].damagePerUnit - d / u) / (d / u)).toBeLessThan(1e-14);
    const c = f.channels[0];
    expect(c.rangeMean.totalCount()).toBe(results.reduce((s, r) => s + RangeMeanMatrix.fromJSON(r.channels[0].rangeMean).totalCount(), 0));
    expect(c.distribution.severeAsset).toBe([...f.assets].sort((x, y) => y.damagePerUnit - x.damagePerUnit)[0].asset);
    expect(c.extrapolation!.linear.totalCount()).toBeCloseTo((c.rangeMean.totalCount() * 1000) / c.usage, 6);
    expect(c.extrapolation!.damageLinear).toBeCloseTo(c.damagePerUnit * 1000, 15);
  });

  test('mergeFleet lists failed rows and rows without a result, in row order, and leaves them out of the sums', () => {
    const { tasks, results } = fleetOf(5, 8);
    const map = new Map(results.map((r) => [r.key, r]));
    map.set('k1', { ...results[1], channels: [], failure: { message: 'm.csv row 2: bad', input: true } });
    map.delete('k3');
    const rowFailure = { ...results[0], key: 'row-9', row: 9, channels: [], failure: { message: 'm.csv row 9: usage: bad', input: true } };
    const f = mergeFleet(SETTINGS, tasks, map, [rowFailure]);
    expect(f.failures.map((x) => x.row)).toEqual([2, 4, 9]);
    expect(f.failures[1].message).toMatch(/row 4 \(f3\.csv\): no result/);
    expect(f.counts).toEqual({ rows: 6, assessed: 3, failed: 3 });
    expect(f.files.map((x) => x.row)).toEqual([1, 3, 5]);
  });
});
