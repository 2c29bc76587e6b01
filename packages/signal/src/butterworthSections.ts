import { integerOption, onlyKnownFields, positiveOption } from './checkOptions';
import { SignalError } from './SignalError';

/**
 * A digital Butterworth low-pass filter as a cascade of sections, each with DC gain 1:
 * second-order sections H(z) = g (1 + 2z⁻¹ + z⁻²) / (1 + a1 z⁻¹ + a2 z⁻²) and, for an odd
 * order, one first-order section H(z) = g (1 + z⁻¹) / (1 + a1 z⁻¹) (its `a2` is 0, `first` true).
 */
export interface ButterworthDesign {
  readonly order: number;
  readonly cutoff: number;
  readonly sampleRate: number;
  /** Per section: gain g, a1, a2 (0 for the first-order one). */
  readonly sections: readonly { readonly gain: number; readonly a1: number; readonly a2: number; readonly firstOrder: boolean }[];
}

/** Options of {@link butterworthSections}. */
export interface ButterworthOptions {
  /** Cut-off frequency fc in Hz (the −3 dB point: |H| = 1/√2); 0 < fc < sampleRate / 2. */
  cutoff: number;
  /** Sample rate fs in Hz. */
  sampleRate: number;
  /** Filter order N, an integer 1 … 16. Default 2. */
  order?: number;
}

/**
 * Designs a digital Butterworth low-pass of order N and cut-off fc by the bilinear transform
 * with pre-warping. The analogue prototype |H(jΩ)|² = 1 / (1 + (Ω/Ωc)^(2N)) has its poles on a
 * circle, in conjugate pairs at angles θk = π(2k − 1)/(2N) from the imaginary axis, so each pair
 * is a section 1 / (s² + 2 sin θk s + 1) in s/Ωc (and, for odd N, 1 / (s + 1)). With
 * K = tan(π fc / fs) the bilinear map s = (1/K)(1 − z⁻¹)/(1 + z⁻¹) sends Ω = Ωc to exactly fc,
 * so |H(e^{jωc})| = 1/√2 with ωc = 2π fc/fs, and H(1) = 1. A second-order section:
 * a0 = 1 + 2 sin θk K + K², g = K²/a0, a1 = 2(K² − 1)/a0, a2 = (1 − 2 sin θk K + K²)/a0; the
 * first-order one: g = K/(1 + K), a1 = (K − 1)/(K + 1).
 *
 * Special cases: at very low cut-offs (fc/fs below about 1e-3) 1 + a1 + a2 ≈ 4K² cancels, so
 * the sections' DC gain departs from 1 by about 1e-16 / K² (1e-10 at fc/fs = 1e-3); decimate
 * first, or filter at a lower sample rate, for lower cut-offs.
 *
 * References: S. Butterworth, "On the theory of filter amplifiers", Experimental Wireless and
 * the Wireless Engineer 7, 1930, 536–541 (the maximally flat response); A. V. Oppenheim and
 * R. W. Schafer, Discrete-Time Signal Processing, 3rd ed., Pearson, 2010, section 7.2.2 (the
 * bilinear transformation and its frequency warping) and 7.3 (Butterworth design by it)
 * (`value from memory`: section numbers).
 *
 * @example
 * const d = butterworthSections({ cutoff: 10, sampleRate: 100 });
 * d.sections.length;
 * // returns 1
 * Math.abs(butterworthResponse(d, 10) - Math.SQRT1_2) < 1e-12;
 * // returns true
 */
export function butterworthSections(options: ButterworthOptions): ButterworthDesign {
  if (options === null || typeof options !== 'object') throw new SignalError('invalid-option', 'options', options, 'must be an options object with cutoff and sampleRate');
  onlyKnownFields(options, ['cutoff', 'sampleRate', 'order'], 'options');
  const sampleRate = positiveOption(options.sampleRate, 'sampleRate', NaN);
  if (options.sampleRate === undefined) throw new SignalError('invalid-option', 'sampleRate', undefined, 'is required: the sample rate in Hz');
  if (options.cutoff === undefined) throw new SignalError('invalid-option', 'cutoff', undefined, 'is required: the cut-off frequency in Hz');
  const cutoff = positiveOption(options.cutoff, 'cutoff', NaN);
  if (!(cutoff < sampleRate / 2)) throw new SignalError('invalid-option', 'cutoff', cutoff, `must be below the Nyquist frequency sampleRate / 2 = ${sampleRate / 2} Hz`);
  const order = integerOption(options.order, 'order', 2, 1);
  if (order > 16) throw new SignalError('invalid-option', 'order', order, 'must be an integer in 1 … 16');
  const K = Math.tan((Math.PI * cutoff) / sampleRate);
  const sections = [];
  for (let k = 1; k <= order >> 1; k++) {
    const twoZeta = 2 * Math.sin((Math.PI * (2 * k - 1)) / (2 * order));
    const a0 = 1 + twoZeta * K + K * K;
    sections.push(Object.freeze({ gain: (K * K) / a0, a1: (2 * (K * K - 1)) / a0, a2: (1 - twoZeta * K + K * K) / a0, firstOrder: false }));
  }
  if (order % 2 === 1) sections.push(Object.freeze({ gain: K / (1 + K), a1: (K - 1) / (K + 1), a2: 0, firstOrder: true }));
  return Object.freeze({ order, cutoff, sampleRate, sections: Object.freeze(sections) });
}

/**
 * |H(e^{jω})| of a design at `frequency` Hz (one pass; a forward-backward pass has the square),
 * evaluated from the sections' coefficients.
 */
export function butterworthResponse(design: ButterworthDesign, frequency: number): number {
  const w = (2 * Math.PI * frequency) / design.sampleRate;
  const c1 = Math.cos(w);
  const s1 = Math.sin(w);
  const c2 = Math.cos(2 * w);
  const s2 = Math.sin(2 * w);
  let mag = 1;
  for (const s of design.sections) {
    // numerator and denominator at z⁻¹ = e^{−jω}
    const nr = s.firstOrder ? 1 + c1 : 1 + 2 * c1 + c2;
    const ni = s.firstOrder ? -s1 : -2 * s1 - s2;
    const dr = 1 + s.a1 * c1 + s.a2 * c2;
    const di = -s.a1 * s1 - s.a2 * s2;
    mag *= (s.gain * Math.hypot(nr, ni)) / Math.hypot(dr, di);
  }
  return mag;
}
