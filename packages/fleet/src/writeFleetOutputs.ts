import { randomBytes } from 'node:crypto';
import { existsSync, lstatSync, mkdirSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { InputFiles } from '@loopwise/cli';
import { FleetError } from './FleetError';

/** One output of a fleet run: a file name inside the output folder and its content. */
export interface FleetOutput {
  name: string;
  content: string | Uint8Array;
}

/** The names of a fleet run's outputs in its folder. */
export const FLEET_OUTPUT_NAMES = ['fleet.json', 'spectra.json', 'files.parquet', 'assets.parquet', 'fleet.html'] as const;

/** Temporaries being written now (removed on a signal; see {@link removeFleetTemporaries}). */
const pending = new Set<string>();

/** Removes every temporary a write in progress left (for a signal handler). */
export function removeFleetTemporaries(): void {
  for (const t of pending) rmSync(t, { force: true });
  pending.clear();
}

/**
 * Checks the targets of a fleet run's outputs and returns their paths: the folder is a folder
 * (or does not exist yet), and no target is a symbolic link, a folder or any input of the run
 * (by device and inode). Called before any work, so a run that could not write stops at once,
 * and again by {@link writeFleetOutputs}.
 */
export function checkFleetOutputs(folder: string, names: readonly string[], inputs: InputFiles): string[] {
  if (existsSync(folder) && !statSync(folder).isDirectory()) throw new FleetError('output-not-folder', '--out', folder, `${folder}: --out names a file; the outputs go into a folder`);
  return names.map((name) => {
    const path = join(folder, name);
    let st = null;
    try {
      st = lstatSync(path);
    } catch {
      st = null;
    }
    if (st !== null) {
      if (st.isSymbolicLink()) throw new FleetError('output-link', '--out', path, `${path}: is a symbolic link; loopwise-fleet does not write through links`);
      if (st.isDirectory()) throw new FleetError('output-folder', '--out', path, `${path}: is a folder, not an output file`);
      const input = inputs.find(st.dev, st.ino);
      if (input) throw new FleetError('output-is-input', '--out', path, `${path}: is an input of this run (${input.shown}); loopwise-fleet never writes over its inputs`);
    }
    return path;
  });
}

/**
 * Writes the outputs of a fleet run all or nothing, by the rule of the `loopwise` command's
 * outputs: the targets are checked ({@link checkFleetOutputs}), each output is written to a
 * temporary file beside its target (opened exclusively), and only when all are complete are
 * they renamed into place. On any failure the temporaries are removed and no output of this
 * call is changed.
 */
export function writeFleetOutputs(folder: string, outputs: readonly FleetOutput[], inputs: InputFiles): void {
  mkdirSync(folder, { recursive: true });
  const targets = checkFleetOutputs(folder, outputs.map((o) => o.name), inputs);
  const temps: string[] = [];
  try {
    for (const o of outputs) {
      const temp = join(folder, `.${o.name}.${process.pid}-${randomBytes(4).toString('hex')}.loopwise-tmp`);
      pending.add(temp);
      temps.push(temp);
      writeFileSync(temp, o.content, { flag: 'wx', mode: 0o666 & ~process.umask() });
    }
    outputs.forEach((_, k) => {
      renameSync(temps[k], targets[k]);
      pending.delete(temps[k]);
    });
  } finally {
    for (const t of temps) {
      if (!pending.has(t)) continue;
      rmSync(t, { force: true });
      pending.delete(t);
    }
  }
}
