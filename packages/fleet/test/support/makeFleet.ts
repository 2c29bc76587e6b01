import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';

// INVENTED data for the tests only: stress histories of two gauges ("left", "right") on a few
// assets, random sums of sines with a seeded generator; no measurement.

/** A small seeded generator (mulberry32), so every run writes the same files. */
export function seeded(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export const JOB = {
  format: 'loopwise-job',
  version: 1,
  material: 'SAE 1045 (hot rolled and normalized)',
  notch: { Kt: 2 },
  meanStress: 'smithWatsonTopper',
  channels: [
    { name: 'left', column: 'left', quantity: 'stress', unit: 'MPa' },
    { name: 'right', column: 'right', quantity: 'stress', unit: 'MPa' },
  ],
  // what `loopwise assess --job job.json` reads; in the fleet each row's file takes its place
  file: 'data/f000.csv',
};

/** Bins that hold every cycle of the generated files (MPa). */
export const BINS = { range: { count: 24, min: 0, max: 720 }, mean: { count: 16, min: -240, max: 240 }, fromTo: { count: 24, min: -360, max: 360 } };

/** Writes one CSV file of `n` rows (time, left, right); `severity` scales the amplitudes. */
export function writeHistory(path: string, n: number, severity: number, seed: number): void {
  const rnd = seeded(seed);
  const lines = ['time,left,right'];
  const f1 = 0.05 + 0.1 * rnd();
  const f2 = 0.3 + 0.4 * rnd();
  for (let i = 0; i < n; i++) {
    const burst = rnd() < 0.002 ? 1.6 : 1;
    const l = severity * burst * (90 * Math.sin(f1 * i) + 40 * Math.sin(f2 * i) + 30 * (rnd() - 0.5));
    const r = severity * (60 * Math.sin(0.7 * f1 * i + 1) + 30 * (rnd() - 0.5)) + 20;
    lines.push(`${(i / 100).toFixed(2)},${l.toFixed(3)},${r.toFixed(3)}`);
  }
  writeFileSync(path, lines.join('\n') + '\n');
}

export interface MadeFleet {
  folder: string;
  manifest: string;
  rows: { file: string; asset: string; channels: string; usage: number }[];
}

/**
 * Writes a fleet into `folder`: `count` files over `assets` assets, lengths between `minRows`
 * and `maxRows`, some rows on one channel only, the job and a CSV manifest (fleet.csv).
 */
export function makeFleet(folder: string, count: number, assets: number, minRows: number, maxRows: number, seed = 1): MadeFleet {
  mkdirSync(join(folder, 'data'), { recursive: true });
  writeFileSync(join(folder, 'job.json'), JSON.stringify(JOB, null, 2));
  const rnd = seeded(seed);
  const rows: MadeFleet['rows'] = [];
  for (let k = 0; k < count; k++) {
    const asset = `asset-${String(k % assets).padStart(2, '0')}`;
    const n = Math.round(minRows + (maxRows - minRows) * rnd());
    const file = `data/f${String(k).padStart(3, '0')}.csv`;
    writeHistory(join(folder, file), n, 0.8 + 0.15 * (k % assets) + 0.2 * rnd(), seed * 1000 + k);
    rows.push({ file, asset, channels: k % 5 === 4 ? 'left' : 'left;right', usage: Number((n / 100 / 3.6).toFixed(3)) });
  }
  const manifest = join(folder, 'fleet.csv');
  writeFileSync(manifest, ['file,asset,channels,usage,job', ...rows.map((r) => `${r.file},${r.asset},${r.channels},${r.usage},job.json`)].join('\n') + '\n');
  return { folder, manifest, rows };
}

/** The command-line settings that go with a generated fleet's CSV manifest. */
export const SETTINGS = ['--unit', 'km', '--target-service', '100000', '--range-bins', '24:0:720', '--mean-bins', '16:-240:240', '--from-to-bins', '24:-360:360'];
