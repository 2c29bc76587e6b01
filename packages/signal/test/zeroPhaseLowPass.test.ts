import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { butterworthResponse, zeroPhaseLowPass, zeroPhaseLowPassInto } from '@loopwise/signal';
import { checkProperty } from '../../../test/property';

const tone = (n: number, f: number, fs: number, amplitude = 1) => Float64Array.from({ length: n }, (_, i) => amplitude * Math.sin((2 * Math.PI * f * i) / fs));
const amplitudeIn = (y: Float64Array, from: number, to: number) => {
  let m = 0;
  for (let i = from; i < to; i++) m = Math.max(m, Math.abs(y[i]));
  return m;
};

describe('zeroPhaseLowPass(history, { cutoff, sampleRate, order, padLength })', () => {
  it('halves a tone at the cut-off (1/√2 per pass, forward-backward squares it)', () => {
    // |H_fb(fc)| = |H(fc)|² = 1/2 (Butterworth magnitude at Ωc; Oppenheim & Schafer 7.2, `value from memory`)
    for (const order of [1, 2, 3, 4]) {
      const y = zeroPhaseLowPass(tone(20000, 10, 1000), { cutoff: 10, sampleRate: 1000, order }).values;
      expect(Math.abs(amplitudeIn(y, 5000, 15000) - 0.5)).toBeLessThan(2e-3);
    }
  });

  it('passes a tone far below the cut-off and removes one far above it', () => {
    const low = zeroPhaseLowPass(tone(20000, 1, 1000), { cutoff: 50, sampleRate: 1000 }).values;
    expect(Math.abs(amplitudeIn(low, 5000, 15000) - 1)).toBeLessThan(1e-4);
    const high = zeroPhaseLowPass(tone(20000, 400, 1000), { cutoff: 20, sampleRate: 1000 }).values;
    expect(amplitudeIn(high, 5000, 15000)).toBeLessThan(1e-5);
  });

  it('keeps peaks at their sample index (zero phase): a symmetric pulse stays symmetric', () => {
    const x = Float64Array.from({ length: 1001 }, (_, i) => Math.exp(-(((i - 500) / 30) ** 2)));
    const y = zeroPhaseLowPass(x, { cutoff: 5, sampleRate: 1000, order: 4 }).values;
    let peak = 0;
    for (let i = 0; i < y.length; i++) if (y[i] > y[peak]) peak = i;
    expect(peak).toBe(500);
    // exact only for an endless record: the start-up of each pass at the ends leaves a trace
    for (let k = 1; k < 400; k += 37) expect(Math.abs(y[500 - k] - y[500 + k])).toBeLessThan(1e-7);
  });

  it('returns a constant and a ramp unchanged at the ends (odd reflection, steady-state start)', () => {
    const c = zeroPhaseLowPass(new Float64Array(300).fill(-4.25), { cutoff: 3, sampleRate: 100 }).values;
    for (const v of c) expect(Math.abs(v + 4.25)).toBeLessThan(1e-12);
    const ramp = Float64Array.from({ length: 300 }, (_, i) => 2 + 0.5 * i);
    const r = zeroPhaseLowPass(ramp, { cutoff: 3, sampleRate: 100 }).values;
    // the steady state of a constant starts the pad: its transient has decayed by the data (six periods of the cut-off)
    for (let i = 0; i < 300; i += 13) expect(Math.abs(r[i] - ramp[i])).toBeLessThan(1e-8);
  });

  it('records what it did', () => {
    const { correction, design } = zeroPhaseLowPass(tone(100, 1, 100), { cutoff: 10, sampleRate: 100 });
    expect(correction.kind).toBe('low-pass');
    expect(correction.samples).toBe(100);
    expect(correction.parameters).toEqual({ method: 'Butterworth, forward-backward', order: 2, cutoff: 10, sampleRate: 100, padLength: 60 });
    expect(Math.abs(butterworthResponse(design, 10) ** 2 - 0.5)).toBeLessThan(1e-12);
  });

  it('works in place and gives the same as into a new array', () => {
    const x = tone(999, 7, 100);
    const y = zeroPhaseLowPass(x, { cutoff: 5, sampleRate: 100, order: 3 }).values;
    zeroPhaseLowPassInto(x, x, { cutoff: 5, sampleRate: 100, order: 3 });
    expect(Array.from(x)).toEqual(Array.from(y));
  });

  it('handles empty, one and two samples', () => {
    expect(zeroPhaseLowPass([], { cutoff: 1, sampleRate: 10 }).values.length).toBe(0);
    expect(Array.from(zeroPhaseLowPass([3], { cutoff: 1, sampleRate: 10 }).values)).toEqual([3]);
    expect(zeroPhaseLowPass([3, 3], { cutoff: 1, sampleRate: 10 }).values.every((v) => Math.abs(v - 3) < 1e-12)).toBe(true);
  });

  it('rejects NaN naming the sample, a cut-off at Nyquist, order 0, a bad pad and unknown fields', () => {
    expect(() => zeroPhaseLowPass([1, NaN], { cutoff: 1, sampleRate: 10 })).toThrow(expect.objectContaining({ code: 'non-finite-sample', index: 1 }));
    expect(() => zeroPhaseLowPass([1, 2], { cutoff: 5, sampleRate: 10 })).toThrow(expect.objectContaining({ field: 'cutoff' }));
    expect(() => zeroPhaseLowPass([1, 2], { cutoff: 1, sampleRate: 10, order: 0 })).toThrow(expect.objectContaining({ field: 'order' }));
    expect(() => zeroPhaseLowPass([1, 2], { cutoff: 1, sampleRate: 10, padLength: -1 })).toThrow(expect.objectContaining({ field: 'padLength' }));
    expect(() => zeroPhaseLowPass([1, 2], { cutoff: 1, sampleRate: 10, cutOff: 2 } as never)).toThrow(expect.objectContaining({ code: 'unknown-option' }));
    expect(() => zeroPhaseLowPassInto([1, 2], new Float64Array(3), { cutoff: 1, sampleRate: 10 })).toThrow(expect.objectContaining({ field: 'out' }));
  });

  it('never creates NaN or ±Infinity, and stays within the bounds a stable filter allows (property)', () => {
    checkProperty(
      'low-pass output finite',
      fc.property(
        fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { minLength: 0, maxLength: 300 }),
        fc.double({ min: 1e-3, max: 0.49, noNaN: true }),
        fc.integer({ min: 1, max: 6 }),
        (x, ratio, order) => {
          const y = zeroPhaseLowPass(x, { cutoff: ratio * 100, sampleRate: 100, order }).values;
          expect(y.every((v) => Number.isFinite(v))).toBe(true);
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe('zeroPhaseLowPassInto(history, out, options)', () => {
  it('names the first non-finite sample wherever it is, in place too, for every order', () => {
    for (const order of [1, 2, 3]) {
      for (const at of [0, 1, 40, 500, 998, 999]) {
        for (const bad of [NaN, Infinity, -Infinity]) {
          const x = Float64Array.from({ length: 1000 }, (_, i) => Math.sin(i / 7));
          x[at] = bad;
          const options = { cutoff: 5, sampleRate: 100, order };
          expect(() => zeroPhaseLowPassInto(x, new Float64Array(1000), options)).toThrow(expect.objectContaining({ code: 'non-finite-sample', index: at }));
          expect(() => zeroPhaseLowPassInto(x, x, options)).toThrow(expect.objectContaining({ code: 'non-finite-sample', index: at }));
        }
      }
    }
  });
});
