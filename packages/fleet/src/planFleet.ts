import { readdirSync, readFileSync, statSync } from 'node:fs';
import { basename, extname, join } from 'node:path';
import { FileAccess, InputFiles, readJobFile, splitFields, type CliJob } from '@loopwise/cli';
import { binEdges, type BinSpec } from '@loopwise/rainflow';
import { channelName, failureOf } from './assessFile';
import type { FleetBins } from './FleetBins';
import { FleetError } from './FleetError';
import type { FileResult, FleetTask } from './FleetTask';
import { fileKey } from './fileKey';
import { isInputError } from './isInputError';

/** Settings of the whole fleet (from a JSON manifest, or from the command's options). */
export interface FleetSettings {
  /** The service unit every usage is given in (`km`, `h`, …). */
  unit: string;
  /** Service to extrapolate the combined spectrum to, in the unit; null for none. */
  targetService: number | null;
  bins: FleetBins;
}

/** Settings as a manifest gives them (any may be missing). */
type ManifestSettings = { unit?: string; targetService?: number; bins?: Partial<FleetBins> };

/** What the command line may give (each fills what the manifest leaves out; giving both is an error). */
export interface FleetOptions {
  unit?: string;
  targetService?: number;
  bins?: Partial<FleetBins>;
  /** The job of rows that name none (and of a folder). */
  job?: string;
  /** Lets the manifest and its jobs name files outside their folders. */
  anywhere?: boolean;
}

/** The JSON manifest (`loopwise-fleet`, version 1); relative paths are read from its folder. */
export interface FleetManifestJSON {
  format: 'loopwise-fleet';
  version: 1;
  unit?: string;
  targetService?: number;
  bins?: Partial<FleetBins>;
  job?: string;
  files: { file: string; asset: string; channels?: string[] | string; usage: number; job?: string }[];
}

/** A planned fleet: the tasks to run, the rows that failed already, and every file read. */
export interface FleetPlan {
  source: string;
  settings: FleetSettings;
  tasks: FleetTask[];
  /** Rows that cannot be assessed (missing file, unknown channel, bad usage, …), by row. */
  failures: FileResult[];
  inputs: InputFiles;
}

interface Row {
  row: number;
  where: string;
  file: string;
  asset: string;
  channels: string[] | null;
  usage: unknown;
  job: string | null;
}

const DATA_EXTENSIONS = ['.csv', '.txt', '.dat', '.tsv'];
const MANIFEST_FIELDS = ['format', 'version', 'unit', 'targetService', 'bins', 'job', 'files'];
const ROW_FIELDS = ['file', 'asset', 'channels', 'usage', 'job'];

/**
 * Reads a fleet: a CSV manifest (header `file,asset,channels,usage,job`; channels separated by
 * `;`, `job` optional when `--job` is given), a JSON manifest (`loopwise-fleet`), or a folder
 * holding one job file and the measured files (each file an asset of its own, or each
 * sub-folder an asset; the usage is the job's `service.perRepeat`). Every row is checked here
 * (the file exists and lies inside the manifest's folder, the job reads, its channels are the
 * job's, the usage is a finite number > 0); a bad row becomes a failure naming the row, and the
 * other rows go on. Errors of the manifest itself are thrown ({@link FleetError}, exit 2).
 */
export function planFleet(path: string, options: FleetOptions = {}): FleetPlan {
  const inputs = new InputFiles();
  const anywhere = options.anywhere ?? false;
  let st;
  try {
    st = statSync(path);
  } catch {
    throw new FleetError('missing-manifest', 'manifest', path, `${path}: no such manifest file or folder`);
  }
  let rows: Row[];
  let fromManifest: ManifestSettings = {};
  let defaultJob: string | null = options.job ?? null;
  let fromManifestJob = false;
  let access: FileAccess;
  if (st.isDirectory()) {
    ({ rows, job: defaultJob } = folderRows(path, options.job));
    access = FileAccess.forJob(inputs, join(path, 'manifest'), anywhere);
    const job = readJobFile(defaultJob, new InputFiles(), anywhere);
    if (job.service?.perRepeat === undefined) throw new FleetError('missing-usage', 'service.perRepeat', undefined, `${defaultJob}: service.perRepeat: a folder's job gives the usage of every file (the service one repeat stands for)`);
    fromManifest.unit = job.service.unit;
    for (const r of rows) r.usage = job.service.perRepeat;
  } else {
    access = FileAccess.forJob(inputs, path, anywhere);
    const text = new FileAccess(inputs, null, true).readText(path, 'manifest').text;
    if (extname(path).toLowerCase() === '.json') {
      const m = parseManifestJson(text, path);
      fromManifest = { ...(m.unit !== undefined ? { unit: m.unit } : {}), ...(m.targetService !== undefined ? { targetService: m.targetService } : {}), ...(m.bins ? { bins: m.bins } : {}) };
      if (m.job !== undefined) {
        if (options.job !== undefined) throw new FleetError('given-twice', 'job', m.job, `${path}: job: the manifest names its job; --job cannot be given too`);
        defaultJob = m.job;
        fromManifestJob = true;
      }
      rows = m.files.map((f, k) => ({ row: k + 1, where: `${path} row ${k + 1}`, file: f.file, asset: f.asset, channels: f.channels === undefined ? null : typeof f.channels === 'string' ? splitChannels(f.channels) : f.channels, usage: f.usage, job: f.job ?? null }));
    } else rows = csvRows(text, path);
  }
  const settings = settingsOf(fromManifest, options, path);
  for (const [k, spec] of Object.entries(settings.bins)) {
    try {
      binEdges(spec, `bins.${k}`);
    } catch (error) {
      throw new FleetError('invalid-bins', `bins.${k}`, spec, `${path}: bins.${k}: ${(error as Error).message}`);
    }
  }
  const tasks: FleetTask[] = [];
  const failures: FileResult[] = [];
  const jobs = new Map<string, { job: CliJob; path: string; shown: string; files: string[] } | Error>();
  const seen = new Map<string, number>();
  // a row's own job resolves from the manifest's folder; the default job as typed (or the folder's)
  const loadJob = (text: string, own: boolean, row: number) => {
    const id = own ? `row:${text}` : `default:${text}`;
    if (!jobs.has(id)) {
      try {
        const at = own || fromManifestJob ? access.resolve(text, own ? `row ${row}: job` : 'job') : new FileAccess(inputs, null, true).resolve(text, '--job');
        const jobInputs = new InputFiles();
        const job = readJobFile(at.path, jobInputs, anywhere);
        for (const f of jobInputs.list()) inputs.add(f.real, f.shown);
        jobs.set(id, { job, path: at.path, shown: at.shown, files: jobInputs.list().map((f) => f.real) });
      } catch (error) {
        jobs.set(id, error as Error);
      }
    }
    return jobs.get(id)!;
  };
  for (const r of rows) {
    const stub: FleetTask = { key: `row-${r.row}`, row: r.row, where: r.where, file: r.file, shown: r.file, asset: r.asset, channels: r.channels ?? [], usage: Number(r.usage), job: r.job ?? '', jobShown: r.job ?? '', anywhere, bins: settings.bins, unit: settings.unit };
    try {
      if (typeof r.file !== 'string' || r.file === '') throw new FleetError('missing-field', 'file', r.file, `${r.where}: file: missing`, r.row);
      if (typeof r.asset !== 'string' || r.asset === '') throw new FleetError('missing-field', 'asset', r.asset, `${r.where}: asset: missing`, r.row);
      const usage = typeof r.usage === 'number' ? r.usage : typeof r.usage === 'string' && r.usage.trim() !== '' ? Number(r.usage) : NaN;
      if (!(usage > 0 && usage < Infinity)) throw new FleetError('invalid-usage', 'usage', r.usage, `${r.where}: usage: the service the file stands for must be a finite number > 0 (in ${settings.unit}), got ${JSON.stringify(r.usage)}`, r.row);
      const data = access.resolve(r.file, `row ${r.row}: file`);
      const jobText = r.job ?? defaultJob;
      if (jobText === null) throw new FleetError('missing-field', 'job', null, `${r.where}: job: the row names no job and no --job was given`, r.row);
      const j = loadJob(jobText, r.job !== null, r.row);
      if (j instanceof Error) throw j;
      if (j.job.events !== null) throw new FleetError('fleet-job', 'events', 'events', `${r.where}: ${j.shown}: a fleet job assesses one file per row; a duty cycle (events) cannot be applied`, r.row);
      const known = j.job.channels.map(channelName);
      const channels = r.channels ?? known;
      if (channels.length === 0) throw new FleetError('missing-field', 'channels', r.channels, `${r.where}: channels: none given`, r.row);
      for (const c of channels) {
        if (!known.includes(c)) throw new FleetError('unknown-channel', 'channels', c, `${r.where}: channels: '${c}' is not a channel of ${j.shown} (its channels: ${known.join(', ')})`, r.row);
      }
      const task: FleetTask = { ...stub, file: data.path, shown: data.shown, channels, usage, job: j.path, jobShown: j.shown };
      task.key = fileKey(task, j.files);
      const before = seen.get(task.key);
      if (before !== undefined) throw new FleetError('duplicate-row', 'file', r.file, `${r.where}: the same file, asset, channels, usage and job as row ${before}; a file counts once`, r.row);
      seen.set(task.key, r.row);
      tasks.push(task);
    } catch (error) {
      if (!isInputError(error)) throw error;
      failures.push(failureOf(stub, error));
    }
  }
  if (rows.length === 0) throw new FleetError('empty-manifest', 'files', 0, `${path}: lists no files`);
  return { source: path, settings, tasks, failures, inputs };
}

function splitChannels(text: string): string[] {
  return text.split(';').map((s) => s.trim()).filter((s) => s !== '');
}

function csvRows(text: string, path: string): Row[] {
  const lines = text.split(/\r?\n/);
  const header = splitFields(lines[0] ?? '', 'comma').map((s) => s.trim());
  for (const h of header) if (!ROW_FIELDS.includes(h)) throw new FleetError('unknown-column', 'header', h, `${path} line 1: unknown column '${h}'; the columns are ${ROW_FIELDS.join(', ')}`);
  for (const need of ['file', 'asset', 'usage']) if (!header.includes(need)) throw new FleetError('missing-column', 'header', need, `${path} line 1: the column '${need}' is missing (header ${ROW_FIELDS.join(',')})`);
  const rows: Row[] = [];
  for (let i = 1; i < lines.length; i++) {
    if (lines[i].trim() === '') continue;
    const f = splitFields(lines[i], 'comma');
    const at = (name: string) => {
      const k = header.indexOf(name);
      return k < 0 ? undefined : (f[k] ?? '').trim();
    };
    const row = rows.length + 1;
    const channels = at('channels');
    const job = at('job');
    rows.push({ row, where: `${path} row ${row} (line ${i + 1})`, file: at('file') ?? '', asset: at('asset') ?? '', channels: channels === undefined || channels === '' ? null : splitChannels(channels), usage: at('usage'), job: job === undefined || job === '' ? null : job });
  }
  return rows;
}

function parseManifestJson(text: string, path: string): FleetManifestJSON {
  let m: FleetManifestJSON;
  try {
    m = JSON.parse(text);
  } catch (error) {
    throw new FleetError('invalid-json', 'manifest', null, `${path}: invalid JSON (${(error as Error).message})`);
  }
  if (m === null || typeof m !== 'object' || m.format !== 'loopwise-fleet') throw new FleetError('invalid-manifest', 'format', (m as { format?: unknown })?.format, `${path}: format: expected "loopwise-fleet"`);
  if (m.version !== 1) throw new FleetError('invalid-manifest', 'version', m.version, `${path}: version: expected 1, got ${JSON.stringify(m.version)}`);
  for (const k of Object.keys(m)) if (!MANIFEST_FIELDS.includes(k)) throw new FleetError('unknown-field', k, k, `${path}: unknown field '${k}'; the fields are ${MANIFEST_FIELDS.join(', ')}`);
  if (!Array.isArray(m.files)) throw new FleetError('invalid-manifest', 'files', m.files, `${path}: files: expected a list of rows`);
  m.files.forEach((f, k) => {
    if (f === null || typeof f !== 'object') throw new FleetError('invalid-manifest', `files[${k}]`, f, `${path} row ${k + 1}: expected an object with ${ROW_FIELDS.join(', ')}`, k + 1);
    for (const key of Object.keys(f)) if (!ROW_FIELDS.includes(key)) throw new FleetError('unknown-field', `files[${k}].${key}`, key, `${path} row ${k + 1}: unknown field '${key}'; a row has ${ROW_FIELDS.join(', ')}`, k + 1);
  });
  return m;
}

function folderRows(folder: string, job: string | undefined): { rows: Row[]; job: string } {
  const entries = readdirSync(folder, { withFileTypes: true }).sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
  let jobPath = job ?? null;
  if (jobPath === null) {
    const jobs = entries.filter((e) => e.isFile() && e.name.endsWith('.json') && isJobText(join(folder, e.name)));
    if (jobs.length !== 1) throw new FleetError('folder-job', 'job', jobs.length, `${folder}: a fleet folder holds exactly one job file (loopwise-job), found ${jobs.length}${jobs.length ? `: ${jobs.map((e) => e.name).join(', ')}` : ''}; or give --job`);
    jobPath = join(folder, jobs[0].name);
  }
  const rows: Row[] = [];
  const add = (file: string, asset: string) => {
    const row = rows.length + 1;
    rows.push({ row, where: `${folder} file ${file}`, file, asset, channels: null, usage: undefined, job: null });
  };
  for (const e of entries) {
    if (e.isFile() && DATA_EXTENSIONS.includes(extname(e.name).toLowerCase())) add(e.name, basename(e.name, extname(e.name)));
    else if (e.isDirectory()) {
      const inner = readdirSync(join(folder, e.name), { withFileTypes: true }).filter((x) => x.isFile() && DATA_EXTENSIONS.includes(extname(x.name).toLowerCase())).map((x) => x.name).sort();
      for (const f of inner) add(join(e.name, f), e.name);
    }
  }
  return { rows, job: jobPath };
}

function isJobText(path: string): boolean {
  try {
    return (JSON.parse(readFileSync(path, 'utf8')) as { format?: unknown }).format === 'loopwise-job';
  } catch {
    return false;
  }
}

function settingsOf(m: ManifestSettings, o: FleetOptions, path: string): FleetSettings {
  const pick = <T>(a: T | undefined, b: T | undefined, field: string, option: string): T | undefined => {
    if (a !== undefined && b !== undefined) throw new FleetError('given-twice', field, b, `${path}: ${field}: the manifest sets it; ${option} cannot be given too`);
    return a ?? b;
  };
  const unit = pick(m.unit, o.unit, 'unit', '--unit');
  if (unit === undefined || typeof unit !== 'string' || unit.trim() === '') throw new FleetError('missing-unit', 'unit', unit, `${path}: unit: the service unit of the usages is needed (--unit km, or "unit" in a JSON manifest)`);
  const target = pick(m.targetService, o.targetService, 'targetService', '--target-service');
  if (target !== undefined && !(typeof target === 'number' && target > 0 && target < Infinity)) throw new FleetError('invalid-target', 'targetService', target, `${path}: targetService: a finite number > 0 of ${unit}, got ${JSON.stringify(target)}`);
  const bins: Partial<Record<keyof FleetBins, BinSpec>> = {};
  for (const [k, option] of [['range', '--range-bins'], ['mean', '--mean-bins'], ['fromTo', '--from-to-bins']] as const) {
    const b = pick(m.bins?.[k], o.bins?.[k], `bins.${k}`, option);
    if (b === undefined) throw new FleetError('missing-bins', `bins.${k}`, undefined, `${path}: bins.${k}: the fleet's matrices need fixed bins to add (${option} count:min:max, or "bins" in a JSON manifest)`);
    bins[k] = b;
  }
  return { unit, targetService: target ?? null, bins: bins as FleetBins };
}
