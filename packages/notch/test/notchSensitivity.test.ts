import { describe, expect, it } from 'vitest';
import { fatigueNotchFactor, NotchOptionError, neuberConstantMm, neuberSensitivity, petersonConstantMm, petersonSensitivity } from '@loopwise/notch';

describe('notch sensitivity and Kf', () => {
  it('petersonConstantMm(Su) is the SI form of a = 0.001 (300/Su[ksi])^1.8 in (value from memory)', () => {
    expect(petersonConstantMm(2070)).toBe(0.0254);
    const ksi = 100;
    expect(petersonConstantMm(ksi * 6.894757)).toBeCloseTo(0.001 * Math.pow(300 / ksi, 1.8) * 25.4, 3);
  });

  it('neuberConstantMm(Su) agrees with the inch-ksi polynomial of Kuhn and Hardrath (value from memory)', () => {
    const ksi = 100;
    const rootIn = 0.246 - 3.08e-3 * ksi + 1.51e-5 * ksi ** 2 - 2.67e-8 * ksi ** 3;
    expect(Math.sqrt(neuberConstantMm(ksi * 6.894757))).toBeCloseTo(rootIn * Math.sqrt(25.4), 2);
    expect(() => neuberConstantMm(3000)).toThrow(NotchOptionError);
  });

  it('q after Peterson and Neuber, and Kf = 1 + q(Kt - 1)', () => {
    expect(petersonSensitivity(1, 0.25)).toBe(0.8);
    expect(neuberSensitivity(1, 0.25)).toBeCloseTo(1 / 1.5, 15);
    expect(fatigueNotchFactor(3, 0.8)).toBeCloseTo(2.6, 15);
    expect(() => fatigueNotchFactor(0.5, 0.5)).toThrow(NotchOptionError);
    expect(() => petersonSensitivity(NaN, 1)).toThrow(/rootRadiusMm/);
  });
});
