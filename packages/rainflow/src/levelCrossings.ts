import { checkHistory } from './checkHistory';
import { InvalidOptionError } from './errors';
import type { GateOptions } from './gateRange';
import { turningPoints } from './turningPoints';

/** Level-crossing counts at given levels. */
export interface LevelCrossings {
  levels: Float64Array;
  /** Up-crossings: rising half cycles p → q with p < level <= q. */
  up: Float64Array;
  /** Down-crossings: falling half cycles p → q with q < level <= p. */
  down: Float64Array;
}

/**
 * Counts how often the history crosses each level, upwards and downwards.
 *
 * A rising excursion from p to q crosses level L upwards when p < L <= q; a falling one from p
 * to q crosses it downwards when q < L <= p (a level touched at an extreme counts on the side it
 * was reached from). Counted on turning points, so plateaus and monotone runs cost nothing;
 * O(turning points × log levels + levels).
 *
 * Reference: ASTM E1049-85 (reapproved 2017), 5.1 (level-crossing counting). That clause also
 * counts crossings of the reference level and may restrict counting to positive slopes above it
 * and negative below; these counts keep both directions at every level, from which either form
 * follows.
 *
 * @example
 * levelCrossings([0, 3, -1, 2], [0, 1, 2, 3]).up;   // returns Float64Array [1, 2, 2, 1]
 * levelCrossings([0, 3, -1, 2], [0, 1, 2, 3]).down; // returns Float64Array [1, 1, 1, 1]
 */
export function levelCrossings(history: ArrayLike<number>, levels: ArrayLike<number>, options: GateOptions = {}): LevelCrossings {
  checkHistory(levels as ArrayLike<number>, 0);
  const L = Float64Array.from(levels);
  for (let i = 0; i < L.length; i++) {
    if (!Number.isFinite(L[i])) throw new InvalidOptionError(`levels[${i}]`, L[i], 'levels must be finite');
    if (i > 0 && !(L[i] > L[i - 1])) throw new InvalidOptionError(`levels[${i}]`, L[i], 'levels must increase strictly');
  }
  const tp = turningPoints(history, options).values;
  const du = new Float64Array(L.length + 1);
  const dd = new Float64Array(L.length + 1);
  for (let k = 0; k + 1 < tp.length; k++) {
    const p = tp[k];
    const q = tp[k + 1];
    if (q > p) {
      du[firstAbove(L, p)] += 1; // first level > p
      du[firstAbove(L, q)] -= 1; // levels <= q end here
    } else {
      dd[firstAbove(L, q)] += 1;
      dd[firstAbove(L, p)] -= 1;
    }
  }
  const up = new Float64Array(L.length);
  const down = new Float64Array(L.length);
  let su = 0;
  let sd = 0;
  for (let i = 0; i < L.length; i++) {
    su += du[i];
    sd += dd[i];
    up[i] = su;
    down[i] = sd;
  }
  return { levels: L, up, down };
}

/** Index of the first level strictly above v (levels.length if none). */
function firstAbove(levels: Float64Array, v: number): number {
  let lo = 0;
  let hi = levels.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (levels[mid] > v) hi = mid;
    else lo = mid + 1;
  }
  return lo;
}
