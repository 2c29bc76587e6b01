import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { grownCapacity, RowShare, widenColumn } from '@loopwise/base';
import { checkProperty } from '../../../test/property';

describe('widenColumn(column, used, capacity)', () => {
  test('widenColumn keeps the first used entries, zeros after them, in a new column', () => {
    const column = Float64Array.of(1, -0, 3);
    const wide = widenColumn(column, 2, 4);
    expect(Array.from(wide)).toEqual([1, -0, 0, 0]);
    expect(Object.is(wide[1], -0)).toBe(true);
    wide[0] = 99;
    expect(column[0]).toBe(1); // shares nothing
  });

  test('widenColumn of a view copies only the view\'s rows', () => {
    const storage = Float64Array.of(1, 2, 3, 4, 5);
    const wide = widenColumn(storage.subarray(2), 3, 3);
    expect(Array.from(wide)).toEqual([3, 4, 5]);
    expect(wide.buffer).not.toBe(storage.buffer);
  });

  test('widenColumn(column, 0, capacity) is an empty column of that capacity', () => {
    expect(Array.from(widenColumn(new Float64Array(0), 0, 3))).toEqual([0, 0, 0]);
  });
});

describe('grownCapacity(capacity, needed)', () => {
  test('grownCapacity doubles from at least 16 until needed fits', () => {
    expect(grownCapacity(16, 17)).toBe(32);
    expect(grownCapacity(0, 1)).toBe(16);
    expect(grownCapacity(100, 50)).toBe(100);
    expect(grownCapacity(1024, 5000)).toBe(8192);
  });

  test('grownCapacity(c, n) is the smallest doubling of max(c, 16) that holds n', () => {
    checkProperty(
      'grown capacity',
      fc.property(fc.integer({ min: 0, max: 1e6 }), fc.integer({ min: 0, max: 1e8 }), (capacity, needed) => {
        const c = grownCapacity(capacity, needed);
        const start = Math.max(capacity, 16);
        expect(c).toBeGreaterThanOrEqual(needed);
        expect(c).toBeGreaterThanOrEqual(start);
        expect(Number.isInteger(Math.log2(c / start))).toBe(true);
        if (c > start) expect(c / 2).toBeLessThan(needed);
      }),
      { numRuns: 1000 },
    );
  });
});

describe('new RowShare(holders).leave() and .join()', () => {
  test('every holder but the last must copy when it leaves', () => {
    const share = new RowShare(3);
    expect([share.leave(), share.leave(), share.leave()]).toEqual([true, true, false]);
  });

  test('join() adds a holder, who must then be left too', () => {
    const share = new RowShare(1);
    share.join();
    expect(share.leave()).toBe(true);
    expect(share.leave()).toBe(false);
  });

  test('two tables on one storage: the first to write copies, so writing one never changes the other', () => {
    // Arrange: a minimal table of one column, as rainflow's and notch's tables use the share
    class Column {
      constructor(
        private data: Float64Array,
        private share: RowShare | null,
      ) {}
      values(): Float64Array {
        if (this.share !== null) {
          if (this.share.leave()) this.data = widenColumn(this.data, this.data.length, this.data.length);
          this.share = null;
        }
        return this.data;
      }
    }
    const storage = Float64Array.of(1, 2, 3);
    const share = new RowShare(2);
    const a = new Column(storage, share);
    const b = new Column(storage, share);
    // Act
    a.values().fill(-1);
    const bv = b.values();
    // Assert: b kept the storage (the last holder does not copy) and its rows
    expect(Array.from(bv)).toEqual([1, 2, 3]);
    expect(bv).toBe(storage);
  });
});
