import {
  defineSnCurve,
  en1993DetailCurve,
  EN1993_NORMAL_CATEGORIES,
  EN1993_SHEAR_CATEGORIES,
  iiwFatCurve,
  IIW_NORMAL_FAT_CLASSES,
  IIW_SHEAR_FAT_CLASSES,
  type En1993CurveOptions,
  type IiwBelowKnee,
  type IiwCurveOptions,
  type SnCurve,
  type SnCurveInput,
  type SnKnee,
} from '@loopwise/stress-life';
import { UsageError } from './CliError';

/** An S-N curve as the command line and job files name it, with the text it was named by. */
export interface NamedSnCurve {
  curve: SnCurve;
  /** The curve as given (e.g. `iiw:90`), for the summary and the report. */
  label: string;
}

/** The forms of a curve spec, for messages. */
export const SN_CURVE_FORMS =
  'iiw:<FAT>[,shear][,constant][,below-knee=haibach|elementary|original|veryHighCycle][,gamma-m=<x>][,thickness-factor=<x>], ' +
  'en1993:<category>[,shear][,constant][,gamma-mf=<x>][,gamma-ff=<x>][,size-factor=<x>], ' +
  'or basquin:stress=<S>,cycles=<N>,slope=<m>[,knee=<N>/<m>]…[,cutoff=<N>][,amplitude]';

function fail(where: string, message: string): never {
  throw new UsageError(`${where}: ${message}`);
}

function numberOf(where: string, key: string, text: string | undefined): number {
  const x = Number(text);
  if (text === undefined || text.trim() === '' || !Number.isFinite(x)) fail(where, `${key}= needs a number, got "${text ?? ''}"`);
  return x;
}

/** Splits `a,b=c,…` into flags and key=value pairs; every key must be one of `keys`. */
function partsOf(where: string, rest: string[], keys: readonly string[], flags: readonly string[]): { flags: Set<string>; values: Map<string, string[]> } {
  const f = new Set<string>();
  const v = new Map<string, string[]>();
  for (const p of rest) {
    const eq = p.indexOf('=');
    const key = (eq < 0 ? p : p.slice(0, eq)).trim();
    if (eq < 0) {
      if (!flags.includes(key)) fail(where, `unknown part "${key}" (known: ${[...flags, ...keys.map((k) => `${k}=`)].join(', ')})`);
      f.add(key);
    } else {
      if (!keys.includes(key)) fail(where, `unknown part "${key}=" (known: ${[...flags, ...keys.map((k) => `${k}=`)].join(', ')})`);
      v.set(key, [...(v.get(key) ?? []), p.slice(eq + 1).trim()]);
    }
  }
  return { flags: f, values: v };
}

/** A stress-life package error (unknown detail, bad option) as a usage error at `where`. */
function curveOf(where: string, make: () => SnCurve): SnCurve {
  try {
    return make();
  } catch (error) {
    if (error instanceof Error && error.name === 'StressLifeError') fail(where, error.message);
    throw error;
  }
}

/**
 * Reads a curve spec (the forms of {@link SN_CURVE_FORMS}) or, in a job file, an object of
 * `defineSnCurve`'s parameters. `where` names the option or job field in messages.
 */
export function parseSnCurveSpec(spec: unknown, where: string): NamedSnCurve {
  if (spec !== null && typeof spec === 'object') {
    const input = spec as SnCurveInput;
    return { curve: curveOf(where, () => defineSnCurve(input)), label: 'basquin (job file)' };
  }
  if (typeof spec !== 'string' || spec.trim() === '') fail(where, `expected ${SN_CURVE_FORMS}`);
  const text = spec.trim();
  const colon = text.indexOf(':');
  const kind = colon < 0 ? text : text.slice(0, colon);
  const [head, ...rest] = (colon < 0 ? '' : text.slice(colon + 1)).split(',');
  if (kind === 'iiw') {
    const fat = numberOf(where, 'FAT class', head);
    const p = partsOf(where, rest, ['below-knee', 'gamma-m', 'thickness-factor'], ['shear', 'constant']);
    const o: IiwCurveOptions = { stress: p.flags.has('shear') ? 'shear' : 'normal', loading: p.flags.has('constant') ? 'constant' : 'variable' };
    const bk = p.values.get('below-knee')?.[0];
    if (bk !== undefined) o.belowKnee = bk as IiwBelowKnee;
    if (p.values.has('gamma-m')) o.gammaM = numberOf(where, 'gamma-m', p.values.get('gamma-m')?.[0]);
    if (p.values.has('thickness-factor')) o.thicknessFactor = numberOf(where, 'thickness-factor', p.values.get('thickness-factor')?.[0]);
    const known = o.stress === 'shear' ? IIW_SHEAR_FAT_CLASSES : IIW_NORMAL_FAT_CLASSES;
    if (!known.includes(fat)) fail(where, `FAT ${fat} is not an IIW ${o.stress}-stress class (known: ${known.join(', ')})`);
    return { curve: curveOf(where, () => iiwFatCurve(fat, o)), label: text };
  }
  if (kind === 'en1993') {
    const category = numberOf(where, 'detail category', head);
    const p = partsOf(where, rest, ['gamma-mf', 'gamma-ff', 'size-factor'], ['shear', 'constant']);
    const o: En1993CurveOptions = { stress: p.flags.has('shear') ? 'shear' : 'normal', loading: p.flags.has('constant') ? 'constant' : 'variable' };
    if (p.values.has('gamma-mf')) o.gammaMf = numberOf(where, 'gamma-mf', p.values.get('gamma-mf')?.[0]);
    if (p.values.has('gamma-ff')) o.gammaFf = numberOf(where, 'gamma-ff', p.values.get('gamma-ff')?.[0]);
    if (p.values.has('size-factor')) o.sizeFactor = numberOf(where, 'size-factor', p.values.get('size-factor')?.[0]);
    const known = o.stress === 'shear' ? EN1993_SHEAR_CATEGORIES : EN1993_NORMAL_CATEGORIES;
    if (!known.includes(category)) fail(where, `${category} is not an EN 1993-1-9 ${o.stress}-stress detail category (known: ${known.join(', ')})`);
    return { curve: curveOf(where, () => en1993DetailCurve(category, o)), label: text };
  }
  if (kind === 'basquin') {
    const p = partsOf(where, [head, ...rest].filter((s) => s !== ''), ['stress', 'cycles', 'slope', 'knee', 'cutoff'], ['amplitude']);
    const one = (k: string) => numberOf(where, k, p.values.get(k)?.[0]);
    const knees: SnKnee[] = (p.values.get('knee') ?? []).map((k) => {
      const [n, m, more] = k.split('/');
      const x = Number(n);
      const y = Number(m);
      if (more !== undefined || n === undefined || m === undefined || n.trim() === '' || m.trim() === '' || !Number.isFinite(x) || !Number.isFinite(y)) {
        fail(where, `knee= needs <cycles>/<slope after the knee>, e.g. knee=1e7/5, got "${k}"`);
      }
      return { cycles: x, slope: y };
    });
    const input: SnCurveInput = { measure: p.flags.has('amplitude') ? 'amplitude' : 'range', stress: one('stress'), cycles: one('cycles'), slope: one('slope'), knees };
    if (p.values.has('cutoff')) input.cutoffCycles = one('cutoff');
    return { curve: curveOf(where, () => defineSnCurve(input)), label: text };
  }
  fail(where, `unknown curve "${kind}"; expected ${SN_CURVE_FORMS}`);
}
