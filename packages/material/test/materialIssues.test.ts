import { describe, expect, it } from 'vitest';
import { materialIssues } from '@loopwise/material';

describe('materialIssues(input)', () => {
  it('materialIssues(valid) returns []', () => {
    expect(materialIssues({ E: 200000, sigmaF: 1000, b: -0.1, epsilonF: 1, c: -0.5, K: 1000, n: 0.2 })).toEqual([]);
  });
  it('materialIssues(bad) returns every issue without throwing', () => {
    expect(materialIssues({ E: 0, sigmaF: 900, b: -0.09, epsilonF: 0.5, c: -0.6, K: 1000, n: 1.2 })).toEqual([
      { field: 'E', value: 0, rule: 'must be a finite number > 0' },
      { field: 'n', value: 1.2, rule: 'must be a finite number with 0.01 <= n <= 0.5 (metals have about 0.05 to 0.35; below 0.01 the cyclic curve is nearly a step, elastic-perfectly plastic, that double precision cannot solve; above 0.5 the plastic strain would exceed the elastic one far below any strength of the material)' },
    ]);
    expect(materialIssues(42)).toEqual([{ field: '(material)', value: 42, rule: 'must be an object' }]);
  });
});
