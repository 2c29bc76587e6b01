/**
 * Min/max envelopes of a long history for drawing: a pyramid of block minima and maxima built
 * once (blocks of 16, 256, 4096 … samples), from which the envelope of any view at any width is
 * computed exactly (the smallest and the largest sample of each pixel's samples) in time that
 * grows with the width, not with the samples in view. This keeps a history of 10^7 samples fluid
 * when zoomed and panned.
 */

/** One level of the pyramid: the minimum and maximum of each block of `block` samples. */
export interface EnvelopeLevel {
  block: number;
  min: Float32Array;
  max: Float32Array;
}

/** Blocks grow by this factor from level to level. */
const FACTOR = 16;

/** The pyramid of `values` (levels of blocks of 16, 256, …; none for a short history). */
export function envelopeLevels(values: Float32Array): EnvelopeLevel[] {
  const levels: EnvelopeLevel[] = [];
  let source: { min: Float32Array; max: Float32Array } = { min: values, max: values };
  let block = 1;
  while (source.min.length > FACTOR * 64) {
    const n = Math.ceil(source.min.length / FACTOR);
    const min = new Float32Array(n);
    const max = new Float32Array(n);
    for (let j = 0; j < n; j++) {
      const from = j * FACTOR;
      const to = Math.min(source.min.length, from + FACTOR);
      let lo = source.min[from];
      let hi = source.max[from];
      for (let i = from + 1; i < to; i++) {
        if (source.min[i] < lo) lo = source.min[i];
        if (source.max[i] > hi) hi = source.max[i];
      }
      min[j] = lo;
      max[j] = hi;
    }
    block *= FACTOR;
    levels.push({ block, min, max });
    source = { min, max };
  }
  return levels;
}

/**
 * Writes the envelope of samples `[from, to)` at `width` pixels into `outMin` and `outMax`
 * (length `width`): pixel p covers samples `[from + ⌊p·s⌋, from + ⌊(p+1)·s⌋)` with s = (to − from)
 * / width (at least one sample). Exact: the smallest and largest sample of each pixel.
 */
export function envelopeInto(values: Float32Array, levels: readonly EnvelopeLevel[], from: number, to: number, width: number, outMin: Float32Array, outMax: Float32Array): void {
  const span = to - from;
  const perPixel = span / width;
  // the coarsest level whose blocks fit within one pixel's samples
  let level: EnvelopeLevel | null = null;
  for (const l of levels) if (l.block <= perPixel) level = l;
  for (let p = 0; p < width; p++) {
    const i0 = from + Math.floor(p * perPixel);
    const i1 = Math.max(i0 + 1, Math.min(to, from + Math.floor((p + 1) * perPixel)));
    let lo = Infinity;
    let hi = -Infinity;
    let i = i0;
    if (level !== null) {
      const b = level.block;
      const firstBlock = Math.ceil(i0 / b);
      const lastBlock = Math.floor(i1 / b);
      if (firstBlock < lastBlock) {
        for (; i < firstBlock * b; i++) {
          if (values[i] < lo) lo = values[i];
          if (values[i] > hi) hi = values[i];
        }
        for (let k = firstBlock; k < lastBlock; k++) {
          if (level.min[k] < lo) lo = level.min[k];
          if (level.max[k] > hi) hi = level.max[k];
        }
        i = lastBlock * b;
      }
    }
    for (; i < i1; i++) {
      if (values[i] < lo) lo = values[i];
      if (values[i] > hi) hi = values[i];
    }
    outMin[p] = lo;
    outMax[p] = hi;
  }
}
