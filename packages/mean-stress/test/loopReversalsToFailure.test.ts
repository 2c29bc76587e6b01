import { describe, expect, it } from 'vitest';
import { handbookSteels } from '@loopwise/material';
import { createWalker, damageParameters, loopReversalsToFailure, MeanStressError, type DamageParameterName } from '@loopwise/mean-stress';

const aisi4340 = handbookSteels.find((m) => m.name === 'AISI 4340 (aircraft quality)')!;
const loop = { stressMax: 800, stressMin: -400, strainMax: 0.006, strainMin: -0.004 };

describe('loopReversalsToFailure(material, loop, { parameter? })', () => {
  it('defaults to smithWatsonTopper', () => {
    expect(loopReversalsToFailure(aisi4340, loop)).toEqual(damageParameters.smithWatsonTopper.reversalsToFailure(aisi4340, loop));
  });
  it('selects a parameter by name or by object, and passes options on', () => {
    expect(loopReversalsToFailure(aisi4340, loop, { parameter: 'morrow' })).toEqual(damageParameters.morrow.reversalsToFailure(aisi4340, loop));
    const w = createWalker({ gamma: 0.55 });
    expect(loopReversalsToFailure(aisi4340, loop, { parameter: w })).toEqual(w.reversalsToFailure(aisi4340, loop));
    expect(loopReversalsToFailure(aisi4340, loop, { cutoffReversals: 100 }).reversals).toBe(Infinity);
  });
  it('rejects an unknown name', () => {
    expect(() => loopReversalsToFailure(aisi4340, loop, { parameter: 'gerber' as DamageParameterName })).toThrow(MeanStressError);
  });
});
