import { describe, expect, it } from 'vitest';
import { LoopwiseError } from '@loopwise/base';
import { assertMaterial, defineMaterial, MaterialError, type Material, type MaterialInput } from '@loopwise/material';

// Invented, self-consistent values for tests only.
const valid: MaterialInput = { E: 200000, sigmaF: 1000, b: -0.1, epsilonF: 1, c: -0.5, K: 1000, n: 0.2 };

describe('new MaterialError(issues)', () => {
  it('is a LoopwiseError with code invalid-material whose field and value are the first issue', () => {
    const e = new MaterialError([
      { field: 'b', value: 0.1, rule: 'must be a finite number < 0' },
      { field: 'n', value: NaN, rule: 'must be a finite number with 0 < n < 1' },
    ]);
    expect(e).toBeInstanceOf(LoopwiseError);
    expect([e.name, e.code, e.field, e.value, e.index]).toEqual(['MaterialError', 'invalid-material', 'b', 0.1, undefined]);
    expect(e.issues.map((i) => i.field)).toEqual(['b', 'n']);
    expect(e.message).toBe('invalid material: b = 0.1 (must be a finite number < 0); n = NaN (must be a finite number with 0 < n < 1)');
    expect(Object.isFrozen(e.issues)).toBe(true);
  });

  it('defineMaterial(bad) and assertMaterial(bad) throw it with every issue, the first in field and value', () => {
    for (const f of [() => defineMaterial({ ...valid, sigmaF: -0, n: 2 }), () => assertMaterial({ ...valid, sigmaF: -0, n: 2 } as Material)]) {
      try {
        f();
        throw new Error('expected a throw');
      } catch (e) {
        expect(e).toBeInstanceOf(MaterialError);
        const m = e as MaterialError;
        expect(m.field).toBe('sigmaF');
        expect(Object.is(m.value, -0)).toBe(true);
        expect(m.issues.map((i) => i.field)).toEqual(['sigmaF', 'n']);
        expect(m.message).toMatch(/^invalid material: sigmaF = -0 /);
      }
    }
    expect(() => assertMaterial(null as never)).toThrow(expect.objectContaining({ code: 'invalid-material', field: '(material)', value: null }));
  });

  it('a string value is quoted in the message', () => {
    expect(() => defineMaterial({ ...valid, E: '200000' as never })).toThrow('invalid material: E = "200000" (must be a finite number > 0)');
  });
});
