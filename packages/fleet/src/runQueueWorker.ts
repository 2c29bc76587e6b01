import { Worker } from 'bullmq';
import type { Redis } from 'ioredis';
import { assessFileOrFailure } from './assessFile';
import type { FileResult, FleetTask } from './FleetTask';
import { DEFAULT_QUEUE_NAME, QUEUE_PREFIX, resultsKey } from './queueConnection';

/** Options of {@link runQueueWorker}. */
export interface QueueWorkerOptions {
  connection: Redis;
  queueName?: string;
  /** Files assessed at once by this process; default 1 (run one worker process per core). */
  concurrency?: number;
  /** How long a job's lock lasts without renewal, ms (a crashed worker's job returns after about this); default 30000. */
  lockMs?: number;
  /**
   * Parse each file on a thread of its own (default false: the documented setting is one worker
   * process per core, whose parse threads would only contend for the same cores). Set true for a
   * single worker process on a machine with cores to spare.
   */
  parseThread?: boolean;
  /** Called when a file is taken and when it is done. */
  onJob?: (event: 'taken' | 'done', task: FleetTask, result?: FileResult) => void;
}

/**
 * A worker of the queue route: takes file jobs from the BullMQ queue, assesses each with
 * {@link assessFileOrFailure} and writes its result to the queue's results hash under the task's
 * key (HSET: a job done twice writes the same result to the same field, so it counts once). A
 * file with bad input gives a failure result (not retried); any other error fails the job, and
 * BullMQ retries it. Returns the BullMQ worker; `close()` stops it after its current file.
 */
export function runQueueWorker(options: QueueWorkerOptions): Worker<FleetTask, string> {
  const name = options.queueName ?? DEFAULT_QUEUE_NAME;
  const hash = resultsKey(name);
  const redis = options.connection;
  const lockMs = options.lockMs ?? 30000;
  return new Worker<FleetTask, string>(
    name,
    async (job) => {
      options.onJob?.('taken', job.data);
      const result = await assessFileOrFailure({ ...job.data, parseThread: options.parseThread ?? false });
      await redis.hset(hash, result.key, JSON.stringify(result));
      options.onJob?.('done', job.data, result);
      return result.failure ? 'failed' : 'assessed';
    },
    { connection: redis, prefix: QUEUE_PREFIX, concurrency: options.concurrency ?? 1, lockDuration: lockMs, stalledInterval: lockMs, maxStalledCount: 3 },
  );
}
