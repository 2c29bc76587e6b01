/**
 * Kinds of {@link CorrectionRecord}: `spikes-interpolated` ({@link removeSpikes}),
 * `ranges-excluded` ({@link excludeRanges}), `split-at-dropouts` ({@link splitAtDropouts}),
 * `offset-removed` ({@link removeOffset}), `low-pass` ({@link zeroPhaseLowPass}), `decimated`
 * ({@link decimatePeaks}).
 */
export type CorrectionKind = 'spikes-interpolated' | 'ranges-excluded' | 'split-at-dropouts' | 'offset-removed' | 'low-pass' | 'decimated';

/**
 * What a correction did, for a report: `kind`, the places (`first` sample index and `length`
 * of each, in the input's sample indices), `samples` (how many samples were changed or
 * removed), the `parameters` it ran with, and a one-line `summary` for people. Every correction
 * of this package returns one; a report lists them in the order they were applied.
 */
export interface CorrectionRecord {
  readonly kind: CorrectionKind;
  /** First sample index of each place the correction touched (the whole record for a filter). */
  readonly first: Float64Array;
  /** Samples of each place. */
  readonly length: Float64Array;
  /** Samples changed (or removed, or dropped). */
  readonly samples: number;
  /** The options in effect, defaults filled in. */
  readonly parameters: Readonly<Record<string, number | string>>;
  /** One line for people, e.g. `"3 spikes interpolated (3 samples), first at sample 1200"`. */
  readonly summary: string;
}

/** A record from places given as flat [first, length] pairs. */
export function correctionRecord(kind: CorrectionKind, places: ArrayLike<number>, count: number, samples: number, parameters: Record<string, number | string>, summary: string): CorrectionRecord {
  const first = new Float64Array(count);
  const length = new Float64Array(count);
  for (let k = 0; k < count; k++) {
    first[k] = places[2 * k];
    length[k] = places[2 * k + 1];
  }
  return Object.freeze({ kind, first, length, samples, parameters: Object.freeze({ ...parameters }), summary });
}
