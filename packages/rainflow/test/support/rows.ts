import type { CycleTable } from '@loopwise/rainflow';
import type { RefCycle } from './astmE1049.mjs';

/** Rows of a cycle table as plain objects, in table order. */
export function rows(table: CycleTable | null): ReturnType<CycleTable['row']>[] {
  if (!table) throw new Error('expected a cycle table');
  return Array.from({ length: table.length }, (_, i) => table.row(i));
}

/** A canonical, order-free key list of cycles: from, to, count, start and turn index. */
export function cycleKeys(cycles: Array<Pick<RefCycle, 'from' | 'to' | 'count' | 'startIndex' | 'turnIndex'>>): string[] {
  return cycles.map((c) => `${c.from}|${c.to}|${c.count}|${c.startIndex}|${c.turnIndex}`).sort();
}

/** Order-free list of (range, mean, count): what a repeating-history count is compared on. */
export function rangeMeanKeys(cycles: Array<Pick<RefCycle, 'from' | 'to' | 'count'>>): string[] {
  return cycles.map((c) => `${Math.abs(c.to - c.from)}|${(c.from + c.to) / 2}|${c.count}`).sort();
}

/** Exact column-by-column equality (Object.is, so -0 and 0 differ). */
export function sameTable(a: CycleTable | null, b: CycleTable | null): boolean {
  if (!a || !b) return a === b;
  if (a.length !== b.length) return false;
  const ca = a.columns();
  const cb = b.columns();
  for (const k of Object.keys(ca) as (keyof typeof ca)[]) {
    for (let i = 0; i < a.length; i++) if (!Object.is(ca[k][i], cb[k][i])) return false;
  }
  return true;
}
