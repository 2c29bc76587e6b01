import { escapeHtml } from './escapeHtml.js';
import { formatNumber } from './formatNumber.js';
import type { HtmlChannel } from './HtmlReportInput.js';
import { linearScale } from './linearScale.js';
import { niceTicks } from './niceTicks.js';
import { innerX, innerY, plotFrame } from './PlotFrame.js';
import { sequentialColour, sequentialStops } from './sequentialColour.js';
import { svgAxes } from './svgAxes.js';
import { svgEmptyNote, svgPlot } from './svgPlot.js';
import { dataNumber, svgNumber } from './svgNumber.js';

/**
 * The rainflow range-mean matrix as a heat map: one `<rect class="cell">` per non-zero count
 * with `data-row`, `data-column`, `data-count` and its bin edges; colour on a logarithmic
 * viridis scale between the smallest and the largest count, with a legend. The axes span the
 * occupied bins and one empty bin around them (rows from the first bin).
 */
export function matrixPlot(channel: HtmlChannel, id: string): string {
  const f = plotFrame(440, 84, 190);
  const title = `Rainflow range-mean matrix of ${channel.name}`;
  const m = channel.matrix;
  const rows = m === null ? 0 : m.rowEdges.length - 1;
  const columns = m === null ? 0 : m.columnEdges.length - 1;
  if (m === null || rows < 1 || columns < 1 || m.counts.length < rows * columns) {
    return svgPlot('matrix', id, title, f, svgEmptyNote(f, 'No loop matrix: the loops were not kept (the command keeps them with --cycles-out).'));
  }
  let cmin = Infinity;
  let cmax = 0;
  let total = 0;
  let cells = 0;
  for (let i = 0; i < rows * columns; i++) {
    const c = m.counts[i];
    if (c > 0) {
      cells++;
      total += c;
      if (c < cmin) cmin = c;
      if (c > cmax) cmax = c;
    }
  }
  // Draw the occupied block of bins with one empty bin around it (rows from the first bin, so
  // the smallest ranges stay in view): wide bin layouts would otherwise leave the cells tiny.
  let r0 = rows;
  let r1 = -1;
  let c0 = columns;
  let c1 = -1;
  for (let r = 0; r < rows; r++) {
    for (let c = 0; c < columns; c++) {
      if (m.counts[r * columns + c] > 0) (r0 = Math.min(r0, r)), (r1 = Math.max(r1, r)), (c0 = Math.min(c0, c)), (c1 = Math.max(c1, c));
    }
  }
  if (r1 < 0) (r0 = 0), (r1 = rows - 1), (c0 = 0), (c1 = columns - 1);
  r0 = 0;
  r1 = Math.min(rows - 1, r1 + 1);
  c0 = Math.max(0, c0 - 1);
  c1 = Math.min(columns - 1, c1 + 1);
  const [xr0, xr1] = innerX(f);
  const [yr0, yr1] = innerY(f);
  const cx0 = m.columnEdges[c0];
  const cx1 = m.columnEdges[c1 + 1];
  const ry0 = m.rowEdges[r0];
  const ry1 = m.rowEdges[r1 + 1];
  const x = linearScale(cx0, cx1, xr0, xr1);
  // A little headroom, so the largest-range cells do not sit on the frame.
  const y = linearScale(ry0, ry1 + (ry1 - ry0) * 0.03, yr0, yr1);
  const parts: string[] = [];
  const logMin = Math.log10(cells > 0 ? cmin : 1);
  const logMax = Math.log10(cells > 0 ? cmax : 1);
  const tOf = (c: number) => (logMax > logMin ? (Math.log10(c) - logMin) / (logMax - logMin) : 1);
  const cellMarks: string[] = [];
  for (let r = 0; r < rows; r++) {
    for (let c = 0; c < columns; c++) {
      const count = m.counts[r * columns + c];
      if (!(count > 0)) continue;
      const left = x(m.columnEdges[c]);
      const right = x(m.columnEdges[c + 1]);
      const top = y(m.rowEdges[r + 1]);
      const bottom = y(m.rowEdges[r]);
      cellMarks.push(
        `<rect class="cell" x="${svgNumber(left)}" y="${svgNumber(top)}" width="${svgNumber(Math.max(0.5, right - left))}" height="${svgNumber(Math.max(0.5, bottom - top))}"` +
          ` fill="${sequentialColour(tOf(count))}" data-row="${r}" data-column="${c}" data-count="${dataNumber(count)}"` +
          ` data-row-from="${dataNumber(m.rowEdges[r])}" data-row-to="${dataNumber(m.rowEdges[r + 1])}" data-column-from="${dataNumber(m.columnEdges[c])}" data-column-to="${dataNumber(m.columnEdges[c + 1])}"/>`,
      );
    }
  }
  parts.push(`<g class="cells">${cellMarks.join('')}</g>`);
  parts.push(svgAxes(f, { scale: x, ticks: niceTicks(cx0, cx1, 10), label: m.columnLabel, grid: false }, { scale: y, ticks: niceTicks(ry0, ry1, 6), label: m.rowLabel, grid: false }));
  if (cells === 0) parts.push(svgEmptyNote(f, 'No cycles in the matrix.'));
  else parts.push(legend(f, id, cmin, cmax, logMin, logMax));
  return svgPlot('matrix', id, title, f, parts.join(''), ` data-cells="${cells}" data-total="${dataNumber(total)}" data-rows="${rows}" data-columns="${columns}"`);
}

function legend(f: ReturnType<typeof plotFrame>, id: string, cmin: number, cmax: number, logMin: number, logMax: number): string {
  const gx = f.width - f.right + 28;
  const top = f.top + 24;
  const bottom = f.height - f.bottom;
  const gid = `${id}-gradient`;
  const stops = sequentialStops()
    .map(([o, c]) => `<stop offset="${o}" stop-color="${c}"/>`)
    .join('');
  const y = linearScale(logMin, logMax > logMin ? logMax : logMin + 1, bottom, top);
  // the smallest and the largest count, and the powers of ten between them that leave room
  // (14 px) to both, so no label overprints another
  const at = (c: number) => (logMax > logMin ? y(Math.log10(c)) : bottom);
  const labels: number[] = [cmin];
  for (let p = Math.ceil(logMin + 1e-9); p < logMax - 1e-9; p++) {
    const c = Math.pow(10, p);
    if (Math.abs(at(c) - at(cmin)) >= 14 && Math.abs(at(c) - at(cmax)) >= 14) labels.push(c);
  }
  if (cmax > cmin) labels.push(cmax);
  const ticks = labels
    .map((c) => {
      const py = svgNumber(logMax > logMin ? y(Math.log10(c)) : bottom);
      return `<line class="tick" x1="${gx + 18}" x2="${gx + 23}" y1="${py}" y2="${py}"/><text class="tick-label" x="${gx + 27}" y="${py}" dy="0.35em">${escapeHtml(formatNumber(c))}</text>`;
    })
    .join('');
  return (
    `<g class="legend"><defs><linearGradient id="${escapeHtml(gid)}" x1="0" y1="1" x2="0" y2="0">${stops}</linearGradient></defs>` +
    `<text class="legend-title" x="${gx}" y="${f.top + 8}">cycles per cell</text>` +
    `<rect x="${gx}" y="${top}" width="18" height="${bottom - top}" fill="url(#${escapeHtml(gid)})" class="legend-bar"/>` +
    `<text class="legend-note" x="${gx}" y="${bottom + 18}">log scale</text>${ticks}</g>`
  );
}
