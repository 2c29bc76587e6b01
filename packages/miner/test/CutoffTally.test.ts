import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { LoopwiseError } from '@loopwise/base';
import { CutoffTally, MinerError, MinerSum, type CutoffReport } from '@loopwise/miner';
import { checkProperty } from '../../../test/property';
import { closeRelative, loopRecords, toColumns } from './support/arbitraries';

// The cut-off is a stated policy of the damage sum, not a measured fact: a cycle whose life
// exceeds the cut-off does no damage (CutoffPolicy, after Haibach's original Miner rule); "near"
// is a life within a factor 2 below the cut-off (our choice: common practice, no source). These
// tests check the counts against that policy, written out by hand.

function close(a: CutoffReport, b: CutoffReport, tol: number): boolean {
  return (
    a.cutoffCycles === b.cutoffCycles &&
    a.nearFactor === b.nearFactor &&
    closeRelative(a.removedCount, b.removedCount, tol) &&
    closeRelative(a.removedDamage, b.removedDamage, tol) &&
    closeRelative(a.nearCutoffDamage, b.nearCutoffDamage, tol) &&
    closeRelative(a.nearCutoffShare, b.nearCutoffShare, tol)
  );
}

describe('new CutoffTally(cutoff, { nearFactor? })', () => {
  test('add(count, cyclesToFailure) counts what the cut-off removed and the damage near it (the TSDoc example)', () => {
    const tally = new CutoffTally({ cycles: 1e6 });
    tally.add(1, 2e6); // removed: would do 5e-7
    tally.add(3, 4e6); // removed: would do 7.5e-7
    tally.add(1, 8e5); // near (in [5e5, 1e6]): 1.25e-6
    tally.add(1, 1e3); // far: 1e-3
    tally.add(1, Infinity); // infinite life: does no damage under any policy, so not "removed"
    const r = tally.value();
    expect(r.cutoffCycles).toBe(1e6);
    expect(r.nearFactor).toBe(2);
    expect(r.removedCount).toBe(4);
    expect(r.removedDamage).toBeCloseTo(1.25e-6, 20);
    expect(r.nearCutoffDamage).toBeCloseTo(1.25e-6, 20);
    expect(r.nearCutoffShare).toBeCloseTo(1.25e-6 / (1e-3 + 1.25e-6), 14);
    expect(tally.value()).toEqual(r); // value() does not change the tally
  });

  test('the ends of the intervals: Nf = cut-off damages and is near, Nf = cut-off / f is near, just below it is not', () => {
    const c = 1e6;
    const tally = new CutoffTally({ cycles: c }, { nearFactor: 4 });
    tally.add(1, c).add(1, c / 4).add(1, (c / 4) * (1 - 2 ** -52)).add(1, c * (1 + 2 ** -52));
    const r = tally.value();
    expect(r.nearCutoffDamage).toBeCloseTo(1 / c + 4 / c, 20);
    expect(r.removedCount).toBe(1);
    expect(r.removedDamage).toBeCloseTo(1 / c, 20);
  });

  test("the 'none' policy removes nothing and has nothing near it; an empty tally is all zero", () => {
    const none = new CutoffTally('none').add(1, 1e15).add(2, 10).add(1, Infinity);
    expect(none.value()).toEqual({ cutoffCycles: Infinity, removedCount: 0, removedDamage: 0, nearFactor: 2, nearCutoffDamage: 0, nearCutoffShare: 0 });
    expect(new CutoffTally({ cycles: 10 }).value()).toMatchObject({ removedCount: 0, removedDamage: 0, nearCutoffDamage: 0, nearCutoffShare: 0 });
  });

  test('addColumns over full columns equals MinerSum.cutoffReport() on the same loops (property)', () => {
    checkProperty(
      'tally = MinerSum report',
      fc.property(loopRecords(), fc.double({ min: 1, max: 1e13, noNaN: true }), fc.constantFrom(1.5, 2, 10), (loops, nc, f) => {
        const cols = toColumns(loops);
        const sum = new MinerSum({ cutoff: { cycles: nc } }).addColumns(cols);
        expect(new CutoffTally({ cycles: nc }, { nearFactor: f }).addColumns(cols).value()).toEqual(sum.cutoffReport(f));
      }),
    );
  });

  test('the tally of pieces merged equals the tally of the whole; add row by row equals addColumns (property)', () => {
    checkProperty(
      'pieces merge to the whole',
      fc.property(loopRecords(), fc.double({ min: 1, max: 1e13, noNaN: true }), fc.array(fc.nat(), { maxLength: 4 }), (loops, nc, cuts) => {
        // Arrange: the loops split at generated cut points into consecutive pieces
        const cols = toColumns(loops);
        const n = loops.length;
        const ends = [...new Set(cuts.map((k) => (n === 0 ? 0 : k % (n + 1))))].sort((a, b) => a - b);
        const bounds = [0, ...ends, n];
        // Act
        const whole = new CutoffTally({ cycles: nc }).addColumns(cols);
        const merged = new CutoffTally({ cycles: nc });
        for (let k = 0; k + 1 < bounds.length; k++) merged.merge(new CutoffTally({ cycles: nc }).addColumns(cols, bounds[k], bounds[k + 1]));
        const byRows = new CutoffTally({ cycles: nc });
        for (const l of loops) byRows.add(l.count, l.cyclesToFailure);
        // Assert
        expect(byRows.value()).toEqual(whole.value());
        expect(close(merged.value(), whole.value(), 1e-12)).toBe(true);
      }),
    );
  });

  test('without the cut-off the sum would be the sum with it plus the removed damage (property)', () => {
    checkProperty(
      'removed damage closes the balance',
      fc.property(loopRecords(), fc.double({ min: 1, max: 1e13, noNaN: true }), (loops, nc) => {
        const cols = toColumns(loops);
        const removed = new CutoffTally({ cycles: nc }).addColumns(cols).value().removedDamage;
        const withCut = new MinerSum({ cutoff: { cycles: nc } }).addColumns(cols).damage();
        const without = new MinerSum().addColumns(cols).damage();
        expect(closeRelative(withCut + removed, without, 1e-11)).toBe(true);
      }),
    );
  });

  test('bad input: a MinerError naming the field, the value and the row; a failed addColumns counts nothing', () => {
    const t = new CutoffTally({ cycles: 1e6 });
    expect(() => t.add(NaN, 10)).toThrow(expect.objectContaining({ code: 'invalid-count', field: 'count' }));
    expect(() => t.add(1, 0)).toThrow(expect.objectContaining({ code: 'invalid-life', field: 'cyclesToFailure', value: 0 }));
    expect(() => t.add(-1, 10)).toThrow(MinerError);
    expect(() => t.add(Infinity, 10)).toThrow(LoopwiseError);
    t.add(1, 2e6);
    const bad = { count: [1, 1, 1], cyclesToFailure: [3e6, NaN, 10] };
    expect(() => t.addColumns(bad)).toThrow(expect.objectContaining({ code: 'invalid-life', field: 'cyclesToFailure', index: 1 }));
    expect(t.value().removedCount).toBe(1);
    expect(() => t.addColumns({ count: [1], cyclesToFailure: [1, 2] })).toThrow(expect.objectContaining({ field: 'cyclesToFailure.length' }));
    expect(() => t.addColumns({ count: [1], cyclesToFailure: [1] }, 2)).toThrow(expect.objectContaining({ field: 'from', value: 2 }));
    expect(() => t.addColumns({ count: [1], cyclesToFailure: [1] }, 0, 0.5)).toThrow(expect.objectContaining({ field: 'to' }));
    expect(() => t.addColumns(null as never)).toThrow(expect.objectContaining({ code: 'invalid-argument', field: 'columns' }));
    expect(() => new CutoffTally({ cycles: 0 })).toThrow(expect.objectContaining({ code: 'invalid-cutoff', field: 'cutoff.cycles' }));
    for (const f of [1, 0.5, NaN, Infinity]) {
      expect(() => new CutoffTally('none', { nearFactor: f })).toThrow(expect.objectContaining({ code: 'invalid-argument', field: 'nearFactor' }));
    }
    expect(() => t.merge(new CutoffTally({ cycles: 2e6 }))).toThrow(expect.objectContaining({ field: 'other.cutoffCycles' }));
    expect(() => t.merge(new CutoffTally({ cycles: 1e6 }, { nearFactor: 3 }))).toThrow(expect.objectContaining({ field: 'other.nearFactor' }));
    expect(() => t.merge({} as CutoffTally)).toThrow(expect.objectContaining({ field: 'other' }));
  });

  test('10^5 small near-cut-off damages beside one large one keep their sum (compensated)', () => {
    const t = new CutoffTally({ cycles: 1e12 });
    t.add(1, 1); // damage 1
    for (let i = 0; i < 1e5; i++) t.add(1, 9e11); // 1e5 · 1/9e11 near the cut-off
    expect(closeRelative(t.value().nearCutoffDamage, 1e5 / 9e11, 1e-14)).toBe(true);
  });
});
