import { excerpt } from '@loopwise/ingest';
import { nearestName } from '@loopwise/base';

/** A field of a job (or material) file that breaks its rule; `field` is its path (`channels[0].column`). */
export class JobFieldError extends Error {
  readonly code = 'LW_JOB_FIELD';
  constructor(
    readonly field: string,
    readonly detail: string,
  ) {
    super(`${field === '' ? '' : `${field}: `}${detail}`);
    this.name = 'JobFieldError';
  }
}

/** Checks one value at a field path; throws {@link JobFieldError}. */
export type FieldCheck = (value: unknown, path: string) => void;

/** A value for a message: short and sanitized (strings quoted), never more than a short excerpt. */
export function shown(value: unknown): string {
  if (value === null) return 'null';
  if (Array.isArray(value)) return 'a list';
  if (typeof value === 'object') return 'an object';
  if (typeof value === 'string') return excerpt(value);
  return excerpt(String(value)).slice(1, -1);
}

const join = (path: string, key: string) => (path === '' ? key : `${path}.${key}`);
const where = (path: string) => (path === '' ? 'the job' : path);

/**
 * An object with exactly these fields: unknown fields are errors with the nearest known name
 * suggested, `required` ones must be present, each present one passes its check.
 */
export function objectOf(fields: Record<string, FieldCheck>, required: readonly string[] = [], also: readonly string[] = []): FieldCheck {
  return (value, path) => {
    if (value === null || typeof value !== 'object' || Array.isArray(value)) throw new JobFieldError(path, `expected an object, got ${shown(value)}`);
    const known = Object.keys(fields);
    for (const key of Object.keys(value)) {
      if (key in fields) continue;
      if (also.includes(key)) throw new JobFieldError(join(path, key), `field '${key}' does not belong in ${where(path)}; its fields are ${known.join(', ')}`);
      const near = nearestName(key, [...known, ...also]);
      throw new JobFieldError(join(path, key), `unknown field ${shown(key).replace(/^"|"$/g, "'")} in ${where(path)}${near ? `; did you mean '${near}'?` : `; the fields are ${known.join(', ')}`}`);
    }
    for (const key of required) if (!(key in value)) throw new JobFieldError(join(path, key), `missing (required in ${where(path)})`);
    for (const [key, check] of Object.entries(fields)) {
      const v = (value as Record<string, unknown>)[key];
      if (v !== undefined) check(v, join(path, key));
    }
  };
}

/** A non-empty list whose elements pass `item`. */
export function listOf(item: FieldCheck, what: string): FieldCheck {
  return (value, path) => {
    if (!Array.isArray(value)) throw new JobFieldError(path, `expected a list of ${what}, got ${shown(value)}`);
    if (value.length === 0) throw new JobFieldError(path, `lists no ${what}; give at least one`);
    value.forEach((v, k) => item(v, `${path}[${k}]`));
  };
}

/** A string (non-empty). */
export const text: FieldCheck = (value, path) => {
  if (typeof value !== 'string') throw new JobFieldError(path, `expected a string, got ${shown(value)}`);
  if (value === '') throw new JobFieldError(path, 'is empty');
};

/** A finite number, optionally with a rule such as `> 0`. */
export function number(rule?: { test: (x: number) => boolean; says: string }): FieldCheck {
  return (value, path) => {
    if (typeof value !== 'number' || !Number.isFinite(value)) throw new JobFieldError(path, `expected a finite number, got ${shown(value)}`);
    if (rule && !rule.test(value)) throw new JobFieldError(path, `must be ${rule.says}, got ${shown(value)}`);
  };
}

export const positive = number({ test: (x) => x > 0, says: '> 0' });
export const nonNegative = number({ test: (x) => x >= 0, says: '>= 0' });
export const wholeFromZero = number({ test: (x) => Number.isInteger(x) && x >= 0, says: 'a whole number >= 0 (sample numbers start at 0)' });
export const wholeFromOne = number({ test: (x) => Number.isInteger(x) && x >= 1, says: 'a whole number >= 1' });

/** Any string, the empty one included. */
const text0: FieldCheck = (value, path) => {
  if (typeof value !== 'string') throw new JobFieldError(path, `expected a string, got ${shown(value)}`);
};

export const boolean: FieldCheck = (value, path) => {
  if (typeof value !== 'boolean') throw new JobFieldError(path, `expected true or false, got ${shown(value)}`);
};

/** One of the listed strings. */
export function oneOfText(allowed: readonly string[]): FieldCheck {
  return (value, path) => {
    if (typeof value !== 'string' || !allowed.includes(value)) {
      const near = typeof value === 'string' ? nearestName(value, allowed) : undefined;
      throw new JobFieldError(path, `must be one of ${allowed.map((a) => `'${a}'`).join(', ')}, got ${shown(value)}${near ? `; did you mean '${near}'?` : ''}`);
    }
  };
}

/** A column: a header name or a 1-based column number. */
export const columnRef: FieldCheck = (value, path) => {
  if (typeof value === 'string' && value !== '') return;
  if (typeof value === 'number' && Number.isInteger(value) && value >= 1) return;
  throw new JobFieldError(path, `expected a column name (string) or a 1-based column number, got ${shown(value)}`);
};

const estimateFields = { method: text, SuMPa: positive, EMPa: positive, metal: oneOfText(['steel', 'aluminium-titanium']), hardnessHB: positive, reductionOfArea: number({ test: (x) => x > 0 && x < 1, says: 'between 0 and 1' }) };
const ESTIMATES: Record<string, { fields: (keyof typeof estimateFields)[]; required: string[] }> = {
  'uniform-material-law': { fields: ['method', 'SuMPa', 'EMPa', 'metal'], required: ['SuMPa'] },
  hardness: { fields: ['method', 'hardnessHB', 'EMPa'], required: ['hardnessHB'] },
  'modified-universal-slopes': { fields: ['method', 'SuMPa', 'EMPa', 'reductionOfArea'], required: ['SuMPa', 'reductionOfArea'] },
};

const estimate: FieldCheck = (value, path) => {
  if (value === null || typeof value !== 'object' || Array.isArray(value)) throw new JobFieldError(path, `expected an object { method, … }, got ${shown(value)}`);
  const method = (value as { method?: unknown }).method;
  if (method === undefined) throw new JobFieldError(`${path}.method`, `missing (one of ${Object.keys(ESTIMATES).map((m) => `'${m}'`).join(', ')})`);
  oneOfText(Object.keys(ESTIMATES))(method, `${path}.method`);
  const e = ESTIMATES[method as string];
  objectOf(Object.fromEntries(e.fields.map((f) => [f, estimateFields[f]])), e.required, Object.keys(estimateFields))(value, path);
};

/** The constants of a material (inline in a job, or a material file). */
export const materialConstants = objectOf(
  { E: positive, sigmaF: number(), b: number(), epsilonF: number(), c: number(), K: number(), n: number(), Su: number(), hardnessHB: number(), name: text },
  ['E', 'sigmaF', 'b', 'epsilonF', 'c', 'K', 'n'],
  ['handbook', 'file', 'estimate'],
);

const materialSpec: FieldCheck = (value, path) => {
  if (typeof value === 'string') return text(value, path);
  if (value !== null && typeof value === 'object' && !Array.isArray(value)) {
    if ('handbook' in value) return objectOf({ handbook: text }, ['handbook'])(value, path);
    if ('file' in value) return objectOf({ file: text }, ['file'])(value, path);
    if ('estimate' in value) return objectOf({ estimate }, ['estimate'])(value, path);
    return materialConstants(value, path);
  }
  throw new JobFieldError(path, `expected a handbook name, { "file": … }, { "estimate": … } or the constants, got ${shown(value)}`);
};

const UNITS: Record<string, string[]> = { stress: ['MPa', 'ksi'], strain: ['strain', 'microstrain'] };

const channel: FieldCheck = (value, path) => {
  objectOf(
    { column: columnRef, quantity: oneOfText(['stress', 'strain', 'load']), unit: text, mpaPerUnit: number({ test: (x) => x !== 0, says: 'non-zero' }), name: text, input: oneOfText(['nominal', 'pseudo-elastic', 'local-strain']) },
    ['column', 'quantity'],
  )(value, path);
  const c = value as { quantity: string; unit?: unknown; mpaPerUnit?: unknown };
  if (c.quantity === 'load') {
    if (c.mpaPerUnit === undefined) throw new JobFieldError(`${path}.mpaPerUnit`, 'missing: a load channel needs its nominal stress in MPa per unit of load');
    if (c.unit !== undefined) throw new JobFieldError(`${path}.unit`, "a load channel has no unit field; its factor is 'mpaPerUnit'");
  } else {
    if (c.mpaPerUnit !== undefined) throw new JobFieldError(`${path}.mpaPerUnit`, `only a load channel has a load factor (this one is ${c.quantity})`);
    if (c.unit === undefined) throw new JobFieldError(`${path}.unit`, `missing: a ${c.quantity} channel is in ${UNITS[c.quantity].map((u) => `'${u}'`).join(' or ')}`);
    oneOfText(UNITS[c.quantity])(c.unit, `${path}.unit`);
  }
};

const event = objectOf({ name: text, file: text, repeats: number({ test: (x) => x >= 1, says: '>= 1 (a fraction allowed, e.g. 2.5)' }), duration: nonNegative }, ['name', 'file', 'repeats']);

const time: FieldCheck = (value, path) => {
  if (value !== null && typeof value === 'object' && 'sampleRate' in value) return objectOf({ sampleRate: positive }, ['sampleRate'])(value, path);
  objectOf({ column: columnRef }, ['column'], ['sampleRate'])(value, path);
};

const MEAN_STRESS = ['none', 'morrow', 'modifiedMorrow', 'smithWatsonTopper', 'walker', 'goodman', 'gerber', 'iiw', 'all'];

/** An S-N curve in a job: a spec string (`iiw:90`, `en1993:71`, `basquin:…`) or defineSnCurve's parameters. */
const snCurve: FieldCheck = (value, path) => {
  if (typeof value === 'string') return text(value, path);
  objectOf(
    {
      measure: oneOfText(['range', 'amplitude']),
      stress: positive,
      cycles: positive,
      slope: positive,
      knees: listOf(objectOf({ cycles: positive, slope: positive }, ['cycles', 'slope']), 'knees'),
      cutoffCycles: positive,
    },
    ['stress', 'cycles', 'slope'],
  )(value, path);
};

/** The stress-life route of a job: the curve, Kf, a stress factor and the constants of the amplitude corrections. */
const stressLife = objectOf(
  {
    curve: snCurve,
    kf: number({ test: (x) => x >= 1, says: '>= 1' }),
    stressFactor: positive,
    ultimateStrength: positive,
    sigmaF: positive,
    iiwCategory: oneOfText(['I', 'II', 'III']),
    hotSpot: objectOf({ rule: oneOfText(['typeALinear', 'typeAQuadratic', 'typeBLinear', 'typeBQuadratic']), modulus: positive }, ['rule']),
  },
  ['curve'],
);

/** Every field of a job file with its check (the job file format, version 1). */
export const JOB_FIELDS: Record<string, FieldCheck> = {
  format: (v, p) => {
    if (v !== 'loopwise-job') throw new JobFieldError(p, `must be "loopwise-job", got ${shown(v)}`);
  },
  version: (v, p) => {
    if (v !== 1) throw new JobFieldError(p, `must be 1, got ${shown(v)}`);
  },
  description: (v, p) => {
    if (typeof v !== 'string') throw new JobFieldError(p, `expected a string, got ${shown(v)}`);
  },
  material: materialSpec,
  stressLife,
  notch: objectOf({ Kt: positive, Kf: positive, rule: oneOfText(['neuber', 'glinka', 'linear']) }),
  meanStress: oneOfText(MEAN_STRESS),
  walkerGamma: number(),
  gate: nonNegative,
  gateFraction: nonNegative,
  fullScale: positive,
  scatterFactor: positive,
  cutoffCycles: positive,
  criticalDamage: positive,
  repeating: boolean,
  service: objectOf({ unit: text, perRepeat: positive }, ['unit']),
  channels: listOf(channel, 'channels'),
  file: text,
  events: listOf(event, 'events'),
  time,
  dialect: objectOf({
    skipLines: number({ test: (x) => Number.isInteger(x) && x >= 0, says: 'a whole number >= 0' }),
    delimiter: oneOfText(['comma', 'semicolon', 'tab', 'whitespace']),
    decimalComma: boolean,
    header: boolean,
    unitsRow: boolean,
    commentPrefix: text0,
  }),
  initial: number(),
  offset: number(),
  interpolateSpikes: (v, p) => {
    if (typeof v !== 'boolean') throw new JobFieldError(p, `expected true or false, got ${shown(v)}`);
  },
  excludeFlatRuns: (v, p) => {
    if (typeof v !== 'boolean') throw new JobFieldError(p, `expected true or false, got ${shown(v)}`);
  },
  excludeSamples: listOf(objectOf({ first: wholeFromZero, last: wholeFromZero }, ['first', 'last']), 'sample ranges { first, last }'),
  excludeTimes: listOf(objectOf({ startTime: number(), endTime: number() }, ['startTime', 'endTime']), 'time ranges { startTime, endTime }'),
  subtractOffset: (v, p) => {
    if (v === 'mean') return;
    if (typeof v !== 'number' || !Number.isFinite(v)) throw new JobFieldError(p, `expected a finite number (in the channel's unit) or "mean", got ${shown(v)}`);
  },
  lowPass: objectOf({ cutoffHz: positive, order: number({ test: (x) => Number.isInteger(x) && x >= 1 && x <= 16, says: 'a whole number from 1 to 16' }) }, ['cutoffHz']),
};

/** Checks a parsed job file: every field known and of its type; `file` or `events`, not both. */
export function checkJobFields(json: unknown): void {
  if (json === null || typeof json !== 'object' || Array.isArray(json)) throw new JobFieldError('', `a job file holds one JSON object, got ${shown(json)}`);
  objectOf(JOB_FIELDS, ['format', 'version', 'channels'])(json, '');
  const j = json as { file?: unknown; events?: unknown; material?: unknown; stressLife?: unknown; notch?: unknown };
  if (j.material === undefined && j.stressLife === undefined) throw new JobFieldError('material', 'missing (required in the job, unless it gives stressLife for the stress-life route)');
  if (j.stressLife !== undefined && j.notch !== undefined) throw new JobFieldError('notch', 'applies to the strain-life route; with stressLife the notch enters as stressLife.kf');
  if ((j.file === undefined) === (j.events === undefined)) throw new JobFieldError(j.file === undefined ? 'file' : 'events', 'give either "file" (one history) or "events" (a duty cycle), not both or neither');
}
