import { escapeHtml } from './escapeHtml.js';
import type { PlotFrame } from './PlotFrame.js';
import type { Ticks } from './niceTicks.js';
import { svgNumber } from './svgNumber.js';

/** One axis to draw: its map to pixels, its ticks and its label (with the unit). */
export interface AxisSpec {
  scale: (v: number) => number;
  ticks: Ticks;
  label: string;
  /** Draw light grid lines across the plot at the ticks; default true. */
  grid?: boolean;
}

/**
 * Draws the bottom (x) and left (y) axes of a plot: a frame, ticks with labels, grid lines and
 * the axis labels (a common factor such as '× 10⁻⁶' is appended to the label).
 */
export function svgAxes(f: PlotFrame, x: AxisSpec, y: AxisSpec): string {
  const x0 = f.left;
  const x1 = f.width - f.right;
  const y0 = f.height - f.bottom;
  const y1 = f.top;
  const out: string[] = [];
  out.push('<g class="axes">');
  x.ticks.values.forEach((v, i) => {
    const px = svgNumber(x.scale(v));
    if (x.grid !== false) out.push(`<line class="grid" x1="${px}" x2="${px}" y1="${y1}" y2="${y0}"/>`);
    out.push(`<line class="tick" x1="${px}" x2="${px}" y1="${y0}" y2="${y0 + 5}"/>`);
    out.push(`<text class="tick-label" x="${px}" y="${y0 + 18}" text-anchor="middle">${escapeHtml(x.ticks.labels[i])}</text>`);
  });
  y.ticks.values.forEach((v, i) => {
    const py = svgNumber(y.scale(v));
    if (y.grid !== false) out.push(`<line class="grid" x1="${x0}" x2="${x1}" y1="${py}" y2="${py}"/>`);
    out.push(`<line class="tick" x1="${x0 - 5}" x2="${x0}" y1="${py}" y2="${py}"/>`);
    out.push(`<text class="tick-label" x="${x0 - 8}" y="${py}" dy="0.35em" text-anchor="end">${escapeHtml(y.ticks.labels[i])}</text>`);
  });
  out.push(`<rect class="frame" x="${x0}" y="${y1}" width="${x1 - x0}" height="${y0 - y1}"/>`);
  out.push(`<text class="axis-label" x="${svgNumber((x0 + x1) / 2)}" y="${f.height - 10}" text-anchor="middle">${escapeHtml(x.label + x.ticks.factor)}</text>`);
  const cy = svgNumber((y0 + y1) / 2);
  out.push(`<text class="axis-label" transform="translate(18 ${cy}) rotate(-90)" text-anchor="middle">${escapeHtml(y.label + y.ticks.factor)}</text>`);
  out.push('</g>');
  return out.join('');
}
