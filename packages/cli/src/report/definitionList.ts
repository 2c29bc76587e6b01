import { escapeHtml } from './escapeHtml.js';

/** A `<dl>` of [term, description] pairs, all text escaped. */
export function definitionList(className: string, items: Array<[string, string]>): string {
  return `<dl class="${escapeHtml(className)}">${items.map(([t, d]) => `<div><dt>${escapeHtml(t)}</dt><dd>${escapeHtml(d)}</dd></div>`).join('')}</dl>`;
}
