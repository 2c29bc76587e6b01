// Signal conditioning on 10^7 samples of the reference history (fixtures/generate.mjs; invented
// data) with invented artefacts: 200 one-sample spikes and a dropout of 5,000 samples at zero.
// The figure of issue 11: spike check and removal + dropout check + zero-phase low-pass
// (Butterworth order 2, forward-backward), in the same run as the min/max scan of the same
// array; target ≤ 3 × the scan. Per-step figures follow, without targets. Inputs are prepared
// outside the timed region; every timed result is checked: the spikes and the dropout found are
// exactly the injected ones, the removal leaves no spike, and the filtered history equals a
// plain one-sample-at-a-time direct-form filter with the same padding to 1e-9 of the range.
// The headline figure is conditionSignalInto, the one call of the library for this conditioning
// (scan, spikes interpolated, low-pass; three passes over the record); the same work by the
// separate steps, as a caller would chain them, is the row after it, and its output must equal
// the headline's to the last bit.
import { conditionSignalInto, decimatePeaks, removeSpikesInto, scanSignal, zeroPhaseLowPassInto } from '@loopwise/signal';
import { referenceHistory } from '../../fixtures/generate.mjs';

const N = 1e7;
const SPIKES = 200;
const DROPOUT = { first: 4_000_000, length: 5000 };
const FILTER = { cutoff: 100, sampleRate: 1000, order: 2 };
const CHECKS = { spikes: {}, stuckRuns: {}, clipping: false, offset: false, drift: false };

function artefacts(x) {
  // spike sample indices spread over the record, avoiding the dropout; height 30 × the largest |Δx|
  let maxStep = 0;
  for (let i = 1; i < x.length; i++) maxStep = Math.max(maxStep, Math.abs(x[i] - x[i - 1]));
  const at = [];
  for (let k = 0; k < SPIKES; k++) {
    const i = 1000 + Math.floor(((x.length - 2000) * k) / SPIKES) + 7;
    if (i >= DROPOUT.first - 10 && i < DROPOUT.first + DROPOUT.length + 10) continue;
    x[i] += (k % 2 === 0 ? 30 : -30) * maxStep;
    at.push(i);
  }
  x.fill(0, DROPOUT.first, DROPOUT.first + DROPOUT.length);
  return at;
}

/** The whole conditioning in the library's one call. */
function condition(x, out) {
  return conditionSignalInto(x, out, { checks: CHECKS, lowPass: FILTER }).scan;
}

/** The same by the separate steps: scan (spikes, stuck runs), spikes interpolated into `out`, filtered in place. */
function conditionBySteps(x, out) {
  const scan = scanSignal(x, CHECKS);
  removeSpikesInto(x, scan.findings, out);
  zeroPhaseLowPassInto(out, out, FILTER);
  return scan;
}

/** Slow reference: the same forward-backward filter one sample at a time (direct form I). */
function referenceFilter(x, pad, { gain: g, a1, a2 }) {
  const n = x.length;
  const ext = new Float64Array(n + 2 * pad);
  for (let k = 0; k < pad; k++) {
    ext[k] = 2 * x[0] - x[pad - k];
    ext[pad + n + k] = 2 * x[n - 1] - x[n - 2 - k];
  }
  ext.set(x, pad);
  const run = (get, set, len) => {
    let x1 = get(0);
    let x2 = x1;
    let y1 = x1;
    let y2 = x1;
    for (let i = 0; i < len; i++) {
      const u = get(i);
      const o = g * (u + 2 * x1 + x2) - a1 * y1 - a2 * y2;
      set(i, o);
      x2 = x1;
      x1 = u;
      y2 = y1;
      y1 = o;
    }
  };
  const m = ext.length;
  run((i) => ext[i], (i, v) => (ext[i] = v), m);
  run((i) => ext[m - 1 - i], (i, v) => (ext[m - 1 - i] = v), m);
  return ext.subarray(pad, pad + n);
}

export async function run(h) {
  const x = referenceHistory(N);
  const injected = artefacts(x);
  const out = new Float64Array(N);
  const rows = [];
  const scan0 = h.scanSeconds(x);

  // checks of the results (outside the timed regions)
  const scan = condition(x, out);
  const spikes = scan.findings.select('spike').columns().index;
  h.check(spikes.length === injected.length && injected.every((v, k) => spikes[k] === v), `spikes found ${spikes.length}, injected ${injected.length}`);
  const zero = scan.findings.select('zero-run').toArray();
  h.check(zero.length === 1 && zero[0].index === DROPOUT.first && zero[0].length === DROPOUT.length, 'the dropout is not found exactly');
  const cleaned = new Float64Array(N);
  removeSpikesInto(x, scan.findings, cleaned);
  h.check(scanSignal(cleaned, CHECKS).findings.count('spike') === 0, 'spikes left after removal');
  const { design, correction } = zeroPhaseLowPassInto(cleaned, new Float64Array(N), FILTER);
  const want = referenceFilter(cleaned, correction.parameters.padLength, design.sections[0]);
  let range = 0;
  let worst = 0;
  for (let i = 0; i < N; i++) range = Math.max(range, Math.abs(cleaned[i]));
  for (let i = 0; i < N; i++) worst = Math.max(worst, Math.abs(out[i] - want[i]));
  h.check(worst <= 1e-9 * range, `filter differs from the direct-form reference by ${worst}`);
  const bySteps = new Float64Array(N);
  const stepScan = conditionBySteps(x, bySteps);
  h.check(stepScan.findings.length === scan.findings.length, 'the separate steps find other findings');
  let differ = 0;
  for (let i = 0; i < N; i++) if (!Object.is(bySteps[i], out[i])) differ++;
  h.check(differ === 0, `conditionSignalInto differs from the separate steps at ${differ} samples`);

  const row = (figure, seconds, target) => ({
    figure,
    ratio: seconds / scan0,
    baseline: 'minmax-scan',
    baselineSeconds: scan0,
    seconds,
    sizes: { samples: N, spikes: injected.length, dropoutSamples: DROPOUT.length },
    nsPerSample: (seconds / N) * 1e9,
    target,
  });
  const all = h.measure(() => condition(x, out));
  rows.push(row('signal/spike check and removal + dropout check + zero-phase low-pass (Butterworth order 2), 1e7 samples', all, 3));
  rows.push(row('signal/the same by the separate steps (scanSignal, removeSpikesInto, zeroPhaseLowPassInto in place)', h.measure(() => conditionBySteps(x, bySteps)), null));
  rows.push(row('signal/step: scan for spikes and stuck runs (one pass)', h.measure(() => scanSignal(x, CHECKS)), null));
  rows.push(row('signal/step: spike removal into a copy (interpolation)', h.measure(() => removeSpikesInto(x, scan.findings, cleaned)), null));
  rows.push(row('signal/step: zero-phase low-pass, Butterworth order 2, forward-backward', h.measure(() => zeroPhaseLowPassInto(cleaned, out, FILTER)), null));
  rows.push(row('signal/scan with every check (spikes, stuck runs, clipping, offset, drift)', h.measure(() => scanSignal(x)), null));
  const dec = decimatePeaks(cleaned);
  h.check(dec.indices.length > 2 && dec.indices.length < N, 'decimation kept nothing or everything');
  rows.push(row('signal/peak-preserving decimation, gate 0', h.measure(() => decimatePeaks(cleaned)), null));
  return rows;
}
