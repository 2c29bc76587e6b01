import { createReadStream } from 'node:fs';
import { open, stat } from 'node:fs/promises';
import { parse, type Options as CsvParseOptions } from 'csv-parse';
import {
  DELIMITER_CHARACTERS,
  DelimitedReader,
  IngestError,
  IngestOptionError,
  type ChannelSelection,
  type ColumnReference,
  type IngestChunk,
  type IngestReport,
  type IngestedChannel,
  type ReaderOptions,
  type TimeSource,
} from '@loopwise/ingest';

export type { ChannelSelection, ColumnReference, IngestChunk, IngestReport, IngestedChannel, TimeSource };

/**
 * Options of {@link readDelimited}: those of the reader ({@link ReaderOptions}) and how the file
 * is read. Every field documents its default.
 */
export interface IngestOptions extends ReaderOptions {
  /** 'auto' (default): the fast reader for plain numeric text, the quoted-field reader once quotes appear; 'csv-parse': csv-parse splits every record. */
  reader?: 'auto' | 'csv-parse';
  /** Bytes read at a time. Default 1 MiB (1,048,576). Any size from 1 works (for tests). */
  chunkBytes?: number;
  /** The file's name in messages and in the report. Default: `path`. */
  name?: string;
}

/** 1 MiB. */
export const DEFAULT_CHUNK_BYTES = 1 << 20;


/**
 * Reads the selected columns of a delimited numeric file from disk, streaming: the file is read
 * `chunkBytes` at a time (the next piece is read while this one is parsed) into a
 * {@link DelimitedReader} from `@loopwise/ingest`, which detects the dialect, parses and checks
 * the values and delivers them to `onChunk` as Float64Array chunks of `chunkSamples` rows in the
 * engine's units (stress MPa, strain dimensionless), with the conversion stated in the report.
 * With `reader: 'csv-parse'`, csv-parse 6 splits every record instead of the reader's own
 * byte scanners (the same decimal grammar reads the fields).
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
  const chunkBytes = options.chunkBytes ?? DEFAULT_CHUNK_BYTES;
  if (!Number.isInteger(chunkBytes) || chunkBytes < 1) throw new IngestOptionError('chunkBytes', chunkBytes, 'a whole number >= 1');
  if (options.reader !== undefined && options.reader !== 'auto' && options.reader !== 'csv-parse')
    throw new IngestOptionError('reader', options.reader, "'auto' or 'csv-parse'");
  const { reader: readerChoice, chunkBytes: _chunkBytes, ...rest } = options;
  void _chunkBytes;
  const reader = new DelimitedReader({ ...rest, name: file });

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
    if (readerChoice === 'csv-parse') {
      const head = Buffer.alloc(Math.min(size, options.detectionBytes ?? 1 << 16));
      const { bytesRead } = await handle.read(head, 0, head.length, 0);
      const dialect = reader.detect(head.subarray(0, bytesRead), bytesRead >= size);
      if (dialect.delimiter !== 'whitespace') {
        await readWithCsvParse(path, file, dialect.bom, dialect.delimiter, dialect.commentPrefix, dialect.skipLines, reader, chunkBytes);
        return reader.finish();
      }
    }
    await scanFile(handle, reader, chunkBytes);
    return reader.finish();
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

/** Pushes the file into the reader, reading the next piece while this one is parsed. */
async function scanFile(handle: import('node:fs/promises').FileHandle, reader: DelimitedReader, chunkBytes: number): Promise<void> {
  const buffers = [Buffer.allocUnsafe(chunkBytes), Buffer.allocUnsafe(chunkBytes)];
  let which = 0;
  let filePos = 0;
  let next: Promise<{ bytesRead: number }> | null = handle.read(buffers[which], 0, chunkBytes, filePos);
  try {
    for (;;) {
      const { bytesRead } = await (next as Promise<{ bytesRead: number }>);
      next = null;
      if (bytesRead === 0) return;
      const got = buffers[which];
      filePos += bytesRead;
      which ^= 1;
      next = handle.read(buffers[which], 0, chunkBytes, filePos);
      reader.push(got.subarray(0, bytesRead));
      if (reader.stopped) return;
    }
  } finally {
    // no read may still be running when the caller closes the file
    if (next) await next.catch(() => undefined);
  }
}

/**
 * The csv-parse options of the `reader: 'csv-parse'` route (documented in docs/ingest.md):
 * quote `"`, escape `""`, full-line comments only, empty lines skipped, CRLF or LF record ends,
 * field counts checked by the reader (so the error names the line).
 */
function csvParseOptions(delimiter: keyof typeof DELIMITER_CHARACTERS, commentPrefix: string, bom: boolean): CsvParseOptions {
  return {
    delimiter: DELIMITER_CHARACTERS[delimiter],
    bom,
    comment: commentPrefix !== '' ? commentPrefix : undefined,
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
  file: string,
  bom: boolean,
  delimiter: keyof typeof DELIMITER_CHARACTERS,
  commentPrefix: string,
  skipLines: number,
  reader: DelimitedReader,
  chunkBytes: number,
): Promise<void> {
  const parser = createReadStream(path, { highWaterMark: Math.max(chunkBytes, 16) }).pipe(parse({ ...csvParseOptions(delimiter, commentPrefix, bom), from_line: skipLines + 1 }));
  try {
    for await (const item of parser as AsyncIterable<{ record: string[]; info: { lines: number } }>) {
      reader.pushRecord(item.record, item.info.lines);
      if (reader.stopped) break;
    }
  } catch (err) {
    if (err instanceof IngestError) throw err;
    const e = err as { code?: string; lines?: number; message?: string };
    if (typeof e.code === 'string' && e.code.startsWith('CSV_'))
      throw new IngestError('LW_INGEST_MALFORMED_QUOTES', file, e.lines ?? 0, 0, `csv-parse: ${e.message ?? e.code}`);
    throw err;
  } finally {
    parser.destroy();
  }
}
