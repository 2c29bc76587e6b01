import { checkDamage } from './LoopDamageColumns';
import { MinerError } from './MinerError';
import { MinerSum } from './MinerSum';

/**
 * Row indices of the `n` most damaging loops, most damaging first; ties go to the lower index.
 * Partial selection with a bounded min-heap in typed arrays: O(L log n) for L loops and O(n)
 * memory, no sort of all loops. Fewer than `n` loops give all of them, in that order.
 *
 * Reference: heap selection (J. W. J. Williams, "Algorithm 232: Heapsort", Comm. ACM 7 (1964)
 * 347-348); the order is (damage descending, index ascending).
 *
 * @param loops a MinerSum, its columns, or any `{ damage }` column (finite values ≥ 0)
 * @param n how many, an integer ≥ 0
 * @throws {MinerError} `invalid-argument` for a bad `n` or a damage value NaN, ±Infinity or
 *   negative (naming its index).
 * @example
 * mostDamagingLoops({ damage: [0.1, 0.5, 0.2, 0.5] }, 3); // returns Uint32Array [1, 3, 2]
 */
export function mostDamagingLoops(loops: MinerSum | { damage: ArrayLike<number> }, n: number): Uint32Array {
  const damage = loops instanceof MinerSum ? loops.columns().damage : loops?.damage;
  if (damage === null || typeof damage !== 'object' || typeof damage.length !== 'number') {
    throw new MinerError('invalid-argument', 'damage', damage, 'must be an array-like column of numbers');
  }
  if (!(Number.isInteger(n) && n >= 0)) throw new MinerError('invalid-argument', 'n', n, 'must be an integer >= 0');
  const total = damage.length;
  const k = Math.min(n, total);
  // heap[0] is the weakest kept loop: smallest damage, and among equal damage the largest index.
  const heap = new Uint32Array(k);
  let size = 0;
  const weaker = (a: number, b: number) => damage[a] < damage[b] || (damage[a] === damage[b] && a > b);
  const siftDown = (from: number) => {
    let i = from;
    for (;;) {
      const l = 2 * i + 1;
      if (l >= size) return;
      const r = l + 1;
      const w = r < size && weaker(heap[r], heap[l]) ? r : l;
      if (!weaker(heap[w], heap[i])) return;
      const t = heap[i];
      heap[i] = heap[w];
      heap[w] = t;
      i = w;
    }
  };
  for (let i = 0; i < total; i++) {
    const d = damage[i];
    checkDamage(d, i);
    if (size < k) {
      let j = size++;
      heap[j] = i;
      while (j > 0) {
        const p = (j - 1) >> 1;
        if (!weaker(heap[j], heap[p])) break;
        const t = heap[j];
        heap[j] = heap[p];
        heap[p] = t;
        j = p;
      }
    } else if (k > 0 && d > damage[heap[0]]) {
      // i is later than every kept index, so on equal damage it loses: strictly greater only
      heap[0] = i;
      siftDown(0);
    }
  }
  // pop the weakest to the back: the array ends strongest first
  const out = new Uint32Array(k);
  for (let j = k - 1; j >= 0; j--) {
    out[j] = heap[0];
    heap[0] = heap[--size];
    siftDown(0);
  }
  return out;
}
