import { integerOption, onlyKnownFields } from './checkOptions';
import { butterworthSections, type ButterworthDesign } from './butterworthSections';
import { correctionRecord, type CorrectionRecord } from './CorrectionRecord';
import { interpolateSpikeRun } from './removeSpikes';
import { SignalError } from './SignalError';

/** Options of {@link zeroPhaseLowPass}. */
export interface ZeroPhaseLowPassOptions {
  /** Cut-off frequency fc in Hz: each pass has |H| = 1/√2 there, the forward-backward result 1/2. */
  cutoff: number;
  /** Sample rate fs in Hz; fc must be below fs / 2. */
  sampleRate: number;
  /** Butterworth order N (each pass), an integer 1 … 16. Default 2. */
  order?: number;
  /** Samples of odd reflection added at each end. Default min(n − 1, ⌈6 fs / fc⌉): six periods of the cut-off. */
  padLength?: number;
}

/** The result of {@link zeroPhaseLowPass}. */
export interface LowPassResult {
  readonly values: Float64Array;
  readonly design: ButterworthDesign;
  readonly correction: CorrectionRecord;
}

/**
 * Zero-phase low-pass filter: a digital Butterworth filter ({@link butterworthSections}) run
 * forwards, then backwards over the result, so the phase shifts cancel (peaks stay at their
 * sample index) and the magnitude is squared: |H_fb(f)| = 1 / (1 + (tan(πf/fs)/tan(πfc/fs))^(2N)),
 * 1 at DC and exactly 1/2 at the cut-off. The alias of {@link zeroPhaseLowPassButterworth}.
 *
 * Edge treatment: each end is extended by `padLength` samples of odd reflection about the end
 * sample, x[−k] = 2x[0] − x[k] and x[n−1+k] = 2x[n−1] − x[n−1−k] (a straight continuation of
 * the level and slope at the end), and each section starts in the steady state of a constant
 * input equal to its first input sample; so a constant history comes back unchanged and a
 * ramp's ends are not pulled towards zero. The padding is dropped from the result.
 *
 * Needs the whole record (the backward pass starts at the end): there is no streaming form;
 * filter segments separately and overlap them by a few pad lengths if a record is too large.
 *
 * Effect on a fatigue result: attenuates ranges of content near and above fc (by half at fc),
 * removes noise reversals and lowers the damage; choose fc well above the structure's loading
 * content (check the spectrum first). Peaks of slowly varying content are kept at their time.
 *
 * References: the forward-backward method: F. Gustafsson, "Determining the initial states in
 * forward-backward filtering", IEEE Trans. Signal Processing 44(4), 1996, 988–992,
 * doi:10.1109/78.492552 (`value from memory`); the design: see {@link butterworthSections}.
 *
 * @example
 * const x = Float64Array.from({ length: 200 }, (_, i) => 5 + (i % 2 === 0 ? 1 : -1)); // invented: 5 plus Nyquist noise
 * const y = zeroPhaseLowPass(x, { cutoff: 5, sampleRate: 100 }).values;
 * Math.abs(y[100] - 5) < 1e-6;
 * // returns true
 */
export function zeroPhaseLowPassButterworth(history: ArrayLike<number>, options: ZeroPhaseLowPassOptions): LowPassResult {
  if (history === null || typeof history !== 'object' || typeof history.length !== 'number') throw new SignalError('invalid-argument', 'history', history, 'must be an array or typed array of numbers');
  const out = new Float64Array(history.length);
  const { design, correction } = zeroPhaseLowPassInto(history, out, options);
  return { values: out, design, correction };
}

/** The plain name of the package's zero-phase low-pass: {@link zeroPhaseLowPassButterworth}. */
export const zeroPhaseLowPass = zeroPhaseLowPassButterworth;

/**
 * {@link zeroPhaseLowPassButterworth} into `out` (a Float64Array of the history's length; it
 * may be the history itself). Allocates only the two pads. The history is checked as the first
 * forward pass reads it (no pass of its own): after an error `out` (and so the history, when
 * filtering in place) holds partial results.
 */
export function zeroPhaseLowPassInto(history: ArrayLike<number>, out: Float64Array, options: ZeroPhaseLowPassOptions): { design: ButterworthDesign; correction: CorrectionRecord } {
  return lowPassOfCleanedInto(history, out, options, NO_RUNS);
}

const NO_RUNS: readonly number[] = Object.freeze([]);

/**
 * Checks the options of a zero-phase low-pass (fields, cut-off below Nyquist, order, pad length)
 * and returns the filter's design, before any sample is read: a caller that scans first
 * refuses bad options without the work of the scan.
 */
export function checkLowPassOptions(options: ZeroPhaseLowPassOptions): ButterworthDesign {
  if (options === null || typeof options !== 'object') throw new SignalError('invalid-option', 'options', options, 'must be an options object with cutoff and sampleRate');
  onlyKnownFields(options, ['cutoff', 'sampleRate', 'order', 'padLength'], 'options');
  const design = butterworthSections({ cutoff: options.cutoff, sampleRate: options.sampleRate, ...(options.order === undefined ? {} : { order: options.order }) });
  integerOption(options.padLength, 'padLength', 0, 0);
  return design;
}

/**
 * The one implementation of {@link zeroPhaseLowPassInto}, filtering the history as it would be
 * after {@link removeSpikesInto} with the spike runs `runs` (flat [first, length] pairs, in
 * order, not adjacent): the interpolated samples are written into `out` and read from there by
 * the first forward pass, every other sample is read from the history, so the result equals
 * `removeSpikesInto(history, spikes, out)` then `zeroPhaseLowPassInto(out, out, options)` to the
 * last bit, without the copy. The runs' samples and neighbours must be finite (checked by the
 * caller: {@link conditionSignalInto} has scanned every sample).
 * @internal
 */
export function lowPassOfCleanedInto(history: ArrayLike<number>, out: Float64Array, options: ZeroPhaseLowPassOptions, runs: readonly number[]): { design: ButterworthDesign; correction: CorrectionRecord } {
  const design = checkLowPassOptions(options);
  const x = history;
  const n = x.length;
  if (!(out instanceof Float64Array) || out.length !== n) throw new SignalError('invalid-argument', 'out', out, `must be a Float64Array of length ${n}`);
  const pad = Math.min(Math.max(n - 1, 0), integerOption(options.padLength, 'padLength', Math.ceil((6 * design.sampleRate) / design.cutoff), 0));
  // The samples of the pads are checked here; the others by the first forward pass: a NaN or
  // ±Infinity input makes that sample's output and the filter state non-finite for good, so one
  // look at the state after the pass finds it (and a search from there names the sample).
  for (let i = 0; i < n && i <= pad; i++) if (x[i] - x[i] !== 0) throw new SignalError('non-finite-sample', 'history', x[i], 'samples must be finite numbers', i);
  for (let i = Math.max(0, n - 1 - pad); i < n; i++) if (x[i] - x[i] !== 0) throw new SignalError('non-finite-sample', 'history', x[i], 'samples must be finite numbers', i);
  const correction = correctionRecord(
    'low-pass',
    [0, n],
    n === 0 ? 0 : 1,
    n,
    { method: 'Butterworth, forward-backward', order: design.order, cutoff: design.cutoff, sampleRate: design.sampleRate, padLength: pad },
    `zero-phase Butterworth low-pass, order ${design.order} per pass, cut-off ${design.cutoff} Hz at ${design.sampleRate} Hz, on ${n} samples`,
  );
  if (n < 2) {
    if (n === 1) out[0] = x[0];
    return { design, correction };
  }
  // the interpolated spike samples into `out`, with the other sample of each pair they share
  // (the forward kernel reads pairs from even indices): ranges[] are those [from, to) stretches
  const ranges: number[] = [];
  for (let r = 0; r < runs.length; r += 2) {
    const first = runs[r];
    const last = first + runs[r + 1] - 1;
    const from = first - (first % 2);
    const to = Math.min(n, last + 2 - (last % 2));
    interpolateSpikeRun(x, first, last, out);
    if (from < first) out[from] = x[from];
    if (last + 1 < to) out[last + 1] = x[last + 1];
    ranges.push(from, to);
  }
  // sample i as the filter sees it: interpolated inside a spike run, else the history's
  let run = 0;
  const seen = (i: number) => {
    while (run < runs.length && runs[run] + runs[run + 1] <= i) run += 2;
    return run < runs.length && runs[run] <= i ? out[i] : x[i];
  };
  // odd reflection pads: head[k] is sample −(pad − k), tail[k] is sample n + k
  const head = new Float64Array(pad);
  const tail = new Float64Array(pad);
  const x0 = seen(0);
  for (let k = pad - 1; k >= 0; k--) head[k] = 2 * x0 - seen(pad - k);
  run = 0;
  for (let k = pad - 1; k >= 0; k--) tail[k] = seen(n - 2 - k);
  const xLast = seen(n - 1);
  for (let k = 0; k < pad; k++) tail[k] = 2 * xLast - tail[k];
  const state = new Float64Array(4);
  design.sections.forEach((s, k) => {
    state.fill(pad > 0 ? head[0] : x0);
    if (s.firstOrder) {
      firstOrderForward(head, head, 0, pad, s.gain, s.a1, state);
      if (k === 0) forwardOfCleaned(x, out, ranges, s, state);
      else firstOrderForward(out, out, 0, n, s.gain, s.a1, state);
      firstOrderForward(tail, tail, 0, pad, s.gain, s.a1, state);
    } else {
      secondOrderForward(head, head, 0, pad, s.gain, s.a1, s.a2, state);
      if (k === 0) forwardOfCleaned(x, out, ranges, s, state);
      else secondOrderForward(out, out, 0, n, s.gain, s.a1, s.a2, state);
      secondOrderForward(tail, tail, 0, pad, s.gain, s.a1, s.a2, state);
    }
    if (k === 0 && !(state[2] - state[2] === 0 && state[3] - state[3] === 0)) throw nonFiniteInput(x, out);
  });
  for (const s of design.sections) {
    state.fill(pad > 0 ? tail[pad - 1] : out[n - 1]);
    // the head's backward pass cannot change `out`: it is skipped
    for (const part of [tail, out]) {
      if (s.firstOrder) firstOrderBackward(part, s.gain, s.a1, state);
      else secondOrderBackward(part, s.gain, s.a1, s.a2, state);
    }
  }
  return { design, correction };
}

/** The error for the first sample whose forward output is not finite (the input there, unless it was overwritten in place). */
function nonFiniteInput(x: ArrayLike<number>, out: Float64Array): SignalError {
  let i = 0;
  while (i < out.length && out[i] - out[i] === 0) i++;
  const v = out === x ? out[i] : x[i];
  if (i < x.length && v - v === 0) return new SignalError('invalid-argument', 'history', v, 'the filter overflows here: samples are too large (near the largest double)', i);
  return new SignalError('non-finite-sample', 'history', v, 'samples must be finite numbers', i);
}

// The section kernels, in place, with the state [x1, x2, y1, y2] carried between calls. A
// second-order section computes two outputs per step from the state (its recursion unrolled
// once: y[n+1] = f[n+1] − a1 f[n] + (a1² − a2) y[n−1] + a1 a2 y[n−2], f the numerator's
// output), which halves the chain of dependent multiply-adds per sample; the forward and
// backward kernels are written out separately so that each loop has one fixed direction.

/**
 * The first section's forward pass over the history as the filter sees it: the stretches in
 * `ranges` ([from, to) pairs, even `from`, in order) from `out`, where their interpolated
 * samples are, the rest from the history. Every stretch starts at an even index, so the pairs
 * of the kernel are those of one pass over the whole record (the same result to the last bit).
 */
function forwardOfCleaned(x: ArrayLike<number>, out: Float64Array, ranges: readonly number[], s: ButterworthDesign['sections'][number], state: Float64Array): void {
  let from = 0;
  for (let r = 0; r <= ranges.length; r += 2) {
    const to = r < ranges.length ? ranges[r] : out.length;
    // a stretch of the history, then (but after the last) a stretch of interpolated samples
    if (s.firstOrder) firstOrderForward(x, out, from, to, s.gain, s.a1, state);
    else secondOrderForward(x, out, from, to, s.gain, s.a1, s.a2, state);
    if (r === ranges.length) break;
    if (s.firstOrder) firstOrderForward(out, out, to, ranges[r + 1], s.gain, s.a1, state);
    else secondOrderForward(out, out, to, ranges[r + 1], s.gain, s.a1, s.a2, state);
    from = ranges[r + 1];
  }
}

function secondOrderForward(src: ArrayLike<number>, buf: Float64Array, from: number, to: number, g: number, a1: number, a2: number, state: Float64Array): void {
  let x1 = state[0];
  let x2 = state[1];
  let y1 = state[2];
  let y2 = state[3];
  const c1 = a1 * a1 - a2;
  const c2 = a1 * a2;
  const n = to;
  let i = from;
  for (; i + 1 < n; i += 2) {
    const u0 = src[i];
    const u1 = src[i + 1];
    const f0 = g * (u0 + 2 * x1 + x2);
    const f1 = g * (u1 + 2 * u0 + x1);
    const o0 = f0 - a1 * y1 - a2 * y2;
    const o1 = f1 - a1 * f0 + c1 * y1 + c2 * y2;
    buf[i] = o0;
    buf[i + 1] = o1;
    y2 = o0;
    y1 = o1;
    x2 = u0;
    x1 = u1;
  }
  for (; i < n; i++) {
    const u = src[i];
    const o = g * (u + 2 * x1 + x2) - a1 * y1 - a2 * y2;
    buf[i] = o;
    y2 = y1;
    y1 = o;
    x2 = x1;
    x1 = u;
  }
  state[0] = x1;
  state[1] = x2;
  state[2] = y1;
  state[3] = y2;
}

function secondOrderBackward(buf: Float64Array, g: number, a1: number, a2: number, state: Float64Array): void {
  let x1 = state[0];
  let x2 = state[1];
  let y1 = state[2];
  let y2 = state[3];
  const c1 = a1 * a1 - a2;
  const c2 = a1 * a2;
  let i = buf.length - 1;
  for (; i >= 1; i -= 2) {
    const u0 = buf[i];
    const u1 = buf[i - 1];
    const f0 = g * (u0 + 2 * x1 + x2);
    const f1 = g * (u1 + 2 * u0 + x1);
    const o0 = f0 - a1 * y1 - a2 * y2;
    const o1 = f1 - a1 * f0 + c1 * y1 + c2 * y2;
    buf[i] = o0;
    buf[i - 1] = o1;
    y2 = o0;
    y1 = o1;
    x2 = u0;
    x1 = u1;
  }
  for (; i >= 0; i--) {
    const u = buf[i];
    const o = g * (u + 2 * x1 + x2) - a1 * y1 - a2 * y2;
    buf[i] = o;
    y2 = y1;
    y1 = o;
    x2 = x1;
    x1 = u;
  }
  state[0] = x1;
  state[1] = x2;
  state[2] = y1;
  state[3] = y2;
}

function firstOrderForward(src: ArrayLike<number>, buf: Float64Array, from: number, to: number, g: number, a1: number, state: Float64Array): void {
  let x1 = state[0];
  let y1 = state[2];
  for (let i = from; i < to; i++) {
    const u = src[i];
    const o = g * (u + x1) - a1 * y1;
    buf[i] = o;
    x1 = u;
    y1 = o;
  }
  state[0] = x1;
  state[2] = y1;
}

function firstOrderBackward(buf: Float64Array, g: number, a1: number, state: Float64Array): void {
  let x1 = state[0];
  let y1 = state[2];
  for (let i = buf.length - 1; i >= 0; i--) {
    const u = buf[i];
    const o = g * (u + x1) - a1 * y1;
    buf[i] = o;
    x1 = u;
    y1 = o;
  }
  state[0] = x1;
  state[2] = y1;
}
