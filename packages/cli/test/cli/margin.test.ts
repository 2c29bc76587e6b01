import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { assessDutyCycle } from '@loopwise/engine';
import { handbookSteels } from '@loopwise/material';
import { beforeAll, describe, expect, test } from 'vitest';
import { cli } from './runCli';

// Issue 11, item 7: `loopwise margin` with a job file and a target life, stated as a design or a
// mean life, with progress on a terminal. The files are INVENTED for the test (sums of sines in
// microstrain at a notch root, not measurements): a 'track' event and a 'yard' event of a duty cycle.
let dir = '';


const track = Array.from({ length: 3000 }, (_, i) => 700 * Math.sin(i / 11.3) + 300 * Math.sin(i / 2.9) + 150);
const yard = Array.from({ length: 800 }, (_, i) => 1100 * Math.sin(i / 40.1));
const csv = (v: number[]) => 'strain_ue\n' + v.map((x) => x.toFixed(2)).join('\n') + '\n';
const sae1045 = handbookSteels.find((m) => m.name === 'SAE 1045 (hot rolled and normalized)')!;

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'loopwise-margin-'));
  writeFileSync(join(dir, 'track.csv'), csv(track));
  writeFileSync(join(dir, 'yard.csv'), csv(yard));
  const job = {
    format: 'loopwise-job',
    version: 1,
    material: 'SAE 1045 (hot rolled and normalized)',
    meanStress: 'smithWatsonTopper',
    scatterFactor: 3,
    service: { unit: 'km' },
    channels: [{ name: 'gauge', column: 'strain_ue', quantity: 'strain', unit: 'microstrain' }],
    events: [
      { name: 'track', file: 'track.csv', repeats: 2.5, duration: 0.2 },
      { name: 'yard', file: 'yard.csv', repeats: 3, duration: 0.05 },
    ],
  };
  writeFileSync(join(dir, 'duty.json'), JSON.stringify(job));
  writeFileSync(join(dir, 'nodur.json'), JSON.stringify({ ...job, events: job.events.map(({ duration: _, ...e }) => e) }));
});

/** The duty cycle as the engine takes it, every sample times f (the files hold two decimals of µε). */
function lifeAt(f: number): number {
  const read = (v: number[]) => v.map((x) => Number(x.toFixed(2)) * 1e-6 * f);
  const events = [
    { name: 'track', history: read(track), repeats: 2.5 },
    { name: 'yard', history: read(yard), repeats: 3 },
  ];
  return assessDutyCycle(events, { material: sae1045, input: 'local-strain', meanStress: 'smithWatsonTopper' }).life.repeats;
}

describe('loopwise margin --job with a target life', () => {
  test('the service per repeat comes from the events\' durations (2.5 × 0.2 + 3 × 0.05 km); a design target looks for a mean life of target × scatter factor', async () => {
    const r = await cli(['margin', '--job', join(dir, 'duty.json'), '--target-life', '20000', '--json']);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(j.target.service.perRepeat).toBeCloseTo(0.65, 12);
    expect(j.target.of).toBe('design');
    expect(j.target.repeats).toBeCloseTo(20000 / 0.65, 6);
    expect(j.target.meanRepeats).toBeCloseTo((3 * 20000) / 0.65, 6);
    const m = j.channels[0];
    // the factor found: the life there is at most the mean target, just below it (bisection bracket) above it
    expect(m.repeats).toBeLessThanOrEqual(j.target.meanRepeats);
    expect(lifeAt(m.bracket[0])).toBeGreaterThan(j.target.meanRepeats);
    expect(Math.abs(lifeAt(m.factor) - m.repeats)).toBeLessThanOrEqual(1e-9 * m.repeats);
    expect(m.designRepeats).toBeCloseTo(m.repeats / 3, 9);
  });

  test('--target-of mean compares the mean life, so it allows a larger load factor than the design target', async () => {
    const design = JSON.parse((await cli(['margin', '--job', join(dir, 'duty.json'), '--target-life', '20000', '--json'])).stdout);
    const mean = JSON.parse((await cli(['margin', '--job', join(dir, 'duty.json'), '--target-life', '20000', '--target-of', 'mean', '--json'])).stdout);
    expect(mean.target.meanRepeats).toBeCloseTo(20000 / 0.65, 6);
    expect(mean.channels[0].factor).toBeGreaterThan(design.channels[0].factor);
  });

  test('the text says which life the target is, in the service unit, with the caution', async () => {
    const r = await cli(['margin', '--job', join(dir, 'duty.json'), '--target-life', '20000']);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('target: design life 20000 km (30769 repeats of 0.65 km) = mean life ÷ scatter factor 3, so a mean life of 92308 repeats');
    expect(r.stdout).toMatch(/channel gauge: load factor [\d.]+ gives mean life [\d.]+ repeats, design life [\d.]+ repeats \([\d.]+ km\)/);
    expect(r.stdout).toContain('Caution: Fatigue life estimates carry large scatter');
  });

  test('progress shows on a terminal only, and is cleared', async () => {
    const tty = await cli(['margin', '--job', join(dir, 'duty.json'), '--target-repeats', '5000'], true);
    expect(tty.stderr).toMatch(/\rmargin: gauge: assessment 1 of at most \d+/);
    expect(tty.stderr.endsWith('\r\x1b[K')).toBe(true);
    expect((await cli(['margin', '--job', join(dir, 'duty.json'), '--target-repeats', '5000', '--quiet'], true)).stderr).toBe('');
    expect((await cli(['margin', '--job', join(dir, 'duty.json'), '--target-repeats', '5000'])).stderr).toBe('');
  });

  test('bad targets exit 2 naming the option', async () => {
    const nodur = await cli(['margin', '--job', join(dir, 'nodur.json'), '--target-life', '20000']);
    expect(nodur.code).toBe(2);
    expect(nodur.stderr).toContain('--target-life: the job gives no service per repeat');
    expect((await cli(['margin', '--job', join(dir, 'duty.json'), '--target-life', '0'])).stderr).toContain('--target-life: must be > 0, got 0');
    expect((await cli(['margin', '--job', join(dir, 'duty.json'), '--target-life', '5', '--target-of', 'median'])).stderr).toContain('--target-of: one of design, mean');
    expect((await cli(['margin', '--job', join(dir, 'duty.json'), '--target-life', '5', '--target-repeats', '3'])).stderr).toContain('give exactly one');
  });
});
