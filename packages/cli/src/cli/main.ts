import { closeSync, existsSync, openSync, readSync, statSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import { handbookSteels, type Material } from '@loopwise/material';
import { CycleTable, FromToMatrix, RainflowCounter, RangeMeanMatrix, type CycleMatrix } from '@loopwise/rainflow';
import { readDelimited, type TimeSource } from '../ingest';
import { exitCodeOf, oneLine, UsageError } from './CliError';
import { checkRoute, readJobFile, type CliChannel, type CliJob, type CorrectionJob } from './CliJob';
import { parseSnCurveSpec } from './snCurveSpec';
import { FileAccess, OUTSIDE_OPTION } from './FileAccess';
import { InputFiles } from './InputFiles';
import { DEFAULT_MEMORY_LIMIT_MB, MemoryGuard, MemoryLimitError } from './MemoryGuard';
import { OutputSet, type StdoutWrite } from './OutputSet';
import { spoolStdin } from './spoolStdin';
import { SpoolFile } from './SpoolFile';
import { formatCount, formatNumber } from '../report/formatNumber.js';
import { HELP } from './helpTexts';
import { chooseColumns, dialectOf, LAYOUT_OPTIONS, surveyFile } from './fileLayout';
import { correctionJson, jsonReport, stableJson, summaryText, writeCyclesCsv } from './outputs';
import { resolveMaterial, type MaterialSpec } from './resolveMaterial';
import { checkLowPassMemory, runAssessment, type ChannelResult } from './runAssessment';
import { correctedStream } from './correctedStream';
import { checkSignalCorrections } from './signalCorrections';
import { runMargin } from './marginCommand';
import { renderChannelsHtml, reportTitle } from './renderChannelsHtml';

import { TOOL } from './version';

export { VERSION } from './version';

/** Where the command writes (injectable for tests). */
export interface Io {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
  /** True when stderr is a terminal (progress is shown only then). */
  stderrIsTerminal: boolean;
  /** Writes an output given as `-` to standard output, waiting while it is full; default: `stdout`. */
  stdoutWrite?: StdoutWrite;
}

const processIo: Io = {
  stdout: (t) => process.stdout.write(t),
  stderr: (t) => process.stderr.write(t),
  stderrIsTerminal: Boolean(process.stderr.isTTY),
  stdoutWrite: (t) =>
    new Promise<void>((resolve, reject) => {
      process.stdout.write(t, (error) => (error ? reject(error) : resolve()));
    }),
};

const COMMON = {
  help: { type: 'boolean' },
  version: { type: 'boolean' },
} as const;

const CHANNEL = {
  column: { type: 'string', multiple: true },
  quantity: { type: 'string' },
  unit: { type: 'string' },
  'mpa-per-unit': { type: 'string' },
  'sample-rate': { type: 'string' },
  'time-column': { type: 'string' },
  gate: { type: 'string' },
  'gate-fraction': { type: 'string' },
  'full-scale': { type: 'string' },
  ...LAYOUT_OPTIONS,
} as const;

/** The corrections of the signal (assess, margin and count; parsed by {@link signalCorrectionsOf}). */
const SIGNAL_CORRECTIONS = {
  'interpolate-spikes': { type: 'boolean' },
  'exclude-flat-runs': { type: 'boolean' },
  'exclude-samples': { type: 'string', multiple: true },
  'exclude-time': { type: 'string', multiple: true },
  'subtract-offset': { type: 'string' },
  'low-pass': { type: 'string' },
  'low-pass-order': { type: 'string' },
} as const;

const MODEL = {
  ...CHANNEL,
  material: { type: 'string' },
  su: { type: 'string' },
  hardness: { type: 'string' },
  kt: { type: 'string' },
  kf: { type: 'string' },
  rule: { type: 'string' },
  'mean-stress': { type: 'string' },
  'walker-gamma': { type: 'string' },
  'sn-curve': { type: 'string' },
  'hot-spot': { type: 'string' },
  ...SIGNAL_CORRECTIONS,
  'hot-spot-modulus': { type: 'string' },
  'stress-factor': { type: 'string' },
  'ultimate-strength': { type: 'string' },
  'sigma-f': { type: 'string' },
  'iiw-category': { type: 'string' },
  'one-off': { type: 'boolean' },
  'scatter-factor': { type: 'string' },
  'cutoff-cycles': { type: 'string' },
  'critical-damage': { type: 'string' },
  service: { type: 'string' },
  job: { type: 'string' },
  json: { type: 'boolean' },
  'json-out': { type: 'string' },
  'cycles-out': { type: 'string' },
  'html-out': { type: 'string' },
  quiet: { type: 'boolean' },
  'job-may-read-anywhere': { type: 'boolean' },
  'memory-limit': { type: 'string' },
} as const;

/** Options that may be given with --job (outputs and how the run reads and writes). */
const WITH_JOB = ['job', 'json', 'json-out', 'cycles-out', 'html-out', 'quiet', 'job-may-read-anywhere', 'memory-limit'];

/**
 * Runs the `loopwise` command with the given arguments and returns its exit code: 0 success,
 * 1 failure, 2 usage or input error (with a one-line message on stderr naming where).
 */
export async function main(argv: string[], io: Io = processIo): Promise<number> {
  const [command, ...rest] = argv;
  try {
    if (command === undefined || command === '--help' || command === '-h' || command === 'help') {
      const topic = command === 'help' ? rest[0] : undefined;
      if (topic !== undefined && !(topic in HELP)) throw new UsageError(`help: no command "${topic}"; commands: ${commands().join(', ')}`);
      io.stdout(HELP[topic ?? 'main'] + '\n');
      return command === undefined ? 2 : 0;
    }
    if (command === '--version') {
      io.stdout(TOOL + '\n');
      return 0;
    }
    switch (command) {
      case 'assess':
        return await assessCommand(rest, io, false);
      case 'margin':
        return await assessCommand(rest, io, true);
      case 'count':
        return await countCommand(rest, io);
      case 'material':
        return await materialCommand(rest, io);
      case 'demo':
        return await demoCommand(rest, io);
      default:
        throw new UsageError(`unknown command "${command}"; commands: ${commands().join(', ')} (loopwise --help)`);
    }
  } catch (caught) {
    const error = outOfMemory(caught);
    io.stderr(`loopwise ${command ?? ''}: ${oneLine(error)}\n`.replace('loopwise : ', 'loopwise: '));
    return exitCodeOf(error);
  }
}

/** An allocation that failed (typed array, string) as a coded error instead of a raw RangeError. */
function outOfMemory(error: unknown): unknown {
  if (error instanceof RangeError && /allocation failed|Invalid (typed )?array length|Invalid string length/i.test(error.message))
    return new MemoryLimitError(`out of memory (${error.message}); the input is too large for this route on this machine`);
  return error;
}

function commands(): string[] {
  return Object.keys(HELP).filter((k) => k !== 'main');
}

function parse<O extends Record<string, { type: 'string' | 'boolean'; multiple?: boolean }>>(args: string[], options: O, command: string) {
  try {
    return parseArgs({ args, options: { ...COMMON, ...options, ...(command === 'margin' ? MARGIN : {}) }, allowPositionals: true, strict: true });
  } catch (error) {
    throw new UsageError(`${(error as Error).message.replace(/\. To specify a positional.*$/, '')} (loopwise help ${command})`);
  }
}

const MARGIN = { 'target-repeats': { type: 'string' }, 'target-life': { type: 'string' }, 'target-of': { type: 'string' } } as const;

/** A choice option: one of `allowed`, with the option named in the error; undefined when absent. */
function oneOf<T extends string>(values: Record<string, unknown>, name: string, allowed: readonly T[]): T | undefined {
  const v = values[name];
  if (v === undefined) return undefined;
  if (!allowed.includes(v as T)) throw new UsageError(`--${name}: one of ${allowed.join(', ')}, got "${String(v)}"`);
  return v as T;
}

/** A number option: finite, with the option named in the error. */
function num(values: Record<string, unknown>, name: string): number | undefined {
  const v = values[name];
  if (v === undefined) return undefined;
  const x = Number(v);
  if (typeof v !== 'string' || v.trim() === '' || !Number.isFinite(x)) throw new UsageError(`--${name}: expected a number, got "${String(v)}"`);
  return x;
}

function timeOf(values: Record<string, unknown>): TimeSource | undefined {
  const rate = num(values, 'sample-rate');
  const col = values['time-column'] as string | undefined;
  if (rate !== undefined && col !== undefined) throw new UsageError('--sample-rate and --time-column: give one of them');
  if (rate !== undefined) return { sampleRate: rate };
  if (col !== undefined) return { column: /^\d+$/.test(col) ? Number(col) : col };
  return undefined;
}

/**
 * The ranges of a repeatable option given as `<from>..<to>` (several in one value may be separated
 * by commas), each end a number; the option named in the error.
 */
function rangesOf(values: Record<string, unknown>, name: string): [number, number][] {
  const given = (values[name] as string[] | undefined) ?? [];
  const out: [number, number][] = [];
  for (const text of given.flatMap((g) => g.split(','))) {
    const cut = text.indexOf('..');
    const from = cut < 0 ? '' : text.slice(0, cut).trim();
    const to = cut < 0 ? '' : text.slice(cut + 2).trim();
    const a = from === '' ? NaN : Number(from);
    const b = to === '' ? NaN : Number(to);
    if (!Number.isFinite(a) || !Number.isFinite(b)) throw new UsageError(`--${name}: expected <from>..<to> (e.g. ${name === 'exclude-time' ? '12.5..14' : '1000..1999'}), got "${text}"`);
    out.push([a, b]);
  }
  return out;
}

/**
 * The corrections of the signal given as options (`--interpolate-spikes`, `--exclude-samples`,
 * `--exclude-time`, `--subtract-offset`, `--low-pass`, `--low-pass-order`), as a job's fields;
 * only those given. Checks what the options alone say (numbers, whole sample numbers, the order
 * without the cut-off); checkSignalCorrections checks them against each other and the time base.
 */
function signalCorrectionsOf(values: Record<string, unknown>): Pick<CorrectionJob, 'interpolateSpikes' | 'excludeFlatRuns' | 'excludeSamples' | 'excludeTimes' | 'subtractOffset' | 'lowPass'> {
  const out: Pick<CorrectionJob, 'interpolateSpikes' | 'excludeFlatRuns' | 'excludeSamples' | 'excludeTimes' | 'subtractOffset' | 'lowPass'> = {};
  if (values['interpolate-spikes']) out.interpolateSpikes = true;
  if (values['exclude-flat-runs']) out.excludeFlatRuns = true;
  const samplesCut = rangesOf(values, 'exclude-samples');
  if (samplesCut.length > 0) {
    for (const [a, b] of samplesCut) {
      if (!(Number.isInteger(a) && a >= 0 && Number.isInteger(b) && b >= 0)) throw new UsageError(`--exclude-samples: ${a}..${b}: sample numbers are whole numbers from 0, as the reports give them`);
    }
    out.excludeSamples = samplesCut.map(([first, last]) => ({ first, last }));
  }
  const timesCut = rangesOf(values, 'exclude-time');
  if (timesCut.length > 0) out.excludeTimes = timesCut.map(([startTime, endTime]) => ({ startTime, endTime }));
  const offsetGiven = values['subtract-offset'] as string | undefined;
  if (offsetGiven !== undefined) out.subtractOffset = offsetGiven.trim() === 'mean' ? 'mean' : (num(values, 'subtract-offset') as number);
  const cutoff = num(values, 'low-pass');
  const order = num(values, 'low-pass-order');
  if (cutoff !== undefined) out.lowPass = { cutoffHz: cutoff, ...(order !== undefined ? { order } : {}) };
  else if (order !== undefined) throw new UsageError('--low-pass-order: only with --low-pass <cut-off Hz>');
  return out;
}

function serviceOf(values: Record<string, unknown>): CliJob['service'] | undefined {
  const s = values.service as string | undefined;
  if (s === undefined) return undefined;
  const m = /^\s*([0-9.eE+-]+)\s+(\S.*?)\s*$/.exec(s);
  const x = m ? Number(m[1]) : NaN;
  if (!m || !(x > 0 && x < Infinity)) throw new UsageError(`--service: expected "<amount> <unit>", e.g. "0.5 h", got "${s}"`);
  return { unit: m[2], perRepeat: x };
}

async function jobFromFlags(values: Record<string, unknown>, positionals: string[], command: string, inputs: InputFiles): Promise<CliJob> {
  if (values.job !== undefined) {
    if (positionals.length > 0) throw new UsageError(`${command}: give a file or --job, not both`);
    for (const k of Object.keys(values)) {
      if (k in MODEL && !WITH_JOB.includes(k)) {
        throw new UsageError(`--${k}: the job file sets the model; only outputs may be given with --job`);
      }
    }
    return readJobFile(values.job as string, inputs, Boolean(values['job-may-read-anywhere']));
  }
  if (values['job-may-read-anywhere']) throw new UsageError(`${OUTSIDE_OPTION}: only with --job (files named on the command line are read as given)`);
  if (positionals.length !== 1) throw new UsageError(`${command}: give one measured file (or --job <file>); loopwise help ${command}`);
  const access = new FileAccess(inputs, null, true);
  const data = await dataFile(positionals[0], inputs, access);
  const su = num(values, 'su');
  const hb = num(values, 'hardness');
  const stressRoute = values['sn-curve'] !== undefined;
  const given = [values.material !== undefined, su !== undefined, hb !== undefined].filter(Boolean).length;
  // the stress-life route needs no material (one may still give Su or σf′ for a correction)
  if (given > 1 || (given === 0 && !stressRoute)) throw new UsageError('--material, --su or --hardness: give exactly one');
  const spec: MaterialSpec | undefined =
    values.material !== undefined
      ? (values.material as string)
      : su !== undefined
        ? { estimate: { method: 'uniform-material-law', SuMPa: su } }
        : hb !== undefined
          ? { estimate: { method: 'hardness', hardnessHB: hb } }
          : undefined;
  const meanStress =
    oneOf(values, 'mean-stress', ['none', 'morrow', 'modifiedMorrow', 'smithWatsonTopper', 'walker', 'goodman', 'gerber', 'iiw', 'all'] as const) ?? (stressRoute ? 'none' : 'smithWatsonTopper');
  const job: CliJob = {
    material: spec === undefined ? undefined : resolveMaterial(spec, access, '--material'),
    meanStress,
    scatterFactor: num(values, 'scatter-factor') ?? 1,
    repeating: !values['one-off'],
    channels: [],
    file: data.path,
    fileShown: data.shown,
    events: null,
  };
  const dialect = dialectOf(values);
  if (dialect) job.dialect = dialect;
  const layout = chooseColumns(values, surveyFile(data.path, dialect, data.shown), timeOf(values), data.shown);
  job.channels = layout.channels;
  job.notes = layout.notes;
  const kt = num(values, 'kt');
  const kf = num(values, 'kf');
  const rule = oneOf(values, 'rule', ['neuber', 'glinka', 'linear'] as const);
  if (stressRoute) {
    if (kt !== undefined || rule !== undefined) throw new UsageError(`--${kt !== undefined ? 'kt' : 'rule'}: the stress-life route (--sn-curve) takes the notch as --kf, on range and mean`);
    job.stressLife = { ...parseSnCurveSpec(values['sn-curve'], '--sn-curve') };
    const s = job.stressLife;
    const set = (k: 'kf' | 'stressFactor' | 'ultimateStrength' | 'sigmaF', v: number | undefined) => {
      if (v !== undefined) s[k] = v;
    };
    set('kf', kf);
    set('stressFactor', num(values, 'stress-factor'));
    set('ultimateStrength', num(values, 'ultimate-strength'));
    set('sigmaF', num(values, 'sigma-f'));
    const cat = oneOf(values, 'iiw-category', ['I', 'II', 'III'] as const);
    if (cat !== undefined) s.iiwCategory = cat;
    const hot = oneOf(values, 'hot-spot', ['typeALinear', 'typeAQuadratic', 'typeBLinear', 'typeBQuadratic'] as const);
    const modulus = num(values, 'hot-spot-modulus');
    if (hot !== undefined) s.hotSpot = { rule: hot, ...(modulus !== undefined ? { modulus } : {}) };
    else if (modulus !== undefined) throw new UsageError('--hot-spot-modulus: only with --hot-spot');
  } else {
    for (const k of ['stress-factor', 'ultimate-strength', 'sigma-f', 'iiw-category', 'hot-spot', 'hot-spot-modulus']) {
      if (values[k] !== undefined) throw new UsageError(`--${k}: applies to the stress-life route; give --sn-curve`);
    }
  }
  if (!stressRoute && (kt !== undefined || kf !== undefined || rule !== undefined)) {
    job.notch = {};
    if (kt !== undefined) job.notch.Kt = kt;
    if (kf !== undefined) job.notch.Kf = kf;
    if (rule !== undefined) job.notch.rule = rule;
  }
  const opt = (k: keyof CliJob, name: string) => {
    const v = num(values, name);
    if (v !== undefined) (job as unknown as Record<string, unknown>)[k] = v;
  };
  opt('walkerGamma', 'walker-gamma');
  opt('gate', 'gate');
  opt('gateFraction', 'gate-fraction');
  opt('fullScale', 'full-scale');
  opt('cutoffCycles', 'cutoff-cycles');
  opt('criticalDamage', 'critical-damage');
  Object.assign(job, signalCorrectionsOf(values));
  const service = serviceOf(values);
  if (service) job.service = service;
  if (layout.time) job.time = layout.time;
  if (layout.timeSecondsPerUnit !== undefined) job.timeSecondsPerUnit = layout.timeSecondsPerUnit;
  checkRoute(job, null);
  return job;
}

/** A data file named on the command line: as typed, or `-` for standard input (copied to a private temporary file). */
async function dataFile(path: string, inputs: InputFiles, access: FileAccess): Promise<{ path: string; shown: string }> {
  if (path === '-') {
    inputs.addStdin();
    return { path: await spoolStdin(), shown: 'standard input' };
  }
  return access.resolve(path, 'file');
}

function guardOf(values: Record<string, unknown>): MemoryGuard {
  const mb = num(values, 'memory-limit') ?? DEFAULT_MEMORY_LIMIT_MB;
  if (!(mb >= 1)) throw new UsageError(`--memory-limit: a number of MB >= 1, got ${mb}`);
  return new MemoryGuard(mb);
}

/**
 * A progress bar on stderr while a file is read, only when stderr is a terminal. The total is
 * estimated from the file size and the bytes per line of its first 64 KiB.
 */
function progressOf(io: Io, quiet: boolean, file: string | null) {
  if (quiet || !io.stderrIsTerminal || file === null) return undefined;
  let estimate = 0;
  try {
    const size = statSync(file).size;
    const head = Buffer.alloc(Math.min(size, 65536));
    const fd = openSync(file, 'r');
    readSync(fd, head, 0, head.length, 0);
    closeSync(fd);
    let lines = 0;
    for (const b of head) if (b === 10) lines++;
    estimate = lines > 0 ? (size / head.length) * lines : 0;
  } catch {
    estimate = 0;
  }
  let last = 0;
  return (samples: number, pass: 1 | 2 | 3) => {
    const now = Date.now();
    if (now - last < 200) return;
    last = now;
    const share = estimate > 0 ? Math.min(1, samples / estimate) : 0;
    const width = 30;
    const filled = Math.round(share * width);
    const bar = estimate > 0 ? `[${'#'.repeat(filled)}${'.'.repeat(width - filled)}] ${String(Math.round(100 * share)).padStart(3)} % ` : '';
    io.stderr(`\r${pass === 1 ? 'reading    ' : pass === 2 ? 'second read' : 'artefacts  '} ${bar}${samples.toLocaleString('en-US')} samples`);
  };
}

async function assessCommand(args: string[], io: Io, margin: boolean): Promise<number> {
  const command = margin ? 'margin' : 'assess';
  const { values, positionals } = parse(args, MODEL, command);
  if (values.help) {
    io.stdout(HELP[command] + '\n');
    return 0;
  }
  const inputs = new InputFiles();
  const guard = guardOf(values);
  const job = await jobFromFlags(values, positionals, command, inputs);
  if (margin) return marginOf(job, values, io, guard);
  // every output is checked before the work starts, and written all or nothing after it
  const box: { results: ChannelResult[] } = { results: [] };
  const outputs = planOutputs(values, inputs, io, command, null, box);
  const progress = progressOf(io, Boolean(values.quiet), job.file);
  // the loop table is kept only when it is written (--cycles-out); otherwise memory stays flat
  const results = await runAssessment(job, progress, { keepLoops: values['cycles-out'] !== undefined, guard, serviceFromTime: true });
  box.results = results;
  if (progress) io.stderr('\r\x1b[K');
  try {
    await outputs.commit();
  } finally {
    for (const r of results) r.loopStream?.remove();
  }
  if (!outputs.usesStdout) io.stdout(values.json ? jsonReport(command, TOOL, results) : notesText(job) + summaryText(results, null));
  return 0;
}

/** How the command chose columns, units and the time base, one `input:` line each (empty when it chose nothing). */
function notesText(job: CliJob): string {
  return (job.notes ?? []).map((n) => `input: ${n}\n`).join('') + ((job.notes ?? []).length > 0 ? '\n' : '');
}

/** The outputs of assess and demo, checked now and written by `commit()` from `box.results`. */
function planOutputs(values: Record<string, unknown>, inputs: InputFiles, io: Io, command: string, title: string | null, box: { results: ChannelResult[] }): OutputSet {
  const outputs = new OutputSet(inputs, io.stdoutWrite ?? (async (t) => io.stdout(t)));
  if (values['json-out'] !== undefined) outputs.add('--json-out', values['json-out'] as string, (sink) => sink.write(jsonReport(command, TOOL, box.results)));
  if (values['cycles-out'] !== undefined) outputs.add('--cycles-out', values['cycles-out'] as string, (sink) => writeCyclesCsv(box.results, sink));
  if (values['html-out'] !== undefined)
    outputs.add('--html-out', values['html-out'] as string, async (sink) =>
      sink.write(await renderChannelsHtml(box.results, title ?? reportTitle(command, box.results), TOOL)),
    );
  if (outputs.usesStdout && values.json) throw new UsageError('--json: the report cannot go to standard output when an output file is "-"');
  return outputs;
}

async function marginOf(job: CliJob, values: Record<string, unknown>, io: Io, guard: MemoryGuard): Promise<number> {
  for (const k of ['json-out', 'cycles-out', 'html-out']) if (values[k] !== undefined) throw new UsageError(`--${k}: margin writes no files; use --json`);
  const targetRepeats = num(values, 'target-repeats');
  const targetLife = num(values, 'target-life');
  const targetOf = oneOf(values, 'target-of', ['design', 'mean'] as const);
  return runMargin(
    job,
    { ...(targetRepeats !== undefined ? { targetRepeats } : {}), ...(targetLife !== undefined ? { targetLife } : {}), ...(targetOf ? { targetOf } : {}), json: Boolean(values.json), tool: TOOL, progress: io.stderrIsTerminal && !values.quiet },
    io,
    guard,
  );
}

async function countCommand(args: string[], io: Io): Promise<number> {
  const { values, positionals } = parse(
    args,
    { ...CHANNEL, ...SIGNAL_CORRECTIONS, residue: { type: 'string' }, 'range-bins': { type: 'string' }, 'mean-bins': { type: 'string' }, 'matrix-out': { type: 'string' }, 'from-to-out': { type: 'string' }, 'matrix-format': { type: 'string' }, 'cycles-out': { type: 'string' }, json: { type: 'boolean' }, quiet: { type: 'boolean' }, 'memory-limit': { type: 'string' } },
    'count',
  );
  if (values.help) {
    io.stdout(HELP.count + '\n');
    return 0;
  }
  if (positionals.length !== 1) throw new UsageError('count: give one measured file; loopwise help count');
  const inputs = new InputFiles();
  const guard = guardOf(values);
  const data = await dataFile(positionals[0], inputs, new FileAccess(inputs, null, true));
  const file = data.path;
  const dialect = dialectOf(values);
  const layout = chooseColumns(values, surveyFile(file, dialect, data.shown), timeOf(values), data.shown);
  const channels = layout.channels;
  if (channels.length !== 1) throw new UsageError('--column: count takes one column');
  const residue = (values.residue as string | undefined) ?? 'half';
  if (!['half', 'repeat', 'none'].includes(residue)) throw new UsageError(`--residue: half, repeat or none, got "${residue}"`);
  const rangeBins = num(values, 'range-bins') ?? 32;
  const meanBins = num(values, 'mean-bins') ?? 32;
  for (const [k, v] of [['range-bins', rangeBins], ['mean-bins', meanBins]] as const) {
    if (!Number.isInteger(v) || v < 1 || v > 4096) throw new UsageError(`--${k}: an integer from 1 to 4096, got ${v}`);
  }
  const time = layout.time;
  // the corrections of the signal as assess takes them, checked before anything is read; the
  // channel keeps its own unit here (a given offset is in it, and the records say it)
  const job: CorrectionJob & Pick<CliJob, 'file' | 'fileShown'> = {
    channels,
    events: null,
    file,
    fileShown: data.shown,
    ...(time ? { time } : {}),
    ...(layout.timeSecondsPerUnit !== undefined ? { timeSecondsPerUnit: layout.timeSecondsPerUnit } : {}),
    ...signalCorrectionsOf(values),
  };
  checkSignalCorrections(job);
  checkLowPassMemory(job, guard);
  // the count stays in the channel's own unit (µε stays µε): the samples are read as they are
  // in the file, so the gate, the matrix, the cycles and the spectrum are all in that unit
  const own = ownUnitOf(channels[0]);
  const opts = { channels: [own.channel], name: data.shown, ...(time ? { time } : {}), ...(dialect ? { dialect } : {}) };
  const outputs = new OutputSet(inputs, io.stdoutWrite ?? (async (t) => io.stdout(t)));
  const format = (values['matrix-format'] as string | undefined) ?? 'json';
  if (format !== 'json' && format !== 'csv') throw new UsageError(`--matrix-format: json or csv, got "${format}"`);
  const box: { matrix: RangeMeanMatrix | null; fromTo: FromToMatrix | null } = { matrix: null, fromTo: null };
  const matrixText = (m: CycleMatrix, axes: [string, string]) => (format === 'csv' ? matrixCsv(m, axes) : JSON.stringify(m.toJSON()) + '\n');
  if (values['matrix-out'] !== undefined) outputs.add('--matrix-out', values['matrix-out'] as string, (sink) => sink.write(matrixText(box.matrix as RangeMeanMatrix, ['range', 'mean'])));
  if (values['from-to-out'] !== undefined) outputs.add('--from-to-out', values['from-to-out'] as string, (sink) => sink.write(matrixText(box.fromTo as FromToMatrix, ['from', 'to'])));
  // every cycle goes to a spool on disk as it closes (memory stays flat), copied out at the end
  const spool = values['cycles-out'] !== undefined ? new SpoolFile('the cycles') : null;
  if (spool) outputs.add('--cycles-out', values['cycles-out'] as string, (sink) => spool.copyTo(sink));
  if (outputs.usesStdout && values.json) throw new UsageError('--json: the summary cannot go to standard output when an output file is "-"');
  // every read below is of the corrected samples (the file's own when nothing is asked); after a
  // cut they are numbered in the history joined across the cuts, as in assess
  const at = (c: { firstSample: number; length: number }) => () => `while reading ${data.shown} (sample ${c.firstSample + c.length})`;
  const corrected = await correctedStream(job, (o) => readDelimited(file, o), { options: opts, check: (where) => guard.check(where), at, alsoInFileNumbers: null });
  // first read: the range, for the bins and a gate fraction (memory does not grow with the file)
  let lo = Infinity;
  let hi = -Infinity;
  const source = await corrected.read({
    ...opts,
    onChunk: (c) => {
      const v = c.channels[0];
      for (let i = 0; i < v.length; i++) {
        if (v[i] < lo) lo = v[i];
        if (v[i] > hi) hi = v[i];
      }
      guard.check(() => `while reading ${data.shown}`);
    },
  });
  const fraction = num(values, 'gate-fraction');
  const gate = num(values, 'gate') ?? (fraction !== undefined ? fraction * (num(values, 'full-scale') ?? hi - lo) : 0);
  const span = hi > lo ? hi - lo : 1;
  const matrix = new RangeMeanMatrix({ range: { count: rangeBins, min: 0, max: span }, mean: { count: meanBins, min: lo, max: hi > lo ? hi : lo + 1 } });
  box.matrix = matrix;
  // the from-to matrix (the cycles' direction kept) over the same span, square, range bins a side
  const fromTo = values['from-to-out'] !== undefined ? new FromToMatrix({ from: { count: rangeBins, min: lo, max: hi > lo ? hi : lo + 1 }, to: { count: rangeBins, min: lo, max: hi > lo ? hi : lo + 1 } }) : null;
  box.fromTo = fromTo;
  if (spool) spool.append('range,mean,from,to,count,start_sample,turn_sample,close_sample\n');
  // the cycles pass through a small table (its range and mean), written to the spool in batches
  let batch = new CycleTable();
  const flushBatch = () => {
    const c = batch.columns();
    const lines: string[] = [];
    for (let i = 0; i < c.range.length; i++) lines.push(`${c.range[i]},${c.mean[i]},${c.from[i]},${c.to[i]},${c.count[i]},${c.startIndex[i]},${c.turnIndex[i]},${c.closeIndex[i]}\n`);
    spool?.append(lines.join(''));
    batch = new CycleTable();
  };
  const both =
    spool || fromTo
      ? {
          addCycle: (from: number, to: number, count: number, startIndex: number, turnIndex: number, closeIndex: number) => {
            matrix.addCycle(from, to, count, startIndex, turnIndex, closeIndex);
            fromTo?.addCycle(from, to, count, startIndex, turnIndex, closeIndex);
            if (spool) {
              batch.addCycle(from, to, count, startIndex, turnIndex, closeIndex);
              if (batch.length >= 8192) flushBatch();
            }
          },
        }
      : matrix;
  const counter = new RainflowCounter({ residue: residue as 'half', gate, sink: both });
  await corrected.read({ ...opts, checks: false, onChunk: (c) => { counter.push(c.channels[0]); guard.check(() => `while counting ${data.shown}`); } });
  const result = counter.finish();
  if (spool) flushBatch();
  // exceedance spectrum from the matrix rows: cycles with a range in this bin or above
  const spectrum: { rangeFrom: number; exceedances: number }[] = [];
  let acc = 0;
  const rowEdges = matrix.rowEdges; // a copy: read once
  for (let i = matrix.rows - 1; i >= 0; i--) {
    for (let j = 0; j < matrix.columns; j++) acc += matrix.at(i, j);
    spectrum.unshift({ rangeFrom: rowEdges[i], exceedances: acc });
  }
  const summary = {
    format: 'loopwise-cli-count',
    version: 1,
    tool: TOOL,
    file: source.file,
    channel: source.channels[0].name,
    unit: own.label,
    conversion: `none: counted in the file's unit (${own.label})`,
    samples: result.sampleCount,
    turningPoints: result.turningPointCount,
    gate,
    removedReversals: result.removedReversals,
    residue,
    cycles: matrix.totalCount(),
    largestRange: hi - lo,
    spectrum,
    // the corrections applied before counting, as assess reports them (empty: as measured)
    signalCorrections: corrected.records(0).map(correctionJson),
    // after a cut the cycles' sample numbers count the samples kept (the history joined across the cuts)
    sampleNumbers: corrected.cut ? 'kept' : 'file',
    warnings: source.warnings.map((w) => w.message),
  };
  try {
    await outputs.commit();
  } finally {
    spool?.remove();
  }
  if (outputs.usesStdout) return 0;
  if (values.json) io.stdout(stableJson(summary) + '\n');
  else {
    const u = summary.unit;
    const lines = [
      `${summary.channel} in ${summary.file}: ${summary.samples} samples, ${summary.turningPoints} turning points`,
      ...(summary.signalCorrections.length > 0 ? summary.signalCorrections.map((c) => `corrected ${c.summary}`) : ['corrected none: the samples as measured']),
      ...(corrected.cut ? ["sample numbers (the cycles CSV's start_sample, turn_sample, close_sample) count the samples kept: the history is joined across the cuts"] : []),
      `gate ${formatNumber(gate)} ${u} removed ${summary.removedReversals} reversals; residue counted as ${residue}`,
      `cycles ${formatCount(summary.cycles)}; largest range ${formatNumber(summary.largestRange)} ${u}`,
      'range exceedance (cycles with a range at or above):',
      ...spectrum.filter((_, k) => k % Math.max(1, Math.floor(spectrum.length / 8)) === 0).map((s) => `  ${formatNumber(s.rangeFrom).padStart(10)} ${u}  ${formatCount(s.exceedances)}`),
      ...summary.warnings.map((w) => `warning (signal): ${w}`),
    ];
    io.stdout(lines.join('\n') + '\n');
  }
  return 0;
}

/**
 * A cycle matrix as CSV, one row per bin (every bin, row by row): the bin's edges on both axes and
 * its cycles, e.g. `range_low,range_high,mean_low,mean_high,cycles`. Values in the count's unit.
 */
export function matrixCsv(m: CycleMatrix, axes: [string, string]): string {
  const r = m.rowEdges;
  const c = m.columnEdges;
  const lines = [`${axes[0]}_low,${axes[0]}_high,${axes[1]}_low,${axes[1]}_high,cycles`];
  for (let i = 0; i < m.rows; i++) for (let j = 0; j < m.columns; j++) lines.push(`${r[i]},${r[i + 1]},${c[j]},${c[j + 1]},${m.at(i, j)}`);
  return lines.join('\n') + '\n';
}

/**
 * The channel read as it is in the file (no conversion to engine units), and the label of that
 * unit: µε, strain, MPa, ksi, or "load unit" for a load.
 */
function ownUnitOf(c: CliChannel): { channel: CliChannel; label: string } {
  const base = { column: c.column, ...(c.name !== undefined ? { name: c.name } : {}) };
  if (c.quantity === 'strain') return { channel: { ...base, quantity: 'strain', unit: 'strain' }, label: c.unit === 'microstrain' ? 'µε' : 'strain' };
  if (c.quantity === 'stress') return { channel: { ...base, quantity: 'stress', unit: 'MPa' }, label: c.unit };
  return { channel: { ...base, quantity: 'load', mpaPerUnit: 1 }, label: 'load unit' };
}

async function materialCommand(args: string[], io: Io): Promise<number> {
  const { values } = parse(
    args,
    {
      list: { type: 'boolean' },
      json: { type: 'boolean' },
      su: { type: 'string' },
      method: { type: 'string' },
      metal: { type: 'string' },
      'reduction-of-area': { type: 'string' },
      hardness: { type: 'string' },
      e: { type: 'string' },
      out: { type: 'string' },
    },
    'material',
  );
  if (values.help) {
    io.stdout(HELP.material + '\n');
    return 0;
  }
  if (values.list) {
    if (values.json) io.stdout(stableJson({ note: 'handbook reference values, not certified design data', materials: handbookSteels.map((m) => ({ ...m, warnings: m.warnings })) }) + '\n');
    else io.stdout(materialTable(handbookSteels));
    return 0;
  }
  const su = num(values, 'su');
  const hb = num(values, 'hardness');
  if ((su === undefined) === (hb === undefined)) throw new UsageError('--su or --hardness: give exactly one (or --list)');
  const E = num(values, 'e');
  const method = oneOf(values, 'method', ['uniform-material-law', 'modified-universal-slopes'] as const) ?? 'uniform-material-law';
  const metal = oneOf(values, 'metal', ['steel', 'aluminium-titanium'] as const) ?? 'steel';
  const withE = E ? { EMPa: E } : {};
  let spec: MaterialSpec;
  if (hb !== undefined) spec = { estimate: { method: 'hardness', hardnessHB: hb, ...withE } };
  else if (method === 'modified-universal-slopes') {
    const ra = num(values, 'reduction-of-area');
    if (ra === undefined) throw new UsageError('--reduction-of-area: modified universal slopes need the reduction of area (0 … 1)');
    spec = { estimate: { method, SuMPa: su as number, reductionOfArea: ra, ...withE } };
  } else spec = { estimate: { method, SuMPa: su as number, metal, ...withE } };
  const m = resolveMaterial(spec, new FileAccess(new InputFiles(), null, true), '--su');
  const text = stableJson({ ...m, warnings: m.warnings }) + '\n';
  const outputs = new OutputSet(new InputFiles(), io.stdoutWrite ?? (async (t) => io.stdout(t)));
  if (values.out !== undefined) outputs.add('--out', values.out as string, (sink) => sink.write(text));
  await outputs.commit();
  if (!outputs.usesStdout) io.stdout(text);
  return 0;
}

/**
 * The handbook table for people: one row per material with its constants (MPa), a numbered
 * source below, then the caveat. `--json` gives everything, notes included.
 */
export function materialTable(materials: readonly Material[]): string {
  const sources: string[] = [];
  const head = ['name', 'E', "σf'", 'b', "εf'", 'c', "K'", "n'", 'Su', 'source'];
  const rows = materials.map((m) => {
    let k = sources.indexOf(m.source ?? '');
    if (k < 0) k = sources.push(m.source ?? '(none given)') - 1;
    const v = (x: number | undefined) => (x === undefined ? '—' : String(x));
    return [m.name ?? '(unnamed)', v(m.E), v(m.sigmaF), v(m.b), v(m.epsilonF), v(m.c), v(m.K), v(m.n), v(m.Su), `[${k + 1}]`];
  });
  const width = head.map((h, j) => Math.max(h.length, ...rows.map((r) => r[j].length)));
  const line = (r: string[]) => r.map((x, j) => (j === 0 || j === r.length - 1 ? x.padEnd(width[j]) : x.padStart(width[j]))).join('  ').trimEnd();
  return [
    'Handbook strain-life constants (stresses in MPa): reference values for tests and examples, not certified design data.',
    '',
    line(head),
    ...rows.map(line),
    '',
    ...sources.map((s, k) => `[${k + 1}] ${s}`),
    '',
    'Notes on each entry (how it was transcribed and checked): loopwise material --list --json. Use one with --material "<name>" (a unique part of the name is enough).',
  ].join('\n') + '\n';
}

/** Folder of the bundled demo data (next to the built files, or in the source tree). */
function demoFolder(): string {
  const here = dirname(fileURLToPath(import.meta.url));
  for (const candidate of [join(here, '..', 'demo'), join(here, '..', '..', 'demo')]) if (existsSync(join(candidate, 'demo-job.json'))) return candidate;
  throw new UsageError('demo: the bundled demo data is missing from this installation');
}

async function demoCommand(args: string[], io: Io): Promise<number> {
  const { values } = parse(args, { 'html-out': { type: 'string' }, json: { type: 'boolean' } }, 'demo');
  if (values.help) {
    io.stdout(HELP.demo + '\n');
    return 0;
  }
  const inputs = new InputFiles();
  const job = readJobFile(join(demoFolder(), 'demo-job.json'), inputs);
  const title = 'Demo (INVENTED data): utility-trailer axle, shoulder fillet, rough farm track';
  const box: { results: ChannelResult[] } = { results: [] };
  const outputs = planOutputs(values, inputs, io, 'demo', title, box);
  const results = await runAssessment(job, undefined, { keepLoops: false });
  box.results = results;
  await outputs.commit();
  if (!outputs.usesStdout) io.stdout(values.json ? jsonReport('demo', TOOL, results) : summaryText(results, `${title}\nThis demo uses invented data, not a measurement.`));
  return 0;
}
