import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { assessDutyCycle, assessLife, type LifeJob } from '@loopwise/engine';
import type { IngestChunk, IngestReport, ReaderOptions } from '@loopwise/ingest';
import { handbookSteels } from '@loopwise/material';
import { hotSpotStress, iiwFatCurve } from '@loopwise/stress-life';
import { excludeRanges, removeOffset, zeroPhaseLowPass, type SampleRange, type TimeRange, type TimeBase } from '@loopwise/signal';
import fc from 'fast-check';
import { beforeAll, describe, expect, test } from 'vitest';
import { cli } from './runCli';
import { offsetReader, RangeCut } from '../../src/cli/correctedStream';
import { fileSampleOf, loopInFile } from '../../src/report/cutNumbering';
import type { CliJob } from '../../src/cli/CliJob';

// Issue 11, item 1 and issue 13, item 2 in the command: ranges cut out (--exclude-samples,
// --exclude-time), an offset subtracted (--subtract-offset, a number or the mean) and the
// zero-phase low-pass (--low-pass, --low-pass-order), each checked against @loopwise/signal's
// function applied by hand and the engine's assessLife. The gauge files are INVENTED for the
// test: sums of sines in µε on a mean of 150 µε, sampled at 500 Hz.
let dir = '';
const n = 12000;
const rate = 500;
const gauge = Array.from({ length: n }, (_, i) => Number((150 + 600 * Math.sin(i / 37.1) + 250 * Math.sin(i / 5.3) + 60 * Math.sin(i / 1.3)).toFixed(2)));
const strain = Float64Array.from(gauge, (v) => v / 1e6);
const material = handbookSteels.find((m) => m.name === 'SAE 1045 (hot rolled and normalized)')!;
const job: LifeJob = { material, input: 'local-strain', meanStress: 'smithWatsonTopper' };
const base = ['--column', 'gauge_ue', '--quantity', 'strain', '--unit', 'microstrain', '--material', 'SAE 1045', '--json'];

/** The segments of excludeRanges joined end to end, as the command joins the history across each cut. */
function cutByHand(x: Float64Array, ranges: (SampleRange | TimeRange)[], timeBase?: TimeBase): Float64Array {
  const { segments } = excludeRanges(x, ranges, timeBase ? { timeBase } : {});
  const out = new Float64Array(segments.reduce((a, s) => a + s.values.length, 0));
  let at = 0;
  for (const s of segments) {
    out.set(s.values, at);
    at += s.values.length;
  }
  return out;
}

const relative = (a: number, b: number) => Math.abs(a / b - 1);

async function assess(file: string, extra: string[]): Promise<{ code: number; stderr: string; json: any }> {
  const r = await cli(['assess', join(dir, file), ...base, ...extra]);
  return { code: r.code, stderr: r.stderr, json: r.code === 0 ? JSON.parse(r.stdout) : null };
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'loopwise-corrections-'));
  writeFileSync(join(dir, 'g.csv'), 'gauge_ue\n' + gauge.map((v) => v.toFixed(2)).join('\n') + '\n');
  // the same samples with a time column in ms (2 ms steps)
  writeFileSync(join(dir, 'timed.csv'), 'time_ms,gauge_ue\n' + gauge.map((v, i) => `${2 * i},${v.toFixed(2)}`).join('\n') + '\n');
});

describe('--exclude-samples and --exclude-time', () => {
  test('the life equals assessLife of the history with excludeRanges\' segments joined, and every output says so', async () => {
    const ranges = [{ first: 3000, last: 3999 }, { first: 9000, last: 9500 }];
    const r = await assess('g.csv', ['--exclude-samples', '3000..3999,9000..9500']);
    expect(r.stderr).toBe('');
    const want = assessLife(cutByHand(strain, ranges), job);
    expect(relative(r.json.channels[0].report.life.repeats, want.life.repeats)).toBeLessThanOrEqual(1e-12);
    // the loops are numbered in the joined history
    expect(r.json.channels[0].report.worstLoops.map((w: { startIndex: number }) => w.startIndex)).toEqual(want.worstLoops.map((w) => w.startIndex));
    // and given in the file's sample numbers too: the file's sample there is the joined history's
    const joined = cutByHand(Float64Array.from(gauge), ranges);
    const inFile = r.json.channels[0].worstLoopsInFile as { startSample: number; turnSample: number; acrossCut: boolean }[];
    expect(inFile).toHaveLength(want.worstLoops.length);
    want.worstLoops.forEach((w, k) => {
      expect(gauge[inFile[k].startSample]).toBe(joined[w.startIndex]);
      expect(gauge[inFile[k].turnSample]).toBe(joined[w.turnIndex]);
      const lo = Math.min(inFile[k].startSample, inFile[k].turnSample);
      const hi = Math.max(inFile[k].startSample, inFile[k].turnSample);
      const seam = inFile[k].startSample > inFile[k].turnSample;
      // a cut lies between start and turn (over the seam: outside [turn, start])
      const between = ranges.some((c) => (seam ? c.first > hi || c.first < lo : c.first > lo && c.first < hi));
      expect(inFile[k].acrossCut).toBe(between);
    });
    const c = r.json.channels[0].signalCorrections;
    expect(c).toHaveLength(1);
    expect(c[0]).toMatchObject({ kind: 'ranges-excluded', samples: 1501, places: [{ first: 3000, length: 1000 }, { first: 9000, length: 501 }] });
    expect(c[0].summary).toContain('joined across each cut, 10499 samples kept');
    // the text summary and the HTML report list it too
    const text = await cli(['assess', join(dir, 'g.csv'), ...base.slice(0, -1), '--exclude-samples', '3000..3999', '--exclude-samples', '9000..9500', '--html-out', join(dir, 'cut.html')]);
    expect(text.stdout).toMatch(/corrected +2 range\(s\) cut out \(1501 of 12000 samples: samples 3000\.\.3999, 9000\.\.9500\); the history is joined/);
    expect(readFileSync(join(dir, 'cut.html'), 'utf8')).toMatch(/<li data-kind="ranges-excluded"><code>ranges-excluded<\/code> 2 range\(s\) cut out/);
    // the summary's worst loops and the HTML table give the file's sample numbers
    const first = inFile[0];
    expect(text.stdout).toContain('(samples of the file; the history assessed is joined across the cuts)');
    expect(first.startSample).toBeLessThan(first.turnSample); // this file's worst loop lies inside one repeat
    expect(text.stdout).toContain(`    samples ${first.startSample}–${first.turnSample}${first.acrossCut ? ' (across a cut)' : ''}: σ`);
    expect(readFileSync(join(dir, 'cut.html'), 'utf8')).toContain(`${first.startSample} – ${first.turnSample}${first.acrossCut ? ' (across a cut)' : ''}`);
    // without corrections every output says the samples are as measured
    const plain = await cli(['assess', join(dir, 'g.csv'), ...base.slice(0, -1)]);
    expect(plain.stdout).toContain('corrected              none: the samples as measured');
  });

  test('time ranges: in seconds with a sample rate, in the time column\'s own unit (ms) with a time column', async () => {
    const withRate = await assess('g.csv', ['--sample-rate', String(rate), '--exclude-time', '2.5..4', '--exclude-time', '20..21.5']);
    expect(withRate.stderr).toBe('');
    const byRate = assessLife(cutByHand(strain, [{ startTime: 2.5, endTime: 4 }, { startTime: 20, endTime: 21.5 }], { sampleRate: rate }), job);
    expect(relative(withRate.json.channels[0].report.life.repeats, byRate.life.repeats)).toBeLessThanOrEqual(1e-12);
    // the repeat lasts the samples kept: the service from the time base counts them
    const kept = n - withRate.json.channels[0].signalCorrections[0].samples;
    expect(withRate.json.channels[0].report.life.perRepeat).toBeCloseTo(kept / rate / 3600, 15);
    const column = Float64Array.from({ length: n }, (_, i) => 2 * i);
    const withColumn = await assess('timed.csv', ['--exclude-time', '2500..4000,20000..21500']);
    expect(withColumn.stderr).toBe('');
    const byColumn = assessLife(cutByHand(strain, [{ startTime: 2500, endTime: 4000 }, { startTime: 20000, endTime: 21500 }], column), job);
    expect(relative(withColumn.json.channels[0].report.life.repeats, byColumn.life.repeats)).toBeLessThanOrEqual(1e-12);
    // the same samples either way (2 ms steps)
    expect(withColumn.json.channels[0].report.life.repeats).toBe(withRate.json.channels[0].report.life.repeats);
  });
});

describe('sample numbers across cuts', () => {
  test('the file sample of a joined sample skips every cut before it; a loop over the seam is across a cut when one lies outside [turn, start]', () => {
    const cut = [1000, 1000, 8000, 1001]; // samples 1000..1999 and 8000..9000 cut out
    expect([0, 999, 1000, 6999, 7000, -1].map((i) => fileSampleOf(cut, i))).toEqual([0, 999, 2000, 7999, 9001, -1]);
    expect(loopInFile({ startIndex: 500, turnIndex: 999 }, cut)).toEqual({ startIndex: 500, turnIndex: 999, acrossCut: false });
    expect(loopInFile({ startIndex: 999, turnIndex: 1000 }, cut)).toEqual({ startIndex: 999, turnIndex: 2000, acrossCut: true });
    // over the seam: from 2500 to the end (the cut at 8000), then from 0 to 600
    expect(loopInFile({ startIndex: 1500, turnIndex: 600 }, cut)).toEqual({ startIndex: 2500, turnIndex: 600, acrossCut: true });
    expect(loopInFile({ startIndex: 1500, turnIndex: 600 }, [1000, 1000])).toEqual({ startIndex: 2500, turnIndex: 600, acrossCut: false });
  });
});

describe('--subtract-offset', () => {
  test('a given offset (in µε) and the mean: the life equals assessLife of removeOffset\'s values', async () => {
    const given = await assess('g.csv', ['--subtract-offset', '150']);
    expect(given.stderr).toBe('');
    const byHand = assessLife(removeOffset(strain, { offset: 150 / 1e6 }).values, job);
    expect(relative(given.json.channels[0].report.life.repeats, byHand.life.repeats)).toBeLessThanOrEqual(1e-12);
    expect(given.json.channels[0].signalCorrections[0]).toMatchObject({ kind: 'offset-removed', parameters: { offset: 150, unit: 'µε', method: 'given' } });
    const mean = await assess('g.csv', ['--subtract-offset', 'mean']);
    const byMean = assessLife(removeOffset(strain).values, job);
    expect(relative(mean.json.channels[0].report.life.repeats, byMean.life.repeats)).toBeLessThanOrEqual(1e-12);
    expect(mean.json.channels[0].signalCorrections[0].summary).toMatch(/^offset 1\d\d\.\d+ µε subtracted from 12000 samples \(the mean of the samples assessed\)$/);
    // the record keeps the mean's every digit
    expect(mean.json.channels[0].signalCorrections[0].parameters.offset).toBe(removeOffset(strain).offset * 1e6);
    // the offset changes the means, not the ranges: the life differs from the one as measured
    const asIs = await assess('g.csv', []);
    expect(asIs.json.channels[0].report.life.repeats).not.toBe(mean.json.channels[0].report.life.repeats);
  });

  test('after a cut, the mean is that of the samples kept (corrections in the order cut, offset)', async () => {
    const r = await assess('g.csv', ['--exclude-samples', '100..2999', '--subtract-offset', 'mean']);
    expect(r.stderr).toBe('');
    const want = assessLife(removeOffset(cutByHand(strain, [{ first: 100, last: 2999 }])).values, job);
    expect(relative(r.json.channels[0].report.life.repeats, want.life.repeats)).toBeLessThanOrEqual(1e-12);
    expect(r.json.channels[0].signalCorrections.map((c: { kind: string }) => c.kind)).toEqual(['ranges-excluded', 'offset-removed']);
  });
});

describe('--low-pass', () => {
  test('the life equals assessLife of zeroPhaseLowPass\'s values (sample rate given, or from the time column)', async () => {
    const r = await assess('g.csv', ['--sample-rate', String(rate), '--low-pass', '20', '--low-pass-order', '4']);
    expect(r.stderr).toBe('');
    const want = assessLife(zeroPhaseLowPass(strain, { cutoff: 20, sampleRate: rate, order: 4 }).values, job);
    expect(relative(r.json.channels[0].report.life.repeats, want.life.repeats)).toBeLessThanOrEqual(1e-12);
    expect(r.json.channels[0].signalCorrections[0]).toMatchObject({ kind: 'low-pass', parameters: { cutoff: 20, sampleRate: rate, order: 4 } });
    // the filter removed the 60 µε at 61 Hz (1/1.3 rad a sample): the life is longer
    const asIs = await assess('g.csv', []);
    expect(r.json.channels[0].report.life.repeats).toBeGreaterThan(asIs.json.channels[0].report.life.repeats);
    // a time column in ms with 2 ms steps gives the same 500 Hz
    const timed = await assess('timed.csv', ['--low-pass', '20', '--low-pass-order', '4']);
    expect(timed.stderr).toBe('');
    expect(timed.json.channels[0].report.life.repeats).toBe(r.json.channels[0].report.life.repeats);
    // default order 2
    const two = await assess('g.csv', ['--sample-rate', String(rate), '--low-pass', '20']);
    expect(relative(two.json.channels[0].report.life.repeats, assessLife(zeroPhaseLowPass(strain, { cutoff: 20, sampleRate: rate }).values, job).life.repeats)).toBeLessThanOrEqual(1e-12);
  });

  test('all four in one job file (spikes, cuts, offset, low-pass), in that order; the life equals the flags\'', async () => {
    const file = {
      format: 'loopwise-job',
      version: 1,
      material: 'SAE 1045 (hot rolled and normalized)',
      file: 'g.csv',
      time: { sampleRate: rate },
      channels: [{ column: 'gauge_ue', quantity: 'strain', unit: 'microstrain' }],
      excludeSamples: [{ first: 500, last: 999 }],
      excludeTimes: [{ startTime: 10, endTime: 12 }],
      subtractOffset: 'mean',
      lowPass: { cutoffHz: 30, order: 3 },
    };
    writeFileSync(join(dir, 'all.json'), JSON.stringify(file));
    const r = await cli(['assess', '--job', join(dir, 'all.json'), '--json']);
    expect(r.stderr).toBe('');
    const j = JSON.parse(r.stdout);
    const cutHand = cutByHand(strain, [{ first: 500, last: 999 }, { first: 5000, last: 6000 }]);
    const want = assessLife(zeroPhaseLowPass(removeOffset(cutHand).values, { cutoff: 30, sampleRate: rate, order: 3 }).values, job);
    expect(relative(j.channels[0].report.life.repeats, want.life.repeats)).toBeLessThanOrEqual(1e-12);
    expect(j.channels[0].signalCorrections.map((c: { kind: string }) => c.kind)).toEqual(['ranges-excluded', 'offset-removed', 'low-pass']);
    const flags = await assess('g.csv', ['--sample-rate', String(rate), '--exclude-samples', '500..999', '--exclude-time', '10..12', '--subtract-offset', 'mean', '--low-pass', '30', '--low-pass-order', '3']);
    expect(flags.json.channels[0].report.life.repeats).toBe(j.channels[0].report.life.repeats);
  });

  test('a duty cycle: a given offset and the low-pass on each event (removeOffset, zeroPhaseLowPass), said per event', async () => {
    writeFileSync(join(dir, 'duty.json'), JSON.stringify({ format: 'loopwise-job', version: 1, material: 'SAE 1045 (hot rolled and normalized)', time: { sampleRate: rate }, subtractOffset: 150, lowPass: { cutoffHz: 20 }, channels: [{ column: 'gauge_ue', quantity: 'strain', unit: 'microstrain' }], events: [{ name: 'run', file: 'g.csv', repeats: 2 }] }));
    const r = await cli(['assess', '--job', join(dir, 'duty.json'), '--json']);
    expect(r.stderr).toBe('');
    const j = JSON.parse(r.stdout);
    const corrected = zeroPhaseLowPass(removeOffset(strain, { offset: 150 / 1e6 }).values, { cutoff: 20, sampleRate: rate }).values;
    const want = assessDutyCycle([{ name: 'run', history: corrected, repeats: 2 }], job);
    expect(relative(j.channels[0].report.life.repeats, want.life.repeats)).toBeLessThanOrEqual(1e-12);
    expect(j.channels[0].signalCorrections.map((c: { summary: string }) => c.summary.slice(0, 10))).toEqual(['event run:', 'event run:']);
  });

  test('with a gate fraction (a first read for the range) the low-pass still reports the signal checks; a hot-spot channel is corrected as one', async () => {
    // a file with three one-sample spikes (the signal checks warn about them)
    const spiky = gauge.map((v, i) => ([2000, 7000, 9999].includes(i) ? v + 4000 : v));
    writeFileSync(join(dir, 'spiky.csv'), 'gauge_ue\n' + spiky.map((v) => v.toFixed(2)).join('\n') + '\n');
    const r = await assess('spiky.csv', ['--sample-rate', String(rate), '--low-pass', '40', '--gate-fraction', '0.01']);
    expect(r.stderr).toBe('');
    expect(r.json.warnings.some((w: { code: string }) => w.code === 'spike')).toBe(true);
    const filtered = zeroPhaseLowPass(Float64Array.from(spiky, (v) => v / 1e6), { cutoff: 40, sampleRate: rate }).values;
    let lo = Infinity;
    let hi = -Infinity;
    for (const v of filtered) [lo, hi] = [Math.min(lo, v), Math.max(hi, v)];
    const want = assessLife(filtered, { ...job, gate: 0.01 * (hi - lo) });
    expect(relative(r.json.channels[0].report.life.repeats, want.life.repeats)).toBeLessThanOrEqual(1e-12);
    // two stress gauges at the IIW points: the hot-spot stress (typeALinear: 1.67 a − 0.67 b) less 20 MPa
    writeFileSync(join(dir, 'weld.csv'), 'a_MPa,b_MPa\n' + gauge.map((v, i) => `${(v / 10).toFixed(2)},${(gauge[(i + 7) % n] / 12).toFixed(2)}`).join('\n') + '\n');
    const hot = await cli(['assess', join(dir, 'weld.csv'), '--column', 'a_MPa', '--column', 'b_MPa', '--sn-curve', 'iiw:71', '--hot-spot', 'typeALinear', '--mean-stress', 'goodman', '--ultimate-strength', '500', '--subtract-offset', '20', '--json']);
    expect(hot.stderr).toBe('');
    const h = JSON.parse(hot.stdout).channels[0];
    expect(h.signalCorrections[0]).toMatchObject({ kind: 'offset-removed', parameters: { offset: 20, unit: 'MPa' } });
    const a = gauge.map((v) => Number((v / 10).toFixed(2)));
    const b = gauge.map((_, i) => Number((gauge[(i + 7) % n] / 12).toFixed(2)));
    const byHand = assessLife(removeOffset(hotSpotStress('typeALinear', [a, b]), { offset: 20 }).values, { stressLife: { curve: iiwFatCurve(71), meanStress: { method: 'goodman', ultimateStrength: 500 } } });
    expect(relative(h.report.life.repeats, byHand.life.repeats)).toBeLessThanOrEqual(1e-12);
  });

  test('margin searches the corrected samples (a cut and the low-pass)', async () => {
    const r = await cli(['margin', join(dir, 'g.csv'), ...base.slice(0, -1), '--sample-rate', String(rate), '--exclude-samples', '3000..3999', '--low-pass', '20', '--target-repeats', '1e6', '--json']);
    expect(r.stderr).toBe('');
    const m = JSON.parse(r.stdout).channels[0];
    const corrected = zeroPhaseLowPass(cutByHand(strain, [{ first: 3000, last: 3999 }]), { cutoff: 20, sampleRate: rate }).values;
    expect(relative(assessLife(corrected.map((v) => v * m.factor), job).life.repeats, m.repeats)).toBeLessThanOrEqual(1e-9);
  });
});

describe('bad settings are refused, naming the option or the job field', () => {
  const cases: [string, string[], RegExp][] = [
    ['a range out of order', ['--exclude-samples', '500..100'], /^loopwise assess: --exclude-samples: 500\.\.100 is out of order/],
    ['ranges overlapping', ['--exclude-samples', '100..500,400..600'], /--exclude-samples: 400\.\.600: the ranges must be in increasing order without overlap \(the one before ends at sample 500\)/],
    ['a range beyond the record', ['--exclude-samples', '11000..12000'], /--exclude-samples: 11000\.\.12000 goes beyond the record: .*g\.csv has samples 0 to 11999/],
    ['a range not a range', ['--exclude-samples', '100-200'], /--exclude-samples: expected <from>\.\.<to> \(e\.g\. 1000\.\.1999\), got "100-200"/],
    ['a fraction of a sample', ['--exclude-samples', '1.5..3'], /--exclude-samples: 1\.5\.\.3: sample numbers are whole numbers from 0/],
    ['time ranges without a time base', ['--exclude-time', '1..2'], /--exclude-time: needs the file's time base: give --time-column or --sample-rate/],
    ['a time range out of order', ['--sample-rate', '500', '--exclude-time', '3..2'], /--exclude-time: 3\.\.2 is out of order/],
    ['a time range beyond the record', ['--sample-rate', '500', '--exclude-time', '30..40'], /--exclude-time: 30\.\.40 holds no sample of .*g\.csv \(its time runs from 0 to 23\.998 s\)/],
    ['the cut-off above the Nyquist frequency', ['--sample-rate', '500', '--low-pass', '250'], /--low-pass: the cut-off 250 Hz must lie below half the sample rate \(the Nyquist frequency, 250 Hz at 500 Hz\)/],
    ['the low-pass without a sample rate', ['--low-pass', '20'], /--low-pass: needs the sample rate: give --sample-rate, or --time-column with even steps/],
    ['an order out of range', ['--sample-rate', '500', '--low-pass', '20', '--low-pass-order', '40'], /--low-pass-order: a whole number from 1 to 16, got 40/],
    ['an order without the low-pass', ['--low-pass-order', '4'], /--low-pass-order: only with --low-pass/],
    ['an offset that is no number', ['--subtract-offset', 'average'], /--subtract-offset: expected a number, got "average"/],
  ];
  for (const [what, args, message] of cases) {
    test(`${what}: exit 2 and a message naming the option`, async () => {
      const r = await cli(['assess', join(dir, 'g.csv'), ...base, ...args]);
      expect(r.code).toBe(2);
      expect(r.stderr).toMatch(message);
    });
  }

  test('the cut-off above the Nyquist frequency of a time column (known once read)', async () => {
    const r = await cli(['assess', join(dir, 'timed.csv'), ...base, '--low-pass', '300']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/--low-pass: the cut-off 300 Hz must lie below half the sample rate \(the Nyquist frequency, 250 Hz at 500 Hz\)/);
  });

  const jobCases: [string, Record<string, unknown>, RegExp][] = [
    ['excludeSamples out of order', { excludeSamples: [{ first: 10, last: 5 }] }, /bad\.json: excludeSamples\[0\]: 10\.\.5 is out of order/],
    ['excludeSamples beyond the record', { excludeSamples: [{ first: 10, last: 50000 }] }, /bad\.json: excludeSamples\[0\]: 10\.\.50000 goes beyond the record/],
    ['excludeSamples not whole', { excludeSamples: [{ first: -1, last: 5 }] }, /bad\.json: excludeSamples\[0\]\.first: must be a whole number >= 0/],
    ['excludeTimes without a time base', { excludeTimes: [{ startTime: 1, endTime: 2 }] }, /bad\.json: excludeTimes: needs the file's time base: set "time"/],
    ['excludeTimes with a wrong field', { time: { sampleRate: 500 }, excludeTimes: [{ start: 1, endTime: 2 }] }, /bad\.json: excludeTimes\[0\]\.start: unknown field/],
    ['subtractOffset neither number nor mean', { subtractOffset: 'median' }, /bad\.json: subtractOffset: expected a finite number \(in the channel's unit\) or "mean", got "median"/],
    ['lowPass above Nyquist', { time: { sampleRate: 500 }, lowPass: { cutoffHz: 300 } }, /bad\.json: lowPass\.cutoffHz: the cut-off 300 Hz must lie below half the sample rate/],
    ['lowPass without a sample rate', { lowPass: { cutoffHz: 20 } }, /bad\.json: lowPass: needs the sample rate: set "time"/],
    ['lowPass order', { time: { sampleRate: 500 }, lowPass: { cutoffHz: 20, order: 0 } }, /bad\.json: lowPass\.order: must be a whole number from 1 to 16, got 0/],
  ];
  for (const [what, fields, message] of jobCases) {
    test(`job file: ${what}`, async () => {
      writeFileSync(join(dir, 'bad.json'), JSON.stringify({ format: 'loopwise-job', version: 1, material: 'SAE 1045 (hot rolled and normalized)', file: 'g.csv', channels: [{ column: 'gauge_ue', quantity: 'strain', unit: 'microstrain' }], ...fields }));
      const r = await cli(['assess', '--job', join(dir, 'bad.json')]);
      expect(r.code).toBe(2);
      expect(r.stderr).toMatch(message);
    });
  }

  test('the low-pass refuses, before reading, a file whose held channels would pass half the memory limit', async () => {
    writeFileSync(join(dir, 'big.csv'), 'gauge_ue\n' + Array.from({ length: 60000 }, (_, i) => gauge[i % n].toFixed(2)).join('\n') + '\n');
    const r = await cli(['assess', join(dir, 'big.csv'), ...base, '--sample-rate', '500', '--low-pass', '20', '--memory-limit', '1']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/big\.csv: --low-pass filters forwards and backwards, so it holds every sample of the file in memory: about 0\.9\d MB for about 6\.0e\+4 samples × 1 column\(s\), above half the limit of 1 MB \(--memory-limit\)/);
  });

  test('a duty cycle refuses cuts and the mean', async () => {
    const events = [{ name: 'run', file: 'g.csv', repeats: 1 }];
    for (const [fields, message] of [
      [{ excludeSamples: [{ first: 1, last: 2 }] }, /excludeSamples: cuts apply to a single file/],
      [{ subtractOffset: 'mean' }, /subtractOffset: the mean applies to a single file/],
    ] as const) {
      writeFileSync(join(dir, 'bad.json'), JSON.stringify({ format: 'loopwise-job', version: 1, material: 'SAE 1045 (hot rolled and normalized)', events, channels: [{ column: 'gauge_ue', quantity: 'strain', unit: 'microstrain' }], ...fields }));
      const r = await cli(['assess', '--job', join(dir, 'bad.json')]);
      expect(r.code).toBe(2);
      expect(r.stderr).toMatch(message);
    }
  });
});

describe('streaming: any chunking gives the same corrected samples', () => {
  /** A reader of `x` (one channel) in chunks of the given sizes, in turn; a time column when given. */
  const chunked = (x: Float64Array, sizes: number[], time: Float64Array | null) => async (o: ReaderOptions): Promise<IngestReport> => {
    let first = 0;
    const stop = o.stopAfterSamples ?? x.length;
    for (let k = 0; first < Math.min(stop, x.length); k++) {
      const m = Math.min(sizes[k % sizes.length], x.length - first);
      o.onChunk?.({ firstSample: first, length: m, channels: [x.slice(first, first + m)], time: time ? time.slice(first, first + m) : null } as IngestChunk);
      first += m;
    }
    return { samples: x.length } as IngestReport;
  };
  const collect = async (read: (o: ReaderOptions) => Promise<IngestReport>, stopAfterSamples?: number) => {
    const out: number[] = [];
    await read({ channels: [], ...(stopAfterSamples !== undefined ? { stopAfterSamples } : {}), onChunk: (c: IngestChunk) => out.push(...c.channels[0].subarray(0, c.length)) } as unknown as ReaderOptions);
    return out;
  };

  test('property: cutting sample and time ranges equals excludeRanges joined, for any chunking; a partial read hands on the first kept samples', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.array(fc.double({ min: -100, max: 100, noNaN: true }), { minLength: 4, maxLength: 150 }),
        fc.uniqueArray(fc.nat(149), { minLength: 2, maxLength: 6 }),
        fc.array(fc.integer({ min: 1, max: 23 }), { minLength: 1, maxLength: 6 }),
        fc.boolean(),
        fc.nat(150),
        async (values, ends, sizes, byTime, stop) => {
          const x = Float64Array.from(values);
          const cuts = ends.filter((i) => i < x.length).sort((a, b) => a - b);
          fc.pre(cuts.length >= 2);
          const ranges: SampleRange[] = [];
          for (let k = 0; k + 1 < cuts.length; k += 2) ranges.push({ first: cuts[k], last: cuts[k + 1] });
          fc.pre(ranges.reduce((a, r) => a + r.last - r.first + 1, 0) < x.length);
          // time ranges on a column of 0.5 s steps (each range's ends at its samples' times)
          const time = Float64Array.from(x, (_, i) => i / 2);
          const times = ranges.map((r) => ({ startTime: r.first / 2, endTime: r.last / 2 }));
          const cliJob = { jobShown: 'job.json', time: { column: 't' }, channels: [] } as unknown as CliJob;
          const make = () => (byTime ? new RangeCut(cliJob, [], times) : new RangeCut(cliJob, ranges, []));
          const want = Array.from(byTime ? cutByHand(x, times, time) : cutByHand(x, ranges));
          const one = make();
          const whole = await collect(one.reader(chunked(x, [x.length], time)));
          const cut = make();
          const reader = cut.reader(chunked(x, sizes, time));
          expect(whole).toEqual(want);
          expect(await collect(reader)).toEqual(want);
          const k = Math.min(stop, want.length);
          expect((await collect(reader, k)).slice(0, k)).toEqual(want.slice(0, k));
          // the flagged samples move with the cut: a spike at a kept sample keeps its value
          const spike = cuts[0] > 0 ? 0 : cuts[cuts.length - 1] + 1;
          if (!byTime && spike < x.length) {
            const mapped = cut.artefacts({ spikes: Float64Array.of(spike), runs: new Float64Array(0) }).spikes;
            expect(want[mapped[0]]).toBe(x[spike]);
          }
        },
      ),
      { seed: 1311, numRuns: 400 },
    );
  });

  test('property: subtracting an offset equals removeOffset, for any chunking', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.array(fc.double({ min: -100, max: 100, noNaN: true }), { minLength: 1, maxLength: 120 }),
        fc.double({ min: -50, max: 50, noNaN: true }),
        fc.array(fc.integer({ min: 1, max: 17 }), { minLength: 1, maxLength: 6 }),
        async (values, offset, sizes) => {
          const x = Float64Array.from(values);
          const want = Array.from(removeOffset(x, { offset }).values);
          expect(await collect(offsetReader(chunked(x, sizes, null), [offset]))).toEqual(want);
        },
      ),
      { seed: 1312, numRuns: 300 },
    );
  });
});
