import { fstatSync, realpathSync, statSync } from 'node:fs';
import { fileErrorOf } from './FileError';

/** One file the run reads, known by its identity on the device. */
export interface InputFile {
  /** The name to show in messages (as the user or the job wrote it). */
  readonly shown: string;
  /** The path after resolving every link (or `-` for standard input). */
  readonly real: string;
  readonly dev: number;
  readonly ino: number;
}

/**
 * Every file a run reads (data, job, material, each file a job names, standard input when it
 * is a file), by device and inode after resolving links: an output is refused when it is the
 * same file as any of them, whatever name, link or hard link reaches it.
 */
export class InputFiles {
  private readonly files: InputFile[] = [];

  /**
   * Notes `path` as read by this run and returns its resolved path. A path that cannot be
   * resolved is reported as a coded file error naming `shown`.
   */
  add(path: string, shown: string = path): string {
    let real: string;
    try {
      real = realpathSync(path);
      const st = statSync(real);
      this.files.push({ shown, real, dev: st.dev, ino: st.ino });
    } catch (error) {
      throw fileErrorOf(error, shown, 'read the file');
    }
    return real;
  }

  /** Notes standard input (when it is a file or pipe, its identity protects it too). */
  addStdin(): void {
    try {
      const st = fstatSync(0);
      this.files.push({ shown: '-', real: '-', dev: st.dev, ino: st.ino });
    } catch {
      // no standard input: nothing to protect
    }
  }

  /** The input that is the same file as device `dev`, inode `ino`, or undefined. */
  find(dev: number, ino: number): InputFile | undefined {
    return this.files.find((f) => f.dev === dev && f.ino === ino);
  }

  /** Every input noted so far. */
  list(): readonly InputFile[] {
    return this.files;
  }
}
