import { describe, expect, test } from 'vitest';
import { DEFAULT_CRITICAL_DAMAGE, lifeFromDamage } from '@loopwise/miner';

describe('lifeFromDamage(damagePerRepeat, {criticalDamage?, scatterFactor?, unit?})', () => {
  test('lifeFromDamage gives Dcrit / D repeats, the design life and the life in the unit (the TSDoc example)', () => {
    expect(lifeFromDamage(0.002, { criticalDamage: 0.5, scatterFactor: 2, unit: { label: 'h', perRepeat: 0.25 } })).toEqual({
      damagePerRepeat: 0.002,
      criticalDamage: 0.5,
      scatterFactor: 2,
      repeats: 250,
      designRepeats: 125,
      service: 62.5,
      designService: 31.25,
      unit: 'h',
      perRepeat: 0.25,
    });
  });

  test('lifeFromDamage defaults: Dcrit = 1 (Miner 1945), no scatter factor, no unit', () => {
    expect(DEFAULT_CRITICAL_DAMAGE).toBe(1);
    expect(lifeFromDamage(0.01)).toEqual({ damagePerRepeat: 0.01, criticalDamage: 1, scatterFactor: 1, repeats: 100, designRepeats: 100 });
  });

  test('the scatter factor divides life and leaves the mean estimate alone', () => {
    const mean = lifeFromDamage(1e-5);
    const design = lifeFromDamage(1e-5, { scatterFactor: 5 });
    expect(design.repeats).toBe(mean.repeats);
    expect(design.designRepeats).toBeCloseTo(mean.repeats / 5, 9);
  });

  test('D = 0 gives infinite life and a tiny D a finite or infinite one, never NaN', () => {
    expect(lifeFromDamage(0, { scatterFactor: 3, unit: { label: 'flights', perRepeat: 1 } })).toMatchObject({ repeats: Infinity, service: Infinity, designService: Infinity });
    expect(lifeFromDamage(5e-324).repeats).toBe(Infinity);
    expect(Object.values(lifeFromDamage(5e-324, { unit: { label: 'km', perRepeat: 1e-300 } })).some((v) => Number.isNaN(v))).toBe(false);
  });
});

describe('lifeFromDamage: a positive life never underflows to 0 (issue 15)', () => {
  test("lifeFromDamage(1.4e-6, { criticalDamage: 1e-300, scatterFactor: 1e300 }) throws invalid-scatter-factor instead of designRepeats 0", () => {
    expect(() => lifeFromDamage(1.4e-6, { criticalDamage: 1e-300, scatterFactor: 1e300 })).toThrow(expect.objectContaining({ code: 'invalid-scatter-factor', field: 'scatterFactor' }));
    expect(() => lifeFromDamage(1e10, { criticalDamage: 5e-324 })).toThrow(expect.objectContaining({ code: 'invalid-critical-damage' }));
    expect(() => lifeFromDamage(1, { criticalDamage: 1e-300, unit: { label: 'km', perRepeat: 1e-30 } })).toThrow(expect.objectContaining({ field: 'unit.perRepeat' }));
    expect(lifeFromDamage(1.4e-6, { criticalDamage: 1e-300, scatterFactor: 10 }).designRepeats).toBeGreaterThan(0);
  });
});
