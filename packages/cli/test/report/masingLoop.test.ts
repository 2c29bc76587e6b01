// Checked against masingStrainRange of @loopwise/material (same equation, independent code).
import { handbookSteels, masingStrainRange } from '@loopwise/material';
import { describe, expect, it } from 'vitest';
import { masingLoop } from '../../src/report/masingLoop.js';

const material = handbookSteels.find((m) => m.name === 'SAE 1045 (hot rolled and normalized)')!;

describe('masingLoop(material, σmax, σmin, εmax, εmin, points)', () => {
  it('runs up from the lower corner and down from the upper one on Masing branches', () => {
    const emin = -0.002;
    const emax = emin + masingStrainRange(material, 500);
    const loop = masingLoop(material, 300, -200, emax, emin, 40);
    expect(loop.strain.length).toBe(80);
    expect(loop.stress[0]).toBe(-200);
    expect(loop.strain[0]).toBe(emin);
    expect(loop.stress[40]).toBe(300);
    expect(loop.strain[40]).toBe(emax);
    for (const i of [7, 23, 39]) {
      expect(loop.strain[i] - emin).toBeCloseTo(masingStrainRange(material, loop.stress[i] + 200), 15);
      expect(emax - loop.strain[40 + i]).toBeCloseTo(masingStrainRange(material, 300 - loop.stress[40 + i]), 15);
    }
    expect(loop.closureError).toBeLessThan(1e-12);
  });

  it('reports how far a loop is from the model, and never NaN on a point loop', () => {
    expect(masingLoop(material, 300, -200, 0.01, -0.002).closureError).toBeGreaterThan(0.1);
    const point = masingLoop(material, 10, 10, 0, 0);
    expect([...point.strain, ...point.stress, point.closureError].some(Number.isNaN)).toBe(false);
  });
});
