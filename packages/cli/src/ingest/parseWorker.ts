// Worker entry of readDelimitedParallel: reads a delimited file with readDelimited and posts its
// chunks to the thread that started it, at most IN_FLIGHT_LIMIT chunks ahead of it.
import { parentPort, workerData } from 'node:worker_threads';
import { IngestError, IngestOptionError } from '@loopwise/ingest';
import { readDelimited, type IngestOptions } from './readDelimited';

/** Chunks the worker may have posted but the reader not yet consumed (memory stays bounded). */
export const IN_FLIGHT_LIMIT = 8;

const { path, options, control } = workerData as { path: string; options: Omit<IngestOptions, 'onChunk'>; control: SharedArrayBuffer };
const inFlight = new Int32Array(control);

readDelimited(path, {
  ...options,
  onChunk: (c) => {
    for (let n = Atomics.load(inFlight, 0); n >= IN_FLIGHT_LIMIT; n = Atomics.load(inFlight, 0)) Atomics.wait(inFlight, 0, n, 1000);
    Atomics.add(inFlight, 0, 1);
    // the chunk's arrays are reused by the reader: post copies, and hand their memory over
    const channels = c.channels.map((a) => a.slice());
    const time = c.time ? c.time.slice() : null;
    const transfer = channels.map((a) => a.buffer as ArrayBuffer);
    if (time) transfer.push(time.buffer as ArrayBuffer);
    parentPort!.postMessage({ kind: 'chunk', firstSample: c.firstSample, length: c.length, channels, time }, transfer);
  },
}).then(
  (report) => parentPort!.postMessage({ kind: 'done', report }),
  (error: unknown) => {
    const e = error as Record<string, unknown>;
    const kind = error instanceof IngestError ? 'IngestError' : error instanceof IngestOptionError ? 'IngestOptionError' : 'Error';
    parentPort!.postMessage({
      kind: 'error',
      error: { kind, message: (error as Error)?.message ?? String(error), code: e?.code, file: e?.file, line: e?.line, column: e?.column, detail: e?.detail, columnName: e?.columnName, field: e?.field, value: e?.value },
    });
  },
);
