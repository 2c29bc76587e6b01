import { closeSync, createReadStream, mkdtempSync, openSync, writeSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileErrorOf } from './FileError';
import type { OutputSink } from './OutputSet';
import type { SpoolStore } from './SpoolStore';
import { holdTemporary, removeTemporary } from './temporaries';

/** Characters gathered before a write to the spool. */
const SPOOL_CHARACTERS = 1 << 20;

/**
 * Text produced while the run goes (rows of an output that can be millions long), kept on disk
 * in a private temporary file instead of in memory, and copied into its output when the run's
 * outputs are written. Removed at the end of the run, also on SIGINT and SIGTERM.
 */
export class SpoolFile implements SpoolStore {
  private readonly dir: string;
  private readonly path: string;
  private fd: number;
  private pending: string[] = [];
  private pendingLength = 0;

  constructor(what: string) {
    try {
      this.dir = mkdtempSync(join(tmpdir(), 'loopwise-spool-'));
    } catch (error) {
      throw fileErrorOf(error, tmpdir(), `make a temporary folder for ${what}`);
    }
    holdTemporary(this.dir);
    this.path = join(this.dir, 'spool');
    try {
      this.fd = openSync(this.path, 'wx', 0o600);
    } catch (error) {
      throw fileErrorOf(error, this.path, `write the temporary copy of ${what}`);
    }
  }

  /** Appends text (buffered). */
  append(text: string): void {
    this.pending.push(text);
    this.pendingLength += text.length;
    if (this.pendingLength >= SPOOL_CHARACTERS) this.flush();
  }

  private flush(): void {
    if (this.pendingLength === 0) return;
    try {
      writeSync(this.fd, this.pending.join(''));
    } catch (error) {
      throw fileErrorOf(error, this.path, 'write a temporary file');
    }
    this.pending = [];
    this.pendingLength = 0;
  }

  /** Ends the writing. */
  close(): void {
    if (this.fd < 0) return;
    this.flush();
    closeSync(this.fd);
    this.fd = -1;
  }

  /** Copies the spooled text into an output, a piece at a time. */
  async copyTo(sink: OutputSink): Promise<void> {
    this.close();
    for await (const piece of createReadStream(this.path, { encoding: 'utf8', highWaterMark: 1 << 20 })) await sink.write(piece as string);
  }

  /** Copies bytes `[start, end)` of the spooled text into an output, a piece at a time. */
  async copyRangeTo(sink: OutputSink, start: number, end: number): Promise<void> {
    this.close();
    if (end <= start) return;
    for await (const piece of createReadStream(this.path, { encoding: 'utf8', start, end: end - 1, highWaterMark: 1 << 20 })) await sink.write(piece as string);
  }

  /** Removes the spool now. */
  remove(): void {
    if (this.fd >= 0) closeSync(this.fd);
    this.fd = -1;
    removeTemporary(this.dir);
  }
}
