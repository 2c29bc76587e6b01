import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { FileResult } from './FleetTask';

/**
 * The per-file results of a fleet run, one JSON file per key in a folder (`<out>/results/`).
 * A result is written to a temporary file beside its place and renamed there, so a reader
 * never sees half a result and an interrupted run leaves only whole ones: the next run finds
 * them and does not redo those files. Failed files are not stored (they are tried again).
 */
export class ResultStore {
  constructor(readonly folder: string) {
    mkdirSync(folder, { recursive: true });
  }

  /** The stored result of `key`, or null. */
  get(key: string): FileResult | null {
    const path = join(this.folder, `${key}.json`);
    if (!existsSync(path)) return null;
    try {
      const r = JSON.parse(readFileSync(path, 'utf8')) as FileResult;
      return r.format === 'loopwise-fleet-file' && r.key === key && r.failure === null ? r : null;
    } catch {
      return null; // a damaged result is redone
    }
  }

  /** Stores a result under its key (atomically; a result of the same key is replaced by an equal one). */
  put(result: FileResult): void {
    if (result.failure !== null) return;
    const path = join(this.folder, `${result.key}.json`);
    const temp = join(this.folder, `.${result.key}.${process.pid}-${randomBytes(4).toString('hex')}.tmp`);
    try {
      writeFileSync(temp, JSON.stringify(result), { flag: 'wx' });
      renameSync(temp, path);
    } catch (error) {
      rmSync(temp, { force: true });
      throw error;
    }
  }
}
