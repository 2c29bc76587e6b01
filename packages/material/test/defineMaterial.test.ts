import { describe, expect, it } from 'vitest';
import { defineMaterial, MaterialError, type MaterialInput } from '@loopwise/material';

// Invented, self-consistent values for tests only.
const valid: MaterialInput = { E: 200000, sigmaF: 1000, b: -0.1, epsilonF: 1, c: -0.5, K: 1000, n: 0.2 };

function issuesOf(input: unknown): { field: string; value: unknown; rule: string }[] {
  try {
    defineMaterial(input as MaterialInput);
  } catch (e) {
    expect(e).toBeInstanceOf(MaterialError);
    expect((e as MaterialError).code).toBe('invalid-material');
    return [...(e as MaterialError).issues];
  }
  throw new Error('defineMaterial did not throw');
}

describe('defineMaterial(input)', () => {
  it('defineMaterial(valid) returns a frozen copy with an empty frozen warnings list', () => {
    const m = defineMaterial({ ...valid, name: 'demo', Su: 800, hardnessHB: 240, source: 'invented', note: 'test' });
    expect(Object.isFrozen(m)).toBe(true);
    expect(Object.isFrozen(m.warnings)).toBe(true);
    expect(m.warnings).toEqual([]);
    expect(m).toMatchObject({ ...valid, name: 'demo', Su: 800, hardnessHB: 240 });
  });

  it('defineMaterial(material) accepts an existing material (its warnings are recomputed)', () => {
    const m = defineMaterial(valid);
    expect(defineMaterial(m)).toEqual(m);
  });

  it('defineMaterial(bad) throws ONE error listing every bad field with its value and rule', () => {
    const issues = issuesOf({ E: 0, sigmaF: -5, b: 0, epsilonF: NaN, c: 0.2, K: Infinity, n: 1 });
    expect(issues.map((i) => i.field)).toEqual(['E', 'sigmaF', 'b', 'epsilonF', 'c', 'K', 'n']);
    expect(issues[0]).toEqual({ field: 'E', value: 0, rule: 'must be a finite number > 0' });
    expect(issues[2].rule).toBe('must be a finite number < 0');
    expect(issues[6].rule).toBe('must be a finite number with 0.01 <= n <= 0.5 (metals have about 0.05 to 0.35; below 0.01 the cyclic curve is nearly a step, elastic-perfectly plastic, that double precision cannot solve; above 0.5 the plastic strain would exceed the elastic one far below any strength of the material)');
    expect(() => defineMaterial({ ...valid, E: -1, b: 0.1 })).toThrow(/E = -1 .*b = 0.1/);
  });

  it.each([
    ['E', NaN], ['E', Infinity], ['E', 0], ['E', -200000],
    ['sigmaF', NaN], ['sigmaF', 0], ['sigmaF', -1],
    ['b', 0], ['b', 0.05], ['b', -Infinity], ['b', NaN],
    ['c', 0], ['c', 0.5], ['c', NaN],
    ['epsilonF', 0], ['epsilonF', -0.2], ['epsilonF', Infinity],
    ['K', 0], ['K', -1000], ['K', NaN],
    ['n', 0], ['n', 1], ['n', -0.1], ['n', 1.5], ['n', NaN],
  ])('defineMaterial({ %s: %s }) is rejected naming that field', (field, value) => {
    const issues = issuesOf({ ...valid, [field]: value });
    expect(issues).toHaveLength(1);
    expect(issues[0].field).toBe(field);
    expect(Object.is(issues[0].value, value)).toBe(true);
  });

  it('defineMaterial() rejects missing fields, strings, bad optional fields and unknown fields', () => {
    expect(issuesOf({}).map((i) => i.field)).toEqual(['E', 'sigmaF', 'b', 'epsilonF', 'c', 'K', 'n']);
    expect(issuesOf({ ...valid, E: '200000' }).map((i) => i.field)).toEqual(['E']);
    expect(issuesOf({ ...valid, Su: -1, hardnessHB: NaN, name: 3 }).map((i) => i.field)).toEqual(['Su', 'hardnessHB', 'name']);
    expect(issuesOf({ ...valid, sigmaf: 900 })).toEqual([{ field: 'sigmaf', value: 900, rule: 'is not a material field' }]);
    expect(issuesOf(null)[0].field).toBe('(material)');
  });

  it('defineMaterial(incompatible) is legal and carries incompatible-cyclic-curve warnings', () => {
    const m = defineMaterial({ ...valid, n: 0.3, K: 2000 });
    expect(m.warnings.map((w) => [w.code, w.field])).toEqual([
      ['incompatible-cyclic-curve', 'n'],
      ['incompatible-cyclic-curve', 'K'],
    ]);
  });
});
