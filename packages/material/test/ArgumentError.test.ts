import { describe, expect, it } from 'vitest';
import { LoopwiseError } from '@loopwise/base';
import {
  ArgumentError,
  cyclicStrain,
  estimateUniformMaterialLaw,
  handbookSteels,
  reversalsToFailureInto,
  solveTwoTermReversals,
  strainAmplitudeAtReversals,
  TwoTermReversalsTable,
} from '@loopwise/material';

const sae1045 = handbookSteels.find((m) => m.name === 'SAE 1045 (hot rolled and normalized)')!;

function thrown(f: () => unknown): ArgumentError {
  try {
    f();
  } catch (e) {
    return e as ArgumentError;
  }
  throw new Error('expected a throw');
}

describe('new ArgumentError(field, value, rule, index)', () => {
  it('is a LoopwiseError with code invalid-argument, the field, the value, the rule and the index', () => {
    const e = new ArgumentError('strainAmplitudes', -0, 'must be a finite number >= 0', 4);
    expect(e).toBeInstanceOf(LoopwiseError);
    expect(e).toBeInstanceOf(ArgumentError);
    expect([e.name, e.code, e.field, e.rule, e.index]).toEqual(['ArgumentError', 'invalid-argument', 'strainAmplitudes', 'must be a finite number >= 0', 4]);
    expect(Object.is(e.value, -0)).toBe(true);
    expect(e.message).toBe('invalid argument: strainAmplitudes[4] = -0 (must be a finite number >= 0)');
    expect(new ArgumentError('stress', NaN, 'must be a finite number').index).toBeUndefined();
  });

  it('the functions name the argument at fault in field', () => {
    expect(thrown(() => strainAmplitudeAtReversals(sae1045, 0.5))).toMatchObject({ field: 'reversals', value: 0.5 });
    expect(thrown(() => cyclicStrain(sae1045, Infinity))).toMatchObject({ field: 'stress', value: Infinity });
    expect(thrown(() => estimateUniformMaterialLaw({ SuMPa: 500, EMPa: 2e5, metal: 'copper' as 'steel' }))).toMatchObject({ field: 'metal', value: 'copper' });
    expect(thrown(() => reversalsToFailureInto(sae1045, [0.01, NaN], new Float64Array(2)))).toMatchObject({ field: 'strainAmplitudes', index: 1 });
    expect(thrown(() => reversalsToFailureInto(sae1045, [0.01, 0.02], new Float64Array(1)))).toMatchObject({ field: 'out.length', value: 1 });
  });

  it('a NaN among several inputs is named alone', () => {
    expect(thrown(() => solveTwoTermReversals(0, -0.1, NaN, -0.5, 0))).toMatchObject({ field: 'lnB' });
    expect(thrown(() => solveTwoTermReversals(0, -0.1, 0, -0.5, NaN))).toMatchObject({ field: 'lnTarget' });
    expect(thrown(() => new TwoTermReversalsTable(0, -0.1, 0, -0.5, { lnTargetMax: NaN }))).toMatchObject({ field: 'lnTargetMax' });
    expect(thrown(() => new TwoTermReversalsTable(0, -0.1, 0, -0.5, { minShift: 1, maxShift: 0 }))).toMatchObject({
      field: 'maxShift',
      value: 0,
      rule: 'must be >= minShift (1)',
    });
    expect(thrown(() => new TwoTermReversalsTable(0, -0.1, 0, -0.5, { minShift: -Infinity }))).toMatchObject({ field: 'minShift' });
  });
});
