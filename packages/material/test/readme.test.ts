import { describe, expect, it } from 'vitest';
import { cyclicStrain, cyclicStress, handbookSteels, reversalsToFailure } from '@loopwise/material';

// The README example's values at full precision (the README's js block itself is executed by the
// workspace's test/readme-examples.test.ts, which checks its rounded values).
describe('README example', () => {
  it('SAE 1045 at epsilon_a = 0.004 gives 43494.70... reversals and a consistent cyclic stress', () => {
    const sae1045 = handbookSteels.find((m) => m.name === 'SAE 1045 (hot rolled and normalized)')!;
    const { reversals } = reversalsToFailure(sae1045, 0.004);
    expect(reversals).toBeCloseTo(43494.70140228771, 6);
    const sigmaA = cyclicStress(sae1045, 0.004);
    expect(cyclicStrain(sae1045, sigmaA)).toBeCloseTo(0.004, 15);
  });
});
