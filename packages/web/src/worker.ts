// The page's worker: reads the dropped file and assesses it off the main thread, with the same
// code as the command (`assessStream`, the loops kept in memory), and writes the command's
// exports from the result it keeps.
import {
  assessEvents,
  assessStream,
  htmlChannelsOf,
  jobOfJobFile,
  jsonReport,
  loopInFile,
  masingLoop,
  MemorySpool,
  readCyclicConstants,
  renderChannelsHtml,
  snCurvePlot,
  reportTitle,
  signalWarningsOf,
  TOOL,
  UsageError,
  writeCyclesCsv,
  type ChannelResult,
  type JobFile,
  type StreamRead,
} from '@loopwise/cli/browser';
import { DelimitedReader, type IngestReport, type ReaderOptions } from '@loopwise/ingest';
import { envelopeLevels } from './envelope';
import type { ChannelView, FromWorker, ToWorker } from './protocol';

/** Bytes read from the file at a time (as the command reads from disk). */
const CHUNK_BYTES = 1 << 20;
/** Least time between two progress messages, ms. */
const PROGRESS_MS = 100;

const scope = self as unknown as { postMessage(message: FromWorker, transfer?: Transferable[]): void; onmessage: ((e: MessageEvent<ToWorker>) => void) | null };
let results: ChannelResult[] | null = null;

function post(message: FromWorker, transfer: Transferable[] = []): void {
  scope.postMessage(message, transfer);
}

/** A reader of `file` for assessStream: every read goes through the file from its start. */
function fileReader(file: File): StreamRead {
  let reads = 0;
  let last = 0;
  return async (options) => {
    const read = ++reads;
    const reader = new DelimitedReader(options);
    for (let at = 0; at < file.size && !reader.stopped; at += CHUNK_BYTES) {
      const bytes = new Uint8Array(await file.slice(at, at + CHUNK_BYTES).arrayBuffer());
      reader.push(bytes);
      const now = performance.now();
      if (now - last >= PROGRESS_MS) {
        last = now;
        post({ kind: 'progress', what: file.name, read, fraction: Math.min(1, (at + bytes.length) / file.size) });
      }
    }
    return reader.finish();
  };
}

/**
 * Reads an event's file whole for assessEvents: every chunk of every channel (and of the time
 * column, for `time`) collected into one Float64Array per channel.
 */
async function readColumns(file: File, options: Omit<ReaderOptions, 'onChunk'>, time: Samples<Float64Array> | null): Promise<{ report: IngestReport; channels: Float64Array[] }> {
  const columns = options.channels.map(() => new Samples(new Float64Array(1 << 16)));
  const reader = new DelimitedReader({
    ...options,
    onChunk: (chunk) => {
      chunk.channels.forEach((v, k) => columns[k].push(v));
      if (time && chunk.time) time.push(chunk.time);
    },
  });
  let last = 0;
  for (let at = 0; at < file.size && !reader.stopped; at += CHUNK_BYTES) {
    reader.push(new Uint8Array(await file.slice(at, at + CHUNK_BYTES).arrayBuffer()));
    const now = performance.now();
    if (now - last >= PROGRESS_MS) {
      last = now;
      post({ kind: 'progress', what: file.name, read: 1, fraction: Math.min(1, (at + CHUNK_BYTES) / file.size) });
    }
  }
  const report = reader.finish();
  return { report, channels: columns.map((c) => c.values.slice(0, c.length)) };
}

/** A growable typed array of one column's samples. */
class Samples<T extends Float32Array | Float64Array> {
  length = 0;
  constructor(public values: T) {}
  push(v: Float64Array): void {
    if (this.length + v.length > this.values.length) {
      let n = this.values.length;
      while (n < this.length + v.length) n *= 2;
      const bigger = new (this.values.constructor as new (n: number) => T)(n);
      bigger.set(this.values.subarray(0, this.length));
      this.values = bigger;
    }
    this.values.set(v, this.length);
    this.length += v.length;
  }
}

async function run(files: File[], jobFile: JobFile): Promise<void> {
  const t0 = performance.now();
  const transferLater: Transferable[] = [];
  for (const r of results ?? []) r.loopStream?.remove();
  results = null;
  const job = jobOfJobFile(jobFile, 'the page', {
    resolve: (path) => ({ path, shown: path }),
    readText: (path, field) => {
      throw new UsageError(`${field}: the page reads no files but the measured ones ("${path}"); give the material's constants`);
    },
  });
  const byName = new Map(files.map((f) => [f.name, f]));
  const fileOf = (name: string, field: string): File => {
    const f = byName.get(name);
    if (f === undefined) throw new UsageError(`${field}: the job names "${name}", which the page was not given`);
    return f;
  };
  const samples = job.channels.map(() => new Samples(new Float32Array(1 << 16)));
  const time = job.time !== undefined && 'column' in job.time ? new Samples(new Float64Array(1 << 16)) : null;
  const eventStarts: { name: string; start: number }[] = [];
  let got: ChannelResult[];
  if (job.events !== null) {
    // a duty cycle: each event's file read whole, then assessed in memory (the command's route)
    got = await assessEvents(job, async (event, options) => {
      eventStarts.push({ name: event.name, start: samples[0].length });
      const read = await readColumns(fileOf(event.file, 'events'), options, time);
      read.channels.forEach((v, k) => samples[k].push(v));
      return read;
    });
  } else {
    eventStarts.push({ name: 'history', start: 0 });
    got = await assessStream(job, fileReader(fileOf(job.file as string, 'file')), {
      newLoopStore: () => new MemorySpool(),
      // as the command: with no service, a file with a time base gives it (the record's duration in h)
      serviceFromTime: true,
      onChunk: (chunk) => {
        chunk.channels.forEach((v, k) => samples[k].push(v));
        if (time && chunk.time) time.push(chunk.time);
      },
    });
  }
  // cut out (sample or time ranges, flat runs found): the corrected history is joined across the cuts
  const cut = got.some((r) => r.cutOut !== undefined && r.cutOut.length > 0);
  const times = time ? time.values.slice(0, time.length) : null;
  if (times) transferLater.push(times.buffer);
  const html = await htmlChannelsOf(got);
  const transfer: Transferable[] = [...transferLater];
  const channels: ChannelView[] = got.map((r, k) => {
    const values = samples[k].values.slice(0, samples[k].length);
    const levels = envelopeLevels(values);
    transfer.push(values.buffer, ...levels.flatMap((l) => [l.min.buffer, l.max.buffer]));
    const { loops: _loops, inputs: _inputs, ...report } = r.report;
    void _loops;
    void _inputs;
    const cyclic = readCyclicConstants(r.report.inputs);
    const worst = r.report.worstLoops.slice(0, 5);
    const hysteresis =
      cyclic === null || worst.some((l) => l.strainMax === null || l.strainMin === null)
        ? null
        : worst.map((l) => ({ ...masingLoop(cyclic, l.stressMax, l.stressMin, l.strainMax as number, l.strainMin as number, 40), share: l.share }));
    return {
      name: r.name,
      unit: r.unit,
      report,
      hysteresis: hysteresis?.map(({ strain, stress, share }) => ({ strain, stress, share })) ?? null,
      // the report's own S-N plot (the same drawing as the HTML export's)
      snCurve: r.report.damage.route === 'stress-life' ? snCurvePlot(html[k], `channel-${k + 1}-sn`, 'MPa') : null,
      corrections: r.corrections,
      signalWarnings: signalWarningsOf(r),
      signalCorrections: r.signalCorrections.map((c) => ({ kind: c.kind, summary: c.summary })),
      matrix: html[k].matrix,
      values,
      levels,
      // after a cut the joined samples are not evenly timed: the plot's axis is then the sample number
      sampleRate: job.time !== undefined && 'sampleRate' in job.time && !cut ? job.time.sampleRate : null,
      // after a cut, the worst loops in the file's sample numbers (as the command's reports give them)
      worstInFile: r.cutOut !== undefined && r.cutOut.length > 0 ? r.report.worstLoops.map((w) => loopInFile(w, r.cutOut as Float64Array)) : null,
      time: times,
      eventStarts,
    };
  });
  results = got;
  post({ kind: 'result', channels, seconds: (performance.now() - t0) / 1000 }, transfer);
}

async function exportOf(what: 'json' | 'csv' | 'html'): Promise<void> {
  if (results === null) throw new UsageError('export: there is no result yet');
  const stem = results.map((r) => r.name).join('-').replace(/[^A-Za-z0-9._-]+/g, '_') || 'loopwise';
  if (what === 'json') post({ kind: 'export', what, name: `${stem}.json`, blob: new Blob([jsonReport('assess', TOOL, results)], { type: 'application/json' }) });
  else if (what === 'html') post({ kind: 'export', what, name: `${stem}.html`, blob: new Blob([await renderChannelsHtml(results, reportTitle('assess', results), TOOL)], { type: 'text/html' }) });
  else {
    const pieces: string[] = [];
    await writeCyclesCsv(results, { write: async (text) => void pieces.push(text) });
    post({ kind: 'export', what, name: `${stem}-cycles.csv`, blob: new Blob(pieces, { type: 'text/csv' }) });
  }
}

scope.onmessage = (e) => {
  const m = e.data;
  const work = m.kind === 'run' ? run(m.files, m.job) : exportOf(m.what);
  work.catch((error: unknown) => post({ kind: 'error', message: error instanceof Error ? error.message : String(error) }));
};
