// Shared timing harness for every benchmark suite. The baselines below are pinned: they are the
// yardsticks every ratio in results.json is measured against, so they must never be slowed,
// "simplified" or warmed differently. Change them only with a note in DEVELOPERS.md and a
// fresh results.json from the same commit.
import { performance } from 'node:perf_hooks';

/** Runs of each timed function before timing starts (JIT warm-up). Pinned. */
export const WARMUP_RUNS = 3;
/** Timed runs; the median is reported. */
export const TIMED_RUNS = 7;

let sink = 0;
/** Keeps a result alive so the work cannot be optimised away. */
export function consume(value) {
  if (typeof value === 'number') sink += value;
  else if (value && typeof value === 'object') sink += 1;
  return value;
}
export function sinkValue() {
  return sink;
}

/** Median wall time in seconds of fn() over TIMED_RUNS runs after WARMUP_RUNS warm-up runs. */
export function measure(fn, { warmup = WARMUP_RUNS, runs = TIMED_RUNS } = {}) {
  for (let i = 0; i < warmup; i++) consume(fn());
  const times = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    consume(fn());
    times.push((performance.now() - t0) / 1000);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)];
}

/** PINNED BASELINE: one pass over a Float64Array keeping its minimum and maximum. */
export function minMaxScan(x) {
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < x.length; i++) {
    const v = x[i];
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  return hi - lo;
}

/** PINNED BASELINE: `count` Math.pow calls on varying arguments, summed. */
export function powCalls(bases, exponent) {
  let s = 0;
  for (let i = 0; i < bases.length; i++) s += Math.pow(bases[i], exponent);
  return s;
}

/** Calls of the compute-bound baseline. Pinned. */
export const EXP_CALLS = 1e7;

/**
 * PINNED ARGUMENTS of the compute-bound baseline: a Weyl sequence u_i = frac(u_(i−1) + g),
 * g = (√5 − 1)/2, mapped to [−2, 2). Equidistributed, so the mean of exp over them is
 * (e² − e⁻²)/4 to about 2e-7 at 10^7 calls (the check in {@link expSeconds}); benchmarks/native
 * builds the same doubles by the same operations.
 */
export function expArguments(n = EXP_CALLS) {
  const g = 0.6180339887498949;
  const x = new Float64Array(n);
  let u = 0;
  for (let i = 0; i < n; i++) {
    u += g;
    if (u >= 1) u -= 1;
    x[i] = 4 * u - 2;
  }
  return x;
}

/**
 * PINNED BASELINE (compute-bound): Math.exp of every argument, summed. Beside the min/max scan,
 * which costs what touching memory costs, this costs what arithmetic costs: a stage bound by its
 * solves (the notch tracker, the pipeline) is compared with it as well.
 */
export function expCalls(x) {
  let s = 0;
  for (let i = 0; i < x.length; i++) s += Math.exp(x[i]);
  return s;
}

/** Seconds for the min/max scan of x, measured now with the pinned warm-up. */
export function scanSeconds(x) {
  return measure(() => minMaxScan(x));
}

/** Seconds for bases.length Math.pow calls, measured now with the pinned warm-up. */
export function powSeconds(bases) {
  return measure(() => powCalls(bases, -0.087));
}

/**
 * Seconds for x.length Math.exp calls (x from {@link expArguments}), measured now with the
 * pinned warm-up; the sum is checked against the mean of exp over [−2, 2) so that the calls
 * cannot be skipped.
 */
export function expSeconds(x) {
  const seconds = measure(() => expCalls(x));
  const mean = expCalls(x) / x.length;
  check(Math.abs(mean / ((Math.E ** 2 - Math.E ** -2) / 4) - 1) < 1e-5, `exp baseline sum is off: mean ${mean}`);
  return seconds;
}

/** Throws when a benchmarked result disagrees with its reference: fast and wrong is not fast. */
export function check(condition, message) {
  if (!condition) throw new Error(`benchmark check failed: ${message}`);
}
