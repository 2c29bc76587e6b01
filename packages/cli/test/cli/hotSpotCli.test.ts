import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { assessDutyCycle, assessLife } from '@loopwise/engine';
import { removeSpikes } from '@loopwise/signal';
import { hotSpotStress, iiwFatCurve } from '@loopwise/stress-life';
import { beforeAll, describe, expect, test } from 'vitest';
import { unionOfArtefacts } from '../../src/cli/hotSpotChannel';
import { cli } from './runCli';

// Issue 12, item 3 in the CLI: two or three gauges at the IIW reference points become one
// hot-spot stress history (IIW recommendations 2.2.3, by the library's hotSpotStress), assessed
// on the stress-life route. Gauge files INVENTED for the test.
let dir = '';
const n = 8000;
const base = Array.from({ length: n }, (_, i) => 60 * Math.sin(i / 17) + 25 * Math.sin(i / 3.1));
const g = [1.3, 1.1, 0.95].map((f) => base.map((b) => Number((f * b).toFixed(2))));

const spiked = [g[0].map((v, i) => (i === 3000 ? v + 700 : v)), g[1].map((v, i) => (i === 5000 ? v - 650 : v))];

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'loopwise-hotspot-'));
  writeFileSync(join(dir, 'weld.csv'), 'a_MPa,b_MPa,c_MPa\n' + g[0].map((_, i) => `${g[0][i]},${g[1][i]},${g[2][i]}`).join('\n') + '\n');
  // the same gauges with a one-sample spike each, at different samples (a: 3000, b: 5000)
  writeFileSync(join(dir, 'weld_spiked.csv'), 'a_MPa,b_MPa\n' + g[0].map((_, i) => `${spiked[0][i]},${spiked[1][i]}`).join('\n') + '\n');
  // the same gauges as microstrain, E = 206000 MPa: ε = σ / E
  writeFileSync(join(dir, 'weld_ue.csv'), 'a_ue,b_ue\n' + g[0].map((_, i) => `${((g[0][i] / 206000) * 1e6).toFixed(6)},${((g[1][i] / 206000) * 1e6).toFixed(6)}`).join('\n') + '\n');
});

const fat71 = { stressLife: { curve: iiwFatCurve(71), meanStress: { method: 'none' as const } } };

describe('hot-spot stress in the CLI', () => {
  test('type a linear from two stress gauges equals the engine on hotSpotStress of the same columns', async () => {
    const r = await cli(['assess', join(dir, 'weld.csv'), '--column', 'a_MPa', '--column', 'b_MPa', '--sn-curve', 'iiw:71', '--hot-spot', 'typeALinear', '--json']);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(j.channels).toHaveLength(1);
    expect(j.channels[0].name).toBe('hot spot (typeALinear: 1.67 × a_MPa − 0.67 × b_MPa)');
    const want = assessLife(hotSpotStress('typeALinear', [g[0], g[1]]), fat71);
    expect(Math.abs(j.channels[0].report.damage.perRepeat / want.damage.perRepeat - 1)).toBeLessThanOrEqual(1e-12);
  });

  test('type a quadratic from three gauges, and strain gauges with --hot-spot-modulus (σ = E·ε)', async () => {
    const q = JSON.parse((await cli(['assess', join(dir, 'weld.csv'), '--column', 'a_MPa', '--column', 'b_MPa', '--column', 'c_MPa', '--sn-curve', 'iiw:71', '--hot-spot', 'typeAQuadratic', '--json'])).stdout);
    const wantQ = assessLife(hotSpotStress('typeAQuadratic', g), fat71);
    expect(Math.abs(q.channels[0].report.damage.perRepeat / wantQ.damage.perRepeat - 1)).toBeLessThanOrEqual(1e-12);
    const s = await cli(['assess', join(dir, 'weld_ue.csv'), '--column', 'a_ue', '--column', 'b_ue', '--quantity', 'strain', '--unit', 'microstrain', '--sn-curve', 'iiw:71', '--hot-spot', 'typeALinear', '--hot-spot-modulus', '206000', '--json']);
    expect(s.code).toBe(0);
    const want = assessLife(hotSpotStress('typeALinear', [g[0], g[1]]), fat71);
    // the strains carry six decimals of µε: the stresses agree to about 1e-9 of their size
    expect(Math.abs(JSON.parse(s.stdout).channels[0].report.damage.perRepeat / want.damage.perRepeat - 1)).toBeLessThan(1e-6);
  });

  test('--interpolate-spikes on a hot-spot channel interpolates every gauge\'s spikes: the life equals the engine on hotSpotStress of the gauges interpolated by hand; the artefact study sees them', async () => {
    // a sample flagged on either gauge is flagged on the combination; the hot-spot stress is
    // linear in the gauges, so interpolating it there is interpolating each gauge there
    const at = Float64Array.from([3000, 5000]);
    const byHand = hotSpotStress('typeALinear', spiked.map((v) => removeSpikes(v, at).values));
    const cleaned = assessLife(byHand, fat71);
    const want = cleaned.damage.perRepeat;
    const args = ['assess', join(dir, 'weld_spiked.csv'), '--column', 'a_MPa', '--column', 'b_MPa', '--sn-curve', 'iiw:71', '--hot-spot', 'typeALinear'];
    const r = await cli([...args, '--interpolate-spikes', '--json']);
    expect(r.stderr).toBe('');
    const c = JSON.parse(r.stdout).channels[0];
    expect(Math.abs(c.report.damage.perRepeat / want - 1)).toBeLessThanOrEqual(1e-12);
    expect(c.signalCorrections.map((x: { kind: string }) => x.kind)).toEqual(['spikes-interpolated']);
    expect(c.signalCorrections[0].places).toEqual([{ first: 3000, length: 1 }, { first: 5000, length: 1 }]);
    // without the correction the spikes are assessed, and the artefact study gives the cleaned life beside it
    const plain = JSON.parse((await cli([...args, '--json'])).stdout).channels[0];
    const measured = assessLife(hotSpotStress('typeALinear', spiked), fat71).damage.perRepeat;
    expect(Math.abs(plain.report.damage.perRepeat / measured - 1)).toBeLessThanOrEqual(1e-12);
    expect(plain.report.damage.perRepeat).toBeGreaterThan(want);
    expect(plain.artefactStudy.spikes).toBe(2);
    expect(Math.abs(plain.artefactStudy.repeatsCleaned / cleaned.life.repeats - 1)).toBeLessThanOrEqual(1e-12);
    // a duty cycle of that file: the event's spikes interpolated the same way
    writeFileSync(join(dir, 'job_spiked.json'), JSON.stringify({ format: 'loopwise-job', version: 1, interpolateSpikes: true, stressLife: { curve: 'iiw:71', hotSpot: { rule: 'typeALinear' } }, channels: [{ column: 'a_MPa', quantity: 'stress', unit: 'MPa' }, { column: 'b_MPa', quantity: 'stress', unit: 'MPa' }], events: [{ name: 'site', file: 'weld_spiked.csv', repeats: 2 }] }));
    const d = await cli(['assess', '--job', join(dir, 'job_spiked.json'), '--json']);
    expect(d.stderr).toBe('');
    const wantDuty = assessDutyCycle([{ name: 'site', history: byHand, repeats: 2 }], fat71).damage.perRepeat;
    expect(Math.abs(JSON.parse(d.stdout).channels[0].report.damage.perRepeat / wantDuty - 1)).toBeLessThanOrEqual(1e-12);
  });

  test('a duty cycle of a job file with stressLife.hotSpot', async () => {
    writeFileSync(join(dir, 'job.json'), JSON.stringify({ format: 'loopwise-job', version: 1, stressLife: { curve: 'iiw:71', hotSpot: { rule: 'typeALinear' } }, channels: [{ column: 'a_MPa', quantity: 'stress', unit: 'MPa' }, { column: 'b_MPa', quantity: 'stress', unit: 'MPa' }], events: [{ name: 'site', file: 'weld.csv', repeats: 3 }] }));
    const r = await cli(['assess', '--job', join(dir, 'job.json'), '--json']);
    expect(r.stderr).toBe('');
    const want = assessDutyCycle([{ name: 'site', history: hotSpotStress('typeALinear', [g[0], g[1]]), repeats: 3 }], fat71);
    expect(Math.abs(JSON.parse(r.stdout).channels[0].report.damage.perRepeat / want.damage.perRepeat - 1)).toBeLessThanOrEqual(1e-12);
  });

  test('margin on a hot-spot job searches the hot-spot channel: the life at the factor found is the engine\'s on the scaled hot-spot history', async () => {
    const r = await cli(['margin', join(dir, 'weld.csv'), '--column', 'a_MPa', '--column', 'b_MPa', '--sn-curve', 'iiw:71', '--hot-spot', 'typeALinear', '--target-repeats', '50', '--json']);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const m = JSON.parse(r.stdout).channels[0];
    expect(m.channel).toBe('hot spot (typeALinear: 1.67 × a_MPa − 0.67 × b_MPa)');
    const hs = hotSpotStress('typeALinear', [g[0], g[1]]);
    const at = assessLife(hs.map((x) => x * m.factor), fat71).life.repeats;
    expect(Math.abs(at / m.repeats - 1)).toBeLessThanOrEqual(1e-9);
    expect(m.repeats).toBeLessThanOrEqual(50);
  });

  test('bad input: the wrong number of gauges, strain without a modulus, --hot-spot without --sn-curve: exit 2 naming the option', async () => {
    const one = await cli(['assess', join(dir, 'weld.csv'), '--column', 'a_MPa', '--sn-curve', 'iiw:71', '--hot-spot', 'typeALinear']);
    expect(one.code).toBe(2);
    expect(one.stderr).toMatch(/--hot-spot: the typeALinear rule takes 2 gauges \(at 0\.4 t, 1 t\)/);
    const strain = await cli(['assess', join(dir, 'weld_ue.csv'), '--column', 'a_ue', '--column', 'b_ue', '--quantity', 'strain', '--unit', 'microstrain', '--sn-curve', 'iiw:71', '--hot-spot', 'typeALinear']);
    expect(strain.code).toBe(2);
    expect(strain.stderr).toMatch(/modulus/);
    const route = await cli(['assess', join(dir, 'weld.csv'), '--column', 'a_MPa', '--column', 'b_MPa', '--material', 'SAE 1045', '--hot-spot', 'typeALinear']);
    expect(route.code).toBe(2);
    expect(route.stderr).toMatch(/--hot-spot: applies to the stress-life route/);
  });
});

describe('unionOfArtefacts', () => {
  test('spikes sorted and unique; runs sorted, merged where they overlap or touch, kept apart otherwise', () => {
    const u = unionOfArtefacts([
      { spikes: Float64Array.from([7, 40]), runs: Float64Array.from([30, 2, 10, 5]) },
      undefined,
      { spikes: Float64Array.from([3, 7]), runs: Float64Array.from([12, 10, 32, 1, 50, 4]) },
    ]);
    expect(Array.from(u.spikes)).toEqual([3, 7, 40]);
    // 10..14 and 12..21 overlap: 10..21; 30..31 and 32 touch: 30..32; 50..53 alone
    expect(Array.from(u.runs)).toEqual([10, 12, 30, 3, 50, 4]);
  });
});
