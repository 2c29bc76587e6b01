import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { handbookSteels, reversalsToFailure, strainAmplitudeAtReversals } from '@loopwise/material';
import { none } from '@loopwise/mean-stress';
import { checkProperty } from '../../../test/property';
import { log10Reversals, loopOf, range, realisticMaterial, rel } from './arbitraries';

const sae1045 = handbookSteels.find((m) => m.name === 'SAE 1045 (hot rolled and normalized)')!;

describe('none.reversalsToFailure(material, loop)', () => {
  it('round trips life -> loop -> reversals to 1e-9 and ignores the mean stress', () => {
    checkProperty(
      'none round trip',
      fc.property(realisticMaterial, log10Reversals, range(-500, 500), (m, lg, sm) => {
        const x = 10 ** lg;
        const ea = strainAmplitudeAtReversals(m, x);
        const r = none.reversalsToFailure(m, loopOf(ea, sm + 200, 400));
        expect(rel(r.reversals, x)).toBeLessThan(1e-9);
        expect(r.value).toBe(ea);
      }),
      { numRuns: 300 },
    );
  });
  it('equals the material package reversalsToFailure at the loop amplitude', () => {
    const r = none.reversalsToFailure(sae1045, { stressMax: 500, stressMin: -300, strainMax: 0.004, strainMin: -0.004 });
    expect(r).toEqual({ reversals: reversalsToFailure(sae1045, 0.004).reversals, value: 0.004, flags: [] });
  });
  it('zero amplitude gives Infinity (below-cutoff); a huge amplitude gives 1 (at-or-above-first-reversal)', () => {
    expect(none.reversalsToFailure(sae1045, loopOf(0, 100, 0))).toEqual({ reversals: Infinity, value: 0, flags: ['below-cutoff'] });
    expect(none.reversalsToFailure(sae1045, loopOf(5, 100, 10)).flags).toEqual(['at-or-above-first-reversal']);
    expect(none.reversalsToFailure(sae1045, loopOf(1e300, 100, 10)).reversals).toBe(1);
  });
});
