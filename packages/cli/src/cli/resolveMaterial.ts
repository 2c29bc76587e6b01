import {
  defineMaterial,
  estimateModifiedUniversalSlopes,
  estimateRoessleFatemi,
  estimateUniformMaterialLaw,
  handbookSteels,
  type Material,
  type MaterialInput,
} from '@loopwise/material';
import { UsageError } from './CliError';
import { JobFieldError, materialConstants } from './checkJobFields';
import { parseJsonText } from './parseJsonText';

/** How {@link resolveMaterial} reads a material file: the command's `FileAccess`, or none where there is no file system. */
export interface TextAccess {
  readText(path: string, field: string): { text: string; shown: string };
}

/** How a job names its material: a handbook row, a JSON file, inline constants, or an estimate. */
export type MaterialSpec =
  | string
  | { handbook: string }
  | { file: string }
  | { estimate: EstimateSpec }
  | MaterialInput;

/** A published estimate from tensile strength or hardness (all values in MPa). */
export type EstimateSpec =
  | { method: 'uniform-material-law'; SuMPa: number; EMPa?: number; metal?: 'steel' | 'aluminium-titanium' }
  | { method: 'hardness'; hardnessHB: number; EMPa?: number }
  | { method: 'modified-universal-slopes'; SuMPa: number; EMPa?: number; reductionOfArea: number };

/** Young's modulus assumed for steel estimates when none is given, MPa (common practice, no source). */
export const DEFAULT_STEEL_E_MPA = 207000;

/**
 * Resolves a material spec. A string is a handbook row name (exact, or a unique case-insensitive
 * prefix such as "SAE 1045") or, when it ends in .json, a file of material constants, read
 * through `access` (relative to the job's folder for a job, as typed on the command line).
 * A material file holds the constants only; unknown fields are errors.
 */
export function resolveMaterial(spec: MaterialSpec | undefined, access: TextAccess, field = 'material'): Material {
  if (spec === undefined || spec === null) throw new UsageError(`${field}: a material is required (a handbook name, a .json file, or constants)`);
  if (typeof spec === 'string') return spec.toLowerCase().endsWith('.json') ? fromFile(spec, access, field) : handbook(spec, field);
  if (typeof spec !== 'object') throw new UsageError(`${field}: must be a name, a file or an object, got ${JSON.stringify(spec)}`);
  if ('handbook' in spec) return handbook(spec.handbook, `${field}.handbook`);
  if ('file' in spec) return fromFile(spec.file, access, `${field}.file`);
  if ('estimate' in spec) return estimate(spec.estimate, `${field}.estimate`);
  return defineMaterial(spec);
}

/** The names of the handbook rows. */
export function handbookNames(): string[] {
  return handbookSteels.map((m) => m.name ?? '');
}

function handbook(name: string, field: string): Material {
  const exact = handbookSteels.find((m) => m.name === name);
  if (exact) return exact;
  const matches = handbookSteels.filter((m) => (m.name ?? '').toLowerCase().startsWith(name.toLowerCase()));
  if (matches.length === 1) return matches[0];
  throw new UsageError(
    `${field}: ${matches.length === 0 ? 'no' : 'more than one'} handbook material matches "${name}"; the table has: ${handbookNames().join('; ')}`,
  );
}

function fromFile(path: string, access: TextAccess, field: string): Material {
  const { text, shown } = access.readText(path, field);
  const json = parseJsonText(text, shown, 'material file');
  try {
    if (json === null || typeof json !== 'object' || Array.isArray(json)) throw new JobFieldError('', 'a material file holds one JSON object of constants');
    materialConstants(json, '');
  } catch (error) {
    if (error instanceof JobFieldError) throw new UsageError(`${shown}: ${error.message}`);
    throw error;
  }
  return defineMaterial(json as MaterialInput);
}

function estimate(spec: EstimateSpec, field: string): Material {
  if (spec === null || typeof spec !== 'object') throw new UsageError(`${field}: must be { method, ... }`);
  const E = spec.EMPa ?? DEFAULT_STEEL_E_MPA;
  switch (spec.method) {
    case 'uniform-material-law':
      return estimateUniformMaterialLaw({ SuMPa: spec.SuMPa, EMPa: E, metal: spec.metal ?? 'steel' });
    case 'hardness':
      return estimateRoessleFatemi({ hardnessHB: spec.hardnessHB, EMPa: E });
    case 'modified-universal-slopes':
      return estimateModifiedUniversalSlopes({ SuMPa: spec.SuMPa, EMPa: E, reductionOfArea: spec.reductionOfArea });
    default:
      throw new UsageError(`${field}.method: must be 'uniform-material-law', 'hardness' or 'modified-universal-slopes', got ${JSON.stringify((spec as { method: unknown }).method)}`);
  }
}
