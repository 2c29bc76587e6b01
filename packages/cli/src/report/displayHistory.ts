import type { HtmlHistory } from './HtmlReportInput.js';

/**
 * A display copy of a history for the report's history plot: the samples split into `buckets`
 * runs of consecutive indices (default 2000, about two per pixel column), and from each run its
 * smallest and largest sample in index order, with their sample indices. Short histories
 * (at most 2 × buckets samples) are copied whole. Turning points of large loops are extremes,
 * so they survive; the first and the last samples are always kept.
 */
export function displayHistory(values: ArrayLike<number>, buckets = 2000): HtmlHistory {
  const n = values.length;
  const b = Math.max(1, Math.floor(buckets));
  if (n <= 2 * b) {
    const index = new Float64Array(n);
    const value = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      index[i] = i;
      value[i] = values[i];
    }
    return { index, value };
  }
  const index = new Float64Array(2 * b + 2);
  const value = new Float64Array(2 * b + 2);
  let k = 0;
  const push = (i: number) => {
    if (k > 0 && index[k - 1] === i) return;
    index[k] = i;
    value[k] = values[i];
    k++;
  };
  push(0);
  for (let j = 0; j < b; j++) {
    const from = Math.floor((j * n) / b);
    const to = Math.floor(((j + 1) * n) / b);
    let lo = from;
    let hi = from;
    for (let i = from + 1; i < to; i++) {
      if (values[i] < values[lo]) lo = i;
      if (values[i] > values[hi]) hi = i;
    }
    push(Math.min(lo, hi));
    push(Math.max(lo, hi));
  }
  push(n - 1);
  return { index: index.slice(0, k), value: value.slice(0, k) };
}
