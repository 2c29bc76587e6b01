import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { cyclicStress, defineMaterial, masingStressRange, type Material } from '@loopwise/material';
import { rainflowFourPoint } from '@loopwise/rainflow';
import {
  checkLoopClosures,
  neuber,
  neuberRange,
  NotchOptionError,
  NotchSampleError,
  NotchStateError,
  NotchTracker,
  NotchValidityError,
  trackNotch,
  trackNotchRepeating,
  type NotchTrackerOptions,
  type NotchTrackResult,
} from '@loopwise/notch';
import { TrackerCore } from '../src/TrackerCore';
import { DEFAULT_TRACKER_TOLERANCE } from '../src/NotchTrackerOptions';
import { checkProperty } from '../../../test/property';
import { gridHistory, realisticMaterial, sae1045 } from './support';

const S = 60; // scales the integer fixtures into plasticity for SAE 1045 at Kt 2.5
const opts: NotchTrackerOptions = { material: sae1045, Kt: 2.5 };
const loopPairs = (r: NotchTrackResult) => r.loops.toRows().map((l) => `${l.startIndex}/${l.turnIndex}`);

/** Independent oracle: closes loops geometrically in σ–ε space with the pure Neuber functions. */
function oracle(history: number[], m: Material, k: number): string[] {
  type P = { v: number; i: number; s: number; e: number };
  const mem: P[] = [];
  const out: string[] = [];
  let env = 0; // largest first-loading |σ|
  let dir = 0;
  let ext = 0;
  let extI = -1;
  const local = (v: number): { s: number; e: number } => {
    if (mem.length === 0) {
      const r = neuber(m, k * v);
      return { s: r.stress, e: r.strain };
    }
    const o = mem[mem.length - 1];
    const r = neuberRange(m, k * (v - o.v));
    return { s: o.s + r.stressRange, e: o.e + r.strainRange };
  };
  const tol = (a: number) => 1e-9 * Math.max(1, Math.abs(a));
  const settle = (x: number, i: number) => {
    for (;;) {
      const p = local(x);
      if (mem.length >= 2) {
        const target = mem[mem.length - 2];
        if (dir * (p.s - target.s) >= -tol(target.s)) {
          const b = mem.pop()!;
          const a = mem.pop()!;
          out.push(`${a.i}/${b.i}`);
          void i;
          continue;
        }
      } else if (mem.length === 1) {
        // mirror of the start, exceeded (beyond −σ_P in σ)
        if (dir * (p.s + mem[0].s) > tol(mem[0].s)) {
          mem.pop();
          continue;
        }
      } else {
        env = Math.max(env, Math.abs(p.s));
      }
      return;
    }
  };
  for (let i = 0; i < history.length; i++) {
    const x = history[i];
    if (dir === 0) {
      if (x === ext) continue;
      dir = x > ext ? 1 : -1;
      ext = x;
      extI = i;
      settle(x, i);
      continue;
    }
    if (dir * (x - ext) > 0) {
      ext = x;
      extI = i;
      settle(x, i);
    } else if (x !== ext) {
      const p = local(ext);
      mem.push({ v: ext, i: extI, s: p.s, e: p.e });
      dir = -dir;
      ext = x;
      extI = i;
      settle(x, i);
    }
  }
  void env;
  return out;
}

/** Four-point counting with mirrored predecessors on the first-loading curve (DESIGN.md consequence). */
function mirroredFourPoint(history: number[]): string[] {
  const tp: { v: number; i: number }[] = [{ v: 0, i: -1 }];
  for (let i = 0; i < history.length; i++) {
    const x = history[i];
    const last = tp[tp.length - 1];
    if (x === last.v) continue;
    if (tp.length >= 2) {
      const prev = tp[tp.length - 2];
      if ((last.v - prev.v) * (x - last.v) > 0) {
        tp[tp.length - 1] = { v: x, i };
        continue;
      }
    }
    tp.push({ v: x, i });
  }
  const st: { v: number; i: number; virtual?: boolean }[] = [];
  const out: string[] = [];
  let xmax = 0;
  for (const p of tp) {
    st.push(p);
    for (;;) {
      const n = st.length;
      if (n < 4) break;
      const [a, b, c, d] = st.slice(n - 4);
      const x = Math.abs(c.v - b.v);
      const y = Math.abs(b.v - a.v);
      if ((a.virtual ? x <= y : x < y) && x <= Math.abs(d.v - c.v)) {
        out.push(`${b.i}/${c.i}`);
        st.splice(n - 3, 2);
      } else break;
    }
    if (Math.abs(p.v) > xmax || (p.i === -1 && xmax === 0)) {
      xmax = Math.abs(p.v);
      st.length = 0;
      st.push({ v: -p.v, i: -2, virtual: true }, p);
    }
  }
  return out;
}

describe('trackNotch(history, options): hand fixtures in the plastic range', () => {
  it('0→5→−4→6 closes the loop 5/−4 on the first pass (memory 2), values from the equations', () => {
    const r = trackNotch([0, 5 * S, -4 * S, 6 * S], opts);
    expect(loopPairs(r)).toEqual(['1/2']);
    const p5 = neuber(sae1045, 2.5 * 5 * S);
    const d = neuberRange(sae1045, -2.5 * 9 * S);
    const rows = r.reversals.toRows();
    expect(rows[0].stress).toBeCloseTo(p5.stress, 9);
    expect(rows[1].stress).toBeCloseTo(p5.stress + d.stressRange, 9);
    expect(rows[1].strain).toBeCloseTo(p5.strain + d.strainRange, 12);
    expect(p5.strain).toBeGreaterThan(2 * p5.stress / sae1045.E); // plastic: more than twice the elastic strain
    // the end point lies on the first-loading curve (continued after the loop closed)
    expect(r.residue.row(r.residue.length - 1).stress).toBeCloseTo(neuber(sae1045, 2.5 * 6 * S).stress, 9);
    expect(rainflowFourPoint([0, 5, -4, 6], { residue: "none" }).cycles!.length).toBe(0); // plain four-point closes fewer
  });

  it('0→5→−6→5.5→−7 closes −6/5.5', () => {
    const r = trackNotch([0, 5 * S, -6 * S, 5.5 * S, -7 * S], opts);
    expect(loopPairs(r)).toEqual(['2/3']);
    const l = r.loops.row(0);
    expect(l.stressMin).toBeCloseTo(-neuber(sae1045, 2.5 * 6 * S).stress, 9);
    expect(l.stressMax).toBeCloseTo(-neuber(sae1045, 2.5 * 6 * S).stress + neuberRange(sae1045, 2.5 * 11.5 * S).stressRange, 9);
  });

  it('a branch beyond the mirror of its start rejoins the first-loading curve (memory 3)', () => {
    const r = trackNotch([0, 5 * S, -6 * S, 2 * S], opts);
    const rows = r.reversals.toRows();
    expect(rows[1].stress).toBeCloseTo(-neuber(sae1045, 2.5 * 6 * S).stress, 9); // on the curve, not on the branch from 5
    expect(r.loops.length).toBe(0);
  });

  it('a gauge zeroed at a non-zero initial value: offset and initial shift the history', () => {
    const v0 = 3 * S;
    const readings = [0, 2 * S, -7 * S, 1 * S];
    const r = trackNotch(readings, { ...opts, offset: v0, initial: v0 });
    const truth = trackNotch(readings.map((x) => x + v0), { ...opts, initial: v0 });
    expect(r.reversals.toRows()).toEqual(truth.reversals.toRows());
    // the first reversal is the true 5·S on the first-loading curve
    expect(r.reversals.row(0).stress).toBeCloseTo(neuber(sae1045, 2.5 * 5 * S).stress, 9);
    // starting at v0 then unloading makes v0 a reversal with index -1
    const u = trackNotch([1 * S], { ...opts, initial: v0 });
    expect(u.reversals.row(0)).toMatchObject({ index: -1, value: v0 });
  });
});

describe('trackNotch: properties', () => {
  it('equals the σ–ε geometric oracle over generated histories and materials', () => {
    checkProperty(
      'tracker == geometric oracle',
      fc.property(realisticMaterial, gridHistory(), fc.double({ min: 20, max: 200, noNaN: true }), (m, h, scale) => {
        const hist = h.map((x) => x * scale);
        const r = trackNotch(hist, { material: m, Kt: 2 });
        expect(loopPairs(r)).toEqual(oracle(hist, m, 2));
      }),
    );
  });

  it('first pass == four-point cycles with mirrored predecessors on the first-loading curve', () => {
    checkProperty(
      'first pass == mirrored four-point',
      fc.property(gridHistory(), (h) => {
        const r = trackNotch(h.map((x) => x * S), opts);
        expect(loopPairs(r).sort()).toEqual(mirroredFourPoint(h).sort());
      }),
    );
  });

  it('after every closed loop the live state equals the memory point to 1e-12 (checkLoopClosures)', () => {
    checkProperty(
      'loop closure',
      fc.property(realisticMaterial, gridHistory(), (m, h) => {
        const o = { material: m, Kt: 2.2 };
        const r = trackNotch(h.map((x) => x * 40), o);
        const c = checkLoopClosures(r, o);
        expect(c.missing).toBe(0);
        expect(c.maxError).toBeLessThan(1e-12);
      }),
    );
  });

  it('local stresses stay within the cyclic-curve envelope', () => {
    checkProperty(
      'envelope',
      fc.property(gridHistory(), (h) => {
        const r = trackNotch(h.map((x) => x * S), opts);
        const xmax = Math.max(0, ...h.map(Math.abs)) * S;
        // the tracker's solves hold their documented tolerance (default 1e-10 relative)
        const bound = neuber(sae1045, 2.5 * xmax).stress * (1 + DEFAULT_TRACKER_TOLERANCE);
        for (const row of r.reversals.toRows()) expect(Math.abs(row.stress)).toBeLessThanOrEqual(bound);
      }),
    );
  });

  it('NotchTracker gives identical events for any chunking (size 1 included) and resumes from JSON', () => {
    checkProperty(
      'chunking',
      fc.property(gridHistory(), fc.integer({ min: 1, max: 7 }), (h, size) => {
        const hist = h.map((x) => x * S);
        const batch = trackNotch(hist, opts);
        let t = new NotchTracker(opts);
        const loops: string[] = [];
        const revs: number[] = [];
        for (let s = 0; s < hist.length; s += size) {
          t.push(hist.slice(s, s + size));
          const e = t.end();
          loops.push(...loopPairs(e));
          revs.push(...e.reversals.columns().stress);
          t = NotchTracker.fromJSON(JSON.parse(JSON.stringify(t)));
        }
        expect(loops).toEqual(loopPairs(batch));
        expect(revs).toEqual(Array.from(batch.reversals.columns().stress));
        expect(t.end().residue.toRows()).toEqual(batch.residue.toRows());
      }),
    );
  });
});

describe('trackNotchRepeating(block, options)', () => {
  const cycles = (block: number[]) => {
    const c = rainflowFourPoint(block, { residue: 'repeat' }).cycles!;
    const out: string[] = [];
    for (let i = 0; i < c.length; i++) {
      const r = c.row(i);
      expect(r.count).toBe(1);
      out.push([r.startIndex, r.turnIndex].sort((a, b) => a - b).join('/'));
    }
    return out.sort();
  };
  const pairs = (r: NotchTrackResult) => r.loops.toRows().map((l) => [l.startIndex, l.turnIndex].sort((a, b) => a - b).join('/')).sort();

  it('stabilised loops are exactly the repeat rainflow cycles; a third pass equals the second', () => {
    checkProperty(
      'stabilised == repeat rainflow',
      fc.property(gridHistory(), (h) => {
        // A plateau across the seam (first sample equal to the last) is named by its last-block
        // sample here and by its first sample in rainflow's repeat residue: same loops, other index.
        fc.pre(h[0] !== h[h.length - 1]);
        const block = h.map((x) => x * S);
        const r = trackNotchRepeating(block, opts);
        expect(pairs(r.stabilised)).toEqual(cycles(h));
        expect(r.stabilised.loops.totalCount()).toBe(cycles(h).length);
        // third pass by streaming
        const t = new TrackerCore(opts);
        t.push(block);
        t.restartIndex(0);
        t.push(block);
        const n2 = t.loops.length;
        t.restartIndex(0);
        t.push(block);
        const all = t.loops.toRows();
        const p2 = all.slice(n2 - r.stabilised.loops.length, n2);
        expect(all.slice(n2)).toEqual(p2);
        // the same loops, listed from just after the largest |value| (closed after it, then up to it)
        const m = r.largestIndex;
        const rotated = r.reusedFirstPass ? [...p2.filter((l) => l.closeIndex > m), ...p2.filter((l) => l.closeIndex <= m)] : p2;
        expect(r.stabilised.loops.toRows()).toEqual(rotated);
      }),
    );
  });

  it('the shortcut equals a second pass tracked in full: reversals, loops, residue, for any initial value and offset', () => {
    checkProperty(
      'repeating shortcut == full second pass',
      fc.property(gridHistory(), fc.integer({ min: -9, max: 9 }), fc.integer({ min: -2, max: 2 }), (h, init, off) => {
        const o: NotchTrackerOptions = { ...opts, initial: init * S, offset: off * S };
        const block = h.map((x) => x * S);
        const r = trackNotchRepeating(block, o);
        const t = new TrackerCore(o);
        t.push(block);
        const first = t.end();
        t.restartIndex(0);
        const nRev = t.reversals.length;
        const nLoops = t.loops.length;
        // the second pass in two parts: up to the largest |value|, then the rest
        const m = Math.max(0, r.largestIndex);
        t.push(block.slice(0, m + 1));
        const splitRev = t.reversals.length - nRev;
        const splitLoops = t.loops.length - nLoops;
        t.push(block.slice(m + 1));
        const all = t.end();
        expect(r.first.reversals.toRows()).toEqual(first.reversals.toRows());
        expect(r.first.loops.toRows()).toEqual(first.loops.toRows());
        expect(r.first.residue.toRows()).toEqual(first.residue.toRows());
        // listed from just after the largest |value| when the shortcut was taken, else from sample 0
        const rotate = <T>(rows: T[], k: number) => (r.reusedFirstPass ? [...rows.slice(k), ...rows.slice(0, k)] : rows);
        expect(r.stabilised.reversals.toRows()).toEqual(rotate(all.reversals.toRows().slice(nRev), splitRev));
        expect(r.stabilised.loops.toRows()).toEqual(rotate(all.loops.toRows().slice(nLoops), splitLoops));
        expect(r.stabilised.residue.toRows()).toEqual(all.residue.toRows());
        // the tables may share storage, yet adding to or writing through one leaves the other as it was
        const before = r.stabilised.loops.toRows();
        const beforeRev = r.stabilised.reversals.toRows();
        r.first.loops.add(1, 2, 3, 4, 5, 6, 7, 1);
        r.first.reversals.add(1, 2, 3, 4);
        for (const c of Object.values(r.first.loops.columns())) c.fill(-1);
        for (const c of Object.values(r.first.reversals.columns())) c.fill(-1);
        expect(r.stabilised.loops.toRows()).toEqual(before);
        expect(r.stabilised.reversals.toRows()).toEqual(beforeRev);
        // the largest |value| found without a scan of its own is the first sample of largest |value|
        const mags = block.map((x) => Math.abs(x + off * S));
        expect(r.largestIndex).toBe(mags.indexOf(Math.max(...mags)));
      }),
    );
  });

  it('largestPoint: the first sample of largest |value|, its table rows and the memory right after it', () => {
    checkProperty(
      'largestPoint',
      fc.property(gridHistory(), fc.integer({ min: -9, max: 9 }), (h, init) => {
        const o: NotchTrackerOptions = { ...opts, initial: init * S };
        const block = h.map((x) => x * S);
        const t = new TrackerCore(o);
        t.push(block);
        const p = t.largestPoint();
        const mags = block.map(Math.abs);
        const best = Math.max(...mags);
        const moves = block.some((x) => x !== init * S);
        if (!moves || !(Math.abs(init * S) < best)) {
          expect(p).toBeNull();
          return;
        }
        expect(p).not.toBeNull();
        const m = mags.indexOf(best);
        expect(p!.index).toBe(m);
        expect(p!.value).toBe(block[m]);
        // replay up to the point and compare with what the tracker saw then
        const u = new TrackerCore(o);
        u.push(block.slice(0, m + 1));
        expect(u.matches(p!.after)).toBe(true);
        expect(p!.loopRow).toBe(u.loops.length);
        expect(p!.reversalRow).toBe(u.reversals.length);
      }),
    );
  });

  it('rotating the block changes nothing in the stabilised result', () => {
    checkProperty(
      'rotation',
      fc.property(gridHistory(), fc.nat(), (h, k) => {
        const block = h.map((x) => x * S);
        const n = block.length;
        const s = k % n;
        const rot = [...block.slice(s), ...block.slice(0, s)];
        const key = (r: NotchTrackResult, _shift: number) =>
          r.loops
            .toRows()
            // Loop values only: with exactly repeated equal ranges which of the equal reversals pair up is a tie-break.
            .map((l) => `${l.stressMax.toPrecision(8)}/${l.stressMin.toPrecision(8)}/${l.strainMax.toPrecision(8)}/${l.strainMin.toPrecision(8)}`)
            .sort();
        expect(key(trackNotchRepeating(rot, opts).stabilised, s)).toEqual(key(trackNotchRepeating(block, opts).stabilised, 0));
      }),
    );
  });
});

describe('trackNotch: inputs, limits and bad input', () => {
  it('elastic limit (very large K\'): σ = Kt·S exactly', () => {
    const m = defineMaterial({ ...sae1045, K: 1e15 });
    const r = trackNotch([0, 100, -80, 120], { material: m, Kt: 3 });
    expect(r.reversals.row(0).stress).toBe(300);
    expect(r.reversals.row(1).stress).toBe(-240);
  });

  it('local-strain input matches the direct curve formulas', () => {
    const r = trackNotch([0, 0.006, -0.004, 0.002], { material: sae1045, input: 'local-strain' });
    const rows = r.reversals.toRows();
    expect(rows[0].stress).toBe(cyclicStress(sae1045, 0.006));
    expect(rows[1].stress).toBe(cyclicStress(sae1045, 0.006) - masingStressRange(sae1045, 0.01));
    expect(rows[1].strain).toBeCloseTo(-0.004, 15);
  });

  it('pseudo-elastic input equals nominal input times Kt', () => {
    const a = trackNotch([0, 200, -150, 210], { material: sae1045, input: 'pseudo-elastic' });
    const b = trackNotch([0, 100, -75, 105], { material: sae1045, Kt: 2 });
    expect(a.reversals.columns().stress).toEqual(b.reversals.columns().stress);
  });

  it('Kt < 1, missing Kt, NaN and Infinity samples (named index), zero history, huge loads', () => {
    expect(() => trackNotch([1], { material: sae1045, Kt: 0.9 })).toThrow(NotchOptionError);
    expect(() => trackNotch([1], { material: sae1045 })).toThrow(/Kt/);
    try {
      trackNotch([0, 1, NaN], opts);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(NotchSampleError);
      expect((e as NotchSampleError).index).toBe(2);
      expect((e as NotchSampleError).code).toBe('non-finite-sample');
    }
    expect(() => trackNotch([Infinity], opts)).toThrow(/history\[0\]/);
    const zero = trackNotch([0, 0, 0], opts);
    expect(zero.reversals.length).toBe(0);
    expect(zero.loops.length).toBe(0);
    expect(zero.residue.toRows()).toEqual([{ index: -1, value: 0, stress: 0, strain: 0 }]);
    expect(trackNotch([], opts).residue.length).toBe(1);
    const big = trackNotch([0, 1e6, -1e6, 1e6], opts);
    expect(big.beyondStrainLimit).toBe(true);
    expect(big.firstBeyondIndex).toBe(1);
    for (const v of big.reversals.columns().stress) expect(Number.isFinite(v)).toBe(true);
    expect(() => trackNotch([0, 1e308, -1e308], opts)).toThrow(NotchValidityError);
    expect(() => NotchTracker.fromJSON({} as never)).toThrow(NotchStateError);
  });
});
