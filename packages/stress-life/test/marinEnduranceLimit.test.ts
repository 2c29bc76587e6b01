import { describe, expect, test } from 'vitest';
import {
  estimateSteelSnCurve,
  fatigueStrengthFraction,
  MARIN_RELIABILITY_FACTORS,
  MARIN_SURFACE_FINISHES,
  marinEnduranceLimit,
  marinLoadFactor,
  marinReliabilityFactor,
  marinSizeFactor,
  marinSurfaceFactor,
  rotatingBeamEnduranceLimit,
  stressAtCycles,
  cyclesToFailure,
} from '@loopwise/stress-life';
import shigley from '../../../fixtures/handbook/shigley-9th-stress-life.json';

const byName = (start: string) => shigley.cases.find((c) => c.name.startsWith(start))!;
const KPSI = 6.894757; // MPa per kpsi

describe('Marin factors and the steel S-N estimate (Shigley 9th ed.)', () => {
  test('the tables are the book\'s Table 6-2 and Table 6-5', () => {
    const t62 = byName("Table 6-2").expected as unknown as Record<string, number[]>;
    for (const [k, [a, b]] of Object.entries(t62)) expect(MARIN_SURFACE_FINISHES[k as keyof typeof MARIN_SURFACE_FINISHES]).toEqual({ a, b });
    const t65 = byName("Table 6-5").expected as unknown as Record<string, number>;
    for (const [r, ke] of Object.entries(t65)) expect(marinReliabilityFactor(Number(r))).toBe(ke);
    for (const row of MARIN_RELIABILITY_FACTORS) expect(Math.abs(1 - 0.08 * row.za - row.ke)).toBeLessThan(5e-4);
  });

  test('Example 6-3: ka = 0.860 for a machined surface at Sut = 520 MPa', () => {
    expect(marinSurfaceFactor('machined', 520)).toBeCloseTo(byName('Example 6-3').expected.ka as number, 3);
  });

  test('Example 6-8: ka 0.963, kc 0.85, ke 0.814 give Se = 16.3 kpsi; a = 119.3 kpsi with f = 0.9', () => {
    const ex = byName('Example 6-8');
    const r = marinEnduranceLimit({ ultimateStrengthMPa: 49 * KPSI, rotatingBeamLimitMPa: 24.5 * KPSI, finish: 'machined', load: 'axial', reliability: 0.99 });
    expect(r.factors.ka).toBeCloseTo(0.963, 2);
    expect([r.factors.kb, r.factors.kc, r.factors.ke]).toEqual([1, 0.85, 0.814]);
    expect(r.enduranceLimitMPa / KPSI).toBeCloseTo(ex.expected.Se as number, 1);
    // f = 0.9 below 70 kpsi (p. 346 step 5)
    expect(fatigueStrengthFraction(49 * KPSI)).toBe(0.9);
  });

  test('Example 6-2: Sut 90, Se 45 kpsi, f 0.86: Sf(1e4) = 64.6 kpsi, N(55 kpsi) = 77 500 (book rounds b)', () => {
    const ex = byName('Example 6-2');
    const curve = estimateSteelSnCurve({ ultimateStrengthMPa: 90, enduranceLimitMPa: 45, fraction: 0.86 });
    expect(stressAtCycles(curve, 1e4)).toBeCloseTo(ex.expected.SfAt1e4 as number, 1);
    expect(stressAtCycles(curve, 1e3)).toBeCloseTo(0.86 * 90, 10);
    expect(-1 / curve.slopes[0]).toBeCloseTo(ex.expected.b as number, 4);
    expect(Math.abs(cyclesToFailure(curve, 55) / (ex.expected.cycles as number) - 1)).toBeLessThan(2e-3);
    expect(cyclesToFailure(curve, 44.9)).toBe(Infinity);
  });

  test('f from Sut draws Figure 6-18: 0.86 at 90 kpsi (Example 6-2), 0.778 at 188.1 kpsi (problem 6-20)', () => {
    expect(fatigueStrengthFraction(90 * KPSI)).toBeCloseTo(0.86, 2);
    expect(fatigueStrengthFraction(188.1 * KPSI)).toBeCloseTo(0.778, 3);
    expect(rotatingBeamEnduranceLimit(2000)).toBe(700);
    expect(rotatingBeamEnduranceLimit(1000)).toBe(500);
  });

  test('size and load factors, eqs. (6-20), (6-21), (6-26); bad input names the field', () => {
    expect(marinSizeFactor(10, 'bending')).toBeCloseTo(1.24 * Math.pow(10, -0.107), 15);
    expect(marinSizeFactor(100, 'torsion')).toBeCloseTo(1.51 * Math.pow(100, -0.157), 15);
    expect(marinSizeFactor(100, 'axial')).toBe(1);
    expect([marinLoadFactor('bending'), marinLoadFactor('axial'), marinLoadFactor('torsion')]).toEqual([1, 0.85, 0.59]);
    expect(() => marinSizeFactor(300, 'bending')).toThrow(expect.objectContaining({ field: 'diameterMm' }));
    expect(() => marinReliabilityFactor(0.98)).toThrow(expect.objectContaining({ field: 'reliability' }));
    expect(() => marinSurfaceFactor('polished' as never, 500)).toThrow(expect.objectContaining({ field: 'finish' }));
    expect(() => marinEnduranceLimit({ ultimateStrengthMPa: -5 })).toThrow(expect.objectContaining({ field: 'ultimateStrengthMPa' }));
    expect(() => estimateSteelSnCurve({ ultimateStrengthMPa: 500, enduranceLimitMPa: 480, fraction: 0.9 })).toThrow(expect.objectContaining({ field: 'enduranceLimitMPa' }));
  });
});
