import { DELIMITER_CHARACTERS, type Dialect } from './detectDialect.js';
import { utf8Decoder } from './textDecoding.js';
import { excerpt } from './excerpt.js';
import { IngestError, IngestOptionError } from './IngestError.js';

/**
 * A column of the file: its header name (a string) or its 1-based field number (a number; the
 * first column is 1). Indices are 1-based everywhere in ingestion, in options and in errors.
 */
export type ColumnReference = string | number;

/** The 0-based field of a column reference; errors name the option `field` and list the columns. */
export function resolveColumn(ref: ColumnReference, dialect: Dialect, file: string, field: string): number {
  if (typeof ref === 'number') {
    if (!Number.isInteger(ref) || ref < 1) throw new IngestOptionError(field, ref, 'a column index is a whole number from 1 (the first column is 1)');
    if (ref > dialect.fieldCount)
      throw new IngestError(
        'LW_INGEST_UNKNOWN_COLUMN',
        file,
        dialect.headerLine,
        0,
        `there is no column ${ref} (1-based): the file has ${dialect.fieldCount} column${dialect.fieldCount === 1 ? '' : 's'}: ${listNames(dialect)}`,
      );
    return ref - 1;
  }
  if (typeof ref !== 'string') throw new IngestOptionError(field, ref, 'a header name (string) or a 1-based column index (number)');
  const k = dialect.header ? dialect.names.indexOf(ref) : -1;
  if (k >= 0 && dialect.names.lastIndexOf(ref) !== k) {
    const at = dialect.names.flatMap((n, j) => (n === ref ? [j + 1] : []));
    throw new IngestError('LW_INGEST_DUPLICATE_COLUMN', file, dialect.headerLine, 0, `the header names ${at.length} columns ${excerpt(ref)} (columns ${at.join(', ')}); choose one by its number`);
  }
  if (k < 0) {
    const detail = dialect.header
      ? `unknown column "${ref}"; the columns are ${listNames(dialect)}`
      : `unknown column "${ref}": the file has no header, so select columns by 1-based index (1 to ${dialect.fieldCount}), or, if the header sits below other lines, skip those (dialect.skipLines; --skip-lines on the command line)`;
    throw new IngestError('LW_INGEST_UNKNOWN_COLUMN', file, dialect.headerLine, 0, detail);
  }
  return k;
}

/** The columns for a message: at most 12, each name a short sanitized excerpt. */
export function listNames(dialect: Dialect): string {
  const shown = dialect.names.slice(0, 12).map((n, k) => `${k + 1} ${excerpt(n)}`);
  if (dialect.names.length > 12) shown.push(`… (${dialect.names.length} in all)`);
  return shown.join(', ');
}

const UTF8 = utf8Decoder(false);

/** The content lines of a detection sample (BOM, CR, blank and comment lines removed), with their 1-based line numbers. */
function contentLines(sample: Uint8Array, dialect: Dialect): { line: number; text: string }[] {
  const text = UTF8.decode(sample).replace(/^\ufeff/, '');
  const out: { line: number; text: string }[] = [];
  text.split('\n').forEach((l, k) => {
    const t = l.replace(/\r$/, '');
    if (t.trim() === '' || (dialect.commentPrefix !== '' && t.startsWith(dialect.commentPrefix))) return;
    out.push({ line: k + 1, text: t });
  });
  return out;
}

/** The error for one column found where several are selected, quoting the first data line. */
export function wrongDelimiter(sample: Uint8Array, dialect: Dialect, file: string): IngestError {
  const lines = contentLines(sample, dialect);
  const pick = lines.find((l) => !dialect.header || l.line > dialect.headerLine) ?? lines[lines.length - 1] ?? { line: 1, text: '' };
  const other = (['comma', 'semicolon', 'tab', 'whitespace'] as const).filter((d) => d !== dialect.delimiter).map((d) => JSON.stringify(DELIMITER_CHARACTERS[d]).replace('" "', 'whitespace'));
  return new IngestError(
    'LW_INGEST_WRONG_DELIMITER',
    file,
    pick.line,
    1,
    `wrong delimiter: one column found with ${dialect.delimiter} (${JSON.stringify(DELIMITER_CHARACTERS[dialect.delimiter])}) where several are selected; the line reads ${excerpt(pick.text)} (other delimiters: ${other.join(', ')})`,
  );
}

/** True when the sample holds only blank and comment lines. */
export function isContentless(sample: Uint8Array, dialect: Dialect): boolean {
  return contentLines(sample, dialect).length === 0;
}
