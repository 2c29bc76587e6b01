import { ChunkAssembler } from './ChunkAssembler.js';
import { channelConversion, type ChannelConversion, type ChannelQuantity } from './channelConversion.js';
import { DELIMITER_CHARACTERS, detectDialect, type Dialect, type DialectOverride } from './detectDialect.js';
import { classifyBadCell, classifyBadText, FastNumericScanner, SCAN_QUOTED, type ScannerLayout } from './FastNumericScanner.js';
import { IngestError, IngestOptionError } from './IngestError.js';
import { parseDecimal, parseDecimalText } from './parseDecimal.js';
import { QuotedRecordReader } from './QuotedRecordReader.js';
import { resolveColumn, wrongDelimiter, isContentless, type ColumnReference } from './selectColumns.js';
import { SignalChecks, type ChannelArtefacts, type SignalCheckThresholds, type SignalWarning } from './SignalChecks.js';
import { TimeAxisCheck, type TimeAxisSummary } from './TimeAxisCheck.js';

export type { ColumnReference } from './selectColumns.js';

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

/** Options of {@link DelimitedReader}. Every field documents its default. */
export interface ReaderOptions {
  /** The channels to read (at least one). */
  channels: readonly ChannelSelection[];
  /** A time column or a sample rate. Default: none (samples only). */
  time?: TimeSource;
  /** Parts of the dialect to fix instead of detecting them. Default: all detected. */
  dialect?: DialectOverride;
  /** Samples per delivered chunk. Default 65,536. */
  chunkSamples?: number;
  /** Bytes looked at for dialect detection. Default 64 KiB. */
  detectionBytes?: number;
  /** Thresholds of the signal checks, or false to skip them. Default: the documented defaults. */
  checks?: Partial<SignalCheckThresholds> | false;
  /** Called with each chunk as it is read. Default: none (only the report). */
  onChunk?: (chunk: IngestChunk) => void;
  /**
   * Stop once this many samples have been delivered (the chunk that reaches it is delivered
   * whole; {@link DelimitedReader.stopped} turns true); default: read everything.
   */
  stopAfterSamples?: number;
  /** The file's name in messages and in the report. Default `'<input>'`. */
  name?: string;
}

/** A channel as read. */
export interface IngestedChannel {
  readonly name: string;
  /** 1-based field number in the file. */
  readonly column: number;
  readonly quantity: ChannelQuantity['quantity'];
  readonly conversion: ChannelConversion;
}

/** What a read found. */
export interface IngestReport {
  readonly file: string;
  readonly dialect: Dialect;
  /** 'fast', 'quoted', 'csv-parse', or 'fast, then quoted from line N' (quotes first seen at line N). */
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
  /** Per channel, in option order, every sample the signal checks flagged (absent when the checks were off). */
  readonly artefacts?: readonly ChannelArtefacts[];
}

export const DEFAULT_CHUNK_SAMPLES = 65536;
const DEFAULT_DETECTION_BYTES = 1 << 16;
/** Longest first line searched for a line end, bytes. */
const MAX_LINE_BYTES = 64 << 20;

/** Thrown inside the assembler's delivery to stop at `stopAfterSamples` (internal). */
const STOP_READING = Symbol('stop reading');

/**
 * Reads the selected columns of a delimited numeric text (comma, semicolon, tab or whitespace;
 * header or not; BOM, CRLF, comment lines, decimal commas, quoted fields) from its bytes as they
 * arrive, in any split: no file system, so it runs in a browser, a worker or Node alike. Values
 * are delivered to `onChunk` as Float64Array chunks of `chunkSamples` rows in the engine's units
 * (stress MPa, strain dimensionless), with the conversion stated in the report; memory does not
 * grow with the input.
 *
 * Method: the dialect is detected from the first `detectionBytes` (cut after a line end;
 * {@link detectDialect}). Plain numeric text goes through {@link FastNumericScanner} (bit-exact
 * with `Number()`); from the first line with a quote character on, {@link QuotedRecordReader}
 * splits records and the same decimal grammar reads the fields. Each channel runs the streaming
 * {@link SignalChecks}; a time column runs {@link TimeAxisCheck}.
 *
 * @throws IngestError for every input problem, naming the file, 1-based line and 1-based column
 *   (field number); IngestOptionError for bad options
 *
 * @example
 * const reader = new DelimitedReader({ name: 'run7.csv', channels: [{ column: 'SG1', quantity: 'strain', unit: 'microstrain' }], onChunk: (c) => counter.push(c.channels[0]) });
 * for (const bytes of pieces) reader.push(bytes);
 * reader.finish().channels[0].conversion.statement;
 * // returns 'microstrain ÷ 10^6 to strain'
 */
export class DelimitedReader {
  private readonly file: string;
  private readonly conversions: ChannelConversion[];
  private readonly chunkSamples: number;
  private readonly detectionBytes: number;
  private readonly stopAfter: number | undefined;
  private head: Uint8Array | null = new Uint8Array(0);
  private headLength = 0;
  private dialectFound: Dialect | null = null;
  private fields: number[] = [];
  private layout: ScannerLayout | null = null;
  private assembler: ChunkAssembler | null = null;
  private checks: SignalChecks[] | null = null;
  private timeCheck: TimeAxisCheck | null = null;
  private scanner: FastNumericScanner | null = null;
  private quoted: QuotedRecordReader | null = null;
  private readerName = 'fast';
  /** Content lines still to skip (header, units row). */
  private headerLinesPending = 0;
  /** Raw lines at the top still to drop (`dialect.skipLines`). */
  private linesToDrop = 0;
  /** Bytes of the input seen so far (the BOM is skipped by offset). */
  private offset = 0;
  private work = new Uint8Array(0);
  private carry = 0;
  private stoppedFlag = false;
  private finished = false;

  constructor(private readonly options: ReaderOptions) {
    this.file = options.name ?? '<input>';
    this.chunkSamples = positiveInteger(options.chunkSamples ?? DEFAULT_CHUNK_SAMPLES, 'chunkSamples');
    this.detectionBytes = positiveInteger(options.detectionBytes ?? DEFAULT_DETECTION_BYTES, 'detectionBytes');
    if (!Array.isArray(options.channels) || options.channels.length === 0) throw new IngestOptionError('channels', options.channels, 'give at least one channel');
    this.conversions = options.channels.map((c, k) => channelConversion(c, `channels[${k}]`));
    const time = options.time;
    if (time !== undefined && 'sampleRate' in time && !(time.sampleRate > 0 && Number.isFinite(time.sampleRate)))
      throw new IngestOptionError('time.sampleRate', time.sampleRate, 'a finite sample rate > 0 in Hz');
    const stopAfter = options.stopAfterSamples;
    if (stopAfter !== undefined && !(Number.isInteger(stopAfter) && stopAfter >= 1)) throw new IngestOptionError('stopAfterSamples', stopAfter, 'an integer >= 1');
    this.stopAfter = stopAfter;
  }

  /** The dialect, once detected (after enough bytes, or after {@link detect}); null before. */
  get dialect(): Dialect | null {
    return this.dialectFound;
  }

  /** True once `stopAfterSamples` samples were delivered: later bytes are ignored. */
  get stopped(): boolean {
    return this.stoppedFlag;
  }

  /** Samples read so far. */
  get samples(): number {
    return this.assembler?.samples ?? 0;
  }

  /**
   * Detects the dialect from the first bytes of the input (`wholeInput` when they are all of
   * it) and sets up the columns. {@link push} does this by itself; call it first only to feed
   * records with {@link pushRecord} instead of bytes.
   */
  detect(first: Uint8Array, wholeInput: boolean): Dialect {
    if (this.dialectFound) return this.dialectFound;
    const file = this.file;
    crOnly(first, file);
    let sample = first;
    if (!wholeInput) {
      const cut = sample.lastIndexOf(10);
      if (cut >= 0) sample = sample.subarray(0, cut + 1);
    }
    const dialect = detectDialect(sample, this.options.dialect ?? {}, file);
    if (dialect.fieldCount === 0 || (wholeInput && dialect.headerLine === 0 && isContentless(sample, dialect)))
      throw new IngestError('LW_INGEST_EMPTY_FILE', file, 0, 0, 'empty file: no data lines (only blank or comment lines, if any)');
    if (dialect.commentPrefix.length > 1 || (dialect.commentPrefix !== '' && dialect.commentPrefix.charCodeAt(0) > 127))
      throw new IngestOptionError('dialect.commentPrefix', dialect.commentPrefix, 'one ASCII character, or empty for none');

    const { channels, time } = this.options;
    const refs: ColumnReference[] = channels.map((c) => c.column);
    if (time !== undefined && 'column' in time) refs.push(time.column);
    if (dialect.fieldCount === 1 && new Set(refs).size > 1) throw wrongDelimiter(sample, dialect, file);
    const fields = refs.map((r, k) => resolveColumn(r, dialect, file, k < channels.length ? `channels[${k}].column` : 'time.column'));
    const width = fields.length;
    const slotOfField = new Int32Array(dialect.fieldCount).fill(-1);
    const multiplier = new Float64Array(width).fill(1);
    const divisor = new Float64Array(width).fill(1);
    fields.forEach((f, slot) => {
      if (slotOfField[f] >= 0) throw new IngestOptionError(slot < channels.length ? `channels[${slot}].column` : 'time.column', refs[slot], `column ${f + 1} is already selected`);
      slotOfField[f] = slot;
      if (slot < this.conversions.length) {
        multiplier[slot] = this.conversions[slot].multiplier;
        divisor[slot] = this.conversions[slot].divisor;
      }
    });
    this.fields = fields;
    const names = channels.map((c, k) => c.name ?? dialect.names[fields[k]]);
    // the checks run on the engine's values; their messages give the file's (µε stays µε)
    const shownOf = (k: number) => {
      const c = this.conversions[k];
      const spec = channels[k] as ChannelQuantity;
      const unit = spec.quantity === 'strain' ? (spec.unit === 'microstrain' ? ' µε' : '') : spec.quantity === 'stress' ? ` ${spec.unit}` : '';
      return { perEngineUnit: c ? c.divisor / c.multiplier : 1, unit };
    };
    this.checks = this.options.checks === false ? null : names.map((n, k) => new SignalChecks(n, this.options.checks || {}, shownOf(k)));
    const hasTimeColumn = time !== undefined && 'column' in time;
    const timeCheck = hasTimeColumn ? new TimeAxisCheck() : null;
    this.timeCheck = timeCheck;
    const nChannels = channels.length;
    const checks = this.checks;
    const onChunk = this.options.onChunk;
    const stopAfter = this.stopAfter;
    this.assembler = new ChunkAssembler(width, this.chunkSamples, (cols, firstSample) => {
      const values = cols.slice(0, nChannels);
      const t = hasTimeColumn ? cols[nChannels] : null;
      if (checks) for (let k = 0; k < nChannels; k++) checks[k].push(values[k], firstSample);
      if (timeCheck && t) timeCheck.push(t);
      onChunk?.({ firstSample, length: values[0].length, channels: values, time: t });
      if (stopAfter !== undefined && firstSample + values[0].length >= stopAfter) throw STOP_READING;
    });
    this.layout = {
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
    this.headerLinesPending = (dialect.header ? 1 : 0) + (dialect.unitsLine > 0 ? 1 : 0);
    this.linesToDrop = dialect.skipLines;
    this.dialectFound = dialect;
    this.head = null;
    const firstLine = dialect.skipLines + 1;
    if (dialect.quoted && dialect.delimiter !== 'whitespace') this.startQuoted(firstLine);
    else this.scanner = new FastNumericScanner(this.layout, this.assembler, firstLine, this.headerLinesPending);
    return dialect;
  }

  /** Reads the next bytes of the input (any length, in order from the first byte). */
  push(bytes: Uint8Array): void {
    if (this.finished) throw new Error('DelimitedReader: push after finish');
    if (this.stoppedFlag || bytes.length === 0) return;
    if (this.head !== null) {
      // collect the detection sample: detectionBytes with a line end in them
      const need = this.headLength + bytes.length;
      if (need > this.head.length) {
        const bigger = new Uint8Array(Math.max(need, Math.min(2 * this.head.length, MAX_LINE_BYTES + bytes.length), 1024));
        bigger.set(this.head.subarray(0, this.headLength));
        this.head = bigger;
      }
      this.head.set(bytes, this.headLength);
      this.headLength += bytes.length;
      const sample = this.head.subarray(0, this.headLength);
      if (this.headLength < this.detectionBytes) return;
      if (sample.lastIndexOf(10) < 0) {
        const cr = sample.indexOf(13);
        if (!(cr >= 0 && cr < sample.length - 1)) {
          if (this.headLength >= MAX_LINE_BYTES)
            throw new IngestError('LW_INGEST_LINE_TOO_LONG', this.file, 1, 0, `no line end in the first ${MAX_LINE_BYTES >> 20} MiB: not a delimited text file, or a line far too long`);
          return;
        }
      }
      this.head = null;
      // the first detectionBytes, or more when they hold no line end (a long first line)
      const first = sample.subarray(0, this.detectionBytes);
      this.detect(first.lastIndexOf(10) >= 0 ? first : sample, false);
      this.feed(sample);
      return;
    }
    if (!this.dialectFound) throw new Error('DelimitedReader: records were pushed; bytes cannot follow');
    this.feed(bytes);
  }

  /**
   * Reads one record already split into fields by another parser (the CLI's csv-parse reader),
   * after {@link detect}: the same header skip, field-count check and decimal grammar as the
   * byte path. `line` is the record's 1-based line, for errors.
   */
  pushRecord(record: readonly string[], line: number): void {
    if (!this.dialectFound || !this.layout || !this.assembler) throw new Error('DelimitedReader: call detect() before pushRecord()');
    if (this.stoppedFlag) return;
    this.readerName = 'csv-parse';
    if (record.length === 1 && record[0].trim() === '') return;
    if (line <= this.dialectFound.skipLines) return;
    if (this.headerLinesPending > 0) {
      this.headerLinesPending--;
      return;
    }
    const { file, fieldCount: nf, slotOfField, multiplier, divisor, decimalComma, names } = this.layout;
    if (record.length !== nf) throw ragged(file, line, record.length, nf);
    const out = this.assembler;
    for (let f = 0; f < nf; f++) {
      const slot = slotOfField[f];
      if (slot < 0) continue;
      const text = record[f];
      const v = parseDecimalText(text, decimalComma);
      if (v - v !== 0) {
        if (/[\u0000-\u0008\u000b\u000c\u000e-\u001f]/.test(text)) throw new IngestError('LW_INGEST_BINARY_DATA', file, line, f + 1, 'binary data: control bytes are not text', names[f]);
        if (text.includes('\ufffd')) throw new IngestError('LW_INGEST_INVALID_UTF8', file, line, f + 1, 'invalid UTF-8 text (binary data, or a file in another encoding)', names[f]);
        throw classifyBadText(text, file, line, f + 1, decimalComma, names[f]);
      }
      out.columns[slot][out.row] = (v * multiplier[slot]) / divisor[slot];
    }
    this.advanceRow();
  }

  /** The end of the input: reads the last line and returns the report. */
  finish(): IngestReport {
    if (this.finished) throw new Error('DelimitedReader: finish called twice');
    this.finished = true;
    if (this.head !== null) {
      const sample = this.head.subarray(0, this.headLength);
      this.head = null;
      if (sample.length === 0) throw new IngestError('LW_INGEST_EMPTY_FILE', this.file, 0, 0, 'empty file: no data lines (only blank or comment lines, if any)');
      this.detect(sample, true);
      this.feed(sample);
    }
    const dialect = this.dialectFound as Dialect;
    const assembler = this.assembler as ChunkAssembler;
    this.guard(() => {
      if (!this.stoppedFlag) {
        if (this.scanner) {
          if (this.carry > 0) {
            this.ensureWork(this.carry + 1);
            this.work[this.carry++] = 10; // the last line has no line feed
            const r = this.scanner.scan(this.work, 0, this.carry);
            if (r === SCAN_QUOTED) {
              this.switchToQuoted();
              this.quoted!.push(this.work, this.scanner.stopOffset, this.carry);
            }
            this.carry = 0;
          }
        }
        this.quoted?.finish();
      }
      assembler.flush();
    });
    if (assembler.samples === 0) {
      if (dialect.header) throw new IngestError('LW_INGEST_HEADER_ONLY', this.file, dialect.headerLine, 0, 'header only: the file has column names but no data rows');
      throw new IngestError('LW_INGEST_EMPTY_FILE', this.file, 0, 0, 'empty file: no data lines (only blank or comment lines, if any)');
    }
    return this.report();
  }

  private report(): IngestReport {
    const dialect = this.dialectFound as Dialect;
    const { channels, time } = this.options;
    const nChannels = channels.length;
    const fields = this.fields;
    const warnings: SignalWarning[] = [];
    if (this.checks) for (const c of this.checks) warnings.push(...c.finish());
    let timeReport: IngestReport['time'] = { kind: 'none' };
    if (time !== undefined && 'sampleRate' in time) timeReport = { kind: 'sample-rate', sampleRate: time.sampleRate, timeStep: 1 / time.sampleRate };
    if (this.timeCheck) {
      const summary = this.timeCheck.summary();
      const f = fields[nChannels];
      const name = dialect.names[f];
      timeReport = { kind: 'column', column: f + 1, name, ...summary };
      if (summary.nonIncreasingSteps > 0)
        warnings.push({
          kind: 'time-not-increasing',
          channel: name,
          samples: summary.nonIncreasingSteps,
          ranges: summary.nonIncreasingAt,
          rangesOmitted: summary.nonIncreasingSteps - summary.nonIncreasingAt.length,
          message: `${name}: time does not increase at ${summary.nonIncreasingSteps} step(s), first between samples ${summary.nonIncreasingAt[0].first} and ${summary.nonIncreasingAt[0].last}`,
        });
    }
    return {
      file: this.file,
      dialect,
      reader: this.readerName,
      samples: (this.assembler as ChunkAssembler).samples,
      channels: channels.map((c, k) => ({ name: c.name ?? dialect.names[fields[k]], column: fields[k] + 1, quantity: c.quantity, conversion: this.conversions[k] })),
      time: timeReport,
      warnings,
      ...(this.checks ? { artefacts: this.checks.map((c) => c.artefacts()) } : {}),
    };
  }

  /** Runs `f`, turning the stop signal into the stopped state. */
  private guard(f: () => void): void {
    try {
      f();
    } catch (err) {
      if (err !== STOP_READING) throw err;
      this.stoppedFlag = true;
      // rows parsed after the chunk that reached the limit are not part of the read
      (this.assembler as ChunkAssembler).row = 0;
    }
  }

  /** Bytes after detection: the BOM skipped, then the fast scanner on complete lines or the quoted reader. */
  private feed(bytes: Uint8Array): void {
    let from = 0;
    if (this.offset < 3 && this.dialectFound!.bom) from = Math.min(bytes.length, 3 - this.offset);
    this.offset += bytes.length;
    // the lines before the table (a logger's preamble), dropped whole
    while (this.linesToDrop > 0 && from < bytes.length) {
      const lf = bytes.indexOf(10, from);
      if (lf < 0) return;
      from = lf + 1;
      this.linesToDrop--;
    }
    if (from >= bytes.length) return;
    this.guard(() => {
      if (this.quoted) {
        this.quoted.push(bytes, from, bytes.length);
        return;
      }
      const scanner = this.scanner as FastNumericScanner;
      const n = bytes.length - from;
      this.ensureWork(this.carry + n + 1);
      const work = this.work;
      work.set(from === 0 ? bytes : bytes.subarray(from), this.carry);
      const len = this.carry + n;
      const lastLineFeed = work.lastIndexOf(10, len - 1);
      if (lastLineFeed < this.carry) {
        this.carry = len;
        return;
      }
      const r = scanner.scan(work, 0, lastLineFeed + 1);
      if (r === SCAN_QUOTED) {
        this.switchToQuoted();
        this.carry = 0;
        (this.quoted as QuotedRecordReader | null)!.push(work, scanner.stopOffset, len);
        return;
      }
      work.copyWithin(0, lastLineFeed + 1, len);
      this.carry = len - lastLineFeed - 1;
    });
  }

  private ensureWork(size: number): void {
    if (size <= this.work.length) return;
    const bigger = new Uint8Array(Math.max(size, 2 * this.work.length, 4096));
    bigger.set(this.work.subarray(0, this.carry));
    this.work = bigger;
  }

  private switchToQuoted(): void {
    const scanner = this.scanner as FastNumericScanner;
    if (this.dialectFound!.delimiter === 'whitespace') throw new IngestError('LW_INGEST_MALFORMED_QUOTES', this.file, scanner.line, 0, 'quoted fields are not supported in the whitespace dialect');
    this.headerLinesPending = scanner.headerLinesPending;
    this.startQuoted(scanner.line);
    this.readerName = `fast, then quoted from line ${scanner.line}`;
    this.scanner = null;
  }

  private startQuoted(line: number): void {
    const layout = this.layout as ScannerLayout;
    this.readerName = 'quoted';
    const delimiter = DELIMITER_CHARACTERS[layout.delimiter].charCodeAt(0);
    this.quoted = new QuotedRecordReader(this.file, delimiter, layout.commentByte, line, (bytes, bounds, n, at) => this.record(bytes, bounds, n, at));
  }

  /** One record from the quoted reader. */
  private record(bytes: Uint8Array, bounds: Int32Array, n: number, line: number): void {
    if (this.headerLinesPending > 0) {
      this.headerLinesPending--;
      return;
    }
    const { file, fieldCount: nf, slotOfField, multiplier, divisor, decimalComma, names } = this.layout as ScannerLayout;
    if (n !== nf) throw ragged(file, line, n, nf);
    const out = this.assembler as ChunkAssembler;
    for (let f = 0; f < nf; f++) {
      const slot = slotOfField[f];
      if (slot < 0) continue;
      let s = bounds[2 * f];
      let e = bounds[2 * f + 1];
      while (s < e && (bytes[s] === 32 || bytes[s] === 9)) s++;
      while (e > s && (bytes[e - 1] === 32 || bytes[e - 1] === 9)) e--;
      const v = parseDecimal(bytes, s, e, decimalComma);
      if (v - v !== 0) {
        for (let i = s; i < e; i++) {
          const b = bytes[i];
          if (b < 32 && b !== 9 && b !== 10) throw new IngestError('LW_INGEST_BINARY_DATA', file, line, f + 1, 'binary data: control bytes are not text', names[f]);
        }
        throw classifyBadCell(bytes, s, e, file, line, f + 1, decimalComma, names[f]);
      }
      out.columns[slot][out.row] = (v * multiplier[slot]) / divisor[slot];
    }
    this.advanceRow();
  }

  private advanceRow(): void {
    const out = this.assembler as ChunkAssembler;
    if (++out.row === out.capacity) out.flush();
  }
}

function ragged(file: string, line: number, got: number, nf: number): IngestError {
  return new IngestError('LW_INGEST_RAGGED_ROW', file, line, got < nf ? got + 1 : nf + 1, `ragged row: ${got} field${got === 1 ? '' : 's'} where ${nf} are expected`);
}

/**
 * Line ends of carriage returns alone (old Mac text) are reported as such: a CR inside the
 * sample with no line feed anywhere in it (a line feed ends every line of LF or CRLF text).
 */
function crOnly(sample: Uint8Array, file: string): void {
  const cr = sample.indexOf(13);
  if (cr < 0 || sample.indexOf(10) >= 0 || cr === sample.length - 1) return;
  throw new IngestError('LW_INGEST_CR_LINE_ENDS', file, 1, 0, "the lines end in a carriage return alone (old Mac text); loopwise reads LF or CRLF line ends: convert the file (e.g. tr '\\r' '\\n')");
}

function positiveInteger(v: number, field: string): number {
  if (!Number.isInteger(v) || v < 1) throw new IngestOptionError(field, v, 'a whole number >= 1');
  return v;
}
