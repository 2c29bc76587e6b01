import { describe, expect, it } from 'vitest';
import { handbookSteels } from '@loopwise/material';
import { createWalker, damageParameters, loopReversalsToFailure, MeanStressError, type DamageParameterName } from '@loopwise/mean-stress';

const aisi4340 = handbookSteels.find((m) => m.name === 'AISI 4340 (aircraft quality)')!;
const loop = { stressMax: 800, stressMin: -400, strainMax: 0.006, strainMin: -0.004 };

describe('loopReversalsToFailure(loop, material, { parameter? })', () => {
  it('defaults to smithWatsonTopper', () => {
    expect(loopReversalsToFailure(loop, aisi4340)).toEqual(damageParameters.smithWatsonTopper.reversalsToFailure(loop, aisi4340));
  });
  it('selects a parameter by name or by object, and passes options on', () => {
    expect(loopReversalsToFailure(loop, aisi4340, { parameter: 'morrow' })).toEqual(damageParameters.morrow.reversalsToFailure(loop, aisi4340));
    const w = createWalker({ gamma: 0.55 });
    expect(loopReversalsToFailure(loop, aisi4340, { parameter: w })).toEqual(w.reversalsToFailure(loop, aisi4340));
    expect(loopReversalsToFailure(loop, aisi4340, { cutoffReversals: 100 }).reversals).toBe(Infinity);
  });
  it('rejects an unknown name', () => {
    expect(() => loopReversalsToFailure(loop, aisi4340, { parameter: 'gerber' as DamageParameterName })).toThrow(MeanStressError);
  });
});
