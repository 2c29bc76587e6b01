import { assessDutyCycle } from '@loopwise/engine';
import { handbookSteels } from '@loopwise/material';
import { describe, expect, test } from 'vitest';
import { localPlaces, loopPlaceText } from '../../src/report/loopPlace';

// Issue 11, item 7: duty-cycle worst loops name the event and the event's own sample, and a loop
// over the seam of the repeating history reads as such. Histories INVENTED for the test.
const events = [
  { name: 'track', samples: 1000 },
  { name: 'yard', samples: 300 },
];

describe('where a loop starts and turns', () => {
  test('schedule indices map to the event and its own sample', () => {
    expect(localPlaces({ startIndex: 999, turnIndex: 1000 }, events)).toEqual({ start: { event: 'track', sample: 999 }, turn: { event: 'yard', sample: 0 } });
    expect(loopPlaceText({ startIndex: 1100, turnIndex: 1250 }, events)).toBe('yard samples 100–250');
    expect(loopPlaceText({ startIndex: 900, turnIndex: 20 }, events)).toBe('track samples 900 → 20 of its next repeat');
    expect(loopPlaceText({ startIndex: 1290, turnIndex: 5 }, events)).toBe('yard sample 290 → track sample 5 of the next repeat');
    expect(loopPlaceText({ startIndex: -1, turnIndex: 1005 }, events)).toBe('from the initial state to yard sample 5');
    expect(loopPlaceText({ startIndex: 8347, turnIndex: 2749 }, [])).toBe('samples 8347 (end of one repeat) – 2749 (next repeat)');
    expect(loopPlaceText({ startIndex: 10, turnIndex: 20 }, [{ name: 'history', samples: 100 }])).toBe('samples 10–20');
  });

  test('the engine\'s worst loops of a duty cycle: each local sample holds the value of the loop\'s corner in that event\'s own history', () => {
    const track = Array.from({ length: 1000 }, (_, i) => 1e-6 * (800 * Math.sin(i / 13.1) + 300 * Math.sin(i / 3.3)));
    const yard = Array.from({ length: 300 }, (_, i) => 1e-6 * 1500 * Math.sin(i / 29.7));
    const material = handbookSteels.find((m) => m.name === 'SAE 1045 (hot rolled and normalized)')!;
    const r = assessDutyCycle(
      [
        { name: 'track', history: track, repeats: 3 },
        { name: 'yard', history: yard, repeats: 2 },
      ],
      { material, input: 'local-strain' },
    );
    const hist: Record<string, number[]> = { track, yard };
    expect(r.worstLoops.length).toBeGreaterThan(3);
    const seen = new Set<string>();
    for (const w of r.worstLoops) {
      const { start, turn } = localPlaces(w, r.events);
      expect(start?.event).toBe(w.startEvent);
      expect(turn?.event).toBe(w.turnEvent);
      seen.add(w.startEvent!);
      // a loop's corners are its extremes of local strain: the event's sample there is one of them
      // (to the tracker's round-off: the local-strain route solves for the stress and back)
      for (const p of [start!, turn!]) {
        const x = hist[p.event][p.sample];
        const off = Math.min(Math.abs(x - w.strainMax!), Math.abs(x - w.strainMin!));
        expect(off, JSON.stringify([w, p])).toBeLessThanOrEqual(1e-12 * Math.abs(x));
      }
    }
    expect(seen.size).toBe(2);
  });
});
