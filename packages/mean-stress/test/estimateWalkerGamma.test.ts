import { describe, expect, it } from 'vitest';
import { estimateWalkerGamma, MeanStressError, WALKER_GAMMA_SOURCE } from '@loopwise/mean-stress';

describe('estimateWalkerGamma({ SuMPa, metal? })', () => {
  it('steels: gamma = 0.8818 - 0.000200 Su (Su in MPa)', () => {
    // Dowling (2009), Fatigue Fract Eng Mater Struct 32:1004 and 32:163: coefficients value from memory.
    expect(estimateWalkerGamma({ SuMPa: 1000 })).toBeCloseTo(0.6818, 12);
    expect(estimateWalkerGamma({ SuMPa: 621, metal: 'steel' })).toBeCloseTo(0.7576, 12);
    expect(estimateWalkerGamma({ SuMPa: 2000 })).toBeLessThan(estimateWalkerGamma({ SuMPa: 500 }));
    expect(WALKER_GAMMA_SOURCE).toMatch(/10\.1111\/j\.1460-2695\.2009\.01404\.x/);
  });
  it('precipitation-hardened 2xxx/7xxx aluminium and other metals: gamma = 0.5', () => {
    // Dowling (2009), Fatigue Fract Eng Mater Struct 32:1004, abstract: gamma = 0.5 for 2000 and 7000
    // series aluminium alloys, and 0.5 as the default for other metals.
    expect(estimateWalkerGamma({ metal: 'aluminium-2xxx-7xxx' })).toBe(0.5);
    expect(estimateWalkerGamma({ metal: 'other', SuMPa: 300 })).toBe(0.5);
  });
  it.each([undefined, 0, -100, NaN, Infinity, 5000])('steel with SuMPa = %s throws invalid-gamma', (su) => {
    expect(() => estimateWalkerGamma({ SuMPa: su })).toThrow(MeanStressError);
  });
  it('an unknown metal throws invalid-gamma', () => {
    expect(() => estimateWalkerGamma({ SuMPa: 500, metal: 'copper' as 'steel' })).toThrow(/metal/);
  });
});
