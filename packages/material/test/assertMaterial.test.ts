import { describe, expect, it } from 'vitest';
import { assertMaterial, defineMaterial, MaterialError, type Material } from '@loopwise/material';

describe('assertMaterial(material)', () => {
  it('assertMaterial(defined material) does not throw', () => {
    expect(() => assertMaterial(defineMaterial({ E: 2e5, sigmaF: 900, b: -0.09, epsilonF: 0.5, c: -0.6, K: 1200, n: 0.15 }))).not.toThrow();
  });
  it('assertMaterial(plain object with bad fields) throws MaterialError listing them', () => {
    const bad = { E: 2e5, sigmaF: 900, b: 0.09, epsilonF: 0.5, c: -0.6, K: 1200, n: NaN, warnings: [] } as Material;
    expect(() => assertMaterial(bad)).toThrow(MaterialError);
    try {
      assertMaterial(bad);
    } catch (e) {
      expect((e as MaterialError).issues.map((i) => i.field)).toEqual(['b', 'n']);
    }
    expect(() => assertMaterial(undefined as unknown as Material)).toThrow(MaterialError);
  });
});
