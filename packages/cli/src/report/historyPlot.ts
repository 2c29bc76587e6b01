import type { HtmlChannel } from './HtmlReportInput.js';
import { linearScale, paddedExtent } from './linearScale.js';
import { niceTicks } from './niceTicks.js';
import { innerX, innerY, plotFrame } from './PlotFrame.js';
import { svgAxes } from './svgAxes.js';
import { svgEmptyNote, svgPlot } from './svgPlot.js';
import { dataNumber, svgNumber } from './svgNumber.js';
import { escapeHtml } from './escapeHtml.js';

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
  // the x axis in time when the file has a time base (ticks at round seconds), else in samples
  const tb = channel.timeBase ?? null;
  let xAxis: { scale: (v: number) => number; ticks: ReturnType<typeof niceTicks>; label: string };
  if (tb !== null && tb.step > 0) {
    const ticks = niceTicks(tb.start + first * tb.step, tb.start + last * tb.step, 10);
    xAxis = { scale: (t: number) => x((t - tb.start) / tb.step), ticks, label: 'time (s)' };
  } else xAxis = { scale: x, ticks: niceTicks(first, last, 10), label: 'sample index' };
  parts.push(svgAxes(f, xAxis, { scale: y, ticks: niceTicks(lo, hi, 6), label: `${channel.name} (${channel.unit})` }));
  // event boundaries of a duty cycle: a dashed line at each event's first sample, named
  for (const e of channel.eventStarts ?? []) {
    if (e.index < first || e.index > last) continue;
    const px = svgNumber(x(e.index));
    parts.push(
      `<g class="event-start" data-event="${escapeHtml(e.name)}" data-index="${dataNumber(e.index)}"><line x1="${px}" x2="${px}" y1="${yr1}" y2="${yr0}" stroke-dasharray="4 3"/>` +
        `<text x="${svgNumber(x(e.index) + 4)}" y="${svgNumber(yr1 + 12)}">${escapeHtml(e.name)}</text></g>`,
    );
  }
  let d = '';
  for (let i = 0; i < n; i++) d += `${i === 0 ? 'M' : 'L'}${svgNumber(x(h.index[i]))} ${svgNumber(y(h.value[i]))}`;
  parts.push(`<path class="history-line" d="${d}" data-points="${n}"/>`);
  const markers: string[] = [];
  // Rank labels sit above maxima and below minima; a label that would overlap one already
  // placed on the same side moves further out, one line at a time.
  const placed: Array<{ x: number; y: number }> = [];
  // A label that would leave the frame goes beside its marker instead, inside the frame.
  const labelAt = (px: number, py: number, up: boolean): [number, number] => {
    let ly = up ? py - 8 : py + 17;
    let lx = px;
    for (let tries = 0; tries < 12 && placed.some((p) => Math.abs(p.x - lx) < 16 && Math.abs(p.y - ly) < 13); tries++) ly += up ? -13 : 13;
    if (ly < yr1 + 11 || ly > yr0 - 2) {
      ly = Math.min(Math.max(py + 4, yr1 + 11), yr0 - 2);
      lx = px + (px > xr1 - 24 ? -12 : 12);
      for (let tries = 0; tries < 6 && placed.some((p) => Math.abs(p.x - lx) < 12 && Math.abs(p.y - ly) < 13); tries++) lx += px > xr1 - 24 ? -12 : 12;
    }
    placed.push({ x: lx, y: ly });
    return [lx, ly];
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
      const [lx, ly] = labelAt(cx, py, up);
      markers.push(
        `<g class="loop-marker marker-${role}" data-rank="${rank}" data-role="${role}" data-index="${dataNumber(index)}" data-value="${dataNumber(v)}">` +
          `<circle cx="${px}" cy="${svgNumber(py)}" r="4.5"/>` +
          `<text x="${svgNumber(lx)}" y="${svgNumber(ly)}" text-anchor="middle">${rank}</text></g>`,
      );
    };
    mark('start', loop.startIndex, s, vs, vt);
    mark('turn', loop.turnIndex, t, vt, vs);
  });
  // Worst loop last, so its markers are on top.
  parts.push(`<g class="markers">${markers.reverse().join('')}</g>`);
  return svgPlot('history', id, title, f, parts.join(''), ` data-points="${n}"`);
}
