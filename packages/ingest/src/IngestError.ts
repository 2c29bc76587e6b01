import { excerpt } from './excerpt.js';

/**
 * The error class of ingestion. Every problem with an input file is an `IngestError` with a
 * stable `code` for programs and the place for people: the file, the 1-based line and the
 * 1-based column, where "column" always means the field number on that line (the first field is
 * column 1), never a character offset. `line` and `column` are 0 when the problem has no line
 * (a missing file) or no field (an empty file, a header-only file).
 */

/** Stable codes of {@link IngestError}. */
export type IngestErrorCode =
  | 'LW_INGEST_MISSING_FILE'
  | 'LW_INGEST_IS_DIRECTORY'
  | 'LW_INGEST_EMPTY_FILE'
  | 'LW_INGEST_HEADER_ONLY'
  | 'LW_INGEST_NON_NUMERIC'
  | 'LW_INGEST_NON_FINITE'
  | 'LW_INGEST_EMPTY_CELL'
  | 'LW_INGEST_RAGGED_ROW'
  | 'LW_INGEST_WRONG_DELIMITER'
  | 'LW_INGEST_BINARY_DATA'
  | 'LW_INGEST_INVALID_UTF8'
  | 'LW_INGEST_UNKNOWN_COLUMN'
  | 'LW_INGEST_MALFORMED_QUOTES'
  | 'LW_INGEST_READ_FAILED'
  | 'LW_INGEST_OVERFLOW'
  | 'LW_INGEST_CR_LINE_ENDS'
  | 'LW_INGEST_DUPLICATE_COLUMN'
  | 'LW_INGEST_LINE_TOO_LONG';

/**
 * A problem with an input file, located by file, line and column (1-based field number).
 *
 * The message reads `<file>, line <line>, column <column> (<name>): <what was wrong>`, with the
 * parts that do not apply left out, so a one-line report can print it as it is.
 *
 * @example
 * new IngestError('LW_INGEST_NON_NUMERIC', 'run7.csv', 12, 2, 'non-numeric cell "n/a"').message;
 * // returns 'run7.csv, line 12, column 2: non-numeric cell "n/a"'
 */
export class IngestError extends Error {
  constructor(
    readonly code: IngestErrorCode,
    readonly file: string,
    readonly line: number,
    readonly column: number,
    readonly detail: string,
    readonly columnName?: string,
  ) {
    super(`${where(file, line, column, columnName)}: ${detail}`);
    this.name = 'IngestError';
  }
}

function where(file: string, line: number, column: number, columnName?: string): string {
  let s = file;
  if (line > 0) s += `, line ${line}`;
  if (column > 0) s += `, column ${column}`;
  if (column > 0 && columnName !== undefined && columnName !== '') s += ` (${excerpt(columnName)})`;
  return s;
}

/** An ingestion option has a value outside its documented domain; `field` names the option. */
export class IngestOptionError extends Error {
  readonly code = 'LW_INGEST_INVALID_OPTION';
  constructor(
    readonly field: string,
    readonly value: unknown,
    rule: string,
  ) {
    super(`option ${field} = ${describe(value)} is invalid: ${rule}`);
    this.name = 'IngestOptionError';
  }
}

function describe(value: unknown): string {
  if (typeof value === 'string') return JSON.stringify(value);
  if (typeof value === 'number') return Object.is(value, -0) ? '-0' : String(value);
  try {
    return JSON.stringify(value) ?? String(value);
  } catch {
    return String(value);
  }
}
