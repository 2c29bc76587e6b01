import type { OutputSink } from './OutputSet';

/**
 * Where a {@link LoopSpool} keeps its text: appended as the run goes, copied out by byte range
 * when the outputs are written. The command keeps it on disk ({@link SpoolFile}); the browser
 * page keeps it in memory ({@link MemorySpool}), so the rows are the same bytes on both.
 */
export interface SpoolStore {
  /** Appends text. */
  append(text: string): void;
  /** Ends the writing. */
  close(): void;
  /** Copies bytes `[start, end)` (UTF-8) of the text into an output, a piece at a time. */
  copyRangeTo(sink: OutputSink, start: number, end: number): Promise<void>;
  /** Frees the store now. */
  remove(): void;
}

/** Bytes of `text` in UTF-8 (without encoding it). */
export function utf8Length(text: string): number {
  let n = text.length;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c < 0x80) continue;
    if (c < 0x800) n += 1;
    else if (c >= 0xd800 && c <= 0xdbff && i + 1 < text.length && (text.charCodeAt(i + 1) & 0xfc00) === 0xdc00) {
      n += 2; // a surrogate pair: 4 bytes for 2 UTF-16 units
      i++;
    } else n += 2;
  }
  return n;
}
