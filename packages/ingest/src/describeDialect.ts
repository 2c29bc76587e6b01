import type { Dialect } from './detectDialect.js';

/**
 * The dialect in words, for a summary line.
 *
 * @example
 * describeDialect(detectDialect(new TextEncoder().encode('a;b\n1,5;2\n'))); // returns 'semicolon-delimited, decimal comma, header on line 1, all detected'
 */
export function describeDialect(d: Dialect): string {
  const parts = [`${d.delimiter}-delimited`, d.decimalComma ? 'decimal comma' : 'decimal point'];
  parts.push(d.header ? `header on line ${d.headerLine}` : 'no header');
  if (d.unitsLine > 0) parts.push(`units row on line ${d.unitsLine}`);
  if (d.skipLines > 0) parts.push(`${d.skipLines} line${d.skipLines === 1 ? '' : 's'} skipped by option`);
  if (d.bom) parts.push('BOM');
  if (d.lineEnd === 'CRLF') parts.push('CRLF');
  const fixed = (Object.entries(d.source) as [string, string][]).filter(([, s]) => s === 'option').map(([k]) => k);
  parts.push(fixed.length === 0 ? 'all detected' : `${fixed.join(', ')} from options`);
  return parts.join(', ');
}

