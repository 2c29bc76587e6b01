/**
 * Escapes text for HTML element content and for quoted attribute values: `&`, `<`, `>`, `"`
 * and `'` become character references. Any value is turned into text with `String` first.
 *
 * @example
 * escapeHtml('<b>&"x"') // returns '&lt;b&gt;&amp;&quot;x&quot;'
 */
export function escapeHtml(text: unknown): string {
  return String(text)
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');
}
