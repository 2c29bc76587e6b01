/**
 * Slow, literal implementations of the counting procedures of ASTM E1049-85 (reapproved 2017),
 * written step by step from the standard's text for use as test oracles only. They are not
 * exported by the package and are deliberately naive (arrays of objects, splice, O(n²)).
 * Plain JavaScript so that the benchmark runner can check its results against them too;
 * types in astmE1049.d.mts.
 */

/**
 * Peaks and valleys (ASTM E1049-85, 3.1): equal consecutive samples are one point (the first);
 * a point is kept when the slope changes sign there; the first and last points are kept.
 */
export function referenceTurningPoints(history) {
  const runs = [];
  for (let i = 0; i < history.length; i++) {
    if (runs.length === 0 || history[i] !== runs[runs.length - 1].value) runs.push({ value: history[i], index: i });
  }
  return runs.filter((p, k) => {
    if (k === 0 || k === runs.length - 1) return true;
    const before = Math.sign(p.value - runs[k - 1].value);
    const after = Math.sign(runs[k + 1].value - p.value);
    return before !== after;
  });
}

/**
 * ASTM E1049-85, 5.4.4 (rainflow counting), steps 1-6, literally:
 * (1) read the next peak or valley; out of data: step 6. (2) With fewer than three points go to
 * 1; X is the range of the newest two points, Y the range of the two before. (3) X < Y: go to 1.
 * (4) If Y contains the starting point S, go to 5; otherwise count Y as one cycle, discard its
 * two points, go to 2. (5) Count Y as one half cycle, discard the first point of Y, the second
 * becomes S, go to 2. (6) Count each range not yet counted as one half cycle.
 */
export function astmRainflow(points) {
  const out = [];
  const list = [];
  const range = (a, b) => Math.abs(b.value - a.value);
  for (const p of points) {
    list.push(p);
    for (;;) {
      const n = list.length;
      if (n < 3) break;
      const X = range(list[n - 2], list[n - 1]);
      const Y = range(list[n - 3], list[n - 2]);
      if (X < Y) break;
      const a = list[n - 3];
      const b = list[n - 2];
      if (n - 3 === 0) {
        out.push({ from: a.value, to: b.value, count: 0.5, startIndex: a.index, turnIndex: b.index });
        list.splice(0, 1);
      } else {
        out.push({ from: a.value, to: b.value, count: 1, startIndex: a.index, turnIndex: b.index });
        list.splice(n - 3, 2);
      }
    }
  }
  for (let k = 0; k + 1 < list.length; k++) {
    out.push({ from: list[k].value, to: list[k + 1].value, count: 0.5, startIndex: list[k].index, turnIndex: list[k + 1].index });
  }
  return out;
}

/**
 * ASTM E1049-85, 5.4.5 (simplified rainflow counting for repeating histories): the history is
 * taken as circular (points that are not peaks or valleys across the seam drop out), rearranged
 * to start at the peak or valley of largest magnitude and closed by repeating that point; then
 * whenever X >= Y, Y is counted as one cycle and its two points are discarded. Only full cycles.
 */
export function astmRepeating(points) {
  // circular peaks and valleys
  let ring = points.slice();
  while (ring.length > 1 && ring[ring.length - 1].value === ring[0].value) ring.pop();
  ring = ring.filter((p, k) => {
    const prev = ring[(k - 1 + ring.length) % ring.length];
    const next = ring[(k + 1) % ring.length];
    return Math.sign(p.value - prev.value) !== Math.sign(next.value - p.value);
  });
  if (ring.length < 2) return [];
  let start = 0;
  for (let k = 1; k < ring.length; k++) if (Math.abs(ring[k].value) > Math.abs(ring[start].value)) start = k;
  const seq = [...ring.slice(start), ...ring.slice(0, start), ring[start]];
  const out = [];
  const list = [];
  for (const p of seq) {
    list.push(p);
    for (;;) {
      const n = list.length;
      if (n < 3) break;
      const X = Math.abs(list[n - 1].value - list[n - 2].value);
      const Y = Math.abs(list[n - 2].value - list[n - 3].value);
      if (X < Y) break;
      const a = list[n - 3];
      const b = list[n - 2];
      out.push({ from: a.value, to: b.value, count: 1, startIndex: a.index, turnIndex: b.index });
      list.splice(n - 3, 2);
    }
  }
  return out;
}
