/**
 * Helpers of the growable struct-of-arrays tables (rainflow's cycles, notch's loops and
 * reversals): each table keeps one Float64Array field per column, so its hot `add` stays a
 * direct monomorphic store; these functions hold the parts every such table shares.
 */

/**
 * A new column of `capacity` entries (`capacity` >= `used`) holding the first `used` entries of
 * `column`, zeros after them. The new column shares nothing with `column`.
 *
 * @example
 * widenColumn(Float64Array.of(1, 2, 3), 2, 4)
 * // returns Float64Array [1, 2, 0, 0]
 */
export function widenColumn(column: Float64Array, used: number, capacity: number): Float64Array {
  const out = new Float64Array(capacity);
  out.set(column.subarray(0, used));
  return out;
}

/**
 * The capacity to grow to when `needed` rows must fit into a table of `capacity` rows: the
 * capacity (at least 16) doubled until `needed` fits, so n rows cost O(n) copying in all.
 *
 * @example
 * grownCapacity(16, 17)
 * // returns 32
 * grownCapacity(0, 1)
 * // returns 16
 */
export function grownCapacity(capacity: number, needed: number): number {
  let c = capacity < 16 ? 16 : capacity;
  while (c < needed) c *= 2;
  return c;
}

/**
 * The sharing of one storage between tables (honest views). A table made as a view of another
 * table's rows holds the same `RowShare` as every other table on that storage. Before a table
 * hands out its columns or adds a row, it calls {@link RowShare.leave}: when other tables still
 * hold the storage, it must move its rows to storage of its own first (the call returns true),
 * so that writing through one table's columns never changes another table. The last holder
 * keeps the storage without a copy.
 *
 * @example
 * const share = new RowShare(2); // two tables on one storage
 * share.leave(); // returns true: the first to leave copies
 * share.leave(); // returns false: the last one keeps the storage
 */
export class RowShare {
  private holders: number;

  /** @param holders the number of tables on the storage (>= 1) */
  constructor(holders: number) {
    this.holders = holders;
  }

  /** A table stops using the shared storage; true when it must copy its rows first. */
  leave(): boolean {
    this.holders--;
    return this.holders > 0;
  }

  /** One more table on the storage. */
  join(): void {
    this.holders++;
  }
}
