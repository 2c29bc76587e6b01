import { InvalidOptionError, NonFiniteSampleError, RangeOverflowError } from './errors';

/** How a gate is given: an absolute range, or a fraction of a full scale. */
export interface GateOptions {
  /** Absolute gate range, in the history's unit. Default 0 (no gate). */
  gate?: number;
  /**
   * Gate as a fraction (0 … 1) of the largest range of the history (its max − min), or of
   * `fullScale` when that is given. Exclusive with `gate`.
   */
  gateFraction?: number;
  /**
   * Declared full-scale range (e.g. the transducer's span) for `gateFraction`. Needed to stream,
   * where the history's own largest range is not known in advance.
   */
  fullScale?: number;
}

/**
 * Resolves gate options to an absolute gate range. With `gateFraction` and no `fullScale`, the
 * largest range of `history` (max − min, which is also the largest rainflow range) is found by
 * one scan; without a history that case throws, since a stream cannot know its range in advance.
 *
 * @example
 * gateRange({ gateFraction: 0.1 }, [0, 4, -6, 2]); // returns 1
 * gateRange({ gateFraction: 0.05, fullScale: 2000 }); // returns 100
 */
export function gateRange(options: GateOptions, history?: ArrayLike<number>): number {
  const { gate, gateFraction, fullScale } = options;
  for (const [field, v] of [['gate', gate], ['gateFraction', gateFraction], ['fullScale', fullScale]] as const) {
    if (v !== undefined && typeof v !== 'number') throw new InvalidOptionError(field, v, 'must be a number');
  }
  if (gate !== undefined && gateFraction !== undefined) {
    throw new InvalidOptionError('gateFraction', gateFraction, 'give either gate or gateFraction, not both');
  }
  if (gateFraction === undefined) {
    if (fullScale !== undefined) {
      throw new InvalidOptionError('fullScale', fullScale, 'is only used with gateFraction');
    }
    const g = gate ?? 0;
    if (!(g >= 0) || g === Infinity) throw new InvalidOptionError('gate', g, 'must be a finite number >= 0');
    return g;
  }
  if (!(gateFraction >= 0 && gateFraction <= 1)) {
    throw new InvalidOptionError('gateFraction', gateFraction, 'must be a number from 0 to 1');
  }
  if (fullScale !== undefined) {
    if (!(fullScale > 0) || fullScale === Infinity) {
      throw new InvalidOptionError('fullScale', fullScale, 'must be a finite number > 0');
    }
    return gateFraction * fullScale;
  }
  if (history === undefined) {
    throw new InvalidOptionError(
      'fullScale',
      undefined,
      'a streamed history needs a declared fullScale for gateFraction (its largest range is not known in advance)',
    );
  }
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < history.length; i++) {
    const x = history[i];
    if (x - x !== 0) throw new NonFiniteSampleError(i, x);
    if (x < lo) lo = x;
    if (x > hi) hi = x;
  }
  const range = hi - lo;
  if (range === Infinity) throw new RangeOverflowError(-1, -1, lo, hi);
  return history.length === 0 ? 0 : gateFraction * range;
}
