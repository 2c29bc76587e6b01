import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { assessDutyCycle, assessLife, type LifeJob } from '@loopwise/engine';
import type { IngestChunk, IngestReport, ReaderOptions } from '@loopwise/ingest';
import { handbookSteels } from '@loopwise/material';
import { removeSpikes } from '@loopwise/signal';
import fc from 'fast-check';
import { beforeAll, describe, expect, test } from 'vitest';
import { cli } from './runCli';
import { spikeInterpolatedReader } from '../../src/cli/spikeInterpolation';

// Issue 11, item 1 in the command: --interpolate-spikes (a job's interpolateSpikes) assesses the
// samples with the flagged one-sample spikes on the line between their neighbours, at the same
// sample indices. The gauge file is INVENTED for the test: sums of sines in µε with three spikes.
let dir = '';
const n = 20000;
const spikes = [2345, 9000, 15001];
const gauge = Array.from({ length: n }, (_, i) => (spikes.includes(i) ? 5000 : Number((600 * Math.sin(i / 37.1) + 250 * Math.sin(i / 5.3) + 40 * Math.sin(i / 1.7)).toFixed(2))));
const fixedByHand = gauge.map((v, i) => (spikes.includes(i) ? (gauge[i - 1] + gauge[i + 1]) / 2 : v));
const material = handbookSteels.find((m) => m.name === 'SAE 1045 (hot rolled and normalized)')!;
const job: LifeJob = { material, input: 'local-strain', meanStress: 'smithWatsonTopper' };


beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'loopwise-interp-'));
  writeFileSync(join(dir, 'g.csv'), 'gauge_ue\n' + gauge.map((v) => v.toFixed(2)).join('\n') + '\n');
});

describe('--interpolate-spikes', () => {
  test('the life equals the engine on the history with the spikes interpolated by hand, and the output says which samples were corrected', async () => {
    const r = await cli(['assess', join(dir, 'g.csv'), '--quantity', 'strain', '--unit', 'microstrain', '--material', 'SAE 1045', '--interpolate-spikes', '--json']);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    const want = assessLife(fixedByHand.map((v) => v / 1e6), job);
    expect(Math.abs(j.channels[0].report.life.repeats / want.life.repeats - 1)).toBeLessThanOrEqual(1e-12);
    // the loops keep the file's sample numbers
    expect(j.channels[0].report.worstLoops.map((w: { startIndex: number }) => w.startIndex)).toEqual(want.worstLoops.map((w) => w.startIndex));
    const said = j.warnings.find((w: { code: string }) => w.code === 'spikes-interpolated');
    expect(said.message).toContain('3 spike(s) interpolated between their neighbours (asked for) at sample(s) 2345, 9000, 15001');
    // the record of the correction, as @loopwise/signal's removeSpikes words it
    const record = removeSpikes(gauge, spikes).correction;
    expect(j.channels[0].signalCorrections).toEqual([{ kind: record.kind, summary: record.summary, samples: record.samples, parameters: record.parameters, places: spikes.map((first) => ({ first, length: 1 })) }]);
    // without the option the spikes stay in and the life is shorter
    const asIs = JSON.parse((await cli(['assess', join(dir, 'g.csv'), '--quantity', 'strain', '--unit', 'microstrain', '--material', 'SAE 1045', '--json'])).stdout);
    expect(asIs.channels[0].report.life.repeats).toBeLessThan(j.channels[0].report.life.repeats);
  });

  test('margin with --interpolate-spikes searches the corrected samples', async () => {
    const r = await cli(['margin', join(dir, 'g.csv'), '--quantity', 'strain', '--unit', 'microstrain', '--material', 'SAE 1045', '--interpolate-spikes', '--target-repeats', '1e6', '--json']);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const m = JSON.parse(r.stdout).channels[0];
    const at = assessLife(fixedByHand.map((v) => (v / 1e6) * m.factor), job).life.repeats;
    expect(Math.abs(at / m.repeats - 1)).toBeLessThanOrEqual(1e-9);
  });

  test('a duty cycle of a job file with interpolateSpikes: each event read whole and corrected', async () => {
    writeFileSync(join(dir, 'job.json'), JSON.stringify({ format: 'loopwise-job', version: 1, material: 'SAE 1045 (hot rolled and normalized)', interpolateSpikes: true, channels: [{ column: 'gauge_ue', quantity: 'strain', unit: 'microstrain' }], events: [{ name: 'run', file: 'g.csv', repeats: 2 }] }));
    const r = await cli(['assess', '--job', join(dir, 'job.json'), '--json']);
    expect(r.stderr).toBe('');
    const want = assessDutyCycle([{ name: 'run', history: fixedByHand.map((v) => v / 1e6), repeats: 2 }], job);
    expect(Math.abs(JSON.parse(r.stdout).channels[0].report.life.repeats / want.life.repeats - 1)).toBeLessThanOrEqual(1e-12);
    writeFileSync(join(dir, 'bad.json'), JSON.stringify({ format: 'loopwise-job', version: 1, material: 'SAE 1045 (hot rolled and normalized)', interpolateSpikes: 'yes', file: 'g.csv', channels: [{ column: 'gauge_ue', quantity: 'strain', unit: 'microstrain' }] }));
    const bad = await cli(['assess', '--job', join(dir, 'bad.json')]);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toMatch(/interpolateSpikes: expected true or false/);
  });

  test('property: the interpolating reader gives the same samples for any chunking, spikes at chunk edges and side by side included', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.array(fc.double({ min: -100, max: 100, noNaN: true }), { minLength: 3, maxLength: 120 }),
        fc.uniqueArray(fc.nat(119), { maxLength: 10 }),
        fc.array(fc.integer({ min: 1, max: 17 }), { minLength: 1, maxLength: 8 }),
        async (values, at, sizes) => {
          const x = Float64Array.from(values);
          const s = Float64Array.from(at.filter((i) => i < x.length).sort((a, b) => a - b));
          // one piece, and the chunking given; both must agree
          const run = async (chunks: number[]) => {
            const read = async (o: ReaderOptions): Promise<IngestReport> => {
              let first = 0;
              for (let k = 0; first < x.length; k++) {
                const m = Math.min(chunks[k % chunks.length], x.length - first);
                o.onChunk?.({ firstSample: first, length: m, channels: [x.slice(first, first + m)], time: null } as IngestChunk);
                first += m;
              }
              return {} as IngestReport;
            };
            const out: number[] = [];
            await spikeInterpolatedReader(read, [s])({ channels: [], onChunk: (c: IngestChunk) => out.push(...c.channels[0].subarray(0, c.length)) } as unknown as ReaderOptions);
            return out;
          };
          const whole = await run([x.length]);
          expect(await run(sizes)).toEqual(whole);
          expect(whole.length).toBe(x.length);
          // unflagged samples are untouched; a lone spike with both neighbours is their mean
          for (let i = 0; i < x.length; i++) {
            const flagged = Array.prototype.includes.call(s, i);
            if (!flagged) expect(whole[i]).toBe(x[i]);
            else if (i > 0 && i < x.length - 1 && !Array.prototype.includes.call(s, i - 1) && !Array.prototype.includes.call(s, i + 1)) expect(whole[i]).toBeCloseTo((x[i - 1] + x[i + 1]) / 2, 12);
          }
        },
      ),
      { seed: 77, numRuns: 500 },
    );
  });
});
