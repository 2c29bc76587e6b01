/** A linear map from a data interval to a pixel interval (a degenerate domain maps to the middle). */
export function linearScale(d0: number, d1: number, r0: number, r1: number): (v: number) => number {
  if (!(d1 !== d0) || !Number.isFinite(d0) || !Number.isFinite(d1)) {
    const mid = (r0 + r1) / 2;
    return () => mid;
  }
  const k = (r1 - r0) / (d1 - d0);
  return (v) => r0 + (v - d0) * k;
}

/** The interval [min, max] of finite values with a relative pad, and a unit interval around a constant. */
export function paddedExtent(values: ArrayLike<number>, pad = 0.04): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  if (!(lo <= hi)) return [0, 1];
  if (lo === hi) {
    const d = lo === 0 ? 1 : Math.abs(lo) * 0.1;
    return [lo - d, hi + d];
  }
  const d = (hi - lo) * pad;
  return [lo - d, hi + d];
}
