import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, test } from 'vitest';
import { cli } from './runCli';

// The time base of a time column in a job file is read as on the command line (issue 11, items
// 4 and 6): the unit of a units row (`ms`) counts, and a rate from an even step is the rate a
// user would give (1 / 0.01 s is 100 Hz, not 100.00000000000001). The gauge files are INVENTED
// for the test (sums of sines in µε).
let dir = '';
const n = 2000;
const gauge = Array.from({ length: n }, (_, i) => (250 + 400 * Math.sin(i / 17.3) + 90 * Math.sin(i / 2.1)).toFixed(3));

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'loopwise-time-units-'));
  // a units row under the header: the time column in ms (10 ms steps), the gauge in µε
  writeFileSync(join(dir, 'ms.csv'), 't,gauge\nms,ue\n' + gauge.map((v, i) => `${10 * i},${v}`).join('\n') + '\n');
  writeFileSync(join(dir, 'seconds.csv'), 'time_s,gauge_ue\n' + gauge.map((v, i) => `${(i / 100).toFixed(2)},${v}`).join('\n') + '\n');
  writeFileSync(
    join(dir, 'job.json'),
    JSON.stringify({ format: 'loopwise-job', version: 1, file: 'ms.csv', time: { column: 't' }, channels: [{ name: 'g', column: 'gauge', quantity: 'strain', unit: 'microstrain' }], material: 'SAE 1045 (hot rolled and normalized)', lowPass: { cutoffHz: 10 } }),
  );
});

describe('time column units in a job file, and rates from even steps', () => {
  test('a job file reads the units row\'s ms as the options do: the low-pass runs at 100 Hz, the service is 20 s', async () => {
    const job = await cli(['assess', '--job', join(dir, 'job.json'), '--json']);
    expect(job.code).toBe(0);
    const flags = await cli(['assess', join(dir, 'ms.csv'), '--column', 'gauge', '--time-column', 't', '--material', 'SAE 1045', '--low-pass', '10', '--json']);
    expect(flags.code).toBe(0);
    const [a, b] = [JSON.parse(job.stdout).channels[0], JSON.parse(flags.stdout).channels[0]];
    expect(a.signalCorrections[0].parameters.sampleRate).toBe(100);
    expect(b.signalCorrections[0].parameters.sampleRate).toBe(100);
    expect(a.report.damage.perRepeat).toBe(b.report.damage.perRepeat);
    // a repeat stands for the record's 20 s (2000 samples × 10 ms), in hours
    expect(a.report.life.unit).toBe('h');
    expect(Math.abs(a.report.life.service / a.report.life.repeats / (20 / 3600) - 1)).toBeLessThan(1e-12);
  });

  test('a cut-off at half the rate of a 0.01 s time column is refused as with --sample-rate 100', async () => {
    const args = [join(dir, 'seconds.csv'), '--column', 'gauge_ue', '--quantity', 'strain', '--unit', 'microstrain', '--material', 'SAE 1045'];
    const fromColumn = await cli(['assess', ...args, '--low-pass', '50']);
    expect(fromColumn.code).toBe(2);
    expect(fromColumn.stderr).toMatch(/--low-pass: the cut-off 50 Hz must lie below half the sample rate \(the Nyquist frequency, 50 Hz at 100 Hz\)/);
    const ok = await cli(['assess', ...args, '--low-pass', '20', '--json']);
    expect(JSON.parse(ok.stdout).channels[0].signalCorrections[0].summary).toMatch(/cut-off 20 Hz at 100 Hz,/);
  });
});
