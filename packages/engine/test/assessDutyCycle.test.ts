import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { assessDutyCycle, assessLife, EngineError } from '@loopwise/engine';
import { checkProperty } from '../../../test/property';
import { sae1045 } from './support';

const rel = (a: number, b: number) => (a === b ? 0 : Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(b)));

function concatenate(events: { history: number[]; repeats: number }[]): number[] {
  const out: number[] = [];
  for (const e of events) for (let r = 0; r < e.repeats; r++) out.push(...e.history);
  return out;
}

const eventArb = fc.record({
  history: fc.array(fc.integer({ min: -250, max: 250 }), { minLength: 2, maxLength: 12 }),
  repeats: fc.integer({ min: 3, max: 7 }),
});

describe('assessDutyCycle(events, job)', () => {
  test('a duty cycle equals the brute-force concatenation of its repeats, the largest loop spanning events', () => {
    checkProperty(
      'duty cycle = concatenation',
      fc.property(fc.array(eventArb, { minLength: 3, maxLength: 4 }), fc.boolean(), (generated, repeating) => {
        // the largest loop spans events: the schedule's highest peak in the first event and its
        // lowest valley in the last (copies: generated values must not be mutated)
        const events = generated.map((e) => ({ ...e, history: [...e.history] }));
        events[0].history.push(400);
        events[events.length - 1].history.push(-400);
        const named = events.map((e, k) => ({ name: `event ${k}`, ...e }));
        const job = { material: sae1045, notch: { Kt: 2 }, repeating };
        const duty = assessDutyCycle(named, job);
        const flat = assessLife(concatenate(events), job);
        expect(rel(duty.damage.perRepeat, flat.damage.perRepeat)).toBeLessThan(1e-9);
        expect(rel(duty.damage.firstPass, flat.damage.firstPass)).toBeLessThan(1e-9);
        const total = (r: typeof duty) => r.loops.count.reduce((a, b) => a + b, 0);
        expect(total(duty)).toBe(total(flat));
        // event shares sum to the total
        expect(rel(duty.events.reduce((a, e) => a + e.damage, 0), duty.damage.perRepeat)).toBeLessThan(1e-9);
        // the largest loop (from 400 to -400 nominal) spans the first and the last event
        let largest = 0;
        for (let i = 1; i < duty.loops.count.length; i++) {
          if (duty.loops.strainMax[i] - duty.loops.strainMin[i] > duty.loops.strainMax[largest] - duty.loops.strainMin[largest]) largest = i;
        }
        const spans = new Set([duty.loops.startEvent[largest], duty.loops.turnEvent[largest]]);
        expect(spans).toEqual(new Set([0, events.length - 1]));
        // the second pass took the shortcut (a peak of 400 beats every generated value)
        if (repeating) expect(duty.damage.reusedFirstPass).toBe(true);
      }),
      { numRuns: 60 },
    );
  });

  test('the gate warning bounds the damage the gate removed from a duty cycle (each event gated on its own)', () => {
    const ev = fc.record({ history: fc.array(fc.integer({ min: -350, max: 350 }), { minLength: 1, maxLength: 12 }), repeats: fc.integer({ min: 1, max: 4 }) });
    checkProperty(
      'duty-cycle gate bound holds',
      fc.property(fc.array(ev, { minLength: 2, maxLength: 4 }), fc.integer({ min: 5, max: 150 }), fc.boolean(), (events, gate, repeating) => {
        const job = { material: sae1045, notch: { Kt: 2 }, repeating };
        const full = assessLife(concatenate(events), job).damage.perRepeat;
        const gated = assessDutyCycle(events.map((e, k) => ({ name: `event ${k}`, ...e })), { ...job, gate });
        const w = gated.warnings.find((x) => x.code === 'gate-removed-damage');
        const bound = w ? Number(w.details.damageBound) : 0;
        expect(full - gated.damage.perRepeat).toBeLessThanOrEqual(bound + 1e-12 * full);
      }),
      { numRuns: 200 },
    );
  });

  test('cost grows with the events, not their repeat counts: 10^6 repeats take about as long as 10', () => {
    const event = Array.from({ length: 2000 }, (_, i) => 180 * Math.sin(i * 0.37) + 60 * Math.sin(i * 1.9));
    const job = { material: sae1045, notch: { Kt: 2.5 } };
    const t0 = performance.now();
    const few = assessDutyCycle([{ name: 'e', history: event, repeats: 10 }], job);
    const t1 = performance.now();
    const many = assessDutyCycle([{ name: 'e', history: event, repeats: 1_000_000 }], job);
    const t2 = performance.now();
    expect(rel(many.damage.perRepeat / few.damage.perRepeat, 1e5)).toBeLessThan(1e-6);
    expect(t2 - t1).toBeLessThan(10 * (t1 - t0) + 50);
  });

  test('durations give the service per repeat of the schedule', () => {
    const r = assessDutyCycle(
      [
        { name: 'cobbles', history: [0, 250, -200, 0], repeats: 4, duration: 0.25 },
        { name: 'yard', history: [0, 80, -60, 0], repeats: 2, duration: 1 },
      ],
      { material: sae1045, notch: { Kt: 2 }, unit: { label: 'h' } },
    );
    expect(r.life.perRepeat).toBe(3);
    expect(r.life.service).toBeCloseTo(3 * r.life.repeats, 9);
    expect(r.events.map((e) => e.name)).toEqual(['cobbles', 'yard']);
  });

  test('bad events get clear errors naming the event and field', () => {
    const job = { material: sae1045 };
    expect(() => assessDutyCycle([], job)).toThrow(/at least one event/);
    expect(() => assessDutyCycle([{ name: 'a', history: [1, 2], repeats: 0 }], job)).toThrow(/events\[0\].repeats/);
    expect(() => assessDutyCycle([{ name: 'a', history: [1, 2], repeats: 0.5 }], job)).toThrow(EngineError);
    expect(() => assessDutyCycle([{ name: 'a', history: [1, 2], repeats: 1, duration: -1 }], job)).toThrow(/events\[0\].duration/);
    expect(() => assessDutyCycle([{ name: 'a', history: [], repeats: 1 }], job)).toThrow(/event 'a' has no samples/);
    expect(() => assessDutyCycle([{ name: '', history: [1], repeats: 1 }], job)).toThrow(/events\[0\].name/);
    expect(() =>
      assessDutyCycle(
        [
          { name: 'a', history: [1, 2], repeats: 1 },
          { name: 'b', history: [1, NaN], repeats: 1 },
        ],
        job,
      ),
    ).toThrow(/sample 1 of event 'b' is NaN/);
    expect(() =>
      assessDutyCycle([{ name: 'a', history: [1, 2], repeats: 1, duration: 1 }], { material: sae1045, unit: { label: 'h', perRepeat: 2 } }),
    ).toThrow(/not both/);
  });
});
