import { checkIndex, checkLength } from './checks';
import { checkDamage, loopColumns, type LoopDamageColumns } from './LoopDamageColumns';
import { MinerError } from './MinerError';
import type { MinerSum } from './MinerSum';

/**
 * Events as consecutive stretches of one history: event k holds sample indices
 * [starts[k], starts[k+1]), the last event everything from its start on. `starts` is strictly
 * increasing integers ≥ 0, and no reversal may lie before `starts[0]`.
 */
export interface EventStarts {
  starts: ArrayLike<number>;
}

/**
 * Events given per reversal: `startEvent[i]` is the event of loop i's first reversal,
 * `turnEvent[i]` that of its second, integers in [0, eventCount). For histories whose events are
 * not one sample range each (interleaved, or loops counted across concatenated recordings).
 */
export interface EventIds {
  startEvent: ArrayLike<number>;
  turnEvent: ArrayLike<number>;
  eventCount: number;
}

/**
 * Damage by event: each loop's damage split half to the event of its first reversal and half to
 * the event of its second, so that a loop spanning two events is shared between them and the
 * events' damages sum to the total (up to rounding). Returns one value per event; divide by the
 * total for shares.
 *
 *     E[k] = Σ_i d_i/2 · ([event(s_i) = k] + [event(t_i) = k])
 *
 * Reference: the attribution rule of DESIGN.md (half of a loop's damage to each reversal);
 * common practice, no source. O(loops · log events) for `starts`, O(loops) for ids.
 *
 * @throws {MinerError} `invalid-events` for starts that are not strictly increasing integers ≥ 0,
 *   ids outside [0, eventCount) or a bad eventCount; `invalid-index` for a reversal before the
 *   first event; `invalid-argument` for bad damage values or column lengths.
 * @example
 * const loops = { damage: [0.4, 0.2], startIndex: [1, 12], turnIndex: [3, 25] };
 * damageByEvent(loops, { starts: [0, 10, 20] });
 * // returns Float64Array [0.4, 0.1, 0.1]
 */
export function damageByEvent(loops: MinerSum | LoopDamageColumns, events: EventStarts | EventIds): Float64Array {
  const cols = loopColumns(loops);
  if (events === null || typeof events !== 'object') {
    throw new MinerError('invalid-events', 'events', events, 'must be { starts } or { startEvent, turnEvent, eventCount }');
  }
  return 'starts' in events ? byStarts(cols, events.starts) : byIds(cols, events);
}

function byStarts({ damage, startIndex, turnIndex }: LoopDamageColumns, starts: ArrayLike<number>): Float64Array {
  if (starts === null || typeof starts !== 'object' || typeof starts.length !== 'number' || starts.length < 1) {
    throw new MinerError('invalid-events', 'starts', starts, 'must be a non-empty array of sample indices');
  }
  const m = starts.length;
  const s = Float64Array.from(starts);
  for (let k = 0; k < m; k++) {
    if (!(Number.isInteger(s[k]) && s[k] >= 0)) throw new MinerError('invalid-events', 'starts', s[k], 'must be integers >= 0', k);
    if (k > 0 && !(s[k] > s[k - 1])) {
      throw new MinerError('invalid-events', 'starts', s[k], `must increase strictly (starts[${k - 1}] is ${s[k - 1]})`, k);
    }
  }
  const out = new Float64Array(m);
  for (let i = 0; i < damage.length; i++) {
    const d = damage[i];
    checkDamage(d, i);
    const a = eventOf(s, startIndex[i], 'startIndex', i);
    const b = eventOf(s, turnIndex[i], 'turnIndex', i);
    out[a] += d * 0.5;
    out[b] += d * 0.5;
  }
  return out;
}

function eventOf(starts: Float64Array, v: number, field: string, i: number): number {
  checkIndex(v, field, i);
  if (v < starts[0]) throw new MinerError('invalid-index', field, v, `lies before the first event's start ${starts[0]}`, i);
  let lo = 0;
  let hi = starts.length;
  while (hi - lo > 1) {
    const mid = (lo + hi) >>> 1;
    if (starts[mid] <= v) lo = mid;
    else hi = mid;
  }
  return lo;
}

function byIds({ damage }: LoopDamageColumns, events: EventIds): Float64Array {
  const { startEvent, turnEvent, eventCount } = events;
  const n = damage.length;
  if (!(Number.isInteger(eventCount) && eventCount >= 1)) {
    throw new MinerError('invalid-events', 'eventCount', eventCount, 'must be an integer >= 1');
  }
  checkLength(startEvent, n, 'startEvent');
  checkLength(turnEvent, n, 'turnEvent');
  const out = new Float64Array(eventCount);
  for (let i = 0; i < n; i++) {
    const d = damage[i];
    checkDamage(d, i);
    const a = startEvent[i];
    const b = turnEvent[i];
    if (!(Number.isInteger(a) && a >= 0 && a < eventCount)) {
      throw new MinerError('invalid-events', 'startEvent', a, `must be an integer in [0, ${eventCount})`, i);
    }
    if (!(Number.isInteger(b) && b >= 0 && b < eventCount)) {
      throw new MinerError('invalid-events', 'turnEvent', b, `must be an integer in [0, ${eventCount})`, i);
    }
    out[a] += d * 0.5;
    out[b] += d * 0.5;
  }
  return out;
}
