import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { ConvergenceError, cyclicStress } from '@loopwise/material';
import { glinka, neuber, trackNotch } from '@loopwise/notch';
import { BranchSolver } from '../src/BranchSolver';
import { checkProperty } from '../../../test/property';
import { curveStrain, realisticMaterial, sae1045 } from './support';

// Pseudo-elastic amplitudes from 0.01 MPa to 20 × K' (far into plasticity), log-uniform;
// common practice, no source. All lie inside the solver's start table or below it.
const amplitude = (m: { K: number }) => fc.double({ min: Math.log(0.01), max: Math.log(20 * m.K), noNaN: true }).map(Math.exp);
const solveWith = (s: BranchSolver, a: number) => {
  s.amplitude = a;
  s.solve();
};
const caseArb = realisticMaterial.chain((m) => fc.tuple(fc.constant(m), fc.constantFrom<'neuber' | 'glinka'>('neuber', 'glinka'), amplitude(m)));

describe('BranchSolver(material, kind, tolerance, maxIterations, tablesAfter)', () => {
  it('a new solver solves by plain Newton to rounding (the pure rules\' answer) until its own tablesAfter solves, then from its tables within the tolerance', () => {
    checkProperty(
      'tables after N solves',
      fc.property(caseArb, fc.array(fc.double({ min: 0.01, max: 3000, noNaN: true }), { minLength: 1, maxLength: 8 }), ([m, kind, a], more) => {
        const rule = kind === 'neuber' ? neuber : glinka;
        // another solver of the same material takes (and builds) the tables first: this one still waits for its own solves
        solveWith(new BranchSolver(m, kind, 1e-10, 60, 0), a);
        const s = new BranchSolver(m, kind, 1e-10, 60, 3);
        for (const [k, x] of [a, ...more, a].entries()) {
          const want = rule(m, x);
          solveWith(s, x);
          const bound = k < 2 ? 2e-14 : 1e-10 + 1e-14; // solves 1 and 2 plain, from the third on the tables
          expect(Math.abs(s.stress / want.stress - 1)).toBeLessThanOrEqual(bound);
          expect(Math.abs(s.strain / want.strain - 1)).toBeLessThanOrEqual(bound);
        }
        // the default waits 2^15 solves: a new solver's first answer is the plain one, every time
        const fresh = new BranchSolver(m, kind, 1e-10, 60);
        solveWith(fresh, a);
        const again = new BranchSolver(m, kind, 1e-10, 60);
        solveWith(again, a);
        expect(again.stress).toBe(fresh.stress);
        expect(Math.abs(fresh.stress / rule(m, a).stress - 1)).toBeLessThanOrEqual(2e-14);
      }),
      { numRuns: 40 },
    );
  });

  it('solve() agrees with neuber() and glinka() within its tolerance: 1e-10 (answer table), 1e-12 and 1e-14 (Newton)', () => {
    checkProperty(
      'solver == pure rule',
      fc.property(caseArb, fc.constantFrom(1e-10, 1e-12, 1e-14), ([m, kind, a], tol) => {
        // Arrange
        const s = new BranchSolver(m, kind, tol, 60, 0);
        const want = kind === 'neuber' ? neuber(m, a) : glinka(m, a);
        // Act
        s.amplitude = a;
        s.solve();
        // Assert (neuber() and glinka() solve to 1e-14; the margin covers their own error)
        expect(Math.abs(s.stress / want.stress - 1)).toBeLessThanOrEqual(tol + 1e-14);
        expect(Math.abs(s.strain / want.strain - 1)).toBeLessThanOrEqual(tol + 1e-14);
      }),
    );
  });

  it('the answer table holds its tolerance across its whole range, its ends and beyond them', () => {
    // Amplitudes from 1e-9 × K' (plastic term far below 1e-17 of the elastic one: σ = a there)
    // to 1e3 × K' (above the table: the full solve), log-uniform; common practice, no source.
    const wide = realisticMaterial.chain((m) =>
      fc.tuple(
        fc.constant(m),
        fc.constantFrom<'neuber' | 'glinka'>('neuber', 'glinka'),
        fc.double({ min: Math.log(1e-9 * m.K), max: Math.log(1e3 * m.K), noNaN: true }).map(Math.exp),
      ),
    );
    checkProperty(
      'answer table range',
      fc.property(wide, ([m, kind, a]) => {
        const s = new BranchSolver(m, kind, 1e-10, 60, 0);
        const want = kind === 'neuber' ? neuber(m, a) : glinka(m, a);
        solveWith(s, a);
        expect(Math.abs(s.stress / want.stress - 1)).toBeLessThanOrEqual(1e-10);
        expect(Math.abs(s.strain / want.strain - 1)).toBeLessThanOrEqual(1e-10);
        // the identities the rules define, from the returned pair
        const w = kind === 'glinka' ? 2 / (1 + m.n) : 1;
        const plastic = s.strain - s.stress / m.E;
        expect(Math.abs((s.stress * s.stress + w * m.E * s.stress * plastic) / (a * a) - 1)).toBeLessThanOrEqual(3e-10);
      }),
    );
  });

  it('needs at most one Newton step at the tolerance 1e-10 and at most two at 1e-15: the default cap of 60 holds with room', () => {
    checkProperty(
      'solver steps',
      fc.property(caseArb, ([m, kind, a]) => {
        // A cap of 1 (or 2) throws ConvergenceError if the solve needs more steps. (At 1e-10 the
        // answer table usually serves and takes no step; where it does not, one step does.)
        expect(() => solveWith(new BranchSolver(m, kind, 1e-10, 1, 0), a)).not.toThrow();
        expect(() => solveWith(new BranchSolver(m, kind, 1e-15, 2, 0), a)).not.toThrow();
      }),
    );
  });

  it('a cap below what a solve needs throws ConvergenceError, never a wrong value', () => {
    // Nearly elastic, 3 MPa on SAE 1045 (below the table, start σ = a): at the tolerance 1e-15
    // the strain's linearisation needs a second step, so a cap of 1 must throw.
    expect(() => solveWith(new BranchSolver(sae1045, 'neuber', 1e-15, 1, 0), 3)).toThrow(ConvergenceError);
    expect(() => solveWith(new BranchSolver(sae1045, 'neuber', 1e-15, 2, 0), 3)).not.toThrow();
    // A short call solves by plain Newton from the bracket: 3000 MPa (far into plasticity)
    // needs more than one step there.
    const o = { material: sae1045, Kt: 1, tolerance: 1e-15 };
    expect(() => trackNotch([0, 3000, 0], { ...o, maxIterations: 1 })).toThrow(ConvergenceError);
    expect(trackNotch([0, 3000, 0], { ...o, maxIterations: 60 }).reversals.length).toBe(1);
  });

  it('local strain and the linear rule agree with cyclicStress before and after the curve table takes over (tolerance 1e-10)', () => {
    // Strains from 1e-9 × K'/E (elastic to rounding: below the table) to 1e3 (above it: the
    // exact inverse), log-uniform; common practice, no source. The table is used once a solver
    // has done 2^15 solves of its own (a table built earlier for the material is reused, not used sooner).
    const wide = realisticMaterial.chain((m) =>
      fc.tuple(fc.constant(m), fc.array(fc.double({ min: Math.log((1e-9 * m.K) / m.E), max: Math.log(1e3), noNaN: true }).map(Math.exp), { minLength: 1, maxLength: 20 })),
    );
    checkProperty(
      'curve table',
      fc.property(wide, ([m, strains]) => {
        const check = (s: BranchSolver) => {
          for (const e of strains) {
            const want = cyclicStress(m, e);
            solveWith(s, s.kind === 'linear' ? e * m.E : e);
            expect(Math.abs(s.stress / want - 1)).toBeLessThanOrEqual(1e-10);
            expect(Math.abs(s.strain / e - 1)).toBeLessThanOrEqual(s.kind === 'linear' ? 1e-15 : 0);
            // the returned pair lies on the curve: its strain from the stress, to the same accuracy
            expect(Math.abs(curveStrain(m, s.stress) / e - 1)).toBeLessThanOrEqual(1e-10 / m.n + 1e-14);
          }
        };
        const first = new BranchSolver(m, 'local-strain', 1e-10, 60);
        check(first); // before: cyclicStress itself
        for (let k = 0; k < 1 << 15; k++) solveWith(first, 1e-4 * (1 + (k & 7)));
        check(first); // after 2^15 solves: the table where it serves
        const linear = new BranchSolver(m, 'linear', 1e-10, 60);
        check(linear); // a later solver of the same material, other kind: its own first solves exact
        for (let k = 0; k < 1 << 15; k++) solveWith(linear, 2e1 * (1 + (k & 7)));
        check(linear); // then the shared table
      }),
      { numRuns: 40 },
    );
  });
});
