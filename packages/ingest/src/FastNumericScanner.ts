import type { ChunkAssembler } from './ChunkAssembler.js';
import { utf8Decoder } from './textDecoding.js';
import type { DelimiterName } from './detectDialect.js';
import { firstInvalidUtf8 } from './detectDialect.js';
import { excerpt } from './excerpt.js';
import { IngestError } from './IngestError.js';
import { parseDecimal } from './parseDecimal.js';

// byte classes
const ORDINARY = 0;
const DELIMITER = 1;
const LINE_FEED = 2;
const CARRIAGE_RETURN = 3;
const QUOTE = 4;
const CONTROL = 5;
const BLANK = 6;

/** What {@link FastNumericScanner.scan} stopped at. */
export const SCAN_DONE = 0;
/** A quote character: the rest of the file, from `stopOffset` (a line start), needs the quoted-field reader. */
export const SCAN_QUOTED = 1;

/** The fixed part of a scan: dialect, selected fields and their conversions. */
export interface ScannerLayout {
  file: string;
  delimiter: DelimiterName;
  decimalComma: boolean;
  /** Byte of the comment prefix (first character only), or -1. */
  commentByte: number;
  fieldCount: number;
  /** For each 0-based field: the output column it goes to, or -1. */
  slotOfField: Int32Array;
  multiplier: Float64Array;
  divisor: Float64Array;
  /** Column names by 0-based field, for messages. */
  names: readonly string[];
}

/**
 * The fast reader's kernel: parses complete lines of plain numeric delimited text straight
 * from bytes into the columns of a {@link ChunkAssembler}. One pass with a 256-entry byte-class
 * table finds field bounds; {@link parseDecimal} converts each selected field (Clinger's fast
 * path, `Number()` otherwise), so values are bit-exact with `Number()` on the field's text.
 * No allocation or closure per sample.
 *
 * The caller passes only complete lines: `bytes[start, end)` must end with a line feed. Blank
 * lines and comment lines are skipped; the first `headerLinesPending` content lines (a header, a
 * units row) are skipped.
 * A quote character stops the scan at the start of its line (SCAN_QUOTED) so the caller can
 * hand the rest to the quoted-field reader. Every other problem throws an {@link IngestError} naming the file,
 * the 1-based line and the 1-based field number.
 */
export class FastNumericScanner {
  /** 1-based number of the next line to scan. */
  line: number;
  /** Content lines still to skip (header and units row). */
  headerLinesPending: number;
  /** Index in the last scanned buffer where a SCAN_QUOTED stop happened (a line start). */
  stopOffset = 0;
  private readonly cls = new Uint8Array(256);
  private readonly whitespace: boolean;

  constructor(
    private readonly layout: ScannerLayout,
    private readonly out: ChunkAssembler,
    firstLine: number,
    headerLines: number,
  ) {
    this.line = firstLine;
    this.headerLinesPending = headerLines;
    const cls = this.cls;
    for (let b = 0; b < 32; b++) cls[b] = CONTROL;
    cls[127] = ORDINARY;
    cls[10] = LINE_FEED;
    cls[13] = CARRIAGE_RETURN;
    cls[34] = QUOTE;
    this.whitespace = layout.delimiter === 'whitespace';
    cls[32] = BLANK;
    cls[9] = BLANK;
    if (this.whitespace) {
      cls[32] = DELIMITER;
      cls[9] = DELIMITER;
    } else cls[layout.delimiter === 'comma' ? 44 : layout.delimiter === 'semicolon' ? 59 : 9] = DELIMITER;
  }

  /** Scans the complete lines in `bytes[start, end)`; returns SCAN_DONE or SCAN_QUOTED. */
  scan(bytes: Uint8Array, start: number, end: number): number {
    const cls = this.cls;
    const { fieldCount: nf, slotOfField, multiplier, divisor, decimalComma, commentByte } = this.layout;
    const ws = this.whitespace;
    const out = this.out;
    const capacity = out.capacity;
    let cols = out.columns;
    let row = out.row;
    let line = this.line;
    let p = start;
    try {
      while (p < end) {
        if (bytes[p] === commentByte) {
          while (bytes[p] !== 10) {
            if (cls[bytes[p]] === CONTROL) this.fail(bytes, p, p + 1, line, 0, 'control');
            p++;
          }
          p++;
          line++;
          continue;
        }
        const lineStart = p;
        // leading blanks (and, in the whitespace dialect, leading delimiters)
        let k = cls[bytes[p]];
        while (k === BLANK || (ws && k === DELIMITER)) k = cls[bytes[++p]];
        if (k === LINE_FEED || (k === CARRIAGE_RETURN && bytes[p + 1] === 10)) {
          p += k === LINE_FEED ? 1 : 2;
          line++;
          continue; // blank line
        }
        if (this.headerLinesPending > 0) {
          while (bytes[p] !== 10) p++;
          p++;
          line++;
          this.headerLinesPending--;
          continue;
        }
        let field = 0;
        for (;;) {
          const s = p;
          while ((k = cls[bytes[p]]) === ORDINARY) p++;
          const e = p;
          while (k === BLANK) k = cls[bytes[++p]];
          const slot = field < nf ? slotOfField[field] : -1;
          if (k === ORDINARY || k >= QUOTE) {
            if (k === QUOTE) {
              this.stopOffset = lineStart;
              this.line = line;
              out.row = row;
              return SCAN_QUOTED;
            }
            if (k === CONTROL) this.fail(bytes, p, p + 1, line, field + 1, 'control');
            // a blank inside a field
            if (slot >= 0) this.fail(bytes, s, this.fieldEnd(bytes, p), line, field + 1, 'number');
            while ((k = cls[bytes[p]]) === ORDINARY || k === BLANK) p++;
            if (k >= QUOTE) continue; // handled by the checks above on the next round
          }
          if (slot >= 0) {
            const v = parseDecimal(bytes, s, e, decimalComma);
            if (v - v !== 0) this.fail(bytes, s, e, line, field + 1, 'number');
            cols[slot][row] = (v * multiplier[slot]) / divisor[slot];
          }
          field++;
          if (k === DELIMITER) {
            p++;
            if (ws) {
              while ((k = cls[bytes[p]]) === DELIMITER) p++;
              if (k === LINE_FEED || k === CARRIAGE_RETURN) {
                // trailing whitespace ends the line
              } else continue;
            } else {
              while ((k = cls[bytes[p]]) === BLANK) p++;
              continue;
            }
          }
          break;
        }
        // k is LINE_FEED or CARRIAGE_RETURN here
        if (k === CARRIAGE_RETURN) {
          if (bytes[p + 1] !== 10) this.fail(bytes, p, p + 1, line, field, 'control');
          p++;
        }
        p++;
        if (field !== nf) {
          throw new IngestError(
            'LW_INGEST_RAGGED_ROW',
            this.layout.file,
            line,
            field < nf ? field + 1 : nf + 1,
            `ragged row: ${field} field${field === 1 ? '' : 's'} where ${nf} are expected`,
          );
        }
        line++;
        if (++row === capacity) {
          out.row = row;
          out.flush();
          cols = out.columns;
          row = 0;
        }
      }
    } finally {
      out.row = row;
    }
    this.line = line;
    return SCAN_DONE;
  }

  /** End of the field that starts before `p` (next delimiter or line end). */
  private fieldEnd(bytes: Uint8Array, p: number): number {
    let k: number;
    while ((k = this.cls[bytes[p]]) === ORDINARY || k === BLANK) p++;
    return p;
  }

  private fail(bytes: Uint8Array, s: number, e: number, line: number, column: number, what: 'number' | 'control'): never {
    const { file, names } = this.layout;
    const name = column > 0 ? names[column - 1] : undefined;
    if (what === 'control') {
      const b = bytes[s];
      throw new IngestError(
        'LW_INGEST_BINARY_DATA',
        file,
        line,
        column,
        b === 13 ? 'a carriage return inside a line (line ends must be LF or CRLF)' : `binary data: byte 0x${b.toString(16).padStart(2, '0')} is not text`,
        name,
      );
    }
    throw classifyBadCell(bytes, s, e, file, line, column, this.layout.decimalComma, name);
  }
}

const UTF8 = utf8Decoder(false);

/** The error for a cell that is not a finite decimal number (shared with the quoted reader). */
export function classifyBadCell(
  bytes: Uint8Array,
  s: number,
  e: number,
  file: string,
  line: number,
  column: number,
  decimalComma: boolean,
  name?: string,
): IngestError {
  if (s === e) return new IngestError('LW_INGEST_EMPTY_CELL', file, line, column, 'empty cell where a number is expected', name);
  if (firstInvalidUtf8(bytes, s, e) >= 0)
    return new IngestError('LW_INGEST_INVALID_UTF8', file, line, column, 'invalid UTF-8 text (binary data, or a file in another encoding)', name);
  const text = UTF8.decode(bytes.subarray(s, e));
  return classifyBadText(text, file, line, column, decimalComma, name);
}

/** The error for a cell's text that is not a finite decimal number. */
export function classifyBadText(text: string, file: string, line: number, column: number, decimalComma: boolean, name?: string): IngestError {
  const t = text.trim();
  const shown = excerpt(t);
  if (t === '') return new IngestError('LW_INGEST_EMPTY_CELL', file, line, column, 'empty cell where a number is expected', name);
  if (/^[+-]?(nan|inf|infinity)$/i.test(t))
    return new IngestError('LW_INGEST_NON_FINITE', file, line, column, `${shown} is not a finite number (NaN and Infinity are not samples)`, name);
  const v = Number(decimalComma ? t.replace(',', '.') : t);
  if ((v === Infinity || v === -Infinity) && /^[+-]?(\d+[.,]?\d*|[.,]\d+)([eE][+-]?\d+)?$/.test(t))
    return new IngestError('LW_INGEST_OVERFLOW', file, line, column, `overflow: the number ${shown} (${t.length} characters) lies beyond a double's range (|value| > 1.8e308)`, name);
  const hint = !decimalComma && /^[+-]?\d+,\d+$/.test(t) ? ' (a decimal comma? the dialect says the decimal point is ".")' : decimalComma && t.includes('.') ? ' (the dialect says the decimal separator is ",")' : '';
  return new IngestError('LW_INGEST_NON_NUMERIC', file, line, column, `non-numeric cell ${shown}${hint}`, name);
}
