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

/** Seconds for the min/max scan of x, measured now with the pinned warm-up. */
export function scanSeconds(x) {
  return measure(() => minMaxScan(x));
}

/** Seconds for bases.length Math.pow calls, measured now with the pinned warm-up. */
export function powSeconds(bases) {
  return measure(() => powCalls(bases, -0.087));
}

/** Throws when a benchmarked result disagrees with its reference: fast and wrong is not fast. */
export function check(condition, message) {
  if (!condition) throw new Error(`benchmark check failed: ${message}`);
}
