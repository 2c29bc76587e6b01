import { IngestError, IngestOptionError } from './IngestError.js';
import { utf8Decoder } from './textDecoding.js';
import { parseDecimalText } from './parseDecimal.js';

/** Field delimiters: `whitespace` means any run of spaces and tabs. */
export type DelimiterName = 'comma' | 'semicolon' | 'tab' | 'whitespace';

/** The characters of each delimiter (the whitespace dialect splits on runs of ' ' and '\t'). */
export const DELIMITER_CHARACTERS: Readonly<Record<DelimiterName, string>> = Object.freeze({
  comma: ',',
  semicolon: ';',
  tab: '\t',
  whitespace: ' ',
});

/** Parts of the dialect the caller fixes instead of letting {@link detectDialect} find them. */
export interface DialectOverride {
  /** Field delimiter. Default: detected. */
  delimiter?: DelimiterName;
  /** Decimal separator is `,`. Default: detected (only with semicolon or tab delimiters). */
  decimalComma?: boolean;
  /** The first content line is a header of column names. Default: detected. */
  header?: boolean;
  /** A line whose first character is this one is a comment. Default `'#'`; `''` for none. */
  commentPrefix?: string;
  /** Lines at the top of the file before the table (a logger's preamble), ignored whatever they hold. Default 0. */
  skipLines?: number;
  /** The content line after the header holds the columns' units. Default: detected (only with a header). */
  unitsRow?: boolean;
}

/** How each part of a {@link Dialect} was decided. */
export type DialectSource = 'detected' | 'option';

/** The dialect of a delimited file, as detected from its first lines or fixed by options. */
export interface Dialect {
  readonly delimiter: DelimiterName;
  readonly decimalComma: boolean;
  readonly header: boolean;
  /** '' when comment lines are not recognised. */
  readonly commentPrefix: string;
  /** The file starts with a UTF-8 byte order mark (skipped). */
  readonly bom: boolean;
  /** Line ends of the first lines: 'LF' or 'CRLF' (both are accepted everywhere). */
  readonly lineEnd: 'LF' | 'CRLF';
  /** A quote character appears in the first lines: the quoted-field reader handles the file. */
  readonly quoted: boolean;
  /** Fields per row, from the first content lines. */
  readonly fieldCount: number;
  /** Column names: the header's, or `column 1`, `column 2`, … without a header. */
  readonly names: readonly string[];
  /** 1-based line of the header, or 0 without one. */
  readonly headerLine: number;
  /** Lines skipped at the top before the table. */
  readonly skipLines: number;
  /** 1-based line of the units row, or 0 without one. */
  readonly unitsLine: number;
  /**
   * Each column's unit as the file writes it (`'µε'`, `'MPa'`, `'s'`…; `''` when it gives none):
   * from the units row, or from a bracketed suffix of the header name (`SG1 [µε]`, `F (kN)`).
   */
  readonly units: readonly string[];
  /** Where the units came from. */
  readonly unitsSource: 'row' | 'names' | 'none';
  /** How delimiter, decimal separator, header and units row were decided. */
  readonly source: { readonly delimiter: DialectSource; readonly decimalComma: DialectSource; readonly header: DialectSource; readonly unitsRow: DialectSource };
}

/** Content lines of the sample looked at for detection. */
const DETECTION_LINES = 50;
/** Tried in this order; the first with the most consistent field count of at least 2 wins. */
const CANDIDATES: readonly DelimiterName[] = ['tab', 'semicolon', 'comma', 'whitespace'];

interface SampleLine {
  line: number;
  text: string;
}

/**
 * Detects the dialect of a delimited numeric file from its first bytes: delimiter, decimal
 * comma, header, BOM, line ends, quoting, field count and column names. Parts given in
 * `override` are taken as they are.
 *
 * Method (our own, documented in docs/ingest.md): the first 50 content lines (not blank,
 * not comments) are split with each candidate delimiter (tab, semicolon, comma, whitespace runs;
 * quote-aware for the first three). The candidate whose most common field count is at least 2
 * and is shared by the most lines wins; ties go to the earlier candidate, so `1,5;2,5` is
 * semicolon with decimal commas. No candidate with 2 or more fields: one column. A decimal comma
 * is detected with semicolon or tab delimiters when some data field is a number with a comma and
 * none has a point. The first content line is a header when one of its fields is not a number
 * where the next line's field is (or when it is the only line and not numeric).
 *
 * @param sample - the first bytes of the file (ideally cut after a line end)
 * @param override - parts of the dialect fixed by the caller
 * @param file - the file name for error messages
 * @throws IngestError LW_INGEST_BINARY_DATA (NUL or control bytes), LW_INGEST_INVALID_UTF8
 *
 * @example
 * detectDialect(new TextEncoder().encode('t;x\n0;1,5\n0,01;2,5\n')).decimalComma;
 * // returns true
 */
export function detectDialect(sample: Uint8Array, override: DialectOverride = {}, file = '<input>'): Dialect {
  const bom = sample.length >= 3 && sample[0] === 0xef && sample[1] === 0xbb && sample[2] === 0xbf;
  const bytes = bom ? sample.subarray(3) : sample;
  checkBinary(bytes, file);
  const text = decodeUtf8(bytes, file);
  const commentPrefix = override.commentPrefix ?? '#';
  const skipLines = override.skipLines ?? 0;
  if (!Number.isInteger(skipLines) || skipLines < 0) throw new IngestOptionError('dialect.skipLines', skipLines, 'a whole number of lines >= 0');
  const lines: SampleLine[] = [];
  let crlf = false;
  let lineNo = 0;
  for (const raw of text.split('\n')) {
    lineNo++;
    if (lineNo <= skipLines) continue;
    if (lines.length >= DETECTION_LINES) break;
    if (raw.endsWith('\r')) crlf = true;
    const t = raw.endsWith('\r') ? raw.slice(0, -1) : raw;
    if (t.trim() === '') continue;
    if (commentPrefix !== '' && t.startsWith(commentPrefix)) continue;
    lines.push({ line: lineNo, text: t });
  }
  const quoted = lines.some((l) => l.text.includes('"'));

  let delimiter: DelimiterName;
  let fieldCount = 1;
  if (override.delimiter !== undefined) {
    delimiter = override.delimiter;
    fieldCount = modeCount(lines.map((l) => splitFields(l.text, delimiter).length)).value;
  } else {
    delimiter = 'comma';
    let bestScore = 0;
    for (const candidate of CANDIDATES) {
      const { value, score } = modeCount(lines.map((l) => splitFields(l.text, candidate).length));
      if (value >= 2 && score > bestScore) {
        delimiter = candidate;
        fieldCount = value;
        bestScore = score;
      }
    }
  }

  const split = lines.map((l) => splitFields(l.text, delimiter));
  let decimalComma: boolean;
  if (override.decimalComma !== undefined) decimalComma = override.decimalComma;
  else if (delimiter === 'semicolon' || delimiter === 'tab') {
    let comma = false;
    let point = false;
    for (const fields of split)
      for (const f of fields) {
        if (f.includes(',') && !Number.isNaN(parseDecimalText(f, true))) comma = true;
        if (f.includes('.') && !Number.isNaN(parseDecimalText(f, false))) point = true;
      }
    decimalComma = comma && !point;
  } else decimalComma = false;

  const numeric = (f: string | undefined) => f !== undefined && !Number.isNaN(parseDecimalText(f, decimalComma));
  let header: boolean;
  if (override.header !== undefined) header = override.header;
  else if (split.length === 0) header = false;
  else {
    // compared with the next line that holds a number (a units row may sit between)
    const first = split[0];
    const next = split.slice(1, 3).find((l) => l.some((f) => numeric(f))) ?? split[1];
    header = next === undefined ? !first.every((f) => numeric(f)) : first.some((f, k) => !numeric(f) && numeric(next[k]));
  }
  // a units row: right under the header, no field a number, a numeric line after it
  let unitsRow = false;
  if (override.unitsRow !== undefined) unitsRow = override.unitsRow && header;
  else if (header && split.length >= 3) {
    const row = split[1];
    unitsRow = row.every((f) => !numeric(f)) && row.some((f) => f.trim() !== '') && split[2].some((f, k) => numeric(f) && !numeric(row[k]));
  }
  if (override.unitsRow === true && !header) throw new IngestOptionError('dialect.unitsRow', true, 'a units row needs a header row above it');
  const rawNames = header && split.length > 0 ? split[0].map((n) => n.trim()) : Array.from({ length: fieldCount }, (_, k) => `column ${k + 1}`);
  let units: string[] = rawNames.map(() => '');
  let unitsSource: Dialect['unitsSource'] = 'none';
  let names = rawNames;
  if (unitsRow && split.length > 1) {
    units = rawNames.map((_, k) => unwrapUnit((split[1][k] ?? '').trim()));
    unitsSource = 'row';
  } else if (header) {
    const suffix = rawNames.map((n) => /^(.*?\S)\s*[[(]([^[\]()]{1,16})[\])]$/.exec(n));
    if (suffix.some((m) => m !== null)) {
      units = suffix.map((m) => (m ? m[2].trim() : ''));
      unitsSource = 'names';
    }
  }
  if (names.length < fieldCount) names = [...names, ...Array.from({ length: fieldCount - names.length }, (_, k) => `column ${names.length + k + 1}`)];
  return {
    delimiter,
    decimalComma,
    header,
    commentPrefix,
    bom,
    lineEnd: crlf ? 'CRLF' : 'LF',
    quoted,
    fieldCount,
    names,
    headerLine: header && lines.length > 0 ? lines[0].line : 0,
    skipLines,
    unitsLine: unitsRow && lines.length > 1 ? lines[1].line : 0,
    units,
    unitsSource,
    source: {
      delimiter: override.delimiter !== undefined ? 'option' : 'detected',
      decimalComma: override.decimalComma !== undefined ? 'option' : 'detected',
      header: override.header !== undefined ? 'option' : 'detected',
      unitsRow: override.unitsRow !== undefined ? 'option' : 'detected',
    },
  };
}

/** A unit as written in a units row, without enclosing brackets: `[µε]` → `µε`. */
function unwrapUnit(text: string): string {
  const m = /^[[(](.*)[\])]$/.exec(text);
  return m ? m[1].trim() : text;
}

/**
 * Splits one line into fields: quote-aware for comma, semicolon and tab (a field in double
 * quotes may hold the delimiter, `""` is a quote), runs of spaces and tabs for whitespace.
 * Quotes are removed. Used for detection and header names only, not on the hot path.
 */
export function splitFields(line: string, delimiter: DelimiterName): string[] {
  if (delimiter === 'whitespace') {
    const t = line.trim();
    return t === '' ? [''] : t.split(/[ \t]+/);
  }
  const d = DELIMITER_CHARACTERS[delimiter];
  const out: string[] = [];
  let field = '';
  let inQuotes = false;
  for (let i = 0; i < line.length; i++) {
    const ch = line[i];
    if (inQuotes) {
      if (ch === '"') {
        if (line[i + 1] === '"') {
          field += '"';
          i++;
        } else inQuotes = false;
      } else field += ch;
    } else if (ch === '"') inQuotes = true;
    else if (ch === d) {
      out.push(field);
      field = '';
    } else field += ch;
  }
  out.push(field);
  return out;
}

function modeCount(counts: number[]): { value: number; score: number } {
  const tally = new Map<number, number>();
  for (const c of counts) tally.set(c, (tally.get(c) ?? 0) + 1);
  let value = counts.length > 0 ? counts[0] : 1;
  let score = 0;
  for (const [v, n] of tally)
    if (n > score || (n === score && v > value)) {
      value = v;
      score = n;
    }
  return { value, score };
}

/** 1-based line of byte `index` in `bytes`. */
export function lineOfByte(bytes: Uint8Array, index: number): number {
  let line = 1;
  for (let i = 0; i < index && i < bytes.length; i++) if (bytes[i] === 10) line++;
  return line;
}

function checkBinary(bytes: Uint8Array, file: string): void {
  for (let i = 0; i < bytes.length; i++) {
    const b = bytes[i];
    if (b < 32 && b !== 9 && b !== 10 && b !== 13) {
      const line = lineOfByte(bytes, i);
      throw new IngestError(
        'LW_INGEST_BINARY_DATA',
        file,
        line,
        fieldOfByte(bytes, i),
        `binary data: byte 0x${b.toString(16).padStart(2, '0')} is not text (is this a delimited text file?)`,
      );
    }
  }
}

/** 1-based field number of byte `index` on its line, counting any of , ; tab as delimiters (for messages only). */
function fieldOfByte(bytes: Uint8Array, index: number): number {
  let start = index;
  while (start > 0 && bytes[start - 1] !== 10) start--;
  let field = 1;
  for (let i = start; i < index; i++) if (bytes[i] === 44 || bytes[i] === 59 || bytes[i] === 9) field++;
  return field;
}

const STRICT_UTF8 = utf8Decoder(true);

function decodeUtf8(bytes: Uint8Array, file: string): string {
  const bad = firstInvalidUtf8(bytes, 0, bytes.length);
  if (bad >= 0)
    throw new IngestError(
      'LW_INGEST_INVALID_UTF8',
      file,
      lineOfByte(bytes, bad),
      fieldOfByte(bytes, bad),
      `invalid UTF-8 text at byte 0x${bytes[bad].toString(16)} (binary data, or a file in another encoding)`,
    );
  return STRICT_UTF8.decode(bytes);
}

/**
 * Index of the first byte in `bytes[start, end)` that does not belong to a valid UTF-8 sequence
 * (RFC 3629, section 4: no overlong forms, no surrogates, at most U+10FFFF), or -1.
 */
export function firstInvalidUtf8(bytes: Uint8Array, start: number, end: number): number {
  let i = start;
  while (i < end) {
    const b = bytes[i];
    if (b < 0x80) {
      i++;
      continue;
    }
    let n: number;
    let lo = 0x80;
    let hi = 0xbf;
    if (b >= 0xc2 && b <= 0xdf) n = 1;
    else if (b >= 0xe0 && b <= 0xef) {
      n = 2;
      if (b === 0xe0) lo = 0xa0;
      if (b === 0xed) hi = 0x9f;
    } else if (b >= 0xf0 && b <= 0xf4) {
      n = 3;
      if (b === 0xf0) lo = 0x90;
      if (b === 0xf4) hi = 0x8f;
    } else return i;
    if (i + n >= end) return i;
    for (let k = 1; k <= n; k++) {
      const c = bytes[i + k];
      if (k === 1 ? c < lo || c > hi : c < 0x80 || c > 0xbf) return i;
    }
    i += n + 1;
  }
  return -1;
}
