import { defineMaterial } from './defineMaterial';
import type { Material, MaterialInput } from './Material';

/** Source of {@link handbookSteels}, exactly as given by the reference file the rows were taken from. */
export const HANDBOOK_STEELS_SOURCE =
  "N. E. Dowling, Mechanical Behavior of Materials, Pearson, Table 14.1 (cyclic stress-strain and strain-life constants for selected engineering metals); edition believed to be the 4th (2013)";

/** How the rows were obtained, as stated with the reference file. */
export const HANDBOOK_STEELS_PROVENANCE =
  "Transcribed from a secondary copy that quotes the table; sigmaF and b cross-checked against the same book's Table 9.1. Check against the book itself where you can. Handbook reference values for tests and examples, not certified design data.";

function row(values: Omit<MaterialInput, 'source'> & { note?: string }): Material {
  const note = values.note === undefined ? HANDBOOK_STEELS_PROVENANCE : `${values.note}. ${HANDBOOK_STEELS_PROVENANCE}`;
  return defineMaterial({ ...values, source: HANDBOOK_STEELS_SOURCE, note });
}

/**
 * Published strain-life and cyclic constants of six common steels (stresses in MPa, strains
 * dimensionless): handbook reference values for examples and checks, not certified design data.
 * Each row carries {@link HANDBOOK_STEELS_SOURCE} as `source` and the provenance (with any row
 * note, e.g. that SAE 1015's c = −0.513 is from memory) as `note`.
 *
 * Reference: N. E. Dowling, Mechanical Behavior of Materials, Pearson, Table 14.1 (edition
 * believed to be the 4th, 2013), transcribed from a secondary copy; σf' and b cross-checked
 * against the same book's Table 9.1. Check against the book before relying on a value.
 *
 * @example
 * handbookSteels.find((m) => m.name === 'SAE 1045 (hot rolled and normalized)')?.sigmaF
 * // returns 948
 */
export const handbookSteels: readonly Material[] = Object.freeze([
  row({ name: "SAE 1015 (normalized)", Su: 415, E: 207000, K: 1349, n: 0.282, sigmaF: 1020, b: -0.138, epsilonF: 0.439, c: -0.513, note: "c shown truncated as -0.51 in the copy read; -0.513 from memory" }),
  row({ name: "Man-Ten (hot rolled)", Su: 557, E: 203000, K: 1096, n: 0.187, sigmaF: 1089, b: -0.115, epsilonF: 0.912, c: -0.606 }),
  row({ name: "RQC-100 (roller quenched and tempered)", Su: 758, E: 200000, K: 903, n: 0.0905, sigmaF: 938, b: -0.0648, epsilonF: 1.38, c: -0.704 }),
  row({ name: "SAE 1045 (hot rolled and normalized)", Su: 621, E: 202000, K: 1258, n: 0.208, sigmaF: 948, b: -0.092, epsilonF: 0.26, c: -0.445 }),
  row({ name: "SAE 4142 (450 HB)", Su: 1757, E: 207000, K: 2080, n: 0.093, sigmaF: 1937, b: -0.0762, epsilonF: 0.706, c: -0.869 }),
  row({ name: "AISI 4340 (aircraft quality)", Su: 1172, E: 207000, K: 1655, n: 0.131, sigmaF: 1758, b: -0.0977, epsilonF: 2.12, c: -0.774 }),
]);
