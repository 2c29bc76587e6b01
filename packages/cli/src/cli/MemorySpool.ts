import type { OutputSink } from './OutputSet';
import type { SpoolStore } from './SpoolStore';

/** Bytes of one block of the store. */
const BLOCK_BYTES = 1 << 20;
/** Characters gathered before they are encoded into the blocks. */
const PENDING_CHARACTERS = 1 << 18;

/**
 * A {@link SpoolStore} in memory, for places without a file system (the browser page's worker):
 * the text is kept as UTF-8 in blocks of 1 MiB and copied out by byte range, as the command's
 * {@link SpoolFile} does on disk.
 */
export class MemorySpool implements SpoolStore {
  private blocks: Uint8Array[] = [];
  private used = 0;
  private readonly encoder = new TextEncoder();
  /** Text appended but not yet encoded (rows come one at a time; encoding them in batches is faster). */
  private pending: string[] = [];
  private pendingLength = 0;

  append(text: string): void {
    this.pending.push(text);
    this.pendingLength += text.length;
    if (this.pendingLength >= PENDING_CHARACTERS) this.flush();
  }

  private flush(): void {
    if (this.pending.length === 0) return;
    let bytes = this.encoder.encode(this.pending.join(''));
    this.pending = [];
    this.pendingLength = 0;
    while (bytes.length > 0) {
      if (this.blocks.length === 0 || this.used === BLOCK_BYTES) {
        this.blocks.push(new Uint8Array(BLOCK_BYTES));
        this.used = 0;
      }
      const take = Math.min(BLOCK_BYTES - this.used, bytes.length);
      this.blocks[this.blocks.length - 1].set(bytes.subarray(0, take), this.used);
      this.used += take;
      bytes = bytes.subarray(take);
    }
  }

  close(): void {
    this.flush();
  }

  async copyRangeTo(sink: OutputSink, start: number, end: number): Promise<void> {
    this.flush();
    const kept = this.blocks.length === 0 ? 0 : (this.blocks.length - 1) * BLOCK_BYTES + this.used;
    const stop = Math.min(end, kept);
    // one decoder across blocks: a character split between two blocks is decoded whole
    const decoder = new TextDecoder('utf-8');
    for (let at = start; at < stop; ) {
      const k = Math.floor(at / BLOCK_BYTES);
      const from = at - k * BLOCK_BYTES;
      const to = Math.min(BLOCK_BYTES, stop - k * BLOCK_BYTES);
      const text = decoder.decode(this.blocks[k].subarray(from, to), { stream: true });
      if (text.length > 0) await sink.write(text);
      at += to - from;
    }
    const rest = decoder.decode();
    if (rest.length > 0) await sink.write(rest);
  }

  remove(): void {
    this.pending = [];
    this.pendingLength = 0;
    this.blocks = [];
    this.used = 0;
  }
}
