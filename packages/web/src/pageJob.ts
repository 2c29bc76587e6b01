import type { CliChannel, JobFile, MaterialSpec } from '@loopwise/cli/browser';

/** What the page's form holds, as text (field ids of index.html). */
export type FormText = Record<string, string>;

/** An input the page cannot use, naming the field by its label. */
export class FormError extends Error {
  constructor(
    readonly field: string,
    message: string,
  ) {
    super(message);
    this.name = 'FormError';
  }
}

/** Labels of the fields, for messages. */
const LABELS: Record<string, string> = {
  'sample-rate': 'Sample rate',
  'm-E': 'E',
  'm-sigmaF': 'σf′',
  'm-b': 'b',
  'm-epsilonF': 'εf′',
  'm-c': 'c',
  'm-K': 'K′',
  'm-n': 'n′',
  su: 'Tensile strength Su',
  hardness: 'Brinell hardness',
  kt: 'Kt',
  kf: 'Kf',
  'walker-gamma': 'Walker γ',
  gate: 'Gate',
  'scatter-factor': 'Scatter factor',
  'service-amount': 'Service per repeat',
  'gate-fraction': 'Gate as a share of the largest range',
  'critical-damage': 'Critical damage sum',
  'ultimate-strength': 'Ultimate strength',
  'skip-lines': 'Preamble lines',
  'sn-curve': 'S-N curve',
  'offset-amount': 'Offset to subtract',
  'low-pass': 'Low-pass cut-off',
  'low-pass-order': 'Low-pass order',
};

/** The label of an event field (`event-repeats-0` → 'Repeats of event 1'). */
function eventLabel(id: string): string | undefined {
  const m = /^event-(repeats|duration)-(\d+)$/.exec(id);
  if (m === null) return undefined;
  return `${m[1] === 'repeats' ? 'Repeats' : 'Service per repeat'} of event ${Number(m[2]) + 1}`;
}

/** The file layout the form fixes (the job's `dialect`), or undefined when everything is detected. */
export function dialectOf(form: FormText): JobFile['dialect'] {
  const out: NonNullable<JobFile['dialect']> = {};
  const skip = number(form, 'skip-lines', true);
  if (skip !== undefined) {
    if (!Number.isInteger(skip) || skip < 0) throw new FormError('skip-lines', `Preamble lines: a whole number, got ${skip}`);
    out.skipLines = skip;
  }
  if (form.delimiter) out.delimiter = form.delimiter as NonNullable<JobFile['dialect']>['delimiter'];
  if (form['decimal-mark']) out.decimalComma = form['decimal-mark'] === 'comma';
  if (form['header-row']) out.header = form['header-row'] === 'yes';
  if (form['units-row']) out.unitsRow = form['units-row'] === 'yes';
  return Object.keys(out).length > 0 ? out : undefined;
}

function number(form: FormText, id: string, optional: true): number | undefined;
function number(form: FormText, id: string, optional?: false): number;
function number(form: FormText, id: string, optional = false): number | undefined {
  const text = (form[id] ?? '').trim();
  const label = LABELS[id] ?? eventLabel(id) ?? (/^mpa-(\d+)$/.test(id) ? `Nominal stress per unit of load of column ${id.slice(4)}` : id);
  if (text === '') {
    if (optional) return undefined;
    throw new FormError(id, `${label}: a number is needed`);
  }
  const x = Number(text);
  if (!Number.isFinite(x)) throw new FormError(id, `${label}: expected a number, got "${text}"`);
  return x;
}

/**
 * The job file of the page's form for the measured files `fileNames` (one: `file`; several: the
 * events of a duty cycle, in order): the same JSON the command
 * reads with `loopwise assess --job` (format `loopwise-job`, version 1). The page runs its jobs
 * through the command's own reader of job files, so what it shows is what the command computes
 * from this file.
 */
export function jobFileOf(form: FormText, fileNames: readonly string[]): JobFile {
  // the ticked columns (`use-<column>`), each with its quantity and unit
  const channels: CliChannel[] = [];
  for (const key of Object.keys(form)) {
    const m = /^use-(\d+)$/.exec(key);
    if (m === null || form[key] !== 'yes') continue;
    const column = Number(m[1]);
    const quantity = form[`quantity-${column}`];
    if (quantity === 'load') channels.push({ column, quantity: 'load', mpaPerUnit: number(form, `mpa-${column}`) });
    else if (quantity === 'strain') channels.push({ column, quantity: 'strain', unit: form[`unit-${column}`] === 'strain' ? 'strain' : 'microstrain' });
    else channels.push({ column, quantity: 'stress', unit: form[`unit-${column}`] === 'ksi' ? 'ksi' : 'MPa' });
  }
  channels.sort((a, b) => (a.column as number) - (b.column as number));
  const firstColumn = Object.keys(form).find((k) => k.startsWith('use-')) ?? 'channels';
  if (channels.length === 0) throw new FormError(firstColumn, 'Channels: tick at least one column to assess');
  const allStrain = channels.every((c) => c.quantity === 'strain');
  const anyStrain = channels.some((c) => c.quantity === 'strain');
  const stressRoute = form.route === 'stress';
  const material = materialOf(form);
  if (material === undefined && !stressRoute) throw new FormError('material-source', 'Material: the strain-life route needs one (none is for the stress-life route)');
  if (stressRoute && anyStrain) {
    const c = channels.find((x) => x.quantity === 'strain') as CliChannel;
    throw new FormError(`quantity-${c.column}`, `Quantity of column ${c.column}: the stress-life route assesses stress or load channels; a strain gauge at the notch root takes the strain-life route`);
  }
  const job: JobFile = { format: 'loopwise-job', version: 1, channels };
  if (fileNames.length === 1) job.file = fileNames[0];
  else job.events = eventsOf(form, fileNames);
  const timed = job.events?.some((e) => e.duration !== undefined) ?? false;
  if (material !== undefined) job.material = material;
  const dialect = dialectOf(form);
  if (dialect) job.dialect = dialect;
  if (form.time === 'rate') job.time = { sampleRate: number(form, 'sample-rate') };
  else if (form.time !== 'none' && form.time !== undefined && form.time !== '') job.time = { column: Number(form.time) };
  if (stressRoute) {
    const curve = (form['sn-curve'] ?? '').trim();
    if (curve === '') throw new FormError('sn-curve', 'S-N curve: name one (iiw:71, en1993:80, basquin:…)');
    const s: NonNullable<JobFile['stressLife']> = { curve };
    const kf = number(form, 'kf', true);
    if (kf !== undefined) s.kf = kf;
    const su = number(form, 'ultimate-strength', true);
    if (su !== undefined) s.ultimateStrength = su;
    if (form['iiw-category']) s.iiwCategory = form['iiw-category'] as 'I' | 'II' | 'III';
    job.stressLife = s;
  } else if (!allStrain) {
    const kt = number(form, 'kt', true);
    const kf = number(form, 'kf', true);
    if (kt !== undefined && kf !== undefined) throw new FormError('kf', 'Kt and Kf: give one of them');
    const notch: NonNullable<JobFile['notch']> = { rule: form.rule as 'neuber' | 'glinka' | 'linear' };
    if (kt !== undefined) notch.Kt = kt;
    if (kf !== undefined) notch.Kf = kf;
    job.notch = notch;
  }
  job.meanStress = form['mean-stress'] as JobFile['meanStress'];
  const gamma = number(form, 'walker-gamma', true);
  if (gamma !== undefined) job.walkerGamma = gamma;
  const gate = number(form, 'gate', true);
  const fraction = number(form, 'gate-fraction', true);
  if (gate !== undefined && fraction !== undefined) throw new FormError('gate-fraction', 'Gate: give the smallest range or its share of the largest range, not both');
  if (gate !== undefined) job.gate = gate;
  if (fraction !== undefined) job.gateFraction = fraction;
  const critical = number(form, 'critical-damage', true);
  if (critical !== undefined) job.criticalDamage = critical;
  job.repeating = form.repeating !== 'no';
  if (form.spikes === 'interpolate') job.interpolateSpikes = true;
  if (form['flat-runs'] === 'cut') job.excludeFlatRuns = true;
  const samplesCut = rangesOf(form, 'exclude-samples', 'Cut out samples');
  if (samplesCut.length > 0) {
    for (const [a, b] of samplesCut) {
      if (!(Number.isInteger(a) && a >= 0 && Number.isInteger(b) && b >= 0)) throw new FormError('exclude-samples', `Cut out samples: ${a}..${b}: sample numbers are whole numbers from 0`);
    }
    job.excludeSamples = samplesCut.map(([first, last]) => ({ first, last }));
  }
  const timesCut = rangesOf(form, 'exclude-time', 'Cut out times');
  if (timesCut.length > 0) job.excludeTimes = timesCut.map(([startTime, endTime]) => ({ startTime, endTime }));
  if (form['subtract-offset'] === 'mean') job.subtractOffset = 'mean';
  else if (form['subtract-offset'] === 'given') job.subtractOffset = number(form, 'offset-amount');
  const cutoff = number(form, 'low-pass', true);
  if (cutoff !== undefined) {
    const order = number(form, 'low-pass-order', true);
    job.lowPass = order === undefined ? { cutoffHz: cutoff } : { cutoffHz: cutoff, order };
  }
  job.scatterFactor = number(form, 'scatter-factor');
  const amount = number(form, 'service-amount', true);
  const unit = (form['service-unit'] ?? '').trim();
  if (amount !== undefined && timed) throw new FormError('service-amount', 'Service per repeat: the events give their service per repeat; leave this empty');
  if (amount !== undefined || timed) {
    if (unit === '') throw new FormError('service-unit', 'Service unit: give the unit of the service per repeat (h, km, flights…)');
    job.service = amount !== undefined ? { unit, perRepeat: amount } : { unit };
  }
  return job;
}

/** Ranges typed as `from..to`, commas between them (empty: none), the field named in the error. */
function rangesOf(form: FormText, id: string, label: string): [number, number][] {
  const text = (form[id] ?? '').trim();
  if (text === '') return [];
  return text.split(',').map((part) => {
    const cut = part.indexOf('..');
    const from = cut < 0 ? '' : part.slice(0, cut).trim();
    const to = cut < 0 ? '' : part.slice(cut + 2).trim();
    const a = from === '' ? NaN : Number(from);
    const b = to === '' ? NaN : Number(to);
    if (!Number.isFinite(a) || !Number.isFinite(b)) throw new FormError(id, `${label}: expected from..to (e.g. 1000..1999), got "${part.trim()}"`);
    return [a, b];
  });
}

function materialOf(form: FormText): MaterialSpec | undefined {
  switch (form['material-source']) {
    case 'none':
      return undefined;
    case 'handbook':
      return form.handbook;
    case 'su':
      return { estimate: { method: 'uniform-material-law', SuMPa: number(form, 'su') } };
    case 'hardness':
      return { estimate: { method: 'hardness', hardnessHB: number(form, 'hardness') } };
    default:
      return {
        E: number(form, 'm-E'),
        sigmaF: number(form, 'm-sigmaF'),
        b: number(form, 'm-b'),
        epsilonF: number(form, 'm-epsilonF'),
        c: number(form, 'm-c'),
        K: number(form, 'm-K'),
        n: number(form, 'm-n'),
      };
  }
}

/** The events of a duty cycle: one per file, in order, named and repeated as the form says (`event-name-<k>`, `event-repeats-<k>`, `event-duration-<k>`). */
function eventsOf(form: FormText, fileNames: readonly string[]): NonNullable<JobFile['events']> {
  const seenFiles = new Set<string>();
  const seenNames = new Set<string>();
  return fileNames.map((file, k) => {
    if (seenFiles.has(file)) throw new FormError('file', `File: two files are named "${file}"; a job names each event's file by its name, so rename one`);
    seenFiles.add(file);
    const name = (form[`event-name-${k}`] ?? '').trim();
    if (name === '') throw new FormError(`event-name-${k}`, `Event ${k + 1}: give it a name`);
    if (seenNames.has(name)) throw new FormError(`event-name-${k}`, `Event ${k + 1}: the name "${name}" is taken by an earlier event`);
    seenNames.add(name);
    const repeats = number(form, `event-repeats-${k}`);
    if (!(repeats >= 1)) throw new FormError(`event-repeats-${k}`, `Repeats of event ${name}: a number >= 1 (a fraction allowed), got ${repeats}`);
    const duration = number(form, `event-duration-${k}`, true);
    return duration === undefined ? { name, file, repeats } : { name, file, repeats, duration };
  });
}
