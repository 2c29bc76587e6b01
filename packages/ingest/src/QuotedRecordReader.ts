import { IngestError } from './IngestError.js';

/**
 * Called with each record: its bytes, the start and end of each field in them (`bounds[2k]`,
 * `bounds[2k + 1]`, quotes removed and `""` made one quote), the field count and the 1-based
 * line the record starts on. The arrays are reused: read them before returning.
 */
export type RecordSink = (bytes: Uint8Array, bounds: Int32Array, fields: number, line: number) => void;

/**
 * Splits delimited text with quoted fields into records, byte by byte, across any split of the
 * input. The grammar is RFC 4180's (section 2) with the line ends and comments of the fast
 * reader: a field may be enclosed in double quotes, inside which the delimiter, line feeds and
 * `""` (one quote) are text; records end at LF or CRLF outside quotes; a line whose first byte
 * is the comment byte is skipped whole; a line of only spaces and tabs is skipped. Errors
 * (`LW_INGEST_MALFORMED_QUOTES`): a quote inside an unquoted field, text after a closing quote
 * other than a delimiter or a line end, a quote still open at the end. A carriage return not
 * followed by a line feed is `LW_INGEST_BINARY_DATA`, as in the fast reader.
 *
 * This is the slow path of {@link DelimitedReader} from the first line with a quote on (numbers
 * in quotes are rare in logger files); it allocates only when a record outgrows its buffers.
 */
export class QuotedRecordReader {
  /** 1-based line of the next byte. */
  line: number;
  private bytes = new Uint8Array(256);
  private length = 0;
  private bounds = new Int32Array(16);
  private fields = 0;
  private fieldStart = 0;
  private recordLine: number;
  private inQuotes = false;
  private closed = false;
  private pendingCr = false;
  private lineStart = true;
  private inComment = false;

  constructor(
    private readonly file: string,
    private readonly delimiter: number,
    private readonly commentByte: number,
    firstLine: number,
    private readonly sink: RecordSink,
  ) {
    this.line = firstLine;
    this.recordLine = firstLine;
  }

  /** Reads `bytes[start, end)`; complete records go to the sink. */
  push(input: Uint8Array, start: number, end: number): void {
    const delimiter = this.delimiter;
    for (let i = start; i < end; i++) {
      const b = input[i];
      if (this.inComment) {
        if (b === 10) this.newLine();
        continue;
      }
      if (this.pendingCr) {
        this.pendingCr = false;
        if (b !== 10) throw new IngestError('LW_INGEST_BINARY_DATA', this.file, this.line, this.fields, 'a carriage return inside a line (line ends must be LF or CRLF)');
        this.endRecord();
        this.newLine();
        continue;
      }
      if (this.inQuotes) {
        if (b === 34) {
          this.inQuotes = false;
          this.closed = true;
        } else {
          if (b === 10) this.line++;
          this.append(b);
        }
        continue;
      }
      if (this.closed) {
        this.closed = false;
        if (b === 34) {
          this.append(34);
          this.inQuotes = true;
          continue;
        }
        if (b !== delimiter && b !== 10 && b !== 13)
          throw new IngestError('LW_INGEST_MALFORMED_QUOTES', this.file, this.line, this.fields + 1, 'text after a closing quote (a field in quotes must end at the delimiter or the line end)');
      }
      if (this.lineStart) {
        this.lineStart = false;
        this.recordLine = this.line;
        if (b === this.commentByte) {
          this.inComment = true;
          continue;
        }
      }
      if (b === 34) {
        if (this.length > this.fieldStart)
          throw new IngestError('LW_INGEST_MALFORMED_QUOTES', this.file, this.line, this.fields + 1, 'a quote inside a field that does not start with one');
        this.inQuotes = true;
      } else if (b === delimiter) this.endField();
      else if (b === 10) {
        this.endRecord();
        this.newLine();
      } else if (b === 13) this.pendingCr = true;
      else this.append(b);
    }
  }

  /** The end of the text: the last record (without a line end) goes to the sink. */
  finish(): void {
    if (this.inQuotes) throw new IngestError('LW_INGEST_MALFORMED_QUOTES', this.file, this.recordLine, this.fields + 1, 'a quoted field is not closed before the end of the file');
    if (this.inComment) return;
    this.pendingCr = false;
    if (!this.lineStart) this.endRecord();
  }

  private newLine(): void {
    this.line++;
    this.lineStart = true;
    this.inComment = false;
  }

  private append(b: number): void {
    if (this.length === this.bytes.length) {
      const bigger = new Uint8Array(this.bytes.length * 2);
      bigger.set(this.bytes);
      this.bytes = bigger;
    }
    this.bytes[this.length++] = b;
  }

  private endField(): void {
    if (2 * this.fields + 2 > this.bounds.length) {
      const bigger = new Int32Array(this.bounds.length * 2);
      bigger.set(this.bounds);
      this.bounds = bigger;
    }
    this.bounds[2 * this.fields] = this.fieldStart;
    this.bounds[2 * this.fields + 1] = this.length;
    this.fields++;
    this.fieldStart = this.length;
  }

  private endRecord(): void {
    this.endField();
    const blank = this.fields === 1 && this.isBlank(0, this.length);
    if (!blank) this.sink(this.bytes, this.bounds, this.fields, this.recordLine);
    this.fields = 0;
    this.length = 0;
    this.fieldStart = 0;
  }

  private isBlank(s: number, e: number): boolean {
    for (let i = s; i < e; i++) if (this.bytes[i] !== 32 && this.bytes[i] !== 9) return false;
    return true;
  }
}
