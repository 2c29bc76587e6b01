// Small calls (issue 15, item 4): what a caller pays for assessLife on a short history (≤ 100
// samples) with a material never seen before, as in loops that fit constants, run Monte Carlo
// over material scatter or test properties. Two figures, both absolute milliseconds (the
// issue's targets are absolute: a fixed cost, not a cost per sample, so no scan ratio applies):
//   - the fixed cost per call with a new material each call, after warm-up (target ≤ 0.5 ms);
//   - the slowest single call over a set of short cases, each with a material object never
//     seen before (target ≤ 20 ms).
// Materials and histories are prepared outside the timed region; every timed report is checked
// (finite, non-negative damage; positive lives) so the figures cannot be fast and wrong.
import { performance } from 'node:perf_hooks';
import { LoopwiseError } from '@loopwise/base';
import { assessLife } from '@loopwise/engine';
import { compatibleCyclicCurve, defineMaterial, handbookSteels } from '@loopwise/material';
import { mulberry32 } from '../../fixtures/generate.mjs';

const CALLS = 2000;
const CASES = 600;
const sae1045 = handbookSteels.find((m) => m.name.startsWith('SAE 1045'));
const { warnings: _w, ...sae1045Input } = sae1045;

function checked(h, report, what) {
  const d = report.damage.perRepeat;
  h.check(d >= 0 && d < Infinity, `${what}: damage per repeat ${d}`);
  h.check(report.life.repeats > 0 && report.life.designRepeats > 0, `${what}: lives ${report.life.repeats}, ${report.life.designRepeats}`);
  return d;
}

/** CALLS materials near SAE 1045 (K' and σf' varied by a few per cent: invented, for timing). */
function newMaterials(rnd, count) {
  const out = [];
  for (let i = 0; i < count; i++) {
    out.push(defineMaterial({ ...sae1045Input, K: sae1045.K * (0.95 + 0.1 * rnd()), sigmaF: sae1045.sigmaF * (0.95 + 0.1 * rnd()) }));
  }
  return out;
}

/** The short cases: shapes, magnitudes, materials, rules, corrections (invented, seeded). */
function shortCases(rnd) {
  const pick = (list) => list[Math.floor(rnd() * list.length)];
  const shapes = {
    random: (n, s) => Array.from({ length: n }, () => (rnd() * 2 - 1) * s),
    steps: (n, s) => Array.from({ length: n }, (_, i) => Math.floor(i / 3) % 2 === 0 ? s : -0.5 * s),
    plateaus: (n, s) => Array.from({ length: n }, (_, i) => Math.round(Math.sin(i / 2) * 3) * s / 3),
    spike: (n, s) => Array.from({ length: n }, (_, i) => (i === n >> 1 ? 50 * s : (rnd() - 0.5) * s * 0.1)),
    ties: (n, s) => Array.from({ length: n }, (_, i) => (i % 2 === 0 ? s : -s)),
  };
  const materials = [
    ...handbookSteels,
    defineMaterial({ ...compatibleCyclicCurve(sae1045Input), E: sae1045.E, sigmaF: sae1045.sigmaF, b: sae1045.b, epsilonF: sae1045.epsilonF, c: sae1045.c }),
    defineMaterial({ ...sae1045Input, n: 0.01 }),
    defineMaterial({ ...sae1045Input, n: 0.5 }),
    defineMaterial({ ...sae1045Input, b: -1e-6 }),
    defineMaterial({ ...sae1045Input, c: -1e-6 }),
    defineMaterial({ ...sae1045Input, K: 1 }),
  ];
  const cases = [];
  for (let i = 0; i < CASES; i++) {
    const n = 2 + Math.floor(rnd() * 99);
    const scale = 10 ** (rnd() * 8 - 4) * 300; // 0.03 to 3e6 MPa: elastic to far beyond the model
    const offset = rnd() < 0.3 ? (rnd() * 2 - 1) * scale : 0;
    const shape = pick(Object.keys(shapes));
    const history = shapes[shape](n, scale).map((x) => x + offset);
    // a material object never seen before (the tables are per material object), prepared here
    const { warnings: _mw, ...fields } = pick(materials);
    const material = defineMaterial(fields);
    const rule = pick(['neuber', 'glinka', 'linear']);
    const meanStress = pick(['none', 'morrow', 'modifiedMorrow', 'smithWatsonTopper', 'walker']);
    const job = { material, notch: { Kt: 1 + rnd() * 2, rule }, meanStress, repeating: rnd() < 0.7 };
    if (meanStress === 'walker') job.walkerGamma = 0.5;
    cases.push({ history, job, what: `${shape} n=${n} scale=${scale.toPrecision(3)} ${rule} ${meanStress} ${material.name ?? 'edge material'}` });
  }
  return cases;
}

export async function run(h) {
  const rnd = mulberry32(20261215);
  const history = [0, 300, -300, 300, 100, -50];
  // warm-up: the JIT sees every route once
  for (const m of newMaterials(rnd, 200)) h.consume(checked(h, assessLife(history, { material: m }), 'warm-up'));

  // Fixed cost per call with a new material: the median of per-batch means (batches of 200 calls).
  const batches = [];
  for (let b = 0; b < CALLS / 200; b++) {
    const materials = newMaterials(rnd, 200);
    const t0 = performance.now();
    for (const m of materials) h.consume(assessLife(history, { material: m }).damage.perRepeat);
    batches.push((performance.now() - t0) / materials.length);
  }
  batches.sort((a, b) => a - b);
  const fixedMs = batches[batches.length >> 1];
  const reusedSeconds = h.measure(() => assessLife(history, { material: sae1045 }).damage.perRepeat, { warmup: 50, runs: 201 });
  h.check(checked(h, assessLife(history, { material: newMaterials(rnd, 1)[0] }), 'fixed-cost history') > 0, 'the fixed-cost history does damage');

  // The slowest single call over the short cases (each timed once, after one untimed pass).
  const cases = shortCases(rnd);
  const run1 = (c) => {
    try {
      return checked(h, assessLife(c.history, c.job), c.what);
    } catch (e) {
      h.check(e instanceof LoopwiseError && typeof e.code === 'string', `${c.what}: undocumented error ${e}`);
      return -1;
    }
  };
  for (const c of shortCases(mulberry32(1))) run1(c); // warm-up on other cases and materials
  let maxMs = 0;
  let slowest = '';
  let errors = 0;
  for (const c of cases) {
    const t0 = performance.now();
    const d = run1(c);
    const ms = performance.now() - t0;
    if (d < 0) errors++;
    if (ms > maxMs) {
      maxMs = ms;
      slowest = c.what;
    }
  }
  return [
    {
      figure: 'small-calls/assessLife fixed cost per call, 6 samples, a new material each call (ms)',
      ratio: fixedMs,
      baseline: 'absolute ms',
      baselineSeconds: null,
      seconds: fixedMs / 1000,
      sizes: { samples: history.length, calls: CALLS, reusedMaterialMs: reusedSeconds * 1000 },
      target: 0.5,
      note: `same history with one reused material: ${(reusedSeconds * 1000).toFixed(3)} ms`,
    },
    {
      figure: `small-calls/assessLife slowest single call over ${CASES} short cases (2-100 samples), new materials (ms)`,
      ratio: maxMs,
      baseline: 'absolute ms',
      baselineSeconds: null,
      seconds: maxMs / 1000,
      sizes: { cases: CASES, documentedErrors: errors },
      target: 20,
      note: `slowest: ${slowest}; ${errors} of ${CASES} cases ended in a documented input error`,
    },
  ];
}
