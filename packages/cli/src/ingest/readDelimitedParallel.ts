import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import { IngestError, IngestOptionError, type IngestErrorCode } from '@loopwise/ingest';
import { readDelimited, type IngestChunk, type IngestOptions, type IngestReport } from './readDelimited';

/**
 * {@link readDelimited} with the parsing on a worker thread: the file is read and parsed on a
 * second core while `onChunk` runs here, at most a few chunks ahead (memory stays bounded).
 * Results, errors and their messages are those of `readDelimited`. Where no built worker file
 * is at hand (running from sources), it reads on this thread instead.
 */
export async function readDelimitedParallel(path: string, options: IngestOptions): Promise<IngestReport> {
  // the built worker sits in dist/ingest/ beside the bundle that holds this code (dist/)
  const workerFile = new URL('./ingest/parseWorker.js', import.meta.url);
  if (workerFile.protocol !== 'file:' || !existsSync(fileURLToPath(workerFile))) return readDelimited(path, options);
  const { onChunk, ...rest } = options;
  const control = new SharedArrayBuffer(4);
  const inFlight = new Int32Array(control);
  const worker = new Worker(workerFile, { workerData: { path, options: rest, control } });
  return new Promise<IngestReport>((resolve, reject) => {
    let settled = false;
    const fail = (error: unknown) => {
      if (settled) return;
      settled = true;
      void worker.terminate();
      reject(error);
    };
    worker.on('message', (m: { kind: string } & Record<string, unknown>) => {
      if (settled) return;
      if (m.kind === 'chunk') {
        try {
          onChunk?.(m as unknown as IngestChunk);
        } catch (error) {
          fail(error);
          return;
        }
        Atomics.sub(inFlight, 0, 1);
        Atomics.notify(inFlight, 0);
      } else if (m.kind === 'done') {
        settled = true;
        void worker.terminate();
        resolve(m.report as IngestReport);
      } else if (m.kind === 'error') {
        fail(rebuild(m.error as Record<string, unknown>));
      }
    });
    worker.on('error', fail);
    worker.on('exit', (code) => {
      if (!settled) fail(new Error(`the reading thread stopped (exit code ${code})`));
    });
  });
}

/** The error the worker threw, as the same class with the same message. */
function rebuild(e: Record<string, unknown>): Error {
  if (e.kind === 'IngestError') {
    return new IngestError(e.code as IngestErrorCode, e.file as string, e.line as number, e.column as number, e.detail as string, e.columnName as string | undefined);
  }
  if (e.kind === 'IngestOptionError') {
    const err = new IngestOptionError(e.field as string, e.value, '');
    err.message = e.message as string;
    return err;
  }
  return new Error(e.message as string);
}
