import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import {
  equivalentAmplitudeInto,
  gerberAmplitude,
  goodmanAmplitude,
  iiwEnhancedAmplitude,
  iiwMeanStressFactor,
  morrowAmplitude,
  smithWatsonTopperAmplitude,
  walkerAmplitude,
  StressLifeError,
  type AmplitudeCorrection,
} from '@loopwise/stress-life';
import { checkProperty } from '../../../test/property';
import shigley from '../../../fixtures/handbook/shigley-9th-stress-life.json';

const ex615 = shigley.cases.find((c) => c.name.startsWith('Example 6-15'))!;
const p620 = shigley.cases.find((c) => c.name.startsWith('Problem 6-20'))!;

describe('mean-stress corrections of the amplitude', () => {
  test('Gerber: Shigley 9th ed. Example 6-15, cycle 1 (σa 70, σm 10, Sut 151 kpsi) gives Sf = 70.3 kpsi', () => {
    expect(gerberAmplitude(70, 10, 151)).toBeCloseTo(ex615.expected.SfCycle1 as number, 1);
    // cycle 3 has a compressive mean: σar = σa (p. 305 and the example's "since σm < 0, Sf = Se")
    expect(gerberAmplitude(10, -30, 151)).toBe(10);
  });

  test('Goodman: Shigley 9th ed. solutions manual, problem 6-20(a): Sf = 36.78 kpsi', () => {
    const { sigmaA, sigmaM, Sut } = p620.input as { sigmaA: number; sigmaM: number; Sut: number };
    expect(goodmanAmplitude(sigmaA, sigmaM, Sut)).toBeCloseTo(p620.expected.SfGoodman as number, 2);
    expect(goodmanAmplitude(100, -200, 400)).toBe(100);
    expect(goodmanAmplitude(100, -200, 400, 'equation')).toBeCloseTo(100 / 1.5, 12);
  });

  test('identities: Walker γ = 0.5 is SWT, γ = 1 is none; Morrow with σf\' = Su is Goodman; zero mean changes nothing (property)', () => {
    checkProperty(
      'correction identities',
      fc.property(fc.double({ min: 0, max: 500, noNaN: true }), fc.double({ min: -400, max: 400, noNaN: true }), (sa, sm) => {
        expect(walkerAmplitude(sa, sm, 0.5)).toBeCloseTo(smithWatsonTopperAmplitude(sa, sm), 9);
        if (sm + sa > 0) expect(walkerAmplitude(sa, sm, 1)).toBeCloseTo(sa, 9);
        expect(morrowAmplitude(sa, sm, 1000)).toBeCloseTo(goodmanAmplitude(sa, sm, 1000, 'equation'), 9);
        for (const f of [goodmanAmplitude, gerberAmplitude]) expect(f(sa, 0, 1000)).toBe(sa);
        expect(smithWatsonTopperAmplitude(sa, 0)).toBeCloseTo(sa, 9);
      }),
    );
  });

  test('SWT and Walker give no damage for σmax <= 0; IIW f(R) follows its three categories (value from memory)', () => {
    expect(smithWatsonTopperAmplitude(10, -20)).toBe(0);
    expect(walkerAmplitude(10, -10, 0.7)).toBe(0);
    expect(iiwMeanStressFactor(-2, 'I')).toBe(1.6);
    expect(iiwMeanStressFactor(0.5, 'I')).toBeCloseTo(1, 15);
    expect(iiwMeanStressFactor(0.8, 'I')).toBe(1);
    expect(iiwMeanStressFactor(-0.25, 'II')).toBeCloseTo(1, 15);
    expect(iiwMeanStressFactor(-5, 'II')).toBe(1.3);
    expect(iiwMeanStressFactor(-1, 'III')).toBe(1);
    // fully compressive cycle: the R → −∞ end; zero mean R = −1
    expect(iiwEnhancedAmplitude(10, -20, 'I')).toBeCloseTo(10 / 1.6, 15);
    expect(iiwEnhancedAmplitude(10, 0, 'I')).toBeCloseTo(10 / 1.6, 15);
    expect(iiwEnhancedAmplitude(10, 10, 'I')).toBeCloseTo(10 / 1.2, 15);
  });

  test('equivalentAmplitudeInto equals the scalar of every method and writes nothing before a bad cycle throws', () => {
    const sa = [10, 50, 120, 0];
    const sm = [-80, 0, 60, 30];
    const cases: [AmplitudeCorrection, (a: number, m: number) => number][] = [
      [{ method: 'none' }, (a) => a],
      [{ method: 'goodman', ultimateStrength: 500 }, (a, m) => goodmanAmplitude(a, m, 500)],
      [{ method: 'gerber', ultimateStrength: 500, compressiveMean: 'equation' }, (a, m) => gerberAmplitude(a, m, 500, 'equation')],
      [{ method: 'morrow', sigmaF: 900 }, (a, m) => morrowAmplitude(a, m, 900)],
      [{ method: 'smithWatsonTopper' }, smithWatsonTopperAmplitude],
      [{ method: 'walker', gamma: 0.65 }, (a, m) => walkerAmplitude(a, m, 0.65)],
      [{ method: 'iiw', category: 'II' }, (a, m) => iiwEnhancedAmplitude(a, m, 'II')],
    ];
    for (const [c, f] of cases) {
      const out = equivalentAmplitudeInto(c, sa, sm, new Float64Array(4));
      expect(Array.from(out)).toEqual(sa.map((a, i) => f(a, sm[i])));
    }
    const out = new Float64Array(3).fill(7);
    expect(() => equivalentAmplitudeInto({ method: 'goodman', ultimateStrength: 100 }, [1, 1, 1], [0, 100, 0], out)).toThrow(
      expect.objectContaining({ code: 'invalid-mean', field: 'means', index: 1 }),
    );
    expect(Array.from(out)).toEqual([7, 7, 7]);
  });

  test('bad input: negative or non-finite amplitudes and means, means beyond the strength, bad options', () => {
    expect(() => goodmanAmplitude(-1, 0, 100)).toThrow(expect.objectContaining({ code: 'invalid-stress', field: 'amplitude' }));
    expect(() => goodmanAmplitude(1, NaN, 100)).toThrow(expect.objectContaining({ code: 'invalid-mean' }));
    expect(() => goodmanAmplitude(1, 100, 100)).toThrow(expect.objectContaining({ code: 'invalid-mean' }));
    expect(() => gerberAmplitude(1, -100, 100, 'equation')).toThrow(expect.objectContaining({ code: 'invalid-mean' }));
    expect(() => morrowAmplitude(1, 0, 0)).toThrow(expect.objectContaining({ field: 'sigmaF' }));
    expect(() => walkerAmplitude(1, 0, 0)).toThrow(expect.objectContaining({ field: 'gamma' }));
    expect(() => iiwMeanStressFactor(0, 'IV' as never)).toThrow(expect.objectContaining({ field: 'category' }));
    expect(() => equivalentAmplitudeInto({ method: 'soderberg' } as never, [1], [0], new Float64Array(1))).toThrow(expect.objectContaining({ field: 'meanStress.method' }));
    expect(() => equivalentAmplitudeInto({ method: 'none' }, [1, Infinity], [0, 0], new Float64Array(2))).toThrow(expect.objectContaining({ code: 'invalid-stress', index: 1 }));
    expect(() => equivalentAmplitudeInto({ method: 'none' }, [1, 2], [0], new Float64Array(2))).toThrow(StressLifeError);
    expect(equivalentAmplitudeInto({ method: 'none' }, [], [], new Float64Array(0)).length).toBe(0);
  });
});
