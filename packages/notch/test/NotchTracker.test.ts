import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { turningPoints } from '@loopwise/rainflow';
import { NotchSampleError, NotchTracker, trackNotch, type NotchTrackerOptions, type NotchTrackResult } from '@loopwise/notch';
import { checkProperty } from '../../../test/property';
import { gridHistory, realisticMaterial, sae1045 } from './support';

const S = 60; // scales the integer histories into plasticity for SAE 1045 at Kt 2.5
const opts: NotchTrackerOptions = { material: sae1045, Kt: 2.5 };
/** Loops without closeIndex: with thinned points a loop closes at the point that reaches the memory point. */
const loopsWithoutClose = (r: NotchTrackResult) => r.loops.toRows().map(({ closeIndex: _, ...rest }) => rest);

describe('NotchTracker.pushIndexed(values, indices, from, to)', () => {
  it('turning points with their indices give the raw history\'s reversals, loops (σ, ε, start and turn) and residue', () => {
    checkProperty(
      'pushIndexed(turningPoints) == push(raw)',
      fc.property(realisticMaterial, gridHistory(), fc.double({ min: 20, max: 200, noNaN: true }), fc.integer({ min: -3, max: 3 }), (m, h, scale, offset) => {
        // Arrange
        const hist = h.map((x) => x * scale);
        const o: NotchTrackerOptions = { material: m, Kt: 2, offset: offset * scale };
        const tp = turningPoints(hist);
        // Act
        const raw = trackNotch(hist, o);
        const t = new NotchTracker(o).pushIndexed(tp.values, tp.indices, 0, tp.values.length);
        const thin = t.end();
        // Assert
        expect(thin.reversals.toRows()).toEqual(raw.reversals.toRows());
        expect(loopsWithoutClose(thin)).toEqual(loopsWithoutClose(raw));
        expect(thin.residue.toRows()).toEqual(raw.residue.toRows());
        // a loop closes at the point that reached the memory point: not before the raw sample that did
        const rc = raw.loops.columns().closeIndex;
        const tc = thin.loops.columns().closeIndex;
        for (let i = 0; i < rc.length; i++) {
          expect(tc[i]).toBeGreaterThanOrEqual(rc[i]);
          expect(tp.indices).toContain(tc[i]);
        }
        expect(t.nextIndex).toBe(tp.indices[tp.indices.length - 1] + 1);
      }),
    );
  });

  it('gives identical events for any chunking (size 1 included) and resumes from JSON', () => {
    checkProperty(
      'pushIndexed chunking',
      fc.property(gridHistory(), fc.integer({ min: 1, max: 7 }), (h, size) => {
        const tp = turningPoints(h.map((x) => x * S));
        const n = tp.values.length;
        const whole = new NotchTracker(opts).pushIndexed(tp.values, tp.indices, 0, n).end();
        let t = new NotchTracker(opts);
        const loops: unknown[] = [];
        const revs: unknown[] = [];
        for (let s = 0; s < n; s += size) {
          t.pushIndexed(tp.values, tp.indices, s, Math.min(n, s + size));
          const e = t.end();
          loops.push(...e.loops.toRows());
          revs.push(...e.reversals.toRows());
          t = NotchTracker.fromJSON(JSON.parse(JSON.stringify(t)));
        }
        expect(loops).toEqual(whole.loops.toRows());
        expect(revs).toEqual(whole.reversals.toRows());
        expect(t.end().residue.toRows()).toEqual(whole.residue.toRows());
      }),
    );
  });

  it('records indices as given: other indices change no σ or ε, only the indices the events carry', () => {
    const values = [0, 5 * S, -4 * S, 6 * S];
    const a = new NotchTracker(opts).pushIndexed(values, [10, 20, 30, 40], 0, 4).end();
    const b = new NotchTracker(opts).pushIndexed(values, [7, 3, 9, 1], 0, 4).end();
    expect(a.loops.row(0)).toMatchObject({ startIndex: 20, turnIndex: 30, closeIndex: 40 });
    expect(b.loops.row(0)).toMatchObject({ startIndex: 3, turnIndex: 9, closeIndex: 1 });
    expect(b.reversals.columns().stress).toEqual(a.reversals.columns().stress);
    expect(b.loops.columns().strainMax).toEqual(a.loops.columns().strainMax);
  });

  it('bad input: NaN or Infinity names the given index; an empty range pushes nothing', () => {
    const t = new NotchTracker(opts);
    expect(t.pushIndexed([1, 2], [100, 200], 1, 1).nextIndex).toBe(0);
    try {
      t.pushIndexed([1, NaN], [100, 200], 0, 2);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(NotchSampleError);
      expect((e as NotchSampleError).index).toBe(200);
    }
    expect(() => new NotchTracker(opts).pushIndexed([Infinity], [5], 0, 1)).toThrow(/history\[5\]/);
  });
});

describe('NotchTracker({ recordReversals: false })', () => {
  it('keeps no reversal table and closes exactly the same loops', () => {
    const material = sae1045;
    const history = [0, 300, -240, 360, -100, 280, -320, 150, 0];
    const a = new NotchTracker({ material, Kt: 2 }).push(history).end();
    const b = new NotchTracker({ material, Kt: 2, recordReversals: false }).push(history).end();
    expect(b.reversals.length).toBe(0);
    expect(a.reversals.length).toBeGreaterThan(0);
    expect(b.loops.toRows()).toEqual(a.loops.toRows());
    expect(() => new NotchTracker({ material, Kt: 2, recordReversals: 'no' as never })).toThrow(/recordReversals/);
  });
});
