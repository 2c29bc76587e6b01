import { escapeHtml } from './escapeHtml.js';
import { formatNumber, formatPercent } from './formatNumber.js';
import type { HtmlChannel } from './HtmlReportInput.js';
import { linearScale } from './linearScale.js';
import { niceTicks } from './niceTicks.js';
import { plotFrame } from './PlotFrame.js';
import { svgAxes } from './svgAxes.js';
import { svgEmptyNote, svgPlot } from './svgPlot.js';
import { dataNumber, svgNumber } from './svgNumber.js';

const ROW = 30;
const NAME_CHARS = 30;

/**
 * Damage by event: one horizontal `<rect class="event-bar">` per event of the schedule with
 * `data-event` (the name), `data-damage` (per repeat of the schedule), `data-share` and
 * `data-repeats`, labelled with its share of the damage.
 */
export function eventsPlot(channel: HtmlChannel, id: string): string {
  const events = channel.report.events;
  const f = plotFrame(60 + ROW * Math.max(1, events.length), 250, 130, 12);
  const title = `Damage by event of ${channel.name}`;
  if (events.length === 0) return svgPlot('events', id, title, f, svgEmptyNote(f, 'No events.'));
  let dmax = 0;
  for (const e of events) if (e.damage > dmax) dmax = e.damage;
  const top = dmax > 0 ? dmax : 1;
  const x = linearScale(0, top, f.left, f.width - f.right);
  const y0 = f.top;
  const parts: string[] = [];
  const noTicks = { values: [], labels: [], factor: '' };
  parts.push(svgAxes(f, { scale: x, ticks: niceTicks(0, top, 6), label: 'damage per repeat of the schedule' }, { scale: () => 0, ticks: noTicks, label: '' }));
  const bars: string[] = [];
  events.forEach((e, k) => {
    const cy = y0 + ROW * k + ROW / 2;
    const w = e.damage > 0 ? Math.max(1, x(e.damage) - f.left) : 0;
    const name = e.name.length > NAME_CHARS ? `${e.name.slice(0, NAME_CHARS - 1)}…` : e.name;
    bars.push(
      `<g class="event" data-event="${escapeHtml(e.name)}">` +
        `<text class="event-name" x="${f.left - 10}" y="${svgNumber(cy)}" dy="0.35em" text-anchor="end">${escapeHtml(name)}<title>${escapeHtml(e.name)} (${escapeHtml(formatNumber(e.repeats))} repeats)</title></text>` +
        `<rect class="event-bar" x="${f.left}" y="${svgNumber(cy - ROW * 0.32)}" width="${svgNumber(w)}" height="${svgNumber(ROW * 0.64)}" data-event="${escapeHtml(e.name)}"` +
        ` data-damage="${dataNumber(e.damage)}" data-share="${dataNumber(e.share)}" data-repeats="${dataNumber(e.repeats)}"/>` +
        `<text class="event-share" x="${svgNumber(f.left + w + 8)}" y="${svgNumber(cy)}" dy="0.35em">${escapeHtml(formatPercent(e.share))}</text></g>`,
    );
  });
  parts.push(`<g class="events">${bars.join('')}</g>`);
  return svgPlot('events', id, title, f, parts.join(''), ` data-events="${events.length}"`);
}
