import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { assessLife, type LifeJob } from '@loopwise/engine';
import { handbookSteels } from '@loopwise/material';
import { excludeRanges, scanSignal } from '@loopwise/signal';
import { beforeAll, describe, expect, test } from 'vitest';
import { cli } from './runCli';
import { unionOfRuns } from '../../src/cli/correctedStream';

// Issue 11, item 1 in the command: `--exclude-flat-runs` cuts the flat runs the signal checks
// find (a dropout at exactly 0 and a gauge stuck at one value) out of the history before
// counting, as sample ranges are cut. Checked against the engine's assessLife on the history with
// the runs removed by hand (@loopwise/signal's excludeRanges, segments joined). The gauge files
// are INVENTED for the test: sums of sines in µε on a mean of 150 µε.
let dir = '';
const n = 9000;
const wave = (i: number) => Number((150 + 600 * Math.sin(i / 37.1) + 250 * Math.sin(i / 5.3) + 60 * Math.sin(i / 1.3)).toFixed(2));
const gauge = Array.from({ length: n }, (_, i) => wave(i));
// a dropout at 0 (samples 1900..2369, between two peaks: the drop to 0 and back is a loop of its own) and a stuck gauge (samples 6000..6199 hold sample 6000's value)
const DROPOUT = { first: 1900, last: 2369 };
const STUCK = { first: 6000, last: 6199 };
for (let i = DROPOUT.first; i <= DROPOUT.last; i++) gauge[i] = 0;
for (let i = STUCK.first; i <= STUCK.last; i++) gauge[i] = gauge[STUCK.first];
const material = handbookSteels.find((m) => m.name === 'SAE 1045 (hot rolled and normalized)')!;
const job: LifeJob = { material, input: 'local-strain', meanStress: 'smithWatsonTopper' };
const base = ['--column', 'gauge_ue', '--quantity', 'strain', '--unit', 'microstrain', '--material', 'SAE 1045', '--json'];

function withoutByHand(x: ArrayLike<number>, ranges: { first: number; last: number }[]): Float64Array {
  const { segments } = excludeRanges(x, ranges);
  const out = new Float64Array(segments.reduce((a, s) => a + s.values.length, 0));
  let at = 0;
  for (const s of segments) {
    out.set(s.values, at);
    at += s.values.length;
  }
  return out;
}

async function assess(file: string, extra: string[]): Promise<{ code: number; stderr: string; json: any }> {
  const r = await cli(['assess', join(dir, file), ...base, ...extra]);
  return { code: r.code, stderr: r.stderr, json: r.code === 0 ? JSON.parse(r.stdout) : null };
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'loopwise-flat-runs-'));
  writeFileSync(join(dir, 'g.csv'), 'gauge_ue\n' + gauge.map((v) => v.toFixed(2)).join('\n') + '\n');
  // two gauges: the second is flat where the first is not (its own stuck run at 4000..4149)
  const second = gauge.map((_, i) => (i >= 4000 && i < 4150 ? wave(4000) : wave(i + 7)));
  writeFileSync(join(dir, 'two.csv'), 'gauge_ue,other_ue\n' + gauge.map((v, i) => `${v.toFixed(2)},${second[i].toFixed(2)}`).join('\n') + '\n');
});

describe('--exclude-flat-runs', () => {
  test('the signal checks find exactly the two runs (the premise of the test)', () => {
    const runs = scanSignal(Float64Array.from(gauge)).findings.toArray().filter((f) => f.code === 'stuck-run' || f.code === 'zero-run');
    expect(runs.map((f) => [f.index, f.index + f.length - 1])).toEqual([
      [DROPOUT.first, DROPOUT.last],
      [STUCK.first, STUCK.last],
    ]);
  });

  test('the life equals assessLife of the history with the runs cut out by hand; the record lists them', async () => {
    const r = await assess('g.csv', ['--exclude-flat-runs']);
    expect(r.stderr).toBe('');
    const want = assessLife(withoutByHand(Float64Array.from(gauge, (v) => v / 1e6), [DROPOUT, STUCK]), job);
    const got = r.json.channels[0].report.life.repeats;
    expect(Math.abs(got / want.life.repeats - 1)).toBeLessThanOrEqual(1e-12);
    // as measured the dropout makes a big loop: the cut must change the life
    const measured = await assess('g.csv', []);
    expect(measured.json.channels[0].report.life.repeats).not.toBeCloseTo(got, 6);
    const c = r.json.channels[0].signalCorrections;
    expect(c).toHaveLength(1);
    expect(c[0].kind).toBe('ranges-excluded');
    expect(c[0].samples).toBe(670);
    expect(c[0].places).toEqual([
      { first: DROPOUT.first, length: 470 },
      { first: STUCK.first, length: 200 },
    ]);
    expect(c[0].parameters.flatRuns).toBe('2 flat run(s) the signal checks found, 670 samples: 1900..2369, 6000..6199');
    // the same cut as the ranges given by hand, to the bit
    const byHand = await assess('g.csv', ['--exclude-samples', '1900..2369,6000..6199']);
    expect(byHand.json.channels[0].report.life.repeats).toBe(got);
  });

  test('with ranges given too, and with --interpolate-spikes, the cuts are the union', async () => {
    const r = await assess('g.csv', ['--exclude-flat-runs', '--exclude-samples', '2200..2599', '--interpolate-spikes']);
    expect(r.stderr).toBe('');
    const want = assessLife(withoutByHand(Float64Array.from(gauge, (v) => v / 1e6), [{ first: 1900, last: 2599 }, STUCK]), job);
    expect(Math.abs(r.json.channels[0].report.life.repeats / want.life.repeats - 1)).toBeLessThanOrEqual(1e-12);
    expect(r.json.channels[0].signalCorrections.find((c: { kind: string }) => c.kind === 'ranges-excluded').places).toEqual([
      { first: 1900, length: 700 },
      { first: STUCK.first, length: 200 },
    ]);
  });

  test('two channels: a row is cut where either channel is flat', async () => {
    const r = await cli(['assess', join(dir, 'two.csv'), '--column', 'gauge_ue', '--column', 'other_ue', '--quantity', 'strain', '--unit', 'microstrain', '--material', 'SAE 1045', '--json', '--exclude-flat-runs']);
    expect(r.stderr).toBe('');
    const json = JSON.parse(r.stdout);
    for (const ch of json.channels) {
      expect(ch.signalCorrections[0].places).toEqual([
        { first: DROPOUT.first, length: 470 },
        { first: 4000, length: 150 },
        { first: STUCK.first, length: 200 },
      ]);
    }
  });

  test('a file with no flat run: nothing is cut, and the life is as measured', async () => {
    writeFileSync(join(dir, 'clean.csv'), 'gauge_ue\n' + Array.from({ length: n }, (_, i) => wave(i).toFixed(2)).join('\n') + '\n');
    const r = await assess('clean.csv', ['--exclude-flat-runs']);
    const measured = await assess('clean.csv', []);
    expect(r.json.channels[0].signalCorrections).toEqual([]);
    expect(r.json.channels[0].report.life.repeats).toBe(measured.json.channels[0].report.life.repeats);
  });

  test('a duty cycle refuses it, naming the setting; a job field that is not true or false is named', async () => {
    writeFileSync(join(dir, 'duty.json'), JSON.stringify({ format: 'loopwise-job', version: 1, material: 'SAE 1045 (hot rolled and normalized)', channels: [{ column: 'gauge_ue', quantity: 'strain', unit: 'microstrain' }], events: [{ name: 'a', file: 'g.csv', repeats: 2 }], excludeFlatRuns: true }));
    const d = await cli(['assess', '--job', join(dir, 'duty.json')]);
    expect(d.code).toBe(2);
    expect(d.stderr).toMatch(/duty\.json: excludeFlatRuns: cuts apply to a single file/);
    writeFileSync(join(dir, 'bad.json'), JSON.stringify({ format: 'loopwise-job', version: 1, material: 'SAE 1045 (hot rolled and normalized)', channels: [{ column: 'gauge_ue', quantity: 'strain', unit: 'microstrain' }], file: 'g.csv', excludeFlatRuns: 'yes' }));
    const b = await cli(['assess', '--job', join(dir, 'bad.json')]);
    expect(b.code).toBe(2);
    expect(b.stderr).toMatch(/excludeFlatRuns.*expected true or false/);
  });
});

describe('count --exclude-flat-runs', () => {
  test('counts as --exclude-samples over the runs does, to the byte of the cycles CSV', async () => {
    const args = ['count', join(dir, 'g.csv'), '--column', 'gauge_ue', '--quantity', 'strain', '--unit', 'microstrain', '--json'];
    const a = await cli([...args, '--exclude-flat-runs', '--cycles-out', join(dir, 'a.csv')]);
    const b = await cli([...args, '--exclude-samples', '1900..2369,6000..6199', '--cycles-out', join(dir, 'b.csv')]);
    expect(a.stderr).toBe('');
    expect(readFileSync(join(dir, 'a.csv'), 'utf8')).toBe(readFileSync(join(dir, 'b.csv'), 'utf8'));
    const ja = JSON.parse(a.stdout);
    expect(ja.cycles).toBe(JSON.parse(b.stdout).cycles);
    expect(ja.signalCorrections[0].places).toEqual([
      { first: DROPOUT.first, length: 470 },
      { first: STUCK.first, length: 200 },
    ]);
  });
});

describe('unionOfRuns', () => {
  test('merges overlapping and touching runs of several channels, in order', () => {
    expect(unionOfRuns([Float64Array.of(10, 5, 40, 3), Float64Array.of(12, 8)])).toEqual([10, 10, 40, 3]);
    expect(unionOfRuns([Float64Array.of(0, 5), Float64Array.of(5, 5, 20, 1)])).toEqual([0, 10, 20, 1]);
    expect(unionOfRuns([new Float64Array(0), Float64Array.of(7, 2)])).toEqual([7, 2]);
    expect(unionOfRuns([])).toEqual([]);
  });
});
