import { describe, expect, it } from 'vitest';
import { ArgumentError, estimateUniformMaterialLaw, UNIFORM_MATERIAL_LAW_SOURCE } from '@loopwise/material';

describe('estimateUniformMaterialLaw({ SuMPa, EMPa, metal, cyclicCurve? })', () => {
  it("steel at Su = 500 MPa, E = 210000 MPa reproduces the published comparison table's UML row", () => {
    // Expected sigmaF' = 750.00, b = -0.0870, epsilonF' = 0.5900, c = -0.5800: Metals 15 (2025) 780,
    // doi:10.3390/met15070780, table of estimated constants ("Uniform material law method").
    // The inputs Su = 500 MPa and E = 210000 MPa are inferred from that table (750 = 1.5 x 500;
    // E from the Roessle-Fatemi row), not read from the paper's text.
    const m = estimateUniformMaterialLaw({ SuMPa: 500, EMPa: 210000, metal: 'steel' });
    expect(m.sigmaF).toBeCloseTo(750.0, 10);
    expect(m.b).toBe(-0.087);
    expect(m.epsilonF).toBeCloseTo(0.59, 12);
    expect(m.c).toBe(-0.58);
    expect(m.source).toBe(UNIFORM_MATERIAL_LAW_SOURCE);
    expect(m.note).toMatch(/scatter/);
    expect(m.Su).toBe(500);
  });

  it("steel: K' = 1.65 Su, n' = 0.15 and psi = 1.375 - 125 Su/E above Su/E = 0.003", () => {
    // Constants of Baumel and Seeger (1990): value from memory.
    const m = estimateUniformMaterialLaw({ SuMPa: 1000, EMPa: 200000, metal: 'steel' });
    expect(m.K).toBeCloseTo(1650, 10);
    expect(m.n).toBe(0.15);
    expect(m.epsilonF).toBeCloseTo(0.59 * (1.375 - 125 * 0.005), 12);
    expect(m.sigmaF).toBeCloseTo(1500, 10);
    // the steel law is close to compatible (b/c = 0.15): no warning
    expect(m.warnings).toEqual([]);
  });

  it('aluminium and titanium alloys: 1.67 Su, -0.095, 0.35, -0.69, 1.61 Su, 0.11 (warned as incompatible)', () => {
    // Constants of Baumel and Seeger (1990): value from memory.
    const m = estimateUniformMaterialLaw({ SuMPa: 400, EMPa: 70000, metal: 'aluminium-titanium' });
    expect([m.sigmaF, m.b, m.epsilonF, m.c, m.K, m.n]).toEqual([1.67 * 400, -0.095, 0.35, -0.69, 1.61 * 400, 0.11]);
    expect(m.warnings.map((w) => w.field)).toContain('n');
    const c = estimateUniformMaterialLaw({ SuMPa: 400, EMPa: 70000, metal: 'aluminium-titanium', cyclicCurve: 'compatible' });
    expect(c.n).toBeCloseTo(0.095 / 0.69, 14);
    expect(c.warnings).toEqual([]);
  });

  it('rejects bad input with ArgumentError naming the field', () => {
    expect(() => estimateUniformMaterialLaw({ SuMPa: NaN, EMPa: 2e5, metal: 'steel' })).toThrow(/SuMPa/);
    expect(() => estimateUniformMaterialLaw({ SuMPa: 500, EMPa: 0, metal: 'steel' })).toThrow(/EMPa/);
    expect(() => estimateUniformMaterialLaw({ SuMPa: -500, EMPa: 2e5, metal: 'steel' })).toThrow(ArgumentError);
    expect(() => estimateUniformMaterialLaw({ SuMPa: 500, EMPa: 2e5, metal: 'copper' as 'steel' })).toThrow(/metal/);
    expect(() => estimateUniformMaterialLaw({ SuMPa: 3000, EMPa: 2e5, metal: 'steel' })).toThrow(/too high/);
  });
});
