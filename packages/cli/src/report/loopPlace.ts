import type { WorstLoop } from '@loopwise/engine';

/** Where a loop starts or turns in a duty cycle: the event and the sample inside it (0-based). */
export interface EventSample {
  event: string;
  sample: number;
}

/**
 * The event-local samples of a loop's start and turn. A report's loop indices are schedule
 * indices (the events' files one after the other, each once); `events` are the report's events in
 * schedule order with their sample counts. An index of -1 (the initial state) gives null.
 *
 * @example
 * localPlaces({ startIndex: 13173, turnIndex: 13652 } as WorstLoop, [{ name: 'track', samples: 12000 }, { name: 'yard', samples: 1997 }]);
 * // returns { start: { event: 'yard', sample: 1173 }, turn: { event: 'yard', sample: 1652 } }
 */
export function localPlaces(
  loop: Pick<WorstLoop, 'startIndex' | 'turnIndex'>,
  events: readonly { name: string; samples: number }[],
): { start: EventSample | null; turn: EventSample | null } {
  const place = (i: number): EventSample | null => {
    if (i < 0) return null;
    let first = 0;
    for (const e of events) {
      if (i < first + e.samples) return { event: e.name, sample: i - first };
      first += e.samples;
    }
    return null;
  };
  return { start: place(loop.startIndex), turn: place(loop.turnIndex) };
}

/**
 * A loop's place for people. One history: `samples 3786–5717`, and a loop that closes over the
 * seam of the repeating history reads `samples 8347 (end of one repeat) – 2749 (next repeat)`. A
 * duty cycle names the events: `farm track samples 3786–5717`, `yard sample 1990 → farm track
 * sample 12`, and over the seam `farm track samples 8347 → 2749 of its next repeat`.
 */
export function loopPlaceText(loop: Pick<WorstLoop, 'startIndex' | 'turnIndex'>, events: readonly { name: string; samples: number }[]): string {
  const seam = loop.startIndex > loop.turnIndex && loop.turnIndex >= 0;
  if (events.length <= 1) {
    if (loop.startIndex < 0) return `from the initial state to sample ${loop.turnIndex}`;
    return seam ? `samples ${loop.startIndex} (end of one repeat) – ${loop.turnIndex} (next repeat)` : `samples ${loop.startIndex}–${loop.turnIndex}`;
  }
  const { start, turn } = localPlaces(loop, events);
  if (start === null || turn === null) return `from the initial state to ${turn ? `${turn.event} sample ${turn.sample}` : `schedule sample ${loop.turnIndex}`}`;
  if (start.event === turn.event) return seam ? `${start.event} samples ${start.sample} → ${turn.sample} of its next repeat` : `${start.event} samples ${start.sample}–${turn.sample}`;
  return `${start.event} sample ${start.sample} → ${turn.event} sample ${turn.sample}${seam ? ' of the next repeat' : ''}`;
}
