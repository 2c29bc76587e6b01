import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { butterworthResponse, butterworthSections } from '@loopwise/signal';
import { checkProperty } from '../../../test/property';

describe('butterworthSections({ cutoff, sampleRate, order })', () => {
  it('gives the textbook coefficients of order 2 at a quarter of the sample rate', () => {
    // K = tan(π/4) = 1: b = [2 − √2, 2(2 − √2), 2 − √2]/2 ≈ [0.2929, 0.5858, 0.2929],
    // a = [1, 0, 0.1716] (bilinear transform of 1/(s² + √2 s + 1); Oppenheim & Schafer,
    // Discrete-Time Signal Processing, 3rd ed., 7.2, `value from memory`)
    const s = butterworthSections({ cutoff: 25, sampleRate: 100 }).sections[0];
    expect(s.gain).toBeCloseTo(1 / (2 + Math.SQRT2), 15);
    expect(Math.abs(s.a1)).toBeLessThan(1e-15);
    expect(s.a2).toBeCloseTo((2 - Math.SQRT2) / (2 + Math.SQRT2), 15);
  });

  it('has one section per pole pair, and a first-order one for odd orders', () => {
    expect(butterworthSections({ cutoff: 10, sampleRate: 100, order: 1 }).sections.map((s) => s.firstOrder)).toEqual([true]);
    expect(butterworthSections({ cutoff: 10, sampleRate: 100, order: 5 }).sections.map((s) => s.firstOrder)).toEqual([false, false, true]);
  });

  it('passes DC with gain 1 and has |H| = 1/√2 at the cut-off, for every order and cut-off (property)', () => {
    // the Butterworth magnitude |H(jΩ)|² = 1/(1 + (Ω/Ωc)^(2N)) is 1/2 at Ωc, and the pre-warped
    // bilinear transform maps Ωc to fc exactly (Oppenheim & Schafer 7.2.2, `value from memory`)
    checkProperty(
      'Butterworth DC gain and cut-off magnitude',
      fc.property(fc.integer({ min: 1, max: 12 }), fc.double({ min: 1e-3, max: 0.49, noNaN: true }), (order, ratio) => {
        const d = butterworthSections({ cutoff: ratio * 1000, sampleRate: 1000, order });
        // 1 + a1 + a2 ≈ 4K² cancels: the coefficients' rounding grows like 1e-16 / K² at low cut-offs
        expect(Math.abs(butterworthResponse(d, 0) - 1)).toBeLessThan(1e-10);
        expect(Math.abs(butterworthResponse(d, ratio * 1000) - Math.SQRT1_2)).toBeLessThan(1e-9);
        // monotone fall beyond the cut-off (maximally flat, no ripple)
        expect(butterworthResponse(d, Math.min(499, ratio * 1000 * 1.5))).toBeLessThan(Math.SQRT1_2);
      }),
      { numRuns: 300 },
    );
  });

  it('rejects a cut-off at or above Nyquist, an order below 1 and unknown fields', () => {
    expect(() => butterworthSections({ cutoff: 50, sampleRate: 100 })).toThrow(expect.objectContaining({ code: 'invalid-option', field: 'cutoff', value: 50 }));
    expect(() => butterworthSections({ cutoff: 0, sampleRate: 100 })).toThrow(expect.objectContaining({ field: 'cutoff' }));
    expect(() => butterworthSections({ cutoff: 10, sampleRate: 100, order: 0 })).toThrow(expect.objectContaining({ code: 'invalid-option', field: 'order', value: 0 }));
    expect(() => butterworthSections({ cutoff: 10, sampleRate: NaN })).toThrow(expect.objectContaining({ field: 'sampleRate' }));
    expect(() => butterworthSections({ cutoff: 10, sampleRate: 100, ordre: 2 } as never)).toThrow(expect.objectContaining({ code: 'unknown-option', field: 'options.ordre' }));
  });
});
