import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { fileURLToPath } from 'node:url';
import { Piscina } from 'piscina';
import { assessFileOrFailure, failureOf } from './assessFile';
import { FleetError } from './FleetError';
import type { FleetProgressHandler } from './FleetProgress';
import type { FileResult, FleetTask } from './FleetTask';
import type { ResultStore } from './ResultStore';

/** Options of {@link runLocal}. */
export interface LocalRunOptions {
  /** Worker threads; default every core (`os.availableParallelism()`); 0 runs every file on this thread, one after another. */
  workers?: number;
  /** Where results are kept between runs; files whose result is there are not redone. */
  store: ResultStore;
  onProgress?: FleetProgressHandler;
}

/** The built pool worker beside this bundle (dist/poolWorker.js). */
function poolWorkerFile(): string {
  const url = new URL('./poolWorker.js', import.meta.url);
  const path = url.protocol === 'file:' ? fileURLToPath(url) : '';
  if (path === '' || !existsSync(path)) throw new FleetError('no-worker-file', 'workers', null, 'the pool needs the built worker file (dist/poolWorker.js): run from a build (pnpm build), or use workers 0');
  return path;
}

/**
 * Runs a fleet's tasks on this machine: on a pool of worker threads (Piscina), one file per
 * task, or with `workers: 0` on this thread one after another (the reference the pool must
 * equal). Files whose result the store holds are not redone; every new result is stored as
 * it arrives, so an interrupted run resumes where it stopped. Returns the results by key.
 */
export async function runLocal(tasks: readonly FleetTask[], options: LocalRunOptions): Promise<Map<string, FileResult>> {
  const workers = options.workers ?? availableParallelism();
  if (!Number.isInteger(workers) || workers < 0) throw new FleetError('invalid-option', 'workers', workers, `--workers: an integer >= 0, got ${workers}`);
  const results = new Map<string, FileResult>();
  const todo: FleetTask[] = [];
  for (const t of tasks) {
    const stored = options.store.get(t.key);
    if (stored) results.set(t.key, stored);
    else todo.push(t);
  }
  const reused = results.size;
  let failed = 0;
  const finish = (r: FileResult) => {
    results.set(r.key, r);
    if (r.failure) failed++;
    else options.store.put(r);
    options.onProgress?.({ done: results.size, total: tasks.length, failed, reused });
  };
  options.onProgress?.({ done: results.size, total: tasks.length, failed, reused });
  if (workers === 0) {
    for (const t of todo) finish(await assessFileOrFailure(t).catch((error) => failureOf(t, error)));
    return results;
  }
  if (todo.length === 0) return results;
  const pool = new Piscina<FleetTask, FileResult>({ filename: poolWorkerFile(), minThreads: workers, maxThreads: workers, idleTimeout: 1000 });
  try {
    // workers that fill every core read their files on their own thread: a parse thread each
    // would only contend for the same cores; fewer workers than cores keep it
    const parseThread = workers < availableParallelism();
    await Promise.all(todo.map((t) => pool.run({ ...t, parseThread }).then(finish, (error) => finish(failureOf(t, error)))));
  } finally {
    await pool.destroy();
  }
  return results;
}
