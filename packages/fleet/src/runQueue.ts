import { Queue } from 'bullmq';
import type { Redis } from 'ioredis';
import { DEFAULT_QUEUE_NAME, QUEUE_PREFIX, resultsKey } from './queueConnection';
import type { FleetProgressHandler } from './FleetProgress';
import type { FileResult, FleetTask } from './FleetTask';
import type { ResultStore } from './ResultStore';

/** Options of {@link runQueue}. */
export interface QueueRunOptions {
  /** An open connection (see {@link openQueueConnection}); the caller closes it. */
  connection: Redis;
  queueName?: string;
  store: ResultStore;
  onProgress?: FleetProgressHandler;
  /** Attempts of a job whose worker failed with a fault (not bad input); default 3. */
  attempts?: number;
  /** How often the results are looked for, ms; default 200. */
  pollMs?: number;
  /** Give up after this many ms without a file finishing; default: wait as long as it takes. */
  idleTimeoutMs?: number;
}

/**
 * Runs a fleet's tasks on a BullMQ queue: one job per file, its job id the task's key (so the
 * queue holds one job per key however often it is added), taken by any number of
 * `loopwise-fleet worker` processes on any machines. Workers write each result to the queue's
 * results hash under the task's key; this side waits for every key, copying results into the
 * local store as they come. Retries of a failed job and the return of a crashed worker's job
 * (its lock expires; BullMQ's stalled-job check puts it back) are BullMQ's. Files whose result
 * the store or the results hash holds already are not queued again; a failure left from an
 * earlier run is tried again.
 */
export async function runQueue(tasks: readonly FleetTask[], options: QueueRunOptions): Promise<Map<string, FileResult>> {
  const name = options.queueName ?? DEFAULT_QUEUE_NAME;
  const redis = options.connection;
  const hash = resultsKey(name);
  const results = new Map<string, FileResult>();
  const pending = new Map<string, FleetTask>();
  for (const t of tasks) {
    const stored = options.store.get(t.key);
    if (stored) results.set(t.key, stored);
    else pending.set(t.key, t);
  }
  let reused = results.size;
  let failed = 0;
  const report = () => options.onProgress?.({ done: results.size, total: tasks.length, failed, reused });
  const take = (r: FileResult) => {
    results.set(r.key, r);
    pending.delete(r.key);
    if (r.failure) failed++;
    else options.store.put(r);
  };
  // results another run left in the queue's hash (a failure there is tried again)
  if (pending.size > 0) {
    const keys = [...pending.keys()];
    const found = await redis.hmget(hash, ...keys);
    for (let i = 0; i < keys.length; i++) {
      if (found[i] === null) continue;
      const r = JSON.parse(found[i] as string) as FileResult;
      if (r.failure === null) {
        take(r);
        reused++;
      } else await redis.hdel(hash, keys[i]);
    }
  }
  report();
  if (pending.size === 0) return results;
  const queue = new Queue(name, { connection: redis, prefix: QUEUE_PREFIX });
  try {
    for (const t of pending.values()) {
      const old = await queue.getJob(t.key);
      if (old && ((await old.isFailed()) || (await old.isCompleted()))) await old.remove();
      await queue.add('file', t, { jobId: t.key, attempts: options.attempts ?? 3, backoff: { type: 'fixed', delay: 500 }, removeOnComplete: true, removeOnFail: false });
    }
    const poll = options.pollMs ?? 200;
    let last = Date.now();
    for (let round = 1; pending.size > 0; round++) {
      await new Promise((r) => setTimeout(r, poll));
      const keys = [...pending.keys()];
      const found = await redis.hmget(hash, ...keys);
      let moved = false;
      for (let i = 0; i < keys.length; i++) {
        if (found[i] === null) continue;
        take(JSON.parse(found[i] as string) as FileResult);
        moved = true;
      }
      // jobs that failed for good (their attempts spent on faults, not bad input), every 5th look
      if (round % 5 === 0) {
        for (const job of await queue.getFailed()) {
          const t = job.id === undefined ? undefined : pending.get(job.id);
          if (t === undefined) continue;
          take({ format: 'loopwise-fleet-file', version: 1, key: t.key, row: t.row, file: t.shown, asset: t.asset, usage: t.usage, unit: t.unit, samples: 0, channels: [], failure: { message: `${t.where} (${t.shown}): the queue's workers failed on it ${job.attemptsMade} times: ${job.failedReason}`, input: false } });
          moved = true;
        }
      }
      if (moved) {
        last = Date.now();
        report();
      } else if (options.idleTimeoutMs !== undefined && Date.now() - last > options.idleTimeoutMs) break;
    }
  } finally {
    await queue.close();
  }
  return results;
}
