import type { LifeWarning } from '@loopwise/engine';
import { escapeHtml } from './escapeHtml.js';

/** A warning about the measured signal: its kind and sentence. */
export interface SignalNote {
  kind: string;
  message: string;
}

function items(warnings: readonly LifeWarning[], signal: readonly SignalNote[], prefix: string): string[] {
  return [
    ...signal.map((w) => `<li data-code="signal-${escapeHtml(w.kind)}">${prefix}<code>signal: ${escapeHtml(w.kind)}</code> ${escapeHtml(w.message)}</li>`),
    ...warnings.map((w) => `<li data-code="${escapeHtml(w.code)}">${prefix}<code>${escapeHtml(w.code)}</code> ${escapeHtml(w.message)}</li>`),
  ];
}

/**
 * The warnings of one channel as a list — about its measured signal first, then the assessment's
 * (code and sentence) — or a line saying there are none (only when there are none of either).
 */
export function warningsList(warnings: readonly LifeWarning[], signal: readonly SignalNote[] = []): string {
  const li = items(warnings, signal, '');
  if (li.length === 0) return '<p class="none">No warnings.</p>';
  return `<ul class="warnings">${li.join('')}</ul>`;
}

/** Every channel's warnings in one list for the top of the report, each begun with its channel. */
export function allWarningsList(channels: readonly { name: string; report: { warnings: readonly LifeWarning[] }; signalWarnings?: readonly SignalNote[] }[]): string {
  const li = channels.flatMap((c) => items(c.report.warnings, c.signalWarnings ?? [], `<strong>${escapeHtml(c.name)}</strong>: `));
  if (li.length === 0) return '<p class="none">No warnings on any channel.</p>';
  return `<ul class="warnings">${li.join('')}</ul>`;
}
