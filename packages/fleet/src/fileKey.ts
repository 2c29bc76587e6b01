import { createHash } from 'node:crypto';
import { statSync } from 'node:fs';
import type { FleetTask } from './FleetTask';

/** Version of the per-file result; a change of what a file's result holds changes every key. */
export const FILE_RESULT_VERSION = 1;

/**
 * The deterministic key of a task's result: SHA-256 (hex, 32 characters kept) of everything the
 * result depends on: the measured file (resolved path, size and modification time), the job
 * file and every file it reads (same identity), the asset, channels, usage, unit and bins, and
 * the result format's version. The same work always has the same key, so a result stored under
 * it is found again (resumption) and a job processed twice is stored once; a changed input
 * changes the key. The manifest row is not part of it (reordering a manifest redoes nothing).
 */
export function fileKey(task: FleetTask, jobFiles: readonly string[]): string {
  const identity = (path: string) => {
    const st = statSync(path);
    return [path, st.size, st.mtimeMs];
  };
  const parts = {
    version: FILE_RESULT_VERSION,
    file: identity(task.file),
    job: [task.job, ...jobFiles].map(identity),
    asset: task.asset,
    channels: task.channels,
    usage: task.usage,
    unit: task.unit,
    bins: task.bins,
  };
  return createHash('sha256').update(JSON.stringify(parts)).digest('hex').slice(0, 32);
}
