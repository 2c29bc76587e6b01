import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { assessDutyCycle, assessLife, LifeSession, type LifeReport } from '@loopwise/engine';
import { checkProperty } from '../../../test/property';
import { sae1045 } from './support';

// The tracking stage is one route for every gate: turning points with their sample indices into
// the repeating notch tracker. These tests hold it to that: a gate too small to remove anything
// gives the report that no gate gives, in batch and streaming alike.

/** Everything of a report but the echoed gate (the one input that differs). */
function comparable(r: LifeReport) {
  const { inputs, gate, ...rest } = r;
  return { ...rest, inputs: { ...inputs, gate: null }, removed: gate.removedReversals, loops: Object.fromEntries(Object.entries(r.loops).map(([k, v]) => [k, Array.from(v)])) };
}

const job = { material: sae1045, notch: { Kt: 2.2 }, meanStress: 'smithWatsonTopper' as const };

describe('trackDutyCycle (through assessLife and assessDutyCycle): one route for every gate', () => {
  test('assessLife([0, 100, 20, 105, 120, 0]) closes its loops at the same indices with gate 0 and gate 1e-9', () => {
    const h = [0, 100, 20, 105, 120, 0].map((x) => x * 3);
    const a = assessLife(h, { ...job, repeating: false });
    const b = assessLife(h, { ...job, repeating: false, gate: 1e-9 });
    // 105 is no turning point: the loop 100/20 closes at the turning point 120 (index 4)
    expect(Array.from(a.loops.closeIndex)).toEqual(Array.from(b.loops.closeIndex));
    expect(Array.from(a.loops.closeIndex)[0]).toBe(4);
  });

  test('assessLife(history, { gate: 0 }) and { gate: 1e-300 } give the same report on histories without ties that small', () => {
    checkProperty(
      'gate 0 == gate 1e-300',
      fc.property(
        fc.array(fc.integer({ min: -12, max: 12 }), { minLength: 1, maxLength: 40 }),
        fc.boolean(),
        fc.integer({ min: -3, max: 3 }),
        (grid, repeating, init) => {
          const h = grid.map((x) => x * 25);
          const o = { ...job, repeating, initial: init * 25 };
          const a = assessLife(h, o);
          const b = assessLife(h, { ...o, gate: 1e-300 });
          expect(b.gate.removedReversals).toBe(0);
          expect(comparable(b)).toEqual(comparable(a));
        },
      ),
      { numRuns: 150 },
    );
  });

  test('assessDutyCycle(events, { gate: 1e-300 }) equals the ungated duty cycle; LifeSession too', () => {
    checkProperty(
      'duty cycle and stream: gate 0 == gate 1e-300',
      fc.property(
        fc.array(fc.array(fc.integer({ min: -10, max: 10 }), { minLength: 1, maxLength: 15 }), { minLength: 1, maxLength: 3 }),
        fc.array(fc.integer({ min: 1, max: 4 }), { minLength: 3, maxLength: 3 }),
        (blocks, repeats) => {
          const events = blocks.map((b, k) => ({ name: `e${k}`, history: b.map((x) => x * 30), repeats: repeats[k] }));
          const a = assessDutyCycle(events, job);
          const b = assessDutyCycle(events, { ...job, gate: 1e-300 });
          expect(comparable(b)).toEqual(comparable(a));
          // one history streamed, gated and not, equals the batch report
          const h = events[0].history;
          for (const gate of [0, 1e-300]) {
            const s = new LifeSession({ ...job, gate });
            s.push(h);
            if (s.endFirstPass() > 0) s.pushSecondPass(h);
            expect(comparable(s.finish())).toEqual(comparable(assessLife(h, job)));
          }
        },
      ),
      { numRuns: 100 },
    );
  });
});
