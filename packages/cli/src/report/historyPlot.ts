import type { HtmlChannel } from './HtmlReportInput.js';
import { linearScale, paddedExtent } from './linearScale.js';
import { niceTicks } from './niceTicks.js';
import { innerX, innerY, plotFrame } from './PlotFrame.js';
import { svgAxes } from './svgAxes.js';
import { svgEmptyNote, svgPlot } from './svgPlot.js';
import { dataNumber, svgNumber } from './svgNumber.js';

/** Index of the displayed point nearest to a sample index (display indices ascending). */
function nearest(index: Float64Array, target: number): number {
  let lo = 0;
  let hi = index.length - 1;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (index[mid] < target) lo = mid + 1;
    else hi = mid;
  }
  if (lo > 0 && target - index[lo - 1] < index[lo] - target) return lo - 1;
  return lo;
}

/**
 * The history plot: the display copy of the history as a line, and the start and turn of each
 * of the worst loops marked (open circle: start, filled: turn) and labelled by rank. Each marker
 * is a `<g class="loop-marker">` carrying `data-rank`, `data-role` ('start' | 'turn'),
 * `data-index` (the sample index) and `data-value`. A start at the initial state (index -1) or
 * outside the displayed indices is not marked.
 */
export function historyPlot(channel: HtmlChannel, id: string): string {
  const f = plotFrame(340);
  const title = `History of ${channel.name} with its most damaging loops marked`;
  const h = channel.history;
  if (h === null || h.index.length === 0) return svgPlot('history', id, title, f, svgEmptyNote(f, 'No history given.'));
  const n = Math.min(h.index.length, h.value.length);
  const [xr0, xr1] = innerX(f);
  const [yr0, yr1] = innerY(f);
  const first = h.index[0];
  const last = h.index[n - 1];
  const x = linearScale(first, last === first ? first + 1 : last, xr0, xr1);
  const [lo, hi] = paddedExtent(h.value.subarray(0, n), 0.12);
  const y = linearScale(lo, hi, yr0, yr1);
  const parts: string[] = [];
  parts.push(svgAxes(f, { scale: x, ticks: niceTicks(first, last, 10), label: 'sample index' }, { scale: y, ticks: niceTicks(lo, hi, 6), label: `${channel.name} (${channel.unit})` }));
  let d = '';
  for (let i = 0; i < n; i++) d += `${i === 0 ? 'M' : 'L'}${svgNumber(x(h.index[i]))} ${svgNumber(y(h.value[i]))}`;
  parts.push(`<path class="history-line" d="${d}" data-points="${n}"/>`);
  const markers: string[] = [];
  // Rank labels sit above maxima and below minima; a label that would overlap one already
  // placed on the same side moves further out, one line at a time.
  const placed: Array<{ x: number; y: number }> = [];
  const labelY = (px: number, py: number, up: boolean) => {
    let ly = up ? py - 8 : py + 17;
    for (let tries = 0; tries < 12 && placed.some((p) => Math.abs(p.x - px) < 16 && Math.abs(p.y - ly) < 13); tries++) ly += up ? -13 : 13;
    placed.push({ x: px, y: ly });
    return ly;
  };
  channel.report.worstLoops.forEach((loop, k) => {
    const rank = k + 1;
    const at = (index: number) => (index < first || index > last ? -1 : nearest(h.index, index));
    const s = at(loop.startIndex);
    const t = at(loop.turnIndex);
    const vs = s < 0 ? NaN : h.value[s];
    const vt = t < 0 ? NaN : h.value[t];
    const mark = (role: 'start' | 'turn', index: number, p: number, v: number, other: number) => {
      if (p < 0) return;
      const up = !(v < other);
      const cx = x(h.index[p]);
      const px = svgNumber(cx);
      const py = y(v);
      const ly = labelY(cx, py, up);
      markers.push(
        `<g class="loop-marker marker-${role}" data-rank="${rank}" data-role="${role}" data-index="${dataNumber(index)}" data-value="${dataNumber(v)}">` +
          `<circle cx="${px}" cy="${svgNumber(py)}" r="4.5"/>` +
          `<text x="${px}" y="${svgNumber(ly)}" text-anchor="middle">${rank}</text></g>`,
      );
    };
    mark('start', loop.startIndex, s, vs, vt);
    mark('turn', loop.turnIndex, t, vt, vs);
  });
  // Worst loop last, so its markers are on top.
  parts.push(`<g class="markers">${markers.reverse().join('')}</g>`);
  return svgPlot('history', id, title, f, parts.join(''), ` data-points="${n}"`);
}
