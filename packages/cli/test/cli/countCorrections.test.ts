import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { zeroPhaseLowPass } from '@loopwise/signal';
import { beforeAll, describe, expect, test } from 'vitest';
import { cli } from './runCli';

// `loopwise count` with the corrections of the signal assess takes (--interpolate-spikes,
// --exclude-samples, --exclude-time, --subtract-offset, --low-pass, --low-pass-order). Each is
// checked against a computation of its own: count of a file the test corrected by hand (rows
// deleted, the spike replaced by its line, the filtered samples written out), or the plain
// count's cycles moved by the offset. The gauge file is INVENTED for the test: sums of sines in
// µε on a mean of 150 µε, sampled at 500 Hz, with one spike of +5000 µε put in at sample 2345.
let dir = '';
const n = 12000;
const rate = 500;
const spikeAt = 2345;
const smooth = Array.from({ length: n }, (_, i) => Number((150 + 600 * Math.sin(i / 37.1) + 250 * Math.sin(i / 5.3) + 60 * Math.sin(i / 1.3)).toFixed(2)));
const gauge = smooth.map((v, i) => (i === spikeAt ? Number((v + 5000).toFixed(2)) : v));
const channel = ['--column', 'gauge_ue', '--quantity', 'strain', '--unit', 'microstrain'];

/** A one-column gauge file of these values (shortest round-trip text: it parses back to the same numbers). */
function gaugeFile(name: string, values: readonly number[]): string {
  writeFileSync(join(dir, name), 'gauge_ue\n' + values.map((v) => String(v)).join('\n') + '\n');
  return name;
}

interface Counted {
  code: number;
  stderr: string;
  json: any;
  /** The cycles CSV (header and rows). */
  cycles: string;
  /** The range-mean matrix as JSON (loopwise-cycle-matrix). */
  matrix: any;
}

let runs = 0;
/** `loopwise count <file> <channel> <extra> --json` with the cycles CSV and the matrix written. */
async function count(file: string, extra: string[]): Promise<Counted> {
  const k = runs++;
  const cyclesOut = join(dir, `cycles-${k}.csv`);
  const matrixOut = join(dir, `matrix-${k}.json`);
  const r = await cli(['count', join(dir, file), ...channel, ...extra, '--cycles-out', cyclesOut, '--matrix-out', matrixOut, '--json']);
  if (r.code !== 0) return { code: r.code, stderr: r.stderr, json: null, cycles: '', matrix: null };
  return { code: r.code, stderr: r.stderr, json: JSON.parse(r.stdout), cycles: readFileSync(cyclesOut, 'utf8'), matrix: JSON.parse(readFileSync(matrixOut, 'utf8')) };
}

/** The rows of a cycles CSV as numbers: range, mean, from, to, count, start, turn, close. */
function rowsOf(csv: string): number[][] {
  return csv.trim().split('\n').slice(1).map((line) => line.split(',').map(Number));
}

/** What two counts of the same history agree on: every cycle with its sample numbers, the matrix, the summary's figures. */
function expectSameCount(got: Counted, want: Counted): void {
  expect(got.cycles).toBe(want.cycles);
  expect(got.matrix).toEqual(want.matrix);
  for (const k of ['samples', 'turningPoints', 'cycles', 'largestRange', 'gate', 'removedReversals', 'spectrum'] as const) expect(got.json[k]).toEqual(want.json[k]);
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'loopwise-count-corrections-'));
  gaugeFile('g.csv', gauge);
});

describe('count --exclude-samples and --exclude-time', () => {
  test('count --exclude-samples a..b (twice) equals count of the file with those rows deleted; the matrix spans the history kept', async () => {
    // the second cut holds the spike: the plain count's span has it, the corrected one must not
    const got = await count('g.csv', ['--exclude-samples', '2300..2399,3000..3999', '--exclude-samples', '9000..9500']);
    expect(got.stderr).toBe('');
    const kept = gauge.filter((_, i) => !((i >= 2300 && i <= 2399) || (i >= 3000 && i <= 3999) || (i >= 9000 && i <= 9500)));
    const want = await count(gaugeFile('kept.csv', kept), []);
    expectSameCount(got, want);
    expect(got.json.samples).toBe(n - 100 - 1000 - 501);
    const plain = await count('g.csv', []);
    expect(plain.json.largestRange).toBeGreaterThan(got.json.largestRange + 4000); // the spike is gone from the span
    // the record, as assess gives it, and the numbering said
    expect(got.json.signalCorrections).toHaveLength(1);
    expect(got.json.signalCorrections[0]).toMatchObject({ kind: 'ranges-excluded', samples: 1601, places: [{ first: 2300, length: 100 }, { first: 3000, length: 1000 }, { first: 9000, length: 501 }] });
    expect(got.json.signalCorrections[0].summary).toBe(
      '3 range(s) cut out (1601 of 12000 samples: samples 2300..2399, 3000..3999, 9000..9500); the history is joined across each cut, 10399 samples kept; its sample numbers count the samples kept',
    );
    expect(got.json.sampleNumbers).toBe('kept');
    expect(want.json.sampleNumbers).toBe('file');
    expect(want.json.signalCorrections).toEqual([]);
  }, 20000);

  test('count --exclude-time t0..t1 with a sample rate equals count of the file with the rows of those times deleted', async () => {
    // t = sample / 500 Hz: 2 s .. 3.998 s are samples 1000 .. 1999
    const got = await count('g.csv', ['--sample-rate', String(rate), '--exclude-time', '2..3.998']);
    expect(got.stderr).toBe('');
    const want = await count(gaugeFile('kept-t.csv', gauge.filter((_, i) => i < 1000 || i > 1999)), ['--sample-rate', String(rate)]);
    expectSameCount(got, want);
    expect(got.json.signalCorrections[0].places).toEqual([{ first: 1000, length: 1000 }]);
  });

  test('a gate fraction is of the range of the history kept (the first read goes through the cuts)', async () => {
    const got = await count('g.csv', ['--exclude-samples', '2000..2999', '--gate-fraction', '0.05']);
    const kept = gauge.filter((_, i) => i < 2000 || i > 2999);
    expect(got.json.gate).toBe(0.05 * (Math.max(...kept) - Math.min(...kept)));
    expectSameCount(got, await count(gaugeFile('kept-g.csv', kept), ['--gate-fraction', '0.05']));
  });
});

describe('count --interpolate-spikes', () => {
  test('equals count of the file with the spike replaced by the straight line between its neighbours', async () => {
    const got = await count('g.csv', ['--interpolate-spikes']);
    expect(got.stderr).toBe('');
    const fixed = gauge.slice();
    fixed[spikeAt] = (gauge[spikeAt - 1] + gauge[spikeAt + 1]) / 2;
    const want = await count(gaugeFile('fixed.csv', fixed), []);
    expectSameCount(got, want);
    expect(got.json.signalCorrections).toEqual([
      { kind: 'spikes-interpolated', summary: `1 spike(s) interpolated (1 samples), first at sample ${spikeAt}`, samples: 1, parameters: { method: 'linear interpolation' }, places: [{ first: spikeAt, length: 1 }] },
    ]);
    // the file's sample numbers are kept (nothing was cut)
    expect(got.json.sampleNumbers).toBe('file');
  });
});

describe('count --subtract-offset', () => {
  test('a given 100 (µε, the channel\'s own unit) moves every cycle\'s mean, from and to by -100 and keeps its range and samples', async () => {
    const got = await count('g.csv', ['--subtract-offset', '100']);
    expect(got.stderr).toBe('');
    const plain = await count('g.csv', []);
    const a = rowsOf(got.cycles);
    const b = rowsOf(plain.cycles);
    expect(a.length).toBe(b.length);
    expect(a.length).toBeGreaterThan(1000);
    // values near 1e3 µε: two roundings of the subtraction give at most a few 1e-13
    const close = (x: number, y: number) => expect(Math.abs(x - y)).toBeLessThanOrEqual(1e-9);
    a.forEach((row, i) => {
      close(row[0], b[i][0]);
      close(row[1], b[i][1] - 100);
      close(row[2], b[i][2] - 100);
      close(row[3], b[i][3] - 100);
      expect(row.slice(4)).toEqual(b[i].slice(4));
    });
    expect(got.json.unit).toBe('µε');
    expect(got.json.signalCorrections[0]).toMatchObject({ kind: 'offset-removed', parameters: { offset: 100, unit: 'µε', method: 'given' }, summary: 'offset 100 µε subtracted from 12000 samples (as given)' });
    // the matrix's mean axis moved with the history
    close(got.matrix.columnEdges[0], plain.matrix.columnEdges[0] - 100);
    close(got.json.largestRange, plain.json.largestRange);
  });

  test('a ksi stress channel: the offset is in ksi as given (not converted to MPa), and so is every cycle', async () => {
    writeFileSync(join(dir, 'ksi.csv'), 'stress_ksi\n' + gauge.map((v) => String(v / 20)).join('\n') + '\n');
    const r = async (extra: string[], out: string) => {
      const j = JSON.parse((await cli(['count', join(dir, 'ksi.csv'), '--column', 'stress_ksi', '--quantity', 'stress', '--unit', 'ksi', ...extra, '--cycles-out', join(dir, out), '--json'])).stdout);
      return { json: j, rows: rowsOf(readFileSync(join(dir, out), 'utf8')) };
    };
    const got = await r(['--subtract-offset', '5'], 'ksi-5.csv');
    const plain = await r([], 'ksi-0.csv');
    expect(got.json.unit).toBe('ksi');
    expect(got.json.signalCorrections[0]).toMatchObject({ parameters: { offset: 5, unit: 'ksi' }, summary: 'offset 5 ksi subtracted from 12000 samples (as given)' });
    expect(got.rows.length).toBe(plain.rows.length);
    got.rows.forEach((row, i) => {
      expect(Math.abs(row[0] - plain.rows[i][0])).toBeLessThanOrEqual(1e-9);
      expect(Math.abs(row[1] - (plain.rows[i][1] - 5))).toBeLessThanOrEqual(1e-9);
    });
  });

  test('mean: the corrected history has a mean of about 0 (the mean of the file as the test sums it); ranges kept', async () => {
    const got = await count('g.csv', ['--subtract-offset', 'mean']);
    expect(got.stderr).toBe('');
    const mean = gauge.reduce((s, v) => s + v, 0) / n;
    const record = got.json.signalCorrections[0];
    expect(record).toMatchObject({ kind: 'offset-removed', parameters: { unit: 'µε', method: 'mean' } });
    // a plain sum of 12000 values near 1e3 against the command's compensated one: well within 1e-9 relative
    expect(Math.abs(record.parameters.offset / mean - 1)).toBeLessThanOrEqual(1e-9);
    expect(record.summary).toMatch(/^offset 1\d\d\.\d+ µε subtracted from 12000 samples \(the mean of the samples assessed\)$/);
    // the corrected history, given by its extremes on the matrix's mean axis, lies about 0
    expect(Math.abs(gauge.reduce((s, v) => s + (v - record.parameters.offset), 0) / n)).toBeLessThanOrEqual(1e-9);
    expect(Math.abs(got.matrix.columnEdges[0] - (Math.min(...gauge) - mean))).toBeLessThanOrEqual(1e-9);
    const want = await count(gaugeFile('centred.csv', gauge.map((v) => v - mean)), []);
    const a = rowsOf(got.cycles);
    const b = rowsOf(want.cycles);
    expect(a.length).toBe(b.length);
    a.forEach((row, i) => {
      for (let j = 0; j < 4; j++) expect(Math.abs(row[j] - b[i][j])).toBeLessThanOrEqual(1e-9);
      expect(row.slice(4)).toEqual(b[i].slice(4));
    });
  });

  test('after a cut the mean is that of the samples kept', async () => {
    const got = await count('g.csv', ['--exclude-samples', '0..2999', '--subtract-offset', 'mean']);
    const kept = gauge.slice(3000);
    const mean = kept.reduce((s, v) => s + v, 0) / kept.length;
    expect(got.json.signalCorrections.map((c: { kind: string }) => c.kind)).toEqual(['ranges-excluded', 'offset-removed']);
    expect(Math.abs(got.json.signalCorrections[1].parameters.offset / mean - 1)).toBeLessThanOrEqual(1e-9);
    expect(got.json.signalCorrections[1].summary).toContain(`subtracted from ${kept.length} samples`);
  });
});

describe('count --low-pass', () => {
  test('equals count of a file holding zeroPhaseLowPass of the same samples (order 4, and the default 2)', async () => {
    for (const order of [4, undefined]) {
      const extra = ['--sample-rate', String(rate), '--low-pass', '20', ...(order !== undefined ? ['--low-pass-order', String(order)] : [])];
      const got = await count('g.csv', extra);
      expect(got.stderr).toBe('');
      const filtered = zeroPhaseLowPass(Float64Array.from(gauge), { cutoff: 20, sampleRate: rate, ...(order !== undefined ? { order } : {}) }).values;
      // The same filter on the same doubles: the command filters in place (zeroPhaseLowPassInto),
      // which @loopwise/signal makes equal to zeroPhaseLowPass to the bit, and the file holds each
      // filtered value as its shortest round-trip text, which reads back as the same double. So
      // the tolerance is none: every cycle, sample number and bin is the same.
      const want = await count(gaugeFile(`filtered-${order ?? 2}.csv`, Array.from(filtered)), ['--sample-rate', String(rate)]);
      expectSameCount(got, want);
      let lo = Infinity;
      let hi = -Infinity;
      for (const v of filtered) [lo, hi] = [Math.min(lo, v), Math.max(hi, v)];
      expect(got.json.largestRange).toBe(hi - lo); // the first read (the span) is of the filtered history
      expect(got.json.signalCorrections[0]).toMatchObject({ kind: 'low-pass', parameters: { cutoff: 20, sampleRate: rate, order: order ?? 2 } });
    }
  }, 20000);
});

describe('count says what it corrected', () => {
  test('the text summary lists the corrections as assess does and, after a cut, how the cycles CSV numbers its samples', async () => {
    const r = await cli(['count', join(dir, 'g.csv'), ...channel, '--interpolate-spikes', '--exclude-samples', '9000..9500', '--subtract-offset', '100']);
    expect(r.stderr).toBe('');
    const lines = r.stdout.split('\n');
    expect(lines[1]).toBe(`corrected 1 spike(s) interpolated (1 samples), first at sample ${spikeAt}`);
    expect(lines[2]).toBe('corrected 1 range(s) cut out (501 of 12000 samples: samples 9000..9500); the history is joined across each cut, 11499 samples kept; its sample numbers count the samples kept');
    expect(lines[3]).toBe('corrected offset 100 µε subtracted from 11499 samples (as given)');
    expect(lines[4]).toBe("sample numbers (the cycles CSV's start_sample, turn_sample, close_sample) count the samples kept: the history is joined across the cuts");
    // the same records as assess gives for the same options
    const a = JSON.parse((await cli(['assess', join(dir, 'g.csv'), ...channel, '--material', 'SAE 1045', '--interpolate-spikes', '--exclude-samples', '9000..9500', '--subtract-offset', '100', '--json'])).stdout);
    const c = JSON.parse((await cli(['count', join(dir, 'g.csv'), ...channel, '--interpolate-spikes', '--exclude-samples', '9000..9500', '--subtract-offset', '100', '--json'])).stdout);
    const bare = (list: { kind: string; summary: string }[]) => list.map((x) => ({ ...x, summary: x.summary.replace(' (the worst loops are also given in the file\'s)', '') }));
    expect(c.signalCorrections).toEqual(bare(a.channels[0].signalCorrections));
    // nothing asked: said so, and no word on numbering
    const plain = await cli(['count', join(dir, 'g.csv'), ...channel]);
    expect(plain.stdout.split('\n')[1]).toBe('corrected none: the samples as measured');
    expect(plain.stdout).not.toContain('count the samples kept');
  }, 20000);
});

describe('count refuses bad corrections: exit 2, one line naming the option', () => {
  const cases: [string, string[], RegExp][] = [
    ['a range out of order', ['--exclude-samples', '5..2'], /^loopwise count: --exclude-samples: 5\.\.2 is out of order/],
    ['ranges overlapping', ['--exclude-samples', '100..500,400..600'], /^loopwise count: --exclude-samples: 400\.\.600: the ranges must be in increasing order without overlap/],
    ['a range beyond the record', ['--exclude-samples', '11000..12000'], /^loopwise count: --exclude-samples: 11000\.\.12000 goes beyond the record: .*g\.csv has samples 0 to 11999/],
    ['a range not a range', ['--exclude-samples', '100-200'], /^loopwise count: --exclude-samples: expected <from>\.\.<to>/],
    ['time ranges without a time base', ['--exclude-time', '1..2'], /^loopwise count: --exclude-time: needs the file's time base: give --time-column or --sample-rate/],
    ['a time range beyond the record', ['--sample-rate', '500', '--exclude-time', '30..40'], /^loopwise count: --exclude-time: 30\.\.40 holds no sample of .*g\.csv/],
    ['the order without the low-pass', ['--low-pass-order', '4'], /^loopwise count: --low-pass-order: only with --low-pass/],
    ['the cut-off above the Nyquist frequency', ['--sample-rate', '500', '--low-pass', '300'], /^loopwise count: --low-pass: the cut-off 300 Hz must lie below half the sample rate \(the Nyquist frequency, 250 Hz at 500 Hz\)/],
    ['the low-pass without a sample rate', ['--low-pass', '20'], /^loopwise count: --low-pass: needs the sample rate/],
    ['an order out of range', ['--sample-rate', '500', '--low-pass', '20', '--low-pass-order', '40'], /^loopwise count: --low-pass-order: a whole number from 1 to 16, got 40/],
    ['an offset that is no number', ['--subtract-offset', 'average'], /^loopwise count: --subtract-offset: expected a number, got "average"/],
  ];
  for (const [what, args, message] of cases) {
    test(`${what}: ${args.join(' ')}`, async () => {
      const r = await cli(['count', join(dir, 'g.csv'), ...channel, ...args]);
      expect(r.code).toBe(2);
      expect(r.stdout).toBe('');
      expect(r.stderr.trimEnd().split('\n')).toHaveLength(1);
      expect(r.stderr).toMatch(message);
    });
  }

  test('the low-pass refuses, before reading, a file whose held samples would pass half the memory limit (as assess)', async () => {
    gaugeFile('big.csv', Array.from({ length: 60000 }, (_, i) => gauge[i % n]));
    const r = await cli(['count', join(dir, 'big.csv'), ...channel, '--sample-rate', '500', '--low-pass', '20', '--memory-limit', '1']);
    expect(r.code).toBe(2);
    expect(r.stderr.trimEnd().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/^loopwise count: .*big\.csv: --low-pass filters forwards and backwards, so it holds every sample of the file in memory: about \S+ MB for about 6\.0e\+4 samples × 1 column\(s\), above half the limit of 1 MB \(--memory-limit\)/);
  });
});
