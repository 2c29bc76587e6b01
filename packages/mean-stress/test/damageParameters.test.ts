import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { LoopwiseError } from '@loopwise/base';
import { ConvergenceError, handbookSteels, MaterialError, REVERSALS_TABLE_MIN_COUNT, type Material } from '@loopwise/material';
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
const good = { stressMax: 800, stressMin: -400, strainMax: 0.006, strainMin: -0.004 };

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
          const cols = { stressMax: new Float64Array(n), stressMin: new Float64Array(n), strainMax: new Float64Array(n), strainMin: new Float64Array(n) };
          rows.forEach(([lg, sMax, range2], i) => {
            const ea = lg < -4.9 ? 0 : 10 ** lg;
            cols.stressMax[i] = sMax;
            cols.stressMin[i] = sMax - range2;
            cols.strainMax[i] = ea;
            cols.strainMin[i] = -ea;
          });
          const out = new Float64Array(n);
          const flags = new Uint8Array(n);
          expect(p.reversalsToFailureInto(m, cols, out, flags)).toBe(out);
          for (let i = 0; i < n; i++) {
            const r = p.reversalsToFailure(m, { stressMax: cols.stressMax[i], stressMin: cols.stressMin[i], strainMax: cols.strainMax[i], strainMin: cols.strainMin[i] });
            expect(out[i]).toBe(r.reversals);
            expect(flags[i]).toBe(r.flags.reduce((bits, f) => bits | DAMAGE_FLAG_BITS[f], 0));
            expect(Number.isNaN(out[i])).toBe(false);
          }
        },
      ),
      { numRuns: 60 },
    );
  });

  it.each(names)(`%s.reversalsToFailureInto from ${REVERSALS_TABLE_MIN_COUNT} loops on (table start) equals the scalar to 1e-12 relative`, (name) => {
    const p = damageParameters[name];
    checkProperty(
      `${name} kernel with table = scalar`,
      fc.property(
        realisticMaterial,
        range(0.05, 1),
        fc.array(fc.tuple(range(-7, 0.5), range(-1500, 1500), range(0, 3000)), {
          minLength: REVERSALS_TABLE_MIN_COUNT, maxLength: REVERSALS_TABLE_MIN_COUNT + 100,
        }),
        fc.nat(),
        (m0, gamma, rows, tie) => {
          // Arrange: amplitudes from zero and far below the cut-off to above the first reversal,
          // tensile and compressive peaks and means (Walker with a generated γ), and ties
          const m = { ...m0, Su: 800 } as Material;
          const param = name === 'walker' ? createWalker({ gamma }) : p;
          const n = rows.length;
          const cols = { stressMax: new Float64Array(n), stressMin: new Float64Array(n), strainMax: new Float64Array(n), strainMin: new Float64Array(n) };
          rows.forEach(([lg, sMax, range2], i) => {
            const [lgT, sMaxT, range2T] = i % 5 === tie % 5 ? rows[0] : [lg, sMax, range2];
            const ea = lgT < -6.9 ? 0 : 10 ** lgT;
            cols.stressMax[i] = sMaxT;
            cols.stressMin[i] = sMaxT - range2T;
            cols.strainMax[i] = ea;
            cols.strainMin[i] = -ea;
          });
          const out = new Float64Array(n);
          const flags = new Uint8Array(n);
          // Act
          expect(param.reversalsToFailureInto(m, cols, out, flags)).toBe(out);
          // Assert: 1 and Infinity exactly, roots to the solver's tolerance, flags exactly, no NaN
          for (let i = 0; i < n; i++) {
            const r = param.reversalsToFailure(m, { stressMax: cols.stressMax[i], stressMin: cols.stressMin[i], strainMax: cols.strainMax[i], strainMin: cols.strainMin[i] });
            expect(Number.isNaN(out[i])).toBe(false);
            if (r.reversals === 1 || r.reversals === Infinity) expect(out[i]).toBe(r.reversals);
            else expect(Math.abs(out[i] / r.reversals - 1)).toBeLessThan(1e-12);
            expect(flags[i]).toBe(r.flags.reduce((bits, f) => bits | DAMAGE_FLAG_BITS[f], 0));
          }
        },
      ),
      { numRuns: 25 },
    );
  });

  it.each(names)('%s.reversalsToFailureInto over several blocks of loops (1300) equals the scalar, and a bad last loop throws before writing', (name) => {
    // Arrange: amplitudes from 0 to above the first reversal, means across ±1.2 σf', tensile and
    // compressive peaks (invented loops for a test); 1300 rows span three blocks of the kernel
    const p = damageParameters[name];
    const m = aisi4340;
    const n = 1300;
    const cols = { stressMax: new Float64Array(n), stressMin: new Float64Array(n), strainMax: new Float64Array(n), strainMin: new Float64Array(n) };
    for (let i = 0; i < n; i++) {
      const ea = i % 97 === 0 ? 0 : 10 ** (-5 + (5.5 * ((i * 37) % n)) / n);
      const sm = 1.2 * m.sigmaF * Math.sin(i);
      const sa = 50 + ((i * 13) % 900);
      cols.stressMax[i] = sm + sa;
      cols.stressMin[i] = sm - sa;
      cols.strainMax[i] = ea;
      cols.strainMin[i] = -ea;
    }
    const out = new Float64Array(n);
    const flags = new Uint8Array(n);
    // Act
    p.reversalsToFailureInto(m, cols, out, flags);
    // Assert
    for (let i = 0; i < n; i++) {
      const r = p.reversalsToFailure(m, { stressMax: cols.stressMax[i], stressMin: cols.stressMin[i], strainMax: cols.strainMax[i], strainMin: cols.strainMin[i] });
      if (r.reversals === 1 || r.reversals === Infinity) expect(out[i]).toBe(r.reversals);
      else expect(Math.abs(out[i] / r.reversals - 1)).toBeLessThan(1e-12);
      expect(flags[i]).toBe(r.flags.reduce((bits, f) => bits | DAMAGE_FLAG_BITS[f], 0));
    }
    cols.strainMin[n - 1] = Infinity;
    out.fill(-1);
    expect(() => p.reversalsToFailureInto(m, cols, out)).toThrow(new RegExp(`strainMin\\[${n - 1}\\]`));
    expect(out.every((v) => v === -1)).toBe(true);
  });

  // Morrow lowers A alone with the mean stress, so no one-dimensional table serves it: its kernel
  // solves each loop from the bracket at every size. Every kernel checks all loops first.
  it.each(names)('%s.reversalsToFailureInto from the table size on names a bad loop (before writing anything) and honours the cap', (name) => {
    const p = damageParameters[name];
    const n = REVERSALS_TABLE_MIN_COUNT;
    const cols = {
      stressMax: new Float64Array(n).fill(good.stressMax), stressMin: new Float64Array(n).fill(good.stressMin),
      strainMax: new Float64Array(n).fill(good.strainMax), strainMin: new Float64Array(n).fill(good.strainMin),
    };
    const out = new Float64Array(n).fill(-1);
    cols.stressMin[n - 1] = NaN;
    expect(() => p.reversalsToFailureInto(aisi4340, cols, out)).toThrow(new RegExp(`stressMin\\[${n - 1}\\]`));
    expect(out.every((v) => v === -1)).toBe(true);
    cols.stressMin[n - 1] = good.stressMin;
    expect(() => p.reversalsToFailureInto(aisi4340, cols, out, undefined, { maxIterations: 0 })).toThrow(ConvergenceError);
  });

  it.each(names)('%s.parameterValueInto(material, loops, out) equals parameterValue and reversalsToFailure(...).value loop by loop', (name) => {
    const p = damageParameters[name];
    checkProperty(
      `${name} parameter value kernel = scalar`,
      fc.property(
        realisticMaterial,
        fc.array(fc.tuple(range(-5, 0.5), range(-1500, 1500), range(0, 3000)), { minLength: 0, maxLength: 30 }),
        (m0, rows) => {
          // Arrange: zero, small and huge amplitudes; tensile, zero and compressive peaks
          const m = { ...m0, Su: 800 } as Material;
          const n = rows.length;
          const cols = { stressMax: new Float64Array(n), stressMin: new Float64Array(n), strainMax: new Float64Array(n), strainMin: new Float64Array(n) };
          rows.forEach(([lg, sMax, range2], i) => {
            const ea = lg < -4.9 ? 0 : 10 ** lg;
            cols.stressMax[i] = i % 7 === 3 ? 0 : sMax;
            cols.stressMin[i] = cols.stressMax[i] - range2;
            cols.strainMax[i] = ea;
            cols.strainMin[i] = -ea;
          });
          const out = new Float64Array(n).fill(NaN);
          // Act
          expect(p.parameterValueInto(m, cols, out)).toBe(out);
          // Assert: the same numbers exactly, finite, never negative
          for (let i = 0; i < n; i++) {
            const loop = { stressMax: cols.stressMax[i], stressMin: cols.stressMin[i], strainMax: cols.strainMax[i], strainMin: cols.strainMin[i] };
            expect(out[i]).toBe(p.parameterValue(m, loop));
            expect(out[i]).toBe(p.reversalsToFailure(m, loop).value);
            expect(out[i] >= 0 && out[i] < Infinity).toBe(true);
          }
        },
      ),
      { numRuns: 60 },
    );
  });

  it('parameterValue: εa for none, Morrow and modified Morrow; σmax·εa for SWT; the Walker stress; 0 for SWT and Walker (γ < 1) when σmax <= 0', () => {
    // Values from the equations of the parameters' own documentation (arithmetic, no source needed).
    const loop = { stressMax: 800, stressMin: -400, strainMax: 0.006, strainMin: -0.004 };
    expect(damageParameters.none.parameterValue(aisi4340, loop)).toBe(0.005);
    expect(damageParameters.morrow.parameterValue(aisi4340, loop)).toBe(0.005);
    expect(damageParameters.modifiedMorrow.parameterValue(aisi4340, loop)).toBe(0.005);
    expect(damageParameters.smithWatsonTopper.parameterValue(aisi4340, loop)).toBe(4);
    const w = createWalker({ gamma: 0.6 });
    expect(w.parameterValue(aisi4340, loop)).toBeCloseTo(800 ** 0.4 * (aisi4340.E * 0.005) ** 0.6, 9);
    const compressive = { ...loop, stressMax: -100, stressMin: -500 };
    expect(damageParameters.smithWatsonTopper.parameterValue(aisi4340, compressive)).toBe(0);
    expect(w.parameterValue(aisi4340, compressive)).toBe(0);
    expect(createWalker({ gamma: 1 }).parameterValue(aisi4340, compressive)).toBe(aisi4340.E * 0.005);
  });

  describe.each(names)('%s: bad input', (name) => {
    const p = damageParameters[name];
    it.each([
      ['stressMax', NaN], ['stressMax', Infinity], ['stressMin', NaN], ['stressMin', -Infinity],
      ['strainMax', NaN], ['strainMax', Infinity], ['strainMin', NaN], ['strainMin', -Infinity],
    ])('a loop with %s = %s throws invalid-loop naming the field', (field, value) => {
      expect(() => p.reversalsToFailure(aisi4340, { ...good, [field]: value })).toThrow(MeanStressError);
      try {
        p.reversalsToFailure(aisi4340, { ...good, [field]: value });
      } catch (e) {
        expect(e).toBeInstanceOf(LoopwiseError);
        expect((e as MeanStressError).name).toBe('MeanStressError');
        expect((e as MeanStressError).code).toBe('invalid-loop');
        expect((e as MeanStressError).field).toBe(field);
        expect((e as MeanStressError).value).toBe(value);
        expect((e as MeanStressError).index).toBeUndefined();
      }
    });
    it('a loop with stressMax < stressMin or strainMax < strainMin throws invalid-loop', () => {
      expect(() => p.reversalsToFailure(aisi4340, { ...good, stressMax: -500 })).toThrow(/invalid-loop: stressMin = -400 \(must be <= stressMax \(-500\)\)/);
      expect(() => p.reversalsToFailure(aisi4340, { ...good, strainMin: 0.01 })).toThrow(/strainMin/);
    });
    it('the kernel names the index of a bad loop (writing nothing) and checks column lengths', () => {
      const cols = { stressMax: [800, 800, 100], stressMin: [-400, -400, 200], strainMax: [0.006, 0.006, 0.006], strainMin: [-0.004, -0.004, -0.004] };
      const untouched = new Float64Array(3).fill(-1);
      expect(() => p.reversalsToFailureInto(aisi4340, cols, untouched)).toThrow(/stressMin\[2\]/);
      expect(Array.from(untouched)).toEqual([-1, -1, -1]);
      expect(() => p.reversalsToFailureInto(aisi4340, { ...cols, strainMin: [0] }, new Float64Array(3))).toThrow(/loops\.strainMin/);
      expect(() => p.reversalsToFailureInto(aisi4340, cols, new Float64Array(2))).toThrow(/out/);
      expect(() => p.reversalsToFailureInto(aisi4340, cols, new Float64Array(3), new Uint8Array(1))).toThrow(/flags/);
    });
    it('parameterValue and parameterValueInto check the loop, the columns and the material like the kernels', () => {
      expect(() => p.parameterValue(aisi4340, { ...good, stressMax: NaN })).toThrow(/invalid-loop: stressMax = NaN/);
      expect(() => p.parameterValue({ ...aisi4340, E: 0 } as Material, good)).toThrow(MaterialError);
      const cols = { stressMax: [800, 800, 100], stressMin: [-400, -400, 200], strainMax: [0.006, 0.006, 0.006], strainMin: [-0.004, -0.004, -0.004] };
      const out = new Float64Array(3).fill(-1);
      expect(() => p.parameterValueInto(aisi4340, cols, out)).toThrow(/stressMin\[2\]/);
      expect(Array.from(out)).toEqual([-1, -1, -1]); // nothing written before the check
      expect(() => p.parameterValueInto(aisi4340, cols, new Float64Array(2))).toThrow(/out/);
      expect(() => p.parameterValueInto(aisi4340, { ...cols, strainMax: [0] }, new Float64Array(3))).toThrow(/loops\.strainMax/);
      const empty = { stressMax: [], stressMin: [], strainMax: [], strainMin: [] };
      expect(p.parameterValueInto(aisi4340, empty, new Float64Array(0)).length).toBe(0);
      expect(p.reversalsToFailureInto(aisi4340, empty, new Float64Array(0)).length).toBe(0);
    });
    it('a loop that is not an object throws invalid-loop', () => {
      expect(() => p.reversalsToFailure(aisi4340, null as unknown as typeof good)).toThrow(/invalid-loop: loop = null/);
      expect(() => p.parameterValue(aisi4340, undefined as unknown as typeof good)).toThrow(MeanStressError);
    });
    it('an invalid material throws MaterialError (zero or negative moduli, b >= 0, c >= 0, n outside (0, 1))', () => {
      for (const bad of [{ E: 0 }, { E: -2e5 }, { K: 0 }, { b: 0 }, { c: 0.1 }, { n: 1 }, { n: 0 }, { sigmaF: NaN }]) {
        expect(() => p.reversalsToFailure({ ...aisi4340, ...bad } as Material, good)).toThrow(MaterialError);
      }
    });
    it('amplitude 0 gives Infinity, a huge amplitude gives 1 or Infinity (compressive), never NaN', () => {
      expect(p.reversalsToFailure(aisi4340, { ...good, strainMax: 0.001, strainMin: 0.001 }).reversals).toBe(Infinity);
      const huge = p.reversalsToFailure(aisi4340, { ...good, strainMax: 1e300, strainMin: -1e300 });
      expect(huge.reversals).toBe(1);
      expect(huge.flags).toEqual(['at-or-above-first-reversal']);
    });
    it('honours the iteration cap: maxIterations 1 throws ConvergenceError', () => {
      expect(() => p.reversalsToFailure(aisi4340, good, { maxIterations: 1 })).toThrow(ConvergenceError);
    });
  });

  it('createWalker parameters fit the same interface as the registry entries', () => {
    const w = createWalker({ gamma: 0.6 });
    expect(w.name).toBe('walker');
    expect(w.label).toBe('Walker (gamma = 0.6)');
    expect(w.reversalsToFailure(aisi4340, good).flags).toEqual([]);
  });
});
