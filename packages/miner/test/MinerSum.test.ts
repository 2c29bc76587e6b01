import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { handbookSteels, reversalsToFailure } from '@loopwise/material';
import { MinerError, MinerSum, sumDamage } from '@loopwise/miner';
import { checkProperty } from '../../../test/property';
import { closeRelative, loopRecords, toColumns } from './support/arbitraries';

// Source of the material: N. E. Dowling, Mechanical Behavior of Materials, Pearson, Table 14.1
// (via handbookSteels of @loopwise/material, which carries the provenance).
const sae1045 = handbookSteels.find((m) => m.name === 'SAE 1045 (hot rolled and normalized)')!;

describe('new MinerSum() constant amplitude', () => {
  test('n cycles at a strain amplitude of life 2Nf give D = n / Nf with Nf = 2Nf / 2 (closed form)', () => {
    // Arrange: pick the life, compute the amplitude from the Coffin-Manson-Basquin equation
    // εa = σf'/E (2Nf)^b + εf' (2Nf)^c written out here, independently of the package
    // (S. S. Manson, NACA TN 2933 (1953); L. F. Coffin, Trans. ASME 76 (1954) 931-950;
    // O. H. Basquin, Proc. ASTM 10 (1910) 625-630).
    for (const reversals of [200, 2e4, 2e6]) {
      const { E, sigmaF, b, epsilonF, c } = sae1045;
      const epsilonA = (sigmaF / E) * reversals ** b + epsilonF * reversals ** c;
      const n = 137;
      // Act: the engine's route, material solve in reversals then the sum
      const solved = reversalsToFailure(sae1045, epsilonA).reversals;
      const sum = new MinerSum();
      for (let i = 0; i < n; i++) sum.addReversals(1, solved, 2 * i, 2 * i + 1);
      // Assert: D = n / (2Nf / 2); the solve converges to 1e-10 relative, so 1e-9 here
      expect(closeRelative(sum.damage(), n / (reversals / 2), 1e-9)).toBe(true);
      expect(closeRelative(sum.life().repeats, reversals / 2 / n, 1e-9)).toBe(true);
    }
  });

  test('addCycles(count, Nf) and addReversals(count, 2Nf) agree; half cycles count 0.5', () => {
    const a = new MinerSum();
    const b = new MinerSum();
    expect(a.addCycles(0.5, 500, 0, 3)).toBe(0.001);
    expect(b.addReversals(0.5, 1000, 0, 3)).toBe(0.001);
    expect(a.damage()).toBe(b.damage());
    expect(Array.from(a.columns().cyclesToFailure)).toEqual([500]);
  });

  test('the class example: 0.0015 and 1333.33 h', () => {
    const sum = new MinerSum();
    sum.addCycles(1, 1000, 10, 20);
    sum.addReversals(0.5, 2000, 20, 35);
    expect(sum.damage()).toBeCloseTo(0.0015, 15);
    expect(sum.life({ unit: { label: 'h', perRepeat: 2 } }).service).toBeCloseTo(4000 / 3, 9);
    expect(sum.length).toBe(2);
  });

  test('an empty sum has damage 0 and infinite life, never NaN', () => {
    const life = new MinerSum().life({ scatterFactor: 3, unit: { label: 'km', perRepeat: 12 } });
    expect(life).toMatchObject({ damagePerRepeat: 0, repeats: Infinity, designRepeats: Infinity, service: Infinity, designService: Infinity });
  });
});

describe('new MinerSum({ cutoff })', () => {
  test("{cutoff: {cycles: Nc}}: Nf <= Nc damages, Nf > Nc does none; 'none' damages every finite life", () => {
    const cut = new MinerSum({ cutoff: { cycles: 1e6 } });
    expect(cut.addCycles(1, 1e6, 0, 1)).toBe(1e-6); // at the cut-off: damages
    expect(cut.addCycles(1, 1e6 * (1 + 2 ** -52), 1, 2)).toBe(0); // just above: infinite life
    expect(cut.addCycles(1, Infinity, 2, 3)).toBe(0);
    const none = new MinerSum({ cutoff: 'none' });
    expect(none.addCycles(1, 1e15, 0, 1)).toBe(1e-15);
    expect(none.addCycles(1, Infinity, 1, 2)).toBe(0);
    expect(none.cutoffCycles).toBe(Infinity);
  });

  test('cutoffReport() gives the removed count and damage and the damage near the cut-off', () => {
    const sum = new MinerSum({ cutoff: { cycles: 1e6 } });
    sum.addCycles(1, 2e6, 0, 1); // removed: would do 5e-7
    sum.addCycles(3, 4e6, 1, 2); // removed: would do 7.5e-7
    sum.addCycles(1, 8e5, 2, 3); // near (in [5e5, 1e6]): 1.25e-6
    sum.addCycles(1, 1e3, 3, 4); // far: 1e-3
    sum.addCycles(1, Infinity, 4, 5); // infinite life, not "removed"
    const r = sum.cutoffReport();
    expect(r.removedCount).toBe(4);
    expect(r.removedDamage).toBeCloseTo(1.25e-6, 20);
    expect(r.nearCutoffDamage).toBeCloseTo(1.25e-6, 20);
    expect(r.nearCutoffShare).toBeCloseTo(1.25e-6 / (1e-3 + 1.25e-6), 14);
    expect(sum.cutoffReport(10).nearCutoffDamage).toBeCloseTo(1.25e-6, 20); // [1e5, 1e6]: same loop
    expect(new MinerSum().cutoffReport()).toMatchObject({ removedCount: 0, removedDamage: 0, nearCutoffShare: 0 });
  });

  test('the cut-off never raises damage: D(cut-off) <= D(none) and D(cut-off) + removedDamage = D(none) (property)', () => {
    checkProperty(
      'cut-off lowers damage',
      fc.property(loopRecords(), fc.double({ min: 1, max: 1e13, noNaN: true }), (loops, nc) => {
        const cols = toColumns(loops);
        const none = new MinerSum().addColumns(cols);
        const cut = new MinerSum({ cutoff: { cycles: nc } }).addColumns(cols);
        expect(cut.damage()).toBeLessThanOrEqual(none.damage() * (1 + 1e-12));
        const report = cut.cutoffReport();
        expect(closeRelative(cut.damage() + report.removedDamage, none.damage(), 1e-11)).toBe(true);
      }),
    );
  });
});

describe('MinerSum.addColumns(columns) and addSum(other, repeats)', () => {
  test('addColumns equals addCycles row by row and the sumDamage kernel (property)', () => {
    checkProperty(
      'columns equal rows',
      fc.property(loopRecords(), (loops) => {
        const cols = toColumns(loops);
        const byRows = new MinerSum({ initialCapacity: 0 });
        for (const l of loops) byRows.addCycles(l.count, l.cyclesToFailure, l.startIndex, l.turnIndex, l.range);
        const byCols = new MinerSum().addColumns(cols);
        expect(byCols.damage()).toBe(byRows.damage());
        expect(Array.from(byCols.columns().damage)).toEqual(Array.from(byRows.columns().damage));
        expect(byCols.damage()).toBe(sumDamage(cols.count, cols.cyclesToFailure));
        // brute force: plain sum of count / Nf
        const brute = loops.reduce((s, l) => s + l.count / l.cyclesToFailure, 0);
        expect(closeRelative(byCols.damage(), brute, 1e-12)).toBe(true);
      }),
    );
  });

  test('addColumns keeps no row of a call that fails, and names the bad row', () => {
    const sum = new MinerSum();
    sum.addCycles(1, 10, 0, 1);
    const bad = { count: [1, 1, 1], cyclesToFailure: [10, NaN, 10], startIndex: [0, 1, 2], turnIndex: [1, 2, 3] };
    expect(() => sum.addColumns(bad)).toThrow(expect.objectContaining({ code: 'invalid-life', field: 'cyclesToFailure', index: 1 }));
    expect(sum.length).toBe(1);
    expect(sum.damage()).toBe(0.1);
  });

  test('addSum(event, 3) equals adding the event three times; indices and ranges are kept', () => {
    const event = new MinerSum();
    event.addCycles(1, 1e4, 0, 1, 120);
    event.addCycles(0.5, 2e3, 1, 5);
    const thrice = new MinerSum().addSum(event, 3);
    const manual = new MinerSum().addSum(event).addSum(event).addSum(event);
    expect(thrice.damage()).toBeCloseTo(manual.damage(), 17);
    expect(thrice.damage()).toBeCloseTo(3 * (1e-4 + 2.5e-4), 17);
    expect(Array.from(thrice.columns().startIndex)).toEqual([0, 1]);
    expect(Array.from(thrice.columns().range)).toEqual([120, NaN]);
    expect(thrice.firstMissingRange()).toBe(1);
    expect(() => thrice.addSum(event, 0)).toThrow(expect.objectContaining({ code: 'invalid-repeats', field: 'repeats', value: 0 }));
  });

  test('clear() empties the sum', () => {
    const sum = new MinerSum();
    sum.addCycles(1, 10, 0, 1);
    sum.clear();
    expect([sum.length, sum.damage(), sum.firstMissingRange()]).toEqual([0, 0, -1]);
  });

  test('growth past the initial capacity keeps every record', () => {
    const sum = new MinerSum({ initialCapacity: 16 });
    for (let i = 0; i < 1000; i++) sum.addCycles(1, 1000, i, i + 1, i);
    expect(sum.length).toBe(1000);
    expect(sum.columns().range[999]).toBe(999);
    expect(sum.damage()).toBeCloseTo(1, 14);
  });
});

describe('MinerSum.life(options)', () => {
  test('life({criticalDamage, scatterFactor, unit}) gives Dcrit / D repeats and the design life beside it', () => {
    const sum = new MinerSum();
    sum.addCycles(2, 1e4, 0, 1); // D = 2e-4
    const life = sum.life({ criticalDamage: 0.3, scatterFactor: 4, unit: { label: 'laps', perRepeat: 1 } });
    expect(life.repeats).toBeCloseTo(1500, 10);
    expect(life.designRepeats).toBeCloseTo(375, 10);
    expect(life.unit).toBe('laps');
    expect(life.designService).toBeCloseTo(375, 10);
    expect(sum.life({ scatterFactor: 4 }).designRepeats).toBeCloseTo(1250, 10);
  });

  test('errors are MinerError with a stable code and the field', () => {
    const sum = new MinerSum();
    expect(() => sum.life({ criticalDamage: 0 })).toThrow(MinerError);
    expect(() => sum.life({ scatterFactor: 0.5 })).toThrow(/scatterFactor = 0.5/);
  });
});
