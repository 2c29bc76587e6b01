import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { assessLife, type LifeJob } from '@loopwise/engine';
import { handbookSteels } from '@loopwise/material';
import fc from 'fast-check';
import { beforeAll, describe, expect, test } from 'vitest';
import { ArtefactRemover, FlaggedSamples } from '../../src/cli/artefactStudy';
import { cli } from './runCli';
import { formatNumber } from '../../src/report/formatNumber';

// Issue 11, item 2: when flagged samples start or turn damaging loops, the report gives the share
// of the damage those loops carry and the life with the flagged samples removed, beside the life
// as measured. The gauge file is INVENTED for the test (a sum of sines in microstrain at a notch
// root, 500 Hz) with three single-sample spikes and a 300-sample dropout at exactly zero.
let dir = '';
const spikes = [2345, 9000, 15001];
const dropout = { first: 11000, length: 300 };
const n = 20000;
const signal = (i: number) => Number((600 * Math.sin(i / 37.1) + 250 * Math.sin(i / 5.3) + 40 * Math.sin(i / 1.7)).toFixed(2));
const measured = Array.from({ length: n }, (_, i) => {
  if (spikes.includes(i)) return 5000;
  if (i >= dropout.first && i < dropout.first + dropout.length) return 0;
  return signal(i);
});
const sae1045 = handbookSteels.find((m) => m.name === 'SAE 1045 (hot rolled and normalized)')!;
const job: LifeJob = { material: sae1045, input: 'local-strain', meanStress: 'smithWatsonTopper' };

/** The history cleaned by hand: each spike on the line between its neighbours, the dropout cut out. */
function cleanedByHand(): number[] {
  const out: number[] = [];
  for (let i = 0; i < n; i++) {
    if (i >= dropout.first && i < dropout.first + dropout.length) continue;
    out.push(spikes.includes(i) ? (measured[i - 1] + measured[i + 1]) / 2 : measured[i]);
  }
  return out;
}


beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'loopwise-artefacts-'));
  const rows = ['time_s,gauge_ue'];
  measured.forEach((v, i) => rows.push(`${(i / 500).toFixed(3)},${v.toFixed(2)}`));
  writeFileSync(join(dir, 'gauge.csv'), rows.join('\n') + '\n');
});

describe('artefacts and damage side by side', () => {
  test('the share of the damage at flagged samples and the cleaned life equal an independent count of the same histories', async () => {
    const r = await cli(['assess', join(dir, 'gauge.csv'), '--column', 'gauge_ue', '--quantity', 'strain', '--unit', 'microstrain', '--material', 'SAE 1045', '--json']);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    const w = j.warnings.find((x: { code: string }) => x.code === 'artefact-damage');
    expect(w).toBeDefined();
    expect(w.channel).toBe('gauge_ue');

    const asMeasured = assessLife(measured.map((x) => x * 1e-6), job);
    const flagged = (i: number) => spikes.includes(i) || (i >= dropout.first && i < dropout.first + dropout.length);
    let atFlagged = 0;
    const l = asMeasured.loops;
    for (let k = 0; k < l.count.length; k++) if (flagged(l.startIndex[k]) || flagged(l.turnIndex[k])) atFlagged += l.damage[k];
    const share = atFlagged / asMeasured.damage.perRepeat;
    expect(share).toBeGreaterThan(0.5); // the spikes are far beyond the signal: they make the worst loops
    const cleaned = assessLife(cleanedByHand().map((x) => x * 1e-6), job);

    expect(w.message).toContain(`carry ${formatNumber(100 * share, 3)} % of the damage`);
    expect(w.message).toContain(`3 spike(s) interpolated and 1 flat or zero run(s) of 300 samples cut out`);
    expect(w.message).toContain(`the life is ${formatNumber(cleaned.life.repeats)} repeats`);
    expect(w.message).toContain(`(as measured: ${formatNumber(asMeasured.life.repeats)} repeats)`);
    expect(cleaned.life.repeats).toBeGreaterThan(asMeasured.life.repeats);
    // the figures in full precision (the cleaned life moves in the 9th digit if the dropout stays in)
    const a = j.channels[0].artefactStudy;
    expect(a).toMatchObject({ spikes: 3, runs: 1, runSamples: 300 });
    expect(Math.abs(a.shareOfDamage - share)).toBeLessThanOrEqual(1e-12);
    expect(Math.abs(a.repeatsAsMeasured / asMeasured.life.repeats - 1)).toBeLessThanOrEqual(1e-12);
    expect(Math.abs(a.repeatsCleaned / cleaned.life.repeats - 1)).toBeLessThanOrEqual(1e-12);
    // the text summary carries the same warning
    const text = await cli(['assess', join(dir, 'gauge.csv'), '--column', 'gauge_ue', '--quantity', 'strain', '--unit', 'microstrain', '--material', 'SAE 1045']);
    expect(text.stdout).toContain(w.message);
  });

  test('a clean file gets no artefact study', async () => {
    const rows = ['gauge_ue', ...Array.from({ length: n }, (_, i) => signal(i).toFixed(2))];
    writeFileSync(join(dir, 'clean.csv'), rows.join('\n') + '\n');
    const r = await cli(['assess', join(dir, 'clean.csv'), '--quantity', 'strain', '--unit', 'microstrain', '--material', 'SAE 1045', '--json']);
    expect(r.code).toBe(0);
    const codes = JSON.parse(r.stdout).warnings.map((x: { code: string }) => x.code);
    expect(codes).not.toContain('artefact-damage');
    expect(codes).not.toContain('spike');
    expect(JSON.parse(r.stdout).channels[0].artefactStudy).toBeUndefined();
  });

  test('property: the remover gives the same cleaned history for any chunking as in one piece', () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -1000, max: 1000, noNaN: true }), { minLength: 1, maxLength: 200 }),
        fc.uniqueArray(fc.nat(199), { maxLength: 8 }),
        fc.array(fc.tuple(fc.nat(199), fc.integer({ min: 1, max: 20 })), { maxLength: 3 }),
        fc.array(fc.integer({ min: 1, max: 40 }), { minLength: 1, maxLength: 10 }),
        (values, spikeAt, runAt, sizes) => {
          const len = values.length;
          // runs sorted and apart; spikes outside the runs (as the checks flag them)
          const runs: number[] = [];
          let end = -1;
          for (const [s, l] of [...runAt].sort((a, b) => a[0] - b[0])) {
            if (s <= end || s >= len) continue;
            const ln = Math.min(l, len - s);
            runs.push(s, ln);
            end = s + ln;
          }
          const inRun = (i: number) => {
            for (let k = 0; k < runs.length; k += 2) if (i >= runs[k] && i < runs[k] + runs[k + 1]) return true;
            return false;
          };
          const sp = spikeAt.filter((i) => i < len && !inRun(i)).sort((a, b) => a - b);
          const flagged = new FlaggedSamples({ spikes: Float64Array.from(sp), runs: Float64Array.from(runs) });
          const x = Float64Array.from(values);
          const whole = new ArtefactRemover(flagged);
          const one = [...whole.push(x, 0), ...whole.finish()];
          const parts = new ArtefactRemover(flagged);
          const chunked: number[] = [];
          let at = 0;
          for (let k = 0; at < len; k++) {
            const m = Math.min(sizes[k % sizes.length], len - at);
            chunked.push(...parts.push(x.slice(at, at + m), at));
            at += m;
          }
          chunked.push(...parts.finish());
          expect(chunked).toEqual(one);
          // every unflagged sample outside the runs is kept in order; the run samples are gone
          expect(one.length).toBe(len - runs.filter((_, k) => k % 2 === 1).reduce((a, b) => a + b, 0));
          for (const s of sp) expect(flagged.has(s)).toBe(true);
        },
      ),
      { seed: 1103, numRuns: 300 },
    );
  });
});

describe('flagged samples that change nothing', () => {
  test('a dropout in a quiet stretch: the warning says the life is the same', async () => {
    // the same INVENTED gauge, with a dropout to zero where the signal is near zero anyway and no spike
    // (samples 3000 … 5299 are a small ripple of ±30 µε, and 4000 … 4299 of them drop to zero)
    const quiet = Array.from({ length: n }, (_, i) => (i >= 4000 && i < 4300 ? 0 : i >= 3000 && i < 5300 ? Number((30 * Math.sin(i / 37.1)).toFixed(2)) : signal(i)));
    const rows = ['gauge_ue', ...quiet.map((v) => v.toFixed(2))];
    writeFileSync(join(dir, 'quiet.csv'), rows.join('\n') + '\n');
    const r = await cli(['assess', join(dir, 'quiet.csv'), '--quantity', 'strain', '--unit', 'microstrain', '--material', 'SAE 1045', '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    const w = j.warnings.find((x: { code: string }) => x.code === 'artefact-damage');
    expect(w).toBeDefined();
    const a = j.channels[0].artefactStudy;
    expect(a.shareOfDamage).toBeLessThan(1e-3);
    expect(Math.abs(a.repeatsCleaned / a.repeatsAsMeasured - 1)).toBeLessThan(1e-3);
    expect(w.message).toMatch(/no damaging loop starts or turns at a flagged sample, and with them removed \(1 flat or zero run\(s\) of 300 samples cut out\) the life is the same/);
  });
});
