/**
 * Thrown when a history sample is NaN or ±Infinity. Names the sample index (the index the
 * tracker gives the sample, counting from 0 across streamed chunks) and the value.
 *
 * @example
 * try { trackNotch([0, NaN], { material, Kt: 2 }); } catch (e) { (e as NotchSampleError).index; }
 * // returns 1
 */
export class NotchSampleError extends Error {
  /** Stable machine-readable code. */
  readonly code = 'non-finite-sample' as const;
  /** Always `"history"`. */
  readonly field = 'history' as const;
  /** Sample index of the bad value. */
  readonly index: number;
  /** The value (NaN, Infinity or -Infinity). */
  readonly value: number;

  constructor(index: number, value: number) {
    super(`history[${index}] = ${String(value)} (samples must be finite numbers)`);
    this.name = 'NotchSampleError';
    this.index = index;
    this.value = value;
  }
}
