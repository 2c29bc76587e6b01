import { describe, expect, it } from 'vitest';
import { LoopwiseError } from '@loopwise/base';
import { ConvergenceError, handbookSteels, reversalsToFailure } from '@loopwise/material';

const sae1045 = handbookSteels.find((m) => m.name === 'SAE 1045 (hot rolled and normalized)')!;

describe('new ConvergenceError(solver, maxIterations, lastIterate)', () => {
  it('is a LoopwiseError with code not-converged naming the iteration cap as its field', () => {
    const e = new ConvergenceError('solveTwoTermReversals', 3, 1.5);
    expect(e).toBeInstanceOf(LoopwiseError);
    expect([e.name, e.code, e.field, e.value, e.index]).toEqual(['ConvergenceError', 'not-converged', 'maxIterations', 3, undefined]);
    expect([e.solver, e.maxIterations, e.lastIterate]).toEqual(['solveTwoTermReversals', 3, 1.5]);
    expect(e.message).toBe('solveTwoTermReversals did not converge within 3 iterations (last iterate 1.5)');
  });

  it('reversalsToFailure(material, amplitude, {maxIterations: 1}) throws it with the cap', () => {
    expect(() => reversalsToFailure(sae1045, 0.01, { maxIterations: 1 })).toThrow(
      expect.objectContaining({ code: 'not-converged', field: 'maxIterations', value: 1, maxIterations: 1 }),
    );
  });
});
