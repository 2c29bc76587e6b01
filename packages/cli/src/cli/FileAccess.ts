import { accessSync, constants, readFileSync, realpathSync, statSync } from 'node:fs';
import { dirname, isAbsolute, join, relative, resolve, sep } from 'node:path';
import { UsageError } from './CliError';
import { FileError, fileErrorOf } from './FileError';
import type { InputFiles } from './InputFiles';

/** The option that lets a job file name paths outside its own folder. */
export const OUTSIDE_OPTION = '--job-may-read-anywhere';

/** A file to read, resolved. */
export interface ResolvedFile {
  /** The path to open (links resolved). */
  path: string;
  /** The name for messages and reports: as the user typed it, or the job's folder joined with the job's text. */
  shown: string;
}

/**
 * How a run reaches its input files. Files named on the command line are read as given. Files
 * a job file names resolve relative to the job file's folder and must stay inside it (after
 * resolving links) unless the run was started with {@link OUTSIDE_OPTION}; every file read is
 * noted in `inputs`, so no output can overwrite it.
 */
export class FileAccess {
  constructor(
    readonly inputs: InputFiles,
    /** The job file (as shown) and its folder, or null for files named on the command line. */
    private readonly job: { shown: string; folder: string; realFolder: string } | null,
    private readonly anywhere: boolean,
  ) {}

  /** Access for the files of a job file at `jobPath` (as typed). */
  static forJob(inputs: InputFiles, jobPath: string, anywhere: boolean): FileAccess {
    const folder = dirname(resolve(jobPath));
    let realFolder: string;
    try {
      realFolder = realpathSync(folder);
    } catch (error) {
      throw fileErrorOf(error, jobPath, 'read the job file');
    }
    return new FileAccess(inputs, { shown: jobPath, folder, realFolder }, anywhere);
  }

  /** Resolves a path given at `field` (a job field, or an option for command-line files) and notes it as an input. */
  resolve(path: string, field: string): ResolvedFile {
    if (this.job === null) {
      const real = this.inputs.add(resolve(path), path);
      readable(real, path);
      return { path: real, shown: path };
    }
    const { shown: jobShown, folder, realFolder } = this.job;
    const shown = isAbsolute(path) ? path : join(dirname(jobShown), path);
    const lexical = resolve(folder, path);
    if (!this.anywhere && (isAbsolute(path) || !inside(folder, lexical)))
      throw new UsageError(`${jobShown}: ${field}: ${JSON.stringify(path)} lies outside the job file's folder; a job reads such paths only when the command is given ${OUTSIDE_OPTION}`);
    let real: string;
    try {
      real = realpathSync(lexical);
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === 'ENOENT') throw new FileError(shown, `no such file (named by ${jobShown}: ${field})`, 'ENOENT');
      throw fileErrorOf(error, shown, 'read the file');
    }
    if (!this.anywhere && !inside(realFolder, real))
      throw new UsageError(`${jobShown}: ${field}: ${JSON.stringify(path)} leads outside the job file's folder through a link; a job reads such paths only when the command is given ${OUTSIDE_OPTION}`);
    this.inputs.add(real, shown);
    readable(real, shown);
    return { path: real, shown };
  }

  /** Reads a small text file (job, material) at `field`, noted as an input. */
  readText(path: string, field: string): { text: string; shown: string } {
    const f = this.resolve(path, field);
    try {
      if (statSync(f.path).size > MAX_TEXT_BYTES) throw new FileError(f.shown, `is larger than ${MAX_TEXT_BYTES >> 20} MiB: not a job or material file`, 'TOO_LARGE');
      return { text: readFileSync(f.path, 'utf8'), shown: f.shown };
    } catch (error) {
      if (error instanceof FileError) throw error;
      throw fileErrorOf(error, f.shown, 'read the file');
    }
  }
}

/** Largest job or material file read, bytes. */
const MAX_TEXT_BYTES = 16 << 20;

function readable(path: string, shown: string): void {
  try {
    accessSync(path, constants.R_OK);
  } catch (error) {
    throw fileErrorOf(error, shown, 'read the file');
  }
}

function inside(folder: string, path: string): boolean {
  const r = relative(folder, path);
  return r !== '' && !r.startsWith('..' + sep) && r !== '..' && !isAbsolute(r);
}

export { parseJsonText } from './parseJsonText';
