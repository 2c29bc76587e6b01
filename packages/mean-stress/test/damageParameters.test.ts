import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ConvergenceError, handbookSteels, MaterialError, type Material } from '@loopwise/material';
import {
  createWalker,
  DAMAGE_FLAG_BITS,
  damageParameter,
  damageParameters,
  DEFAULT_DAMAGE_PARAMETER,
  MeanStressError,
  type DamageParameterName,
} from '@loopwise/mean-stress';
import { checkProperty } from '../../../test/property';
import { range, realisticMaterial } from './arbitraries';

const aisi4340 = handbookSteels.find((m) => m.name === 'AISI 4340 (aircraft quality)')!;
const names = Object.keys(damageParameters) as DamageParameterName[];
const good = { sigmaMax: 800, sigmaMin: -400, epsilonMax: 0.006, epsilonMin: -0.004 };

describe('damageParameters (registry) and damageParameter(name)', () => {
  it('holds the five parameters, each under its own name; the default is smithWatsonTopper', () => {
    expect(names).toEqual(['none', 'morrow', 'modifiedMorrow', 'smithWatsonTopper', 'walker']);
    for (const name of names) expect(damageParameters[name].name).toBe(name);
    expect(DEFAULT_DAMAGE_PARAMETER).toBe('smithWatsonTopper');
    expect(damageParameter('morrow')).toBe(damageParameters.morrow);
    expect(Object.isFrozen(damageParameters)).toBe(true);
  });

  it("damageParameter('goodman') throws unknown-damage-parameter (untyped callers)", () => {
    expect(() => damageParameter('goodman' as DamageParameterName)).toThrow(MeanStressError);
    expect(() => damageParameter('toString' as DamageParameterName)).toThrow(/unknown-damage-parameter/);
  });

  it.each(names)('%s.reversalsToFailureInto equals %s.reversalsToFailure loop by loop (values and flags)', (name) => {
    const p = damageParameters[name];
    checkProperty(
      `${name} kernel = scalar`,
      fc.property(
        realisticMaterial,
        fc.array(fc.tuple(range(-5, 0.5), range(-1500, 1500), range(0, 3000)), { minLength: 0, maxLength: 30 }),
        (m0, rows) => {
          const m = { ...m0, Su: 800 } as Material;
          const n = rows.length;
          const cols = { sigmaMax: new Float64Array(n), sigmaMin: new Float64Array(n), epsilonMax: new Float64Array(n), epsilonMin: new Float64Array(n) };
          rows.forEach(([lg, sMax, range2], i) => {
            const ea = lg < -4.9 ? 0 : 10 ** lg;
            cols.sigmaMax[i] = sMax;
            cols.sigmaMin[i] = sMax - range2;
            cols.epsilonMax[i] = ea;
            cols.epsilonMin[i] = -ea;
          });
          const out = new Float64Array(n);
          const flags = new Uint8Array(n);
          expect(p.reversalsToFailureInto(cols, m, out, flags)).toBe(out);
          for (let i = 0; i < n; i++) {
            const r = p.reversalsToFailure({ sigmaMax: cols.sigmaMax[i], sigmaMin: cols.sigmaMin[i], epsilonMax: cols.epsilonMax[i], epsilonMin: cols.epsilonMin[i] }, m);
            expect(out[i]).toBe(r.reversals);
            expect(flags[i]).toBe(r.flags.reduce((bits, f) => bits | DAMAGE_FLAG_BITS[f], 0));
            expect(Number.isNaN(out[i])).toBe(false);
          }
        },
      ),
      { numRuns: 60 },
    );
  });

  describe.each(names)('%s: bad input', (name) => {
    const p = damageParameters[name];
    it.each([
      ['sigmaMax', NaN], ['sigmaMax', Infinity], ['sigmaMin', NaN], ['sigmaMin', -Infinity],
      ['epsilonMax', NaN], ['epsilonMax', Infinity], ['epsilonMin', NaN], ['epsilonMin', -Infinity],
    ])('a loop with %s = %s throws invalid-loop naming the field', (field, value) => {
      expect(() => p.reversalsToFailure({ ...good, [field]: value }, aisi4340)).toThrow(MeanStressError);
      try {
        p.reversalsToFailure({ ...good, [field]: value }, aisi4340);
      } catch (e) {
        expect((e as MeanStressError).code).toBe('invalid-loop');
        expect((e as MeanStressError).field).toBe(field);
      }
    });
    it('a loop with sigmaMax < sigmaMin or epsilonMax < epsilonMin throws invalid-loop', () => {
      expect(() => p.reversalsToFailure({ ...good, sigmaMax: -500 }, aisi4340)).toThrow(/invalid-loop: sigmaMin = -400 \(must be <= sigmaMax \(-500\)\)/);
      expect(() => p.reversalsToFailure({ ...good, epsilonMin: 0.01 }, aisi4340)).toThrow(/epsilonMin/);
    });
    it('the kernel names the index of a bad loop and checks column lengths', () => {
      const cols = { sigmaMax: [800, 800, 100], sigmaMin: [-400, -400, 200], epsilonMax: [0.006, 0.006, 0.006], epsilonMin: [-0.004, -0.004, -0.004] };
      expect(() => p.reversalsToFailureInto(cols, aisi4340, new Float64Array(3))).toThrow(/sigmaMin\[2\]/);
      expect(() => p.reversalsToFailureInto({ ...cols, epsilonMin: [0] }, aisi4340, new Float64Array(3))).toThrow(/loops\.epsilonMin/);
      expect(() => p.reversalsToFailureInto(cols, aisi4340, new Float64Array(2))).toThrow(/out/);
      expect(() => p.reversalsToFailureInto(cols, aisi4340, new Float64Array(3), new Uint8Array(1))).toThrow(/flags/);
    });
    it('an invalid material throws MaterialError (zero or negative moduli, b >= 0, c >= 0, n outside (0, 1))', () => {
      for (const bad of [{ E: 0 }, { E: -2e5 }, { K: 0 }, { b: 0 }, { c: 0.1 }, { n: 1 }, { n: 0 }, { sigmaF: NaN }]) {
        expect(() => p.reversalsToFailure(good, { ...aisi4340, ...bad } as Material)).toThrow(MaterialError);
      }
    });
    it('amplitude 0 gives Infinity, a huge amplitude gives 1 or Infinity (compressive), never NaN', () => {
      expect(p.reversalsToFailure({ ...good, epsilonMax: 0.001, epsilonMin: 0.001 }, aisi4340).reversals).toBe(Infinity);
      const huge = p.reversalsToFailure({ ...good, epsilonMax: 1e300, epsilonMin: -1e300 }, aisi4340);
      expect(huge.reversals).toBe(1);
      expect(huge.flags).toEqual(['at-or-above-first-reversal']);
    });
    it('honours the iteration cap: maxIterations 1 throws ConvergenceError', () => {
      expect(() => p.reversalsToFailure(good, aisi4340, { maxIterations: 1 })).toThrow(ConvergenceError);
    });
  });

  it('createWalker parameters fit the same interface as the registry entries', () => {
    const w = createWalker({ gamma: 0.6 });
    expect(w.name).toBe('walker');
    expect(w.label).toBe('Walker (gamma = 0.6)');
    expect(w.reversalsToFailure(good, aisi4340).flags).toEqual([]);
  });
});
