import { describe, expect, it } from 'vitest';
import { handbookSteels } from '@loopwise/material';
import { damageParameters, loopReversalsToFailure } from '@loopwise/mean-stress';

// The README example, executed so the documentation cannot drift from the code (expected values
// computed from the formulas, see smithWatsonTopper.test.ts and walker.test.ts).
describe('README example', () => {
  it('AISI 4340, sigma_max 800 MPa, epsilon_a 0.005: SWT 8250.04..., Walker 9209.21... reversals', () => {
    const aisi4340 = handbookSteels.find((m) => m.name === 'AISI 4340 (aircraft quality)')!;
    const loop = { stressMax: 800, stressMin: -400, strainMax: 0.006, strainMin: -0.004 };
    const swt = loopReversalsToFailure(aisi4340, loop);
    expect(swt.reversals).toBeCloseTo(8250.04652803425, 6);
    expect(swt.value).toBeCloseTo(4, 12);
    expect(swt.flags).toEqual([]);
    expect(damageParameters.walker.reversalsToFailure(aisi4340, loop).reversals).toBeCloseTo(9209.21746607676, 5);
    expect(damageParameters.smithWatsonTopper.parameterValue(aisi4340, loop)).toBe(4);
  });
});
