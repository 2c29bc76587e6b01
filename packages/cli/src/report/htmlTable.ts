import { escapeHtml } from './escapeHtml.js';

/** A table cell: text (escaped) and whether it is numeric (right-aligned). */
export type Cell = string | { text: string; numeric?: boolean };

/**
 * An HTML table with a caption, a header row and body rows; all text escaped, numeric cells
 * right-aligned. `className` is added to the table.
 */
export function htmlTable(className: string, caption: string, head: string[], rows: Cell[][]): string {
  const cell = (c: Cell, tag: 'td' | 'th') => {
    const text = typeof c === 'string' ? c : c.text;
    const numeric = typeof c !== 'string' && c.numeric === true;
    return `<${tag}${numeric ? ' class="num"' : ''}>${escapeHtml(text)}</${tag}>`;
  };
  return (
    `<table class="${escapeHtml(className)}"><caption>${escapeHtml(caption)}</caption>` +
    `<thead><tr>${head.map((h) => `<th scope="col">${escapeHtml(h)}</th>`).join('')}</tr></thead>` +
    `<tbody>${rows.map((r) => `<tr>${r.map((c, i) => cell(c, i === 0 ? 'th' : 'td')).join('')}</tr>`).join('')}</tbody></table>`
  );
}

/** A numeric cell. */
export function num(text: string): Cell {
  return { text, numeric: true };
}
