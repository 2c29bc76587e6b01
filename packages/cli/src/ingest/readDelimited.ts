import { createReadStream } from 'node:fs';
import { open, stat } from 'node:fs/promises';
import { parse, type Options as CsvParseOptions } from 'csv-parse';
import { ChunkAssembler } from './ChunkAssembler.js';
import { channelConversion, type ChannelConversion, type ChannelQuantity } from './channelConversion.js';
import { DELIMITER_CHARACTERS, detectDialect, type Dialect, type DialectOverride } from './detectDialect.js';
import { classifyBadText, FastNumericScanner, SCAN_QUOTED, type ScannerLayout } from './FastNumericScanner.js';
import { excerpt } from './excerpt.js';
import { IngestError, IngestOptionError } from './IngestError.js';
import { parseDecimalText } from './parseDecimal.js';
import { SignalChecks, type SignalCheckThresholds, type SignalWarning } from './SignalChecks.js';
import { TimeAxisCheck, type TimeAxisSummary } from './TimeAxisCheck.js';

/**
 * A column of the file: its header name (a string) or its 1-based field number (a number; the
 * first column is 1). Indices are 1-based everywhere in ingestion, in options and in errors.
 */
export type ColumnReference = string | number;

/** One channel to read: which column, what it holds and in which unit. */
export type ChannelSelection = ChannelQuantity & {
  column: ColumnReference;
  /** Name in reports and warnings. Default: the header name, or `column N`. */
  name?: string;
};

/** Where sample times come from: a time column (any unit, usually s), or a sample rate in Hz. */
export type TimeSource = { column: ColumnReference } | { sampleRate: number };

/** A chunk of samples delivered while the file is read. */
export interface IngestChunk {
  /** 0-based index of the chunk's first sample in the whole file. */
  readonly firstSample: number;
  readonly length: number;
  /** One array per selected channel, in option order, in engine units (MPa or strain). */
  readonly channels: readonly Float64Array[];
  /** The time column's values (file unit), or null with a sample rate. */
  readonly time: Float64Array | null;
}

/** Options of {@link readDelimited}. Every field documents its default. */
export interface IngestOptions {
  /** The channels to read (at least one). */
  channels: readonly ChannelSelection[];
  /** A time column or a sample rate. Default: none (samples only). */
  time?: TimeSource;
  /** Parts of the dialect to fix instead of detecting them. Default: all detected. */
  dialect?: DialectOverride;
  /** 'auto' (default): the fast reader for plain numeric text, csv-parse once quotes appear; 'csv-parse': always csv-parse. */
  reader?: 'auto' | 'csv-parse';
  /** Bytes read at a time. Default 1 MiB (1,048,576). Any size from 1 works (for tests). */
  chunkBytes?: number;
  /** Samples per delivered chunk. Default 65,536. */
  chunkSamples?: number;
  /** Bytes looked at for dialect detection. Default 64 KiB. */
  detectionBytes?: number;
  /** Thresholds of the signal checks, or false to skip them. Default: the documented defaults. */
  checks?: Partial<SignalCheckThresholds> | false;
  /** Called with each chunk as it is read. Default: none (only the report). */
  onChunk?: (chunk: IngestChunk) => void;
  /**
   * Stop reading once this many samples have been delivered (the chunk that reaches it is
   * delivered whole); default: read the whole file. For a second read of a prefix.
   */
  stopAfterSamples?: number;
  /** The file's name in messages and in the report. Default: `path`. */
  name?: string;
}

/** Thrown inside the reading loop to stop at `stopAfterSamples` (internal). */
const STOP_READING = Symbol('stop reading');

/** A channel as read. */
export interface IngestedChannel {
  readonly name: string;
  /** 1-based field number in the file. */
  readonly column: number;
  readonly quantity: ChannelQuantity['quantity'];
  readonly conversion: ChannelConversion;
}

/** What {@link readDelimited} found. */
export interface IngestReport {
  readonly file: string;
  readonly dialect: Dialect;
  /** 'fast', 'csv-parse', or 'fast, then csv-parse from line N' (quotes first seen at line N). */
  readonly reader: string;
  readonly samples: number;
  readonly channels: readonly IngestedChannel[];
  /** Time column statistics, or the sample rate and its time step (s). */
  readonly time:
    | { readonly kind: 'none' }
    | { readonly kind: 'sample-rate'; readonly sampleRate: number; readonly timeStep: number }
    | ({ readonly kind: 'column'; readonly column: number; readonly name: string } & TimeAxisSummary);
  /** Signal-check and time-axis warnings. */
  readonly warnings: readonly SignalWarning[];
}

/** 1 MiB. */
export const DEFAULT_CHUNK_BYTES = 1 << 20;
export const DEFAULT_CHUNK_SAMPLES = 65536;
const DEFAULT_DETECTION_BYTES = 1 << 16;
/** Longest first line searched for a line end, bytes (the detection reads no more). */
const MAX_LINE_BYTES = 64 << 20;

/**
 * Line ends of carriage returns alone (old Mac text) are reported as such: a CR inside the
 * sample with no line feed anywhere in it (a line feed ends every line of LF or CRLF text).
 */
function crOnly(sample: Buffer, file: string): void {
  const cr = sample.indexOf(13);
  if (cr < 0 || sample.indexOf(10) >= 0 || cr === sample.length - 1) return;
  throw new IngestError('LW_INGEST_CR_LINE_ENDS', file, 1, 0, 'the lines end in a carriage return alone (old Mac text); loopwise reads LF or CRLF line ends: convert the file (e.g. tr \'\\r\' \'\\n\')');
}

/**
 * Reads the selected columns of a delimited numeric file (comma, semicolon, tab or whitespace;
 * header or not; BOM, CRLF, comment lines, decimal commas, quoted fields), streaming: the file is
 * read `chunkBytes` at a time and the values are delivered to `onChunk` as Float64Array chunks
 * of `chunkSamples` rows, so memory does not grow with the file. Values come out in the engine's
 * units (stress MPa, strain dimensionless) with the conversion stated in the report.
 *
 * Method: the dialect is detected from the first `detectionBytes` ({@link detectDialect}).
 * Plain numeric text goes through the fast reader ({@link FastNumericScanner}, bit-exact with
 * `Number()`); from the first line with a quote character on, or throughout with
 * `reader: 'csv-parse'`, csv-parse 6 reads the file (`Number()` on each field after the same
 * grammar check). Each channel then runs the streaming {@link SignalChecks}; a time column runs
 * {@link TimeAxisCheck} and a non-increasing time becomes a `time-not-increasing` warning.
 *
 * @param path - the file
 * @param options - channels, time source, dialect overrides, reader and check options
 * @returns the report: dialect (and how it was decided), reader used, samples, channels with
 *   conversions, time statistics, warnings
 * @throws IngestError for every input problem, naming the file, 1-based line and 1-based column
 *   (field number); IngestOptionError for bad options
 *
 * @example
 * const report = await readDelimited('run7.csv', {
 *   channels: [{ column: 'strain_ue', quantity: 'strain', unit: 'microstrain' }],
 *   time: { column: 1 },
 *   onChunk: (c) => counter.push(c.channels[0]),
 * });
 * report.channels[0].conversion.statement;
 * // returns 'microstrain ÷ 10^6 to strain'
 */
export async function readDelimited(path: string, options: IngestOptions): Promise<IngestReport> {
  const file = options.name ?? path;
  const chunkBytes = positiveInteger(options.chunkBytes ?? DEFAULT_CHUNK_BYTES, 'chunkBytes');
  const chunkSamples = positiveInteger(options.chunkSamples ?? DEFAULT_CHUNK_SAMPLES, 'chunkSamples');
  const detectionBytes = positiveInteger(options.detectionBytes ?? DEFAULT_DETECTION_BYTES, 'detectionBytes');
  if (!Array.isArray(options.channels) || options.channels.length === 0)
    throw new IngestOptionError('channels', options.channels, 'give at least one channel');
  const conversions = options.channels.map((c, k) => channelConversion(c, `channels[${k}]`));
  if (options.reader !== undefined && options.reader !== 'auto' && options.reader !== 'csv-parse')
    throw new IngestOptionError('reader', options.reader, "'auto' or 'csv-parse'");
  const time = options.time;
  if (time !== undefined && 'sampleRate' in time && !(time.sampleRate > 0 && Number.isFinite(time.sampleRate)))
    throw new IngestOptionError('time.sampleRate', time.sampleRate, 'a finite sample rate > 0 in Hz');

  // the file itself
  let size: number;
  try {
    const st = await stat(path);
    if (st.isDirectory()) throw new IngestError('LW_INGEST_IS_DIRECTORY', file, 0, 0, 'is a directory, not a data file');
    size = st.size;
  } catch (err) {
    if (err instanceof IngestError) throw err;
    const code = (err as NodeJS.ErrnoException).code;
    if (code === 'ENOENT') throw new IngestError('LW_INGEST_MISSING_FILE', file, 0, 0, 'no such file');
    throw new IngestError('LW_INGEST_READ_FAILED', file, 0, 0, `cannot read the file (${code ?? String(err)})`);
  }
  const handle = await open(path, 'r');
  try {
    // detection sample, cut after its last line feed unless it is the whole file
    let sample = Buffer.alloc(0);
    let want = Math.min(size, detectionBytes);
    for (;;) {
      sample = Buffer.alloc(want);
      const { bytesRead } = await handle.read(sample, 0, want, 0);
      sample = sample.subarray(0, bytesRead);
      if (bytesRead >= size || sample.lastIndexOf(10) >= 0 || want >= size) break;
      // no line feed yet: old Mac line ends (CR only), or a very long first line
      if (sample.indexOf(13) >= 0 && sample.indexOf(13) < sample.length - 1) break;
      if (want >= MAX_LINE_BYTES)
        throw new IngestError('LW_INGEST_LINE_TOO_LONG', file, 1, 0, `no line end in the first ${MAX_LINE_BYTES >> 20} MiB: not a delimited text file, or a line far too long`);
      want = Math.min(size, want * 4, MAX_LINE_BYTES);
    }
    crOnly(sample, file);
    const wholeFile = sample.length >= size;
    if (!wholeFile) {
      const cut = sample.lastIndexOf(10);
      if (cut >= 0) sample = sample.subarray(0, cut + 1);
    }
    const dialect = detectDialect(sample, options.dialect ?? {}, file);
    if (dialect.fieldCount === 0 || (wholeFile && dialect.headerLine === 0 && isContentless(sample, dialect)))
      throw new IngestError('LW_INGEST_EMPTY_FILE', file, 0, 0, 'empty file: no data lines (only blank or comment lines, if any)');

    // columns
    const refs: ColumnReference[] = options.channels.map((c) => c.column);
    if (time !== undefined && 'column' in time) refs.push(time.column);
    if (dialect.fieldCount === 1 && new Set(refs).size > 1) throw wrongDelimiter(sample, dialect, file);
    const fields = refs.map((r, k) => resolveColumn(r, dialect, file, k < options.channels.length ? `channels[${k}].column` : 'time.column'));

    const width = fields.length;
    const slotOfField = new Int32Array(dialect.fieldCount).fill(-1);
    const multiplier = new Float64Array(width).fill(1);
    const divisor = new Float64Array(width).fill(1);
    fields.forEach((f, slot) => {
      if (slotOfField[f] >= 0)
        throw new IngestOptionError(slot < conversions.length ? `channels[${slot}].column` : 'time.column', refs[slot], `column ${f + 1} is already selected`);
      slotOfField[f] = slot;
      if (slot < conversions.length) {
        multiplier[slot] = conversions[slot].multiplier;
        divisor[slot] = conversions[slot].divisor;
      }
    });

    const channelNames = options.channels.map((c, k) => c.name ?? dialect.names[fields[k]]);
    const checks = options.checks === false ? null : channelNames.map((n) => new SignalChecks(n, options.checks || {}));
    const hasTimeColumn = time !== undefined && 'column' in time;
    const timeCheck = hasTimeColumn ? new TimeAxisCheck() : null;
    const nChannels = options.channels.length;
    const onChunk = options.onChunk;
    const stopAfter = options.stopAfterSamples;
    if (stopAfter !== undefined && !(Number.isInteger(stopAfter) && stopAfter >= 1))
      throw new IngestOptionError('stopAfterSamples', stopAfter, 'an integer >= 1');
    const assembler = new ChunkAssembler(width, chunkSamples, (cols, firstSample) => {
      const channels = cols.slice(0, nChannels);
      const t = hasTimeColumn ? cols[nChannels] : null;
      if (checks) for (let k = 0; k < nChannels; k++) checks[k].push(channels[k], firstSample);
      if (timeCheck && t) timeCheck.push(t);
      onChunk?.({ firstSample, length: channels[0].length, channels, time: t });
      if (stopAfter !== undefined && firstSample + channels[0].length >= stopAfter) throw STOP_READING;
    });

    const layout = {
      file,
      delimiter: dialect.delimiter,
      decimalComma: dialect.decimalComma,
      commentByte: dialect.commentPrefix === '' ? -1 : dialect.commentPrefix.charCodeAt(0),
      fieldCount: dialect.fieldCount,
      slotOfField,
      multiplier,
      divisor,
      names: dialect.names,
    };
    if (dialect.commentPrefix.length > 1 || (dialect.commentPrefix !== '' && dialect.commentPrefix.charCodeAt(0) > 127))
      throw new IngestOptionError('dialect.commentPrefix', dialect.commentPrefix, 'one ASCII character, or empty for none');

    let reader = 'fast';
    const bomLength = dialect.bom ? 3 : 0;
    if (dialect.quoted || options.reader === 'csv-parse') {
      reader = 'csv-parse';
      if (dialect.delimiter === 'whitespace') reader = 'fast';
    }
    let headerPending = dialect.header;
    try {
      if (reader === 'fast') {
        const scanner = new FastNumericScanner(layout, assembler, 1, headerPending);
        const stop = await scanFile(handle, scanner, bomLength, chunkBytes);
        headerPending = scanner.headerPending;
        if (stop >= 0) {
          if (dialect.delimiter === 'whitespace')
            throw new IngestError('LW_INGEST_MALFORMED_QUOTES', file, scanner.line, 0, 'quoted fields are not supported in the whitespace dialect');
          reader = `fast, then csv-parse from line ${scanner.line}`;
          await readWithCsvParse(path, stop, scanner.line - 1, false, headerPending, layout, assembler, chunkBytes);
          headerPending = false;
        }
      } else {
        await readWithCsvParse(path, 0, 0, true, headerPending, layout, assembler, chunkBytes);
        headerPending = false;
      }
      assembler.flush();
    } catch (err) {
      if (err !== STOP_READING) throw err;
    }
    if (assembler.samples === 0) {
      if (dialect.header)
        throw new IngestError('LW_INGEST_HEADER_ONLY', file, dialect.headerLine, 0, 'header only: the file has column names but no data rows');
      throw new IngestError('LW_INGEST_EMPTY_FILE', file, 0, 0, 'empty file: no data lines (only blank or comment lines, if any)');
    }

    const warnings: SignalWarning[] = [];
    if (checks) for (const c of checks) warnings.push(...c.finish());
    let timeReport: IngestReport['time'] = { kind: 'none' };
    if (time !== undefined && 'sampleRate' in time) timeReport = { kind: 'sample-rate', sampleRate: time.sampleRate, timeStep: 1 / time.sampleRate };
    if (timeCheck) {
      const summary = timeCheck.summary();
      const f = fields[nChannels];
      timeReport = { kind: 'column', column: f + 1, name: dialect.names[f], ...summary };
      if (summary.nonIncreasingSteps > 0)
        warnings.push({
          kind: 'time-not-increasing',
          channel: dialect.names[f],
          samples: summary.nonIncreasingSteps,
          ranges: summary.nonIncreasingAt,
          rangesOmitted: summary.nonIncreasingSteps - summary.nonIncreasingAt.length,
          message: `${dialect.names[f]}: time does not increase at ${summary.nonIncreasingSteps} step(s), first between samples ${summary.nonIncreasingAt[0].first} and ${summary.nonIncreasingAt[0].last}`,
        });
    }
    return {
      file,
      dialect,
      reader,
      samples: assembler.samples,
      channels: options.channels.map((c, k) => ({ name: channelNames[k], column: fields[k] + 1, quantity: c.quantity, conversion: conversions[k] })),
      time: timeReport,
      warnings,
    };
  } finally {
    await handle.close();
  }
}

/**
 * Reads whole columns into memory: {@link readDelimited} collecting every chunk into one
 * Float64Array per channel (and the time column). For files that fit in memory; stream with
 * `onChunk` otherwise.
 *
 * @example
 * const { channels: [stress] } = await readDelimitedColumns('rig.csv', { channels: [{ column: 2, quantity: 'stress', unit: 'ksi' }] });
 * // stress is a Float64Array in MPa
 */
export async function readDelimitedColumns(
  path: string,
  options: Omit<IngestOptions, 'onChunk'>,
): Promise<{ report: IngestReport; channels: Float64Array[]; time: Float64Array | null }> {
  const n = options.channels.length;
  // size the columns once from the file: its length over the bytes per line of its head
  let capacity = 1 << 16;
  try {
    const st = await stat(path);
    if (st.isFile() && st.size > 0) {
      const handle = await open(path, 'r');
      try {
        const head = Buffer.alloc(Math.min(st.size, 1 << 16));
        const { bytesRead } = await handle.read(head, 0, head.length, 0);
        let lines = 0;
        for (let i = 0; i < bytesRead; i++) if (head[i] === 10) lines++;
        if (lines > 0) capacity = Math.max(capacity, Math.ceil((1.02 * st.size * lines) / bytesRead) + 1024);
      } finally {
        await handle.close();
      }
    }
  } catch {
    // readDelimited reports a missing or unreadable file with its own error
  }
  let channels: Float64Array[] = Array.from({ length: n }, () => new Float64Array(capacity));
  let time: Float64Array | null = null;
  let length = 0;
  const report = await readDelimited(path, {
    ...options,
    onChunk: (chunk) => {
      if (length + chunk.length > capacity) {
        while (length + chunk.length > capacity) capacity *= 2;
        channels = channels.map((c) => grow(c, capacity, length));
        if (time) time = grow(time, capacity, length);
      }
      for (let k = 0; k < n; k++) channels[k].set(chunk.channels[k], length);
      if (chunk.time) {
        if (!time) time = new Float64Array(capacity);
        time.set(chunk.time, length);
      }
      length += chunk.length;
    },
  });
  // a view when the estimate was close (no copy of millions of rows), a trimmed copy otherwise
  const trim = (c: Float64Array) => (c.length - length <= c.length / 4 ? c.subarray(0, length) : c.slice(0, length));
  return { report, channels: channels.map(trim), time: time ? trim(time as Float64Array) : null };
}

function grow(a: Float64Array, capacity: number, used: number): Float64Array {
  const b = new Float64Array(capacity);
  b.set(a.subarray(0, used));
  return b;
}

/** Reads the file through the fast scanner; returns -1 at the end, or the file offset of a quoted line. */
async function scanFile(handle: import('node:fs/promises').FileHandle, scanner: FastNumericScanner, from: number, chunkBytes: number): Promise<number> {
  let work = Buffer.allocUnsafe(Math.max(2 * chunkBytes, 4096) + 1);
  let carry = 0;
  let filePos = from;
  // double buffering: the next chunk is read while this one is scanned
  const buffers = [Buffer.allocUnsafe(chunkBytes), Buffer.allocUnsafe(chunkBytes)];
  let which = 0;
  let next: Promise<{ bytesRead: number }> | null = handle.read(buffers[which], 0, chunkBytes, filePos);
  try {
    for (;;) {
      const { bytesRead } = await (next as Promise<{ bytesRead: number }>);
      next = null;
      const got = buffers[which];
      const readAt = filePos;
      filePos += bytesRead;
      if (carry + bytesRead + 1 > work.length) {
        const bigger = Buffer.allocUnsafe(2 * (carry + bytesRead) + 1);
        work.copy(bigger, 0, 0, carry);
        work = bigger;
      }
      got.copy(work, carry, 0, bytesRead);
      if (bytesRead > 0) {
        which ^= 1;
        next = handle.read(buffers[which], 0, chunkBytes, filePos);
      }
      const workOffset = readAt - carry;
      let len = carry + bytesRead;
      if (bytesRead === 0) {
        if (len === 0) return -1;
        work[len++] = 10; // the last line has no line feed
        const r = scanner.scan(work, 0, len);
        return r === SCAN_QUOTED ? workOffset + scanner.stopOffset : -1;
      }
      const lastLineFeed = work.lastIndexOf(10, len - 1);
      if (lastLineFeed < carry) {
        carry = len;
        continue;
      }
      const r = scanner.scan(work, 0, lastLineFeed + 1);
      if (r === SCAN_QUOTED) return workOffset + scanner.stopOffset;
      work.copy(work, 0, lastLineFeed + 1, len);
      carry = len - lastLineFeed - 1;
    }
  } finally {
    // no read may still be running when the caller closes the file
    if (next) await next.catch(() => undefined);
  }
}

/**
 * The csv-parse options of the public reader (documented in docs/cli-ingestion.md): quote `"`,
 * escape `""`, full-line comments only, empty lines skipped, CRLF or LF record ends, field counts
 * checked by us (so the error names the line).
 */
function csvParseOptions(layout: ScannerLayout, bom: boolean): CsvParseOptions {
  return {
    delimiter: DELIMITER_CHARACTERS[layout.delimiter],
    bom,
    comment: layout.commentByte >= 0 ? String.fromCharCode(layout.commentByte) : undefined,
    comment_no_infix: true,
    skip_empty_lines: true,
    relax_column_count: true,
    record_delimiter: ['\r\n', '\n'],
    info: true,
    cast: false,
  };
}

async function readWithCsvParse(
  path: string,
  start: number,
  lineOffset: number,
  bom: boolean,
  headerPending: boolean,
  layout: ScannerLayout,
  out: ChunkAssembler,
  chunkBytes: number,
): Promise<void> {
  const { file, fieldCount: nf, slotOfField, multiplier, divisor, decimalComma, names } = layout;
  const parser = createReadStream(path, { start, highWaterMark: Math.max(chunkBytes, 16) }).pipe(parse(csvParseOptions(layout, bom)));
  try {
    for await (const item of parser as AsyncIterable<{ record: string[]; info: { lines: number } }>) {
      const { record, info } = item;
      const line = info.lines + lineOffset;
      if (record.length === 1 && record[0].trim() === '') continue; // a line of blanks
      if (headerPending) {
        headerPending = false;
        continue;
      }
      if (record.length !== nf)
        throw new IngestError(
          'LW_INGEST_RAGGED_ROW',
          file,
          line,
          record.length < nf ? record.length + 1 : nf + 1,
          `ragged row: ${record.length} field${record.length === 1 ? '' : 's'} where ${nf} are expected`,
        );
      for (let f = 0; f < nf; f++) {
        const slot = slotOfField[f];
        if (slot < 0) continue;
        const text = record[f];
        const v = parseDecimalText(text, decimalComma);
        if (v - v !== 0) {
          if (/[\u0000-\u0008\u000b\u000c\u000e-\u001f]/.test(text))
            throw new IngestError('LW_INGEST_BINARY_DATA', file, line, f + 1, 'binary data: control bytes are not text', names[f]);
          if (text.includes('\ufffd'))
            throw new IngestError('LW_INGEST_INVALID_UTF8', file, line, f + 1, 'invalid UTF-8 text (binary data, or a file in another encoding)', names[f]);
          throw classifyBadText(text, file, line, f + 1, decimalComma, names[f]);
        }
        out.columns[slot][out.row] = (v * multiplier[slot]) / divisor[slot];
      }
      if (++out.row === out.capacity) out.flush();
    }
  } catch (err) {
    if (err instanceof IngestError) throw err;
    const e = err as { code?: string; lines?: number; message?: string };
    if (typeof e.code === 'string' && e.code.startsWith('CSV_'))
      throw new IngestError('LW_INGEST_MALFORMED_QUOTES', file, (e.lines ?? 0) + lineOffset, 0, `csv-parse: ${e.message ?? e.code}`);
    throw err;
  }
}

function resolveColumn(ref: ColumnReference, dialect: Dialect, file: string, field: string): number {
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
      : `unknown column "${ref}": the file has no header, so select columns by 1-based index (1 to ${dialect.fieldCount})`;
    throw new IngestError('LW_INGEST_UNKNOWN_COLUMN', file, dialect.headerLine, 0, detail);
  }
  return k;
}

/** The columns for a message: at most 12, each name a short sanitized excerpt. */
function listNames(dialect: Dialect): string {
  const shown = dialect.names.slice(0, 12).map((n, k) => `${k + 1} ${excerpt(n)}`);
  if (dialect.names.length > 12) shown.push(`… (${dialect.names.length} in all)`);
  return shown.join(', ');
}

function wrongDelimiter(sample: Buffer, dialect: Dialect, file: string): IngestError {
  // first content line, for the message
  const text = sample.toString('utf8').replace(/^\ufeff/, '');
  const lines = text.split('\n');
  let lineNo = 0;
  let shown = '';
  for (const l of lines) {
    lineNo++;
    const t = l.replace(/\r$/, '');
    if (t.trim() === '' || (dialect.commentPrefix !== '' && t.startsWith(dialect.commentPrefix))) continue;
    shown = t;
    if (!dialect.header || lineNo > dialect.headerLine) break;
  }
  const other = (['comma', 'semicolon', 'tab', 'whitespace'] as const).filter((d) => d !== dialect.delimiter).map((d) => JSON.stringify(DELIMITER_CHARACTERS[d]).replace('" "', 'whitespace'));
  return new IngestError(
    'LW_INGEST_WRONG_DELIMITER',
    file,
    lineNo,
    1,
    `wrong delimiter: one column found with ${dialect.delimiter} (${JSON.stringify(DELIMITER_CHARACTERS[dialect.delimiter])}) where several are selected; the line reads ${excerpt(shown)} (other delimiters: ${other.join(', ')})`,
  );
}

function isContentless(sample: Buffer, dialect: Dialect): boolean {
  const text = sample.toString('utf8').replace(/^\ufeff/, '');
  for (const l of text.split('\n')) {
    const t = l.replace(/\r$/, '');
    if (t.trim() === '') continue;
    if (dialect.commentPrefix !== '' && t.startsWith(dialect.commentPrefix)) continue;
    return false;
  }
  return true;
}

function positiveInteger(v: number, field: string): number {
  if (!Number.isInteger(v) || v < 1) throw new IngestOptionError(field, v, 'a whole number >= 1');
  return v;
}
