import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { damageFromMatrix, lifeFromDamage } from '@loopwise/miner';
import { fatigueNotchFactor, petersonConstantMm, petersonSensitivity } from '@loopwise/notch';
import { rainflow, RangeMeanMatrix } from '@loopwise/rainflow';
import {
  cycleLivesInto,
  cyclesToFailure,
  en1993DetailCurve,
  estimateSteelSnCurve,
  iiwFatCurve,
  IIW_DAMAGE_SUM,
  stressLifeDamage,
  stressLifeKernel,
  type AmplitudeCorrection,
} from '@loopwise/stress-life';
import { checkProperty } from '../../../test/property';
import shigley from '../../../fixtures/handbook/shigley-9th-stress-life.json';

const byName = (start: string) => shigley.cases.find((c) => c.name.startsWith(start))!;
const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('stressLifeDamage(curve, {range, mean, count}, options) — textbook variable-amplitude examples', () => {
  test('Shigley 9th ed. Example 6-15: Gerber and Miner over a block of three cycles give 619 000 repetitions (1.5 %)', () => {
    // Arrange: Sut 151, Se 67.5 kpsi, f 0.795 (Fig. 6-18 reading, value from memory); the
    // cycles of the block as the book's table gives them (p. 322)
    const ex = byName('Example 6-15');
    const { Sut, Se, f, cycles } = ex.input as { Sut: number; Se: number; f: number; cycles: { max: number; min: number }[] };
    const curve = estimateSteelSnCurve({ ultimateStrengthMPa: Sut, enduranceLimitMPa: Se, fraction: f });
    const block = {
      range: cycles.map((c) => c.max - c.min),
      mean: cycles.map((c) => (c.max + c.min) / 2),
      count: cycles.map(() => 1),
    };
    // Act
    const r = stressLifeDamage(curve, block, { meanStress: { method: 'gerber', ultimateStrength: Sut } });
    // Assert: cycles 2 and 3 lie below Se (original Miner: no damage); the book's 619e3 comes
    // from b rounded to −0.0833, the unrounded arithmetic gives 6.13e5
    expect(r.cyclesToFailure[1]).toBe(Infinity);
    expect(r.cyclesToFailure[2]).toBe(Infinity);
    expect(rel(1 / r.damage, ex.expected.repetitions as number)).toBeLessThan(0.015);
    expect(lifeFromDamage(r.damage).repeats).toBeCloseTo(1 / r.damage, 6);
  });

  test('Shigley 9th ed. solutions manual, problem 6-31: 20/50/30 % at 70/55/40 kpsi gives 83 570 cycles', () => {
    const p = byName('Problem 6-31');
    const { Sut, Se, f, levels } = p.input as { Sut: number; Se: number; f: number; levels: { stress: number; fraction: number }[] };
    const curve = estimateSteelSnCurve({ ultimateStrengthMPa: Sut, enduranceLimitMPa: Se, fraction: f });
    const r = stressLifeDamage(curve, { range: levels.map((l) => 2 * l.stress), mean: levels.map(() => 0), count: levels.map((l) => l.fraction) });
    expect(rel(r.cyclesToFailure[0], p.expected.N1 as number)).toBeLessThan(1e-3);
    expect(rel(r.cyclesToFailure[1], p.expected.N2 as number)).toBeLessThan(1e-3);
    expect(r.cyclesToFailure[2]).toBe(Infinity);
    expect(rel(1 / r.damage, p.expected.cycles as number)).toBeLessThan(1e-3);
  });

  test('Shigley 9th ed. solutions manual, problem 6-30(a): after 4000 at 48 and 60 000 at 38 kpsi, 209 160 cycles remain at 32 kpsi', () => {
    const p = byName('Problem 6-30');
    const { Sut, Se, f } = p.input as { Sut: number; Se: number; f: number };
    const curve = estimateSteelSnCurve({ ultimateStrengthMPa: Sut, enduranceLimitMPa: Se, fraction: f });
    const done = stressLifeDamage(curve, { range: [96, 76], mean: [0, 0], count: [4000, 60000] }).damage;
    const n3 = (1 - done) * cyclesToFailure(curve, 32);
    expect(rel(cyclesToFailure(curve, 32), p.expected.N3 as number)).toBeLessThan(2e-3);
    expect(rel(n3, p.expected.n3 as number)).toBeLessThan(2e-3);
  });

  test('Shigley 9th ed. problem 6-20(a): Goodman on a finite-life curve gives 710 000 cycles', () => {
    const p = byName('Problem 6-20');
    const { Sut, Se, f, sigmaA, sigmaM } = p.input as Record<string, number>;
    const curve = estimateSteelSnCurve({ ultimateStrengthMPa: Sut, enduranceLimitMPa: Se, fraction: f });
    const [n] = cycleLivesInto(curve, [2 * sigmaA], [sigmaM], new Float64Array(1), { meanStress: { method: 'goodman', ultimateStrength: Sut } });
    expect(rel(n, p.expected.cycles as number)).toBeLessThan(1e-3);
  });
});

describe('stressLifeDamage properties', () => {
  const curve = iiwFatCurve(71);
  const corrections: AmplitudeCorrection[] = [
    { method: 'none' },
    { method: 'goodman', ultimateStrength: 600 },
    { method: 'smithWatsonTopper' },
    { method: 'iiw', category: 'I' },
  ];
  const cyclesArb = fc.array(
    fc.record({ range: fc.double({ min: 0, max: 300, noNaN: true }), mean: fc.double({ min: -150, max: 150, noNaN: true }), count: fc.constantFrom(0.5, 1, 3) }),
    { maxLength: 40 },
  );

  test('damage is non-negative and monotone in amplitude at fixed means (property)', () => {
    checkProperty(
      'damage >= 0 and monotone in the ranges',
      fc.property(cyclesArb, fc.double({ min: 1, max: 2, noNaN: true }), fc.constantFrom(...corrections), (rows, s, meanStress) => {
        const cols = (k: number) => ({ range: rows.map((r) => r.range * k), mean: rows.map((r) => r.mean), count: rows.map((r) => r.count) });
        const d1 = stressLifeDamage(curve, cols(1), { meanStress }).damage;
        const d2 = stressLifeDamage(curve, cols(s), { meanStress }).damage;
        expect(d1).toBeGreaterThanOrEqual(0);
        expect(d1).toBeLessThanOrEqual(d2 * (1 + 1e-12));
      }),
    );
  });

  test('damage from a rainflow range-mean matrix equals damage from the cycle list at the bin centres (property)', () => {
    checkProperty(
      'matrix route equals cycle list',
      fc.property(fc.array(fc.record({ row: fc.nat(11), column: fc.nat(5), half: fc.boolean() }), { maxLength: 60 }), fc.constantFrom(...corrections), (cells, meanStress) => {
        // Arrange: bins of 25 (range) and 40 (mean); every cycle at a bin centre
        const matrix = new RangeMeanMatrix({ range: { count: 12, min: 0, max: 300 }, mean: { count: 6, min: -120, max: 120 } });
        const list = { range: [] as number[], mean: [] as number[], count: [] as number[] };
        cells.forEach(({ row, column, half }, i) => {
          const range = 12.5 + 25 * row;
          const mean = -100 + 40 * column;
          const count = half ? 0.5 : 1;
          matrix.addCycle(mean - range / 2, mean + range / 2, count, i, i + 1, i + 1);
          list.range.push(range);
          list.mean.push(mean);
          list.count.push(count);
        });
        // Act
        const fromMatrix = damageFromMatrix(matrix, stressLifeKernel(curve, { meanStress })).damage;
        const fromList = stressLifeDamage(curve, list, { meanStress }).damage;
        // Assert
        expect(Math.abs(fromMatrix - fromList)).toBeLessThanOrEqual(1e-12 * Math.max(fromList, 1e-300));
      }),
    );
  });

  test('the route on a rainflow count: a repeating history on the EN 1993-1-9 curve, life with the IIW damage sum', () => {
    const history = Float64Array.from([0, 120, -40, 80, -100, 60, 0]);
    const cycles = rainflow(history, { residue: 'repeat' }).cycles!.columns();
    const en = stressLifeDamage(en1993DetailCurve(71, { gammaMf: 1 }), cycles);
    const manual = Array.from(cycles.range).reduce((d, r, i) => d + cycles.count[i] / cyclesToFailure(en1993DetailCurve(71, { gammaMf: 1 }), r), 0);
    expect(en.damage).toBeCloseTo(manual, 18);
    const life = lifeFromDamage(en.damage, { criticalDamage: IIW_DAMAGE_SUM });
    expect(life.repeats).toBeCloseTo(0.5 / en.damage, 6);
  });

  test('Kf from the notch package multiplies range and mean; an elastic notch (Kf on nominal) equals the local stress (case stated)', () => {
    // Kf = 1 + q(Kt − 1), q by Peterson for Su = 1000 MPa and r = 1 mm (notch package)
    const kf = fatigueNotchFactor(2.5, petersonSensitivity(1, petersonConstantMm(1000)));
    const curve = en1993DetailCurve(90, { gammaMf: 1 });
    const nominal = stressLifeDamage(curve, { range: [40, 60], mean: [10, 0], count: [1e5, 1e4] }, { kf, meanStress: { method: 'goodman', ultimateStrength: 1000 } });
    const local = stressLifeDamage(curve, { range: [40 * kf, 60 * kf], mean: [10 * kf, 0], count: [1e5, 1e4] }, { meanStress: { method: 'goodman', ultimateStrength: 1000 } });
    expect(nominal.damage).toBeCloseTo(local.damage, 15);
    expect(() => stressLifeDamage(curve, { range: [1], mean: [0], count: [1] }, { kf: 0.5 })).toThrow(expect.objectContaining({ field: 'kf' }));
  });

  test('bad input: negative ranges, NaN means, bad counts, columns of different lengths; empty and single cycles', () => {
    const c = iiwFatCurve(90);
    expect(() => stressLifeDamage(c, { range: [10, -1], mean: [0, 0], count: [1, 1] })).toThrow(expect.objectContaining({ code: 'invalid-stress', field: 'ranges', index: 1 }));
    expect(() => stressLifeDamage(c, { range: [10], mean: [NaN], count: [1] })).toThrow(expect.objectContaining({ code: 'invalid-mean', index: 0 }));
    expect(() => stressLifeDamage(c, { range: [10], mean: [0], count: [-1] })).toThrow(expect.objectContaining({ code: 'invalid-count' }));
    expect(() => stressLifeDamage(c, { range: [10, 20], mean: [0], count: [1, 1] })).toThrow(expect.objectContaining({ field: 'mean.length' }));
    expect(stressLifeDamage(c, { range: [], mean: [], count: [] }).damage).toBe(0);
    expect(stressLifeDamage(c, { range: [90], mean: [0], count: [1] }).damage).toBeCloseTo(1 / 2e6, 18);
    expect(stressLifeDamage(c, { range: [1e100], mean: [0], count: [1] }).damage).toBeGreaterThan(1e200);
    expect(() => stressLifeDamage(c, { range: [1e300], mean: [0], count: [1] })).toThrow(expect.objectContaining({ code: 'invalid-stress', field: 'ranges', index: 0 }));
  });
});
