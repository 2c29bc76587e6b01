import { checkHistory, checkOptionFields } from './checkHistory';
import type { CycleSink } from './CycleSink';
import { gateRange, type GateOptions } from './gateRange';
import { RainflowCounter, type RainflowResult, type ResiduePolicy } from './RainflowCounter';

/** Options of {@link rainflowFourPoint}. */
export interface RainflowOptions extends GateOptions {
  /** Residue policy; default `'half'` (ASTM E1049-85, 5.4.4). */
  residue?: ResiduePolicy;
  /** Sample index of `history[0]`; default 0. */
  startIndex?: number;
  /** Where the cycles go; default a new cycle table returned in the result. */
  sink?: CycleSink;
}

/**
 * Counts the cycles of a whole history by the four-point rainflow rule.
 *
 * Method: turning points (plateaus collapsed to their first sample, first and last samples kept,
 * optionally gated) are stacked; whenever the newest four a, b, c, d satisfy
 * |c − b| <= |b − a| and |c − b| <= |d − c|, (b, c) is a full cycle and leaves the stack. The
 * residue is handled by `options.residue`. Units are the history's.
 *
 * References: ASTM E1049-85 (reapproved 2017), 5.4.4 (rainflow counting) and 5.4.5 (repeating
 * histories); Downing and Socie, Int. J. Fatigue 4(1) (1982) 31-40.
 *
 * Special cases: an empty history gives no cycles and an empty residue; a single sample or a
 * constant history gives no cycles and a one-point residue; NaN or ±Infinity throws
 * `NonFiniteSampleError` with the sample index.
 *
 * @example
 * // ASTM E1049-85, 5.4.4 example
 * const { cycles } = rainflowFourPoint([-2, 1, -3, 5, -1, 3, -4, 4, -2]);
 * cycles.totalCount(); // returns 4 (1 full cycle and 6 half cycles)
 */
export function rainflowFourPoint(
  history: ArrayLike<number>,
  options: RainflowOptions = {},
): RainflowResult {
  checkOptionFields(options, ['gate', 'gateFraction', 'fullScale', 'residue', 'startIndex', 'sink'], 'rainflow options');
  checkHistory(history, options.startIndex ?? 0);
  const gate = gateRange(options, history);
  const counter = new RainflowCounter({
    gate,
    residue: options.residue ?? 'half',
    startIndex: options.startIndex ?? 0,
    ...(options.sink ? { sink: options.sink } : {}),
  });
  return counter.push(history).finish();
}

/**
 * `rainflow` is the documented alias of the default counting method, {@link rainflowFourPoint}.
 * Code that must keep its numbers if the default ever changes calls `rainflowFourPoint` by name.
 */
export const rainflow = rainflowFourPoint;
