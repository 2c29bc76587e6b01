import { join } from 'node:path';
import { parseArgs } from 'node:util';
import { assetsParquet, filesParquet } from './fleetParquet';
import { fleetReport, FLEET_CAUTION, spectraJson } from './fleetReport';
import type { FleetBins } from './FleetBins';
import { parseBinText } from './FleetBins';
import { FleetError } from './FleetError';
import type { FleetProgress } from './FleetProgress';
import { isInputError } from './isInputError';
import { mergeFleet, type FleetResult } from './mergeFleet';
import { planFleet, type FleetOptions } from './planFleet';
import { openQueueConnection } from './queueConnection';
import { renderFleetHtml } from './renderFleetHtml';
import { ResultStore } from './ResultStore';
import { runLocal } from './runLocal';
import { runQueue } from './runQueue';
import { runQueueWorker } from './runQueueWorker';
import { checkFleetOutputs, FLEET_OUTPUT_NAMES, removeFleetTemporaries, writeFleetOutputs } from './writeFleetOutputs';

/** Version printed by --version and written into reports. */
export const FLEET_VERSION = '0.1.0';
const TOOL = `loopwise-fleet ${FLEET_VERSION}`;

/** Where the command writes (injectable for tests). */
export interface FleetIo {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
  /** True when stderr is a terminal (progress is shown only then). */
  stderrIsTerminal: boolean;
}

const processIo: FleetIo = { stdout: (t) => process.stdout.write(t), stderr: (t) => process.stderr.write(t), stderrIsTerminal: Boolean(process.stderr.isTTY) };

export const FLEET_HELP = `loopwise-fleet: fatigue damage of fleets of measured files, on every core or on a job queue

  loopwise-fleet run <manifest.csv | manifest.json | folder> --out <folder> [options]
      Assesses every file the manifest lists (or every data file of the folder, with the
      folder's one job file) and writes, into the output folder:
        fleet.json      per-asset sums, the fleet's damage distribution, spectra (small)
        files.parquet   one row per file and channel    assets.parquet   one row per asset and channel
        spectra.json    the combined and extrapolated matrices (exact)
        fleet.html      the summary with the damage distribution and the extrapolated spectrum
        results/        one result per file; a rerun does not redo the files found there
      --workers N            worker threads (default: every core); --sequential: one thread
      --queue redis://H:P    put one job per file on a BullMQ queue for 'loopwise-fleet worker's
      --queue-name NAME      the queue (default loopwise-fleet)
      --job FILE             the job of rows that name none
      --unit U  --target-service N
      --range-bins C:MIN:MAX  --mean-bins C:MIN:MAX  --from-to-bins C:MIN:MAX
                             settings a CSV manifest or a folder cannot hold (a JSON manifest may)
      --job-may-read-anywhere  let the manifest and jobs name files outside their folders
      --quiet                no progress on the terminal
  loopwise-fleet worker --queue redis://H:P [--queue-name NAME] [--concurrency N] [--lock-seconds S] [--parse-thread]
      Takes file jobs from the queue until stopped (SIGINT or SIGTERM: after the current file).
      Run one per core; --parse-thread parses each file on a thread of its own (one worker
      process on a machine with cores to spare).

Exit codes: 0 every file assessed; 2 bad input (a manifest row, a file, an option, an
unreachable queue: the message names it; the other files still finish and the summary lists
the failures); 1 any other failure.`;

/**
 * Runs the \`loopwise-fleet\` command with the given arguments and returns its exit code: 0 every
 * file assessed, 2 bad input (named on stderr; the other files are still assessed and listed),
 * 1 any other failure.
 */
export async function fleetMain(argv: string[], io: FleetIo = processIo): Promise<number> {
  const [command, ...rest] = argv;
  try {
    if (command === undefined || command === '--help' || command === '-h' || command === 'help') {
      io.stdout(FLEET_HELP + '\n');
      return command === undefined ? 2 : 0;
    }
    if (command === '--version') {
      io.stdout(TOOL + '\n');
      return 0;
    }
    if (command === 'run') return await runCommand(rest, io);
    if (command === 'worker') return await workerCommand(rest, io);
    throw new FleetError('unknown-command', 'command', command, `unknown command "${command}"; commands: run, worker (loopwise-fleet --help)`);
  } catch (error) {
    io.stderr(`loopwise-fleet${command ? ` ${command}` : ''}: ${(error instanceof Error ? error.message : String(error)).replace(/\s*\n\s*/g, '; ')}\n`);
    return isInputError(error) ? 2 : 1;
  }
}

function parse(args: string[], options: Record<string, { type: 'string' | 'boolean' }>, command: string): { values: Record<string, string | boolean | undefined>; positionals: string[] } {
  try {
    return parseArgs({ args, options: { help: { type: 'boolean' }, ...options }, allowPositionals: true, strict: true }) as { values: Record<string, string | boolean | undefined>; positionals: string[] };
  } catch (error) {
    throw new FleetError('invalid-option', 'option', args, `${(error as Error).message.replace(/\. To specify a positional.*$/, '')} (loopwise-fleet ${command} --help)`);
  }
}

function positiveNumber(v: unknown, option: string, integer = false): number | undefined {
  if (v === undefined) return undefined;
  const x = Number(v);
  if (typeof v !== 'string' || v.trim() === '' || !(x >= 0 && x < Infinity) || (integer && !Number.isInteger(x)) || (!integer && x === 0)) {
    throw new FleetError('invalid-option', option, v, `${option}: expected ${integer ? 'an integer >= 0' : 'a finite number > 0'}, got "${String(v)}"`);
  }
  return x;
}

/** A progress line on stderr, at most five times a second, only on a terminal. */
function progressOf(io: FleetIo, quiet: boolean): ((p: FleetProgress) => void) | undefined {
  if (quiet || !io.stderrIsTerminal) return undefined;
  let last = 0;
  return (p) => {
    const now = Date.now();
    if (now - last < 200 && p.done < p.total) return;
    last = now;
    const width = 30;
    const filled = p.total ? Math.round((width * p.done) / p.total) : width;
    io.stderr(`\r[${'#'.repeat(filled)}${'.'.repeat(width - filled)}] ${p.done}/${p.total} files${p.reused ? `, ${p.reused} from an earlier run` : ''}${p.failed ? `, ${p.failed} failed` : ''}`);
  };
}

async function runCommand(args: string[], io: FleetIo): Promise<number> {
  const { values, positionals } = parse(
    args,
    {
      out: { type: 'string' },
      workers: { type: 'string' },
      sequential: { type: 'boolean' },
      queue: { type: 'string' },
      'queue-name': { type: 'string' },
      job: { type: 'string' },
      unit: { type: 'string' },
      'target-service': { type: 'string' },
      'range-bins': { type: 'string' },
      'mean-bins': { type: 'string' },
      'from-to-bins': { type: 'string' },
      'job-may-read-anywhere': { type: 'boolean' },
      quiet: { type: 'boolean' },
    },
    'run',
  );
  if (values.help) {
    io.stdout(FLEET_HELP + '\n');
    return 0;
  }
  if (positionals.length !== 1) throw new FleetError('invalid-option', 'manifest', positionals, 'run: give one manifest (CSV or JSON) or one folder');
  if (typeof values.out !== 'string' || values.out === '') throw new FleetError('invalid-option', '--out', values.out, '--out: the output folder is needed');
  if (values.sequential && values.workers !== undefined) throw new FleetError('invalid-option', '--sequential', true, '--sequential and --workers: give one of them');
  if (values.queue !== undefined && (values.sequential || values.workers !== undefined)) throw new FleetError('invalid-option', '--queue', values.queue, '--queue: the queue\'s workers do the work; --workers and --sequential are for the local route');
  const bins: Partial<FleetBins> = {};
  if (values['range-bins'] !== undefined) bins.range = parseBinText(values['range-bins'] as string, '--range-bins');
  if (values['mean-bins'] !== undefined) bins.mean = parseBinText(values['mean-bins'] as string, '--mean-bins');
  if (values['from-to-bins'] !== undefined) bins.fromTo = parseBinText(values['from-to-bins'] as string, '--from-to-bins');
  const options: FleetOptions = { bins, anywhere: Boolean(values['job-may-read-anywhere']) };
  if (values.unit !== undefined) options.unit = values.unit as string;
  const target = positiveNumber(values['target-service'], '--target-service');
  if (target !== undefined) options.targetService = target;
  if (values.job !== undefined) options.job = values.job as string;
  const workers = values.sequential ? 0 : positiveNumber(values.workers, '--workers', true);
  // an unreachable queue is found before any work
  const connection = values.queue === undefined ? null : await openQueueConnection(values.queue as string);
  const onSignal = (signal: NodeJS.Signals) => {
    removeFleetTemporaries();
    process.exit(signal === 'SIGINT' ? 130 : 143);
  };
  process.once('SIGINT', onSignal);
  process.once('SIGTERM', onSignal);
  try {
    const plan = planFleet(positionals[0], options);
    checkFleetOutputs(values.out as string, FLEET_OUTPUT_NAMES, plan.inputs);
    const store = new ResultStore(join(values.out as string, 'results'));
    const progress = progressOf(io, Boolean(values.quiet));
    const results = connection
      ? await runQueue(plan.tasks, { connection, store, ...(values['queue-name'] ? { queueName: values['queue-name'] as string } : {}), ...(progress ? { onProgress: progress } : {}) })
      : await runLocal(plan.tasks, { store, ...(workers !== undefined ? { workers } : {}), ...(progress ? { onProgress: progress } : {}) });
    if (progress) io.stderr('\r\x1b[K');
    const fleet = mergeFleet(plan.settings, plan.tasks, results, plan.failures);
    if (fleet.channels.length > 0) {
      writeFleetOutputs(
        values.out as string,
        [
          { name: 'fleet.json', content: fleetReport(fleet, TOOL) },
          { name: 'spectra.json', content: spectraJson(fleet) },
          { name: 'files.parquet', content: filesParquet(fleet) },
          { name: 'assets.parquet', content: assetsParquet(fleet) },
          { name: 'fleet.html', content: renderFleetHtml(fleet, TOOL) },
        ],
        plan.inputs,
      );
    }
    io.stdout(summaryText(fleet));
    for (const f of fleet.failures) io.stderr(`loopwise-fleet run: ${f.message}\n`);
    if (fleet.channels.length === 0) io.stderr('loopwise-fleet run: no file could be assessed; no outputs written\n');
    if (fleet.failures.some((f) => !f.input)) return 1;
    return fleet.failures.length > 0 ? 2 : 0;
  } finally {
    process.off('SIGINT', onSignal);
    process.off('SIGTERM', onSignal);
    connection?.disconnect();
  }
}

/** The summary on stdout: counts, per channel the fleet's figures, the failures, the caution. */
export function summaryText(fleet: FleetResult): string {
  const u = fleet.settings.unit;
  const g = (x: number) => (Number.isFinite(x) ? Number(x.toPrecision(4)).toString() : String(x));
  const out = [`${fleet.counts.rows} files listed: ${fleet.counts.assessed} assessed, ${fleet.counts.failed} failed`];
  for (const c of fleet.channels) {
    const d = c.distribution;
    out.push(`channel ${c.channel}: ${c.assets} assets, ${c.files} files, ${g(c.usage)} ${u}`);
    out.push(`  damage per ${u}        fleet ${g(c.damagePerUnit)}; assets p50 ${g(d.p50)}, p95 ${g(d.p95)}, max ${g(d.max)} (${d.severeAsset})`);
    if (c.extrapolation) {
      const t = c.extrapolation.tail;
      out.push(`  at ${g(c.extrapolation.targetService)} ${u}         damage ${g(c.extrapolation.damageLinear)} at the fleet rate; ${t.fitted ? `largest range ${g(t.largestRange)} (measured up to ${g(t.measuredLargestRange)})` : (t.note ?? '')}`);
    }
  }
  if (fleet.failures.length) {
    out.push('failures:');
    for (const f of fleet.failures) out.push(`  ${f.message}`);
  }
  out.push(`Caution: ${FLEET_CAUTION}`);
  return out.join('\n') + '\n';
}

async function workerCommand(args: string[], io: FleetIo): Promise<number> {
  const { values } = parse(args, { queue: { type: 'string' }, 'queue-name': { type: 'string' }, concurrency: { type: 'string' }, 'lock-seconds': { type: 'string' }, 'parse-thread': { type: 'boolean' }, quiet: { type: 'boolean' } }, 'worker');
  if (values.help) {
    io.stdout(FLEET_HELP + '\n');
    return 0;
  }
  if (typeof values.queue !== 'string') throw new FleetError('invalid-option', '--queue', values.queue, '--queue: the address of the Redis server (redis://host:port) is needed');
  const concurrency = positiveNumber(values.concurrency, '--concurrency', true) ?? 1;
  if (concurrency < 1) throw new FleetError('invalid-option', '--concurrency', concurrency, '--concurrency: at least 1');
  const lock = positiveNumber(values['lock-seconds'], '--lock-seconds');
  const connection = await openQueueConnection(values.queue);
  const quiet = Boolean(values.quiet);
  const worker = runQueueWorker({
    connection,
    concurrency,
    parseThread: Boolean(values['parse-thread']),
    ...(values['queue-name'] ? { queueName: values['queue-name'] as string } : {}),
    ...(lock !== undefined ? { lockMs: lock * 1000 } : {}),
    onJob: (event, task, result) => {
      if (!quiet) io.stderr(`worker ${process.pid}: ${event === 'taken' ? 'taking' : result?.failure ? 'failed' : 'done'} ${task.where} (${task.shown})\n`);
    },
  });
  worker.on('error', (error) => io.stderr(`worker ${process.pid}: ${error.message}\n`));
  await worker.waitUntilReady();
  if (!quiet) io.stderr(`worker ${process.pid}: waiting for files on ${values.queue}\n`);
  await new Promise<void>((resolve) => {
    const stop = () => resolve();
    process.once('SIGINT', stop);
    process.once('SIGTERM', stop);
  });
  await worker.close();
  connection.disconnect();
  return 0;
}
