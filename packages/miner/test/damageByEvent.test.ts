import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { MinerSum, damageByEvent } from '@loopwise/miner';
import { checkProperty } from '../../../test/property';
import { closeRelative, loopRecords, toColumns } from './support/arbitraries';

describe('damageByEvent(loops, events)', () => {
  test('damageByEvent(loops, {starts}) shares a loop that spans two events (the TSDoc example)', () => {
    const loops = { damage: [0.4, 0.2], startIndex: [1, 12], turnIndex: [3, 25] };
    expect(Array.from(damageByEvent(loops, { starts: [0, 10, 20] }))).toEqual([0.4, 0.1, 0.1]);
  });

  test('damageByEvent by starts and by ids agree, and the events sum to the total (property)', () => {
    checkProperty(
      'events sum to total',
      fc.property(
        loopRecords(120),
        fc.uniqueArray(fc.integer({ min: 1, max: 119 }), { maxLength: 6 }).map((a) => [0, ...a.sort((x, y) => x - y)]),
        (loops, starts) => {
          const sum = new MinerSum().addColumns(toColumns(loops));
          const byStarts = damageByEvent(sum, { starts });
          const eventOf = (i: number) => starts.filter((s) => s <= i).length - 1; // brute force
          const byIds = damageByEvent(sum, {
            startEvent: loops.map((l) => eventOf(l.startIndex)),
            turnEvent: loops.map((l) => eventOf(l.turnIndex)),
            eventCount: starts.length,
          });
          expect(Array.from(byStarts)).toEqual(Array.from(byIds));
          expect(closeRelative(byStarts.reduce((a, b) => a + b, 0), sum.damage(), 1e-12)).toBe(true);
        },
      ),
    );
  });

  test('damageByEvent rejects unsorted starts, reversals before the first event and ids out of range', () => {
    const loops = { damage: [0.4], startIndex: [1], turnIndex: [3] };
    expect(() => damageByEvent(loops, { starts: [0, 5, 5] })).toThrow(expect.objectContaining({ code: 'invalid-events', field: 'starts', index: 2 }));
    expect(() => damageByEvent(loops, { starts: [] })).toThrow(expect.objectContaining({ code: 'invalid-events' }));
    expect(() => damageByEvent(loops, { starts: [2] })).toThrow(expect.objectContaining({ code: 'invalid-index', field: 'startIndex', index: 0 }));
    expect(() => damageByEvent(loops, { startEvent: [0], turnEvent: [2], eventCount: 2 })).toThrow(
      expect.objectContaining({ code: 'invalid-events', field: 'turnEvent', value: 2, index: 0 }),
    );
    expect(() => damageByEvent(loops, { startEvent: [0], turnEvent: [0], eventCount: 0 })).toThrow(expect.objectContaining({ field: 'eventCount' }));
    expect(() => damageByEvent(loops, { startEvent: [0, 1], turnEvent: [0], eventCount: 2 })).toThrow(expect.objectContaining({ field: 'startEvent.length' }));
  });
});
