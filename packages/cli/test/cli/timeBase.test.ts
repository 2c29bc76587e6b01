import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, test } from 'vitest';
import { cli } from './runCli';
import { formatNumber } from '../../src/report/formatNumber';

// Issue 11, items 5 and 6: with a time column or a sample rate the service per repeat comes from
// the time base unless given, the worst loops carry their times, the history plot has a time
// axis, a duty cycle's events are marked on it, and µε stays µε. Files INVENTED for the test.
let dir = '';
const n = 5000;
const step = 0.002; // 500 Hz
const gauge = Array.from({ length: n }, (_, i) => Number((700 * Math.sin(i / 31.3) + 200 * Math.sin(i / 4.1)).toFixed(2)));


beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'loopwise-time-'));
  writeFileSync(join(dir, 'timed.csv'), 'time_s,gauge_ue\n' + gauge.map((v, i) => `${(i * step).toFixed(3)},${v.toFixed(2)}`).join('\n') + '\n');
  writeFileSync(join(dir, 'plain.csv'), 'gauge_ue\n' + gauge.map((v) => v.toFixed(2)).join('\n') + '\n');
  writeFileSync(join(dir, 'yard.csv'), 'gauge_ue\n' + gauge.slice(0, 1200).map((v) => (1.4 * v).toFixed(2)).join('\n') + '\n');
  const job = {
    format: 'loopwise-job',
    version: 1,
    material: 'SAE 1045 (hot rolled and normalized)',
    channels: [{ name: 'gauge', column: 'gauge_ue', quantity: 'strain', unit: 'microstrain' }],
    events: [
      { name: 'road', file: 'plain.csv', repeats: 2 },
      { name: 'yard', file: 'yard.csv', repeats: 1 },
    ],
  };
  writeFileSync(join(dir, 'duty.json'), JSON.stringify(job));
});

const base = ['--column', 'gauge_ue', '--quantity', 'strain', '--unit', 'microstrain', '--material', 'SAE 1045'];

describe('the time base', () => {
  test('no --service: the service per repeat is the record\'s duration in hours (samples × step), said in an input line', async () => {
    const r = await cli(['assess', join(dir, 'timed.csv'), ...base, '--json']);
    expect(r.code).toBe(0);
    const life = JSON.parse(r.stdout).channels[0].report.life;
    expect(life.unit).toBe('h');
    expect(life.perRepeat).toBeCloseTo((n * step) / 3600, 15);
    expect(life.service).toBeCloseTo(life.repeats * life.perRepeat, 6);
    expect(life.designService).toBeCloseTo(life.designRepeats * life.perRepeat, 6);
    const text = await cli(['assess', join(dir, 'timed.csv'), ...base]);
    expect(text.stdout).toContain(`input: service per repeat: ${formatNumber((n * step) / 3600)} h (10 s: 5000 samples × 0.002 s) from the time base`);
    // a given service wins
    const given = JSON.parse((await cli(['assess', join(dir, 'timed.csv'), ...base, '--service', '3 km', '--json'])).stdout).channels[0].report.life;
    expect(given).toMatchObject({ unit: 'km', perRepeat: 3 });
    // no time base: no service
    expect(JSON.parse((await cli(['assess', join(dir, 'plain.csv'), ...base, '--json'])).stdout).channels[0].report.life.unit).toBeUndefined();
  });

  test('a time column in ms (by its name, or by its units row) is converted to seconds', async () => {
    const ms = gauge.map((v, i) => `${i * 2},${v.toFixed(2)}`);
    writeFileSync(join(dir, 'named.csv'), 'time_ms,gauge_ue\n' + ms.join('\n') + '\n');
    writeFileSync(join(dir, 'unitrow.csv'), 't,gauge\n[ms],[µε]\n' + ms.join('\n') + '\n');
    for (const [f, column] of [['named.csv', 'gauge_ue'], ['unitrow.csv', 'gauge']]) {
      const j = JSON.parse((await cli(['assess', join(dir, f), '--column', column, '--quantity', 'strain', '--unit', 'microstrain', '--material', 'SAE 1045', '--json'])).stdout);
      expect(j.channels[0].report.life.perRepeat, f).toBeCloseTo((n * step) / 3600, 15);
    }
  });

  test('the worst loops carry their times (index × step) and their strains in µε; the HTML history has a time axis and µε values', async () => {
    const j = JSON.parse((await cli(['assess', join(dir, 'timed.csv'), ...base, '--json'])).stdout);
    const w = j.channels[0].report.worstLoops[0];
    expect(j.channels[0].unit).toBe('µε');
    const text = (await cli(['assess', join(dir, 'timed.csv'), ...base, '--html-out', join(dir, 't.html')])).stdout;
    const line = text.split('\n').find((l) => l.includes('% of the damage'))!;
    expect(line).toContain(`(t ${formatNumber(w.startIndex * step)} s – ${formatNumber(w.turnIndex * step)} s)`);
    expect(line).toContain(`ε ${formatNumber(w.strainMin * 1e6)} … ${formatNumber(w.strainMax * 1e6)} µε`);
    const html = readFileSync(join(dir, 't.html'), 'utf8');
    const history = /<svg[^>]*data-plot="history".*?<\/svg>/s.exec(html)![0];
    expect(history).toContain('>time (s)<');
    // the markers' values are the file's µε (the display copy keeps each pixel column's extremes)
    const values = [...history.matchAll(/data-value="([^"]+)"/g)].map((m) => Number(m[1]));
    expect(Math.max(...values)).toBeCloseTo(Math.max(...gauge), 6);
  });

  test('a duty cycle\'s history marks where each event starts', async () => {
    const r = await cli(['assess', '--job', join(dir, 'duty.json'), '--html-out', join(dir, 'd.html')]);
    expect(r.code).toBe(0);
    const html = readFileSync(join(dir, 'd.html'), 'utf8');
    const starts = [...html.matchAll(/<g class="event-start" data-event="([^"]+)" data-index="([^"]+)"/g)].map((m) => [m[1], Number(m[2])]);
    expect(starts).toEqual([
      ['road', 0],
      ['yard', n],
    ]);
    expect(html).toContain('>sample index<');
  });
});
