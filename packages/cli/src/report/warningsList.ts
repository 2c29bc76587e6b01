import type { LifeWarning } from '@loopwise/engine';
import { escapeHtml } from './escapeHtml.js';

/** The warnings of an assessment as a list (code and sentence), or a line saying there are none. */
export function warningsList(warnings: LifeWarning[]): string {
  if (warnings.length === 0) return '<p class="none">No warnings.</p>';
  return `<ul class="warnings">${warnings.map((w) => `<li data-code="${escapeHtml(w.code)}"><code>${escapeHtml(w.code)}</code> ${escapeHtml(w.message)}</li>`).join('')}</ul>`;
}
