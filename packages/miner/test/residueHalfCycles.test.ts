import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { rainflow } from '@loopwise/rainflow';
import { MinerError, residueHalfCycles } from '@loopwise/miner';
import { checkProperty } from '../../../test/property';

// ASTM E1049-85 (reapproved 2017), 5.4.4: the rainflow example -2, 1, -3, 5, -1, 3, -4, 4, -2 and
// its table of ranges and counts, with the residue counted as half cycles (the shared fixture,
// values from memory confirmed by two hand counts; see fixtures/cases).
const astm = JSON.parse(readFileSync(new URL('../../../fixtures/cases/astm-e1049-rainflow-example.json', import.meta.url), 'utf8')) as {
  input: number[];
  expected: { half: { rangeCounts: Record<string, number> } };
};

/** Invented modulus for the tests: strain = stress / E, a linear-elastic notch. */
const E = 200_000;

describe('residueHalfCycles({ index, stress, strain })', () => {
  test('the ASTM E1049-85 5.4.4 example: its one full cycle and the residue as half cycles give the standard table', () => {
    // Arrange: the example's points A … I are samples 0 … 8; E-F (-1 → 3) closes as the one full
    // cycle, and the open points A B C D G H I (samples 0 1 2 3 6 7 8) are the residue
    const open = [0, 1, 2, 3, 6, 7, 8];
    const stress = open.map((k) => astm.input[k]);
    // Act
    const halves = residueHalfCycles({ index: open, stress, strain: stress.map((s) => s / E) });
    // Assert: with the full cycle of range 4, ranges 3: 0.5, 4: 1.5, 6: 0.5, 8: 1, 9: 0.5
    const counts: Record<string, number> = { 4: 1 };
    for (let i = 0; i < halves.count.length; i++) {
      const range = halves.stressMax[i] - halves.stressMin[i];
      counts[range] = (counts[range] ?? 0) + halves.count[i];
    }
    expect(counts).toEqual(astm.expected.half.rangeCounts);
    // the residue A B C D G H I (samples 0 1 2 3 6 7 8) as six half cycles, in order
    expect(Array.from(halves.startIndex)).toEqual([0, 1, 2, 3, 6, 7]);
    expect(Array.from(halves.turnIndex)).toEqual([1, 2, 3, 6, 7, 8]);
    expect(Array.from(halves.closeIndex)).toEqual(Array.from(halves.turnIndex));
    expect(Array.from(halves.stressMax)).toEqual([1, 1, 5, 5, 4, 4]);
    expect(Array.from(halves.stressMin)).toEqual([-2, -3, -3, -4, -4, -2]);
    expect(Array.from(halves.strainMax)).toEqual([1, 1, 5, 5, 4, 4].map((s) => s / E));
    expect(Array.from(halves.count)).toEqual([0.5, 0.5, 0.5, 0.5, 0.5, 0.5]);
  });

  test("equals rainflow's half cycles ({residue: 'half'}) on generated histories (property)", () => {
    checkProperty(
      'residue half cycles = rainflow half',
      fc.property(fc.array(fc.integer({ min: -50, max: 50 }), { maxLength: 60 }), (history) => {
        // Arrange: every open point of the four-point count (the residue before a policy closes
        // it; rainflow's 'half' policy counts the same ranges, the leading ones as it goes)
        const { residue } = rainflow(history, { residue: 'repeat' });
        const stress = Array.from(residue.values);
        // Act
        const ours = residueHalfCycles({ index: residue.indices, stress, strain: stress.map((s) => s / E) });
        // Assert: the same half cycles, in the same order, with the same indices and ranges
        const half = rainflow(history, { residue: 'half' }).cycles!.columns();
        const theirs: string[] = [];
        for (let i = 0; i < half.count.length; i++) {
          if (half.count[i] === 0.5) theirs.push(`${half.startIndex[i]}-${half.turnIndex[i]}:${half.range[i]}`);
        }
        const mine = Array.from(ours.count, (_c, i) => `${ours.startIndex[i]}-${ours.turnIndex[i]}:${ours.stressMax[i] - ours.stressMin[i]}`);
        expect(mine).toEqual(theirs);
      }),
    );
  });

  test('fewer than two points give no half cycle; index -1 (the initial value) is kept as given', () => {
    expect(residueHalfCycles({ index: [], stress: [], strain: [] }).count.length).toBe(0);
    expect(residueHalfCycles({ index: [4], stress: [100], strain: [0.001] }).stressMax.length).toBe(0);
    const h = residueHalfCycles({ index: [-1, 5, 5], stress: [0, 250, 250], strain: [0, 0.0015, 0.0015] });
    expect(Array.from(h.startIndex)).toEqual([-1, 5]);
    expect(Array.from(h.turnIndex)).toEqual([5, 5]);
    expect([h.stressMax[1], h.stressMin[1], h.strainMax[1] - h.strainMin[1]]).toEqual([250, 250, 0]); // a zero half cycle
  });

  test('the TSDoc example', () => {
    const h = residueHalfCycles({ index: [0, 3, 8], stress: [0, 300, -200], strain: [0, 0.002, -0.001] });
    expect(Array.from(h.stressMin)).toEqual([0, -200]);
    expect(Array.from(h.stressMax)).toEqual([300, 300]);
    expect(Array.from(h.strainMin)).toEqual([0, -0.001]);
  });

  test.each([
    ['NaN stress', { index: [0, 1], stress: [0, NaN], strain: [0, 0] }, 'invalid-residue', 'stress', 1],
    ['Infinity strain', { index: [0, 1], stress: [0, 1], strain: [-Infinity, 0] }, 'invalid-residue', 'strain', 0],
    ['a decreasing index', { index: [0, 5, 4], stress: [0, 1, 2], strain: [0, 0, 0] }, 'invalid-index', 'index', 2],
    ['a fractional index', { index: [0, 1.5], stress: [0, 1], strain: [0, 0] }, 'invalid-index', 'index', 1],
    ['an index below -1', { index: [-2, 1], stress: [0, 1], strain: [0, 0] }, 'invalid-index', 'index', 0],
    ['a NaN index', { index: [0, NaN], stress: [0, 1], strain: [0, 0] }, 'invalid-index', 'index', 1],
  ])('%s throws a MinerError naming the field and the point', (_name, residue, code, field, index) => {
    expect(() => residueHalfCycles(residue)).toThrow(expect.objectContaining({ code, field, index }));
  });

  test('columns of different lengths or no columns throw invalid-argument', () => {
    expect(() => residueHalfCycles({ index: [0, 1], stress: [0], strain: [0, 1] })).toThrow(expect.objectContaining({ field: 'stress.length' }));
    expect(() => residueHalfCycles(null as never)).toThrow(MinerError);
    expect(() => residueHalfCycles({ stress: [], strain: [] } as never)).toThrow(expect.objectContaining({ code: 'invalid-argument', field: 'index' }));
  });
});
