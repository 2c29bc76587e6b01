import { escapeHtml } from './escapeHtml.js';
import type { PlotFrame } from './PlotFrame.js';

/** The kinds of plot of a channel section, as carried in `data-plot`. */
export type PlotKind = 'history' | 'matrix' | 'loops' | 'timeline' | 'events' | 'sn';

/**
 * Wraps a plot body in an `<svg data-plot="…">` with a `<title>` (and `role="img"`), scaled to
 * the page width by its viewBox. `attributes` are extra, already escaped, attribute text.
 */
export function svgPlot(kind: PlotKind, id: string, title: string, f: PlotFrame, body: string, attributes = ''): string {
  const titleId = `${id}-title`;
  return (
    `<svg xmlns="http://www.w3.org/2000/svg" class="plot plot-${kind}" data-plot="${kind}" id="${escapeHtml(id)}"` +
    ` viewBox="0 0 ${f.width} ${f.height}" width="${f.width}" height="${f.height}" role="img" aria-labelledby="${escapeHtml(titleId)}"${attributes}>` +
    `<title id="${escapeHtml(titleId)}">${escapeHtml(title)}</title>${body}</svg>`
  );
}

/** A placeholder text centred in an empty plot (no data to draw). */
export function svgEmptyNote(f: PlotFrame, text: string): string {
  return `<text class="empty-note" x="${f.width / 2}" y="${f.height / 2}" text-anchor="middle">${escapeHtml(text)}</text>`;
}
