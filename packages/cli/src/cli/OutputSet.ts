import { randomBytes } from 'node:crypto';
import { accessSync, chmodSync, constants, lstatSync, realpathSync, renameSync, statSync, type Stats } from 'node:fs';
import { open, type FileHandle } from 'node:fs/promises';
import { basename, dirname, join, resolve } from 'node:path';
import { FileError, fileErrorOf } from './FileError';
import type { InputFiles } from './InputFiles';
import { holdTemporary, noteOutputsWritten, releaseTemporary, removeTemporary } from './temporaries';

/** Where an output's text goes, piece by piece (awaiting each piece bounds the memory). */
export interface OutputSink {
  write(text: string): Promise<void>;
}

/** Writes an output's content into a sink. */
export type OutputContent = (sink: OutputSink) => Promise<void>;

/** Writes to standard output, waiting while its buffer is full. */
export type StdoutWrite = (text: string) => Promise<void>;

type Target =
  /** A regular file, new or replaced: written to a temporary beside it, renamed at the end. */
  | { kind: 'file'; path: string; shown: string; mode: number | null }
  /** A character device or a FIFO: written in place, never replaced. */
  | { kind: 'special'; path: string; shown: string }
  /** Standard output (`-`). */
  | { kind: 'stdout'; shown: string };

interface Planned {
  option: string;
  target: Target;
  content: OutputContent;
}

/** Bytes gathered before a write to the file (fewer, larger writes; bounded memory). */
const WRITE_BYTES = 1 << 20;

/**
 * All the outputs of one run, written all or nothing. Each output is checked when it is added
 * (before any work): its folder exists and is writable, it is not a folder, a symbolic link, a
 * block device or a socket, and it is not the same file (device and inode) as any input of the
 * run. {@link commit} then writes every regular file to a temporary file beside its target,
 * writes the special targets (character devices, FIFOs, standard output) in place, and only
 * when everything is complete renames the temporaries over their targets, one after another
 * with nothing in between. On any failure the temporaries are removed (and on SIGINT/SIGTERM
 * by the exit handler) and no output of the run is left. System errors become {@link FileError}s
 * naming the path and the cause.
 */
export class OutputSet {
  private readonly planned: Planned[] = [];

  constructor(
    private readonly inputs: InputFiles,
    private readonly stdoutWrite: StdoutWrite,
  ) {}

  /** True when some output goes to standard output (the summary is then not printed). */
  get usesStdout(): boolean {
    return this.planned.some((p) => p.target.kind === 'stdout');
  }

  /** Plans an output of option `option` (e.g. `--json-out`) at `path`; checks the target now. */
  add(option: string, path: string, content: OutputContent): void {
    const target = this.check(option, path);
    for (const p of this.planned) {
      if (target.kind === 'stdout' && p.target.kind === 'stdout') throw new FileError('-', `${option} and ${p.option} both write to standard output; give one of them a file`, 'SAME_OUTPUT');
      if (target.kind !== 'stdout' && p.target.kind !== 'stdout' && sameFile(target.path, p.target.path))
        throw new FileError(path, `${option} and ${p.option} name the same file; each output needs its own`, 'SAME_OUTPUT');
    }
    this.planned.push({ option, target, content });
  }

  private check(option: string, path: string): Target {
    if (path === '-') return { kind: 'stdout', shown: '-' };
    if (path === '') throw new FileError(option, 'an empty file name', 'EMPTY_NAME');
    const full = resolve(path);
    let st: Stats | null = null;
    try {
      st = lstatSync(full);
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== 'ENOENT') throw fileErrorOf(error, path, 'look at the output');
    }
    if (st === null) {
      const dir = dirname(full);
      let d: Stats;
      try {
        d = statSync(dir);
      } catch (error) {
        if ((error as NodeJS.ErrnoException).code === 'ENOENT') throw new FileError(path, `cannot write: the folder ${dirname(path)} does not exist`, 'ENOENT');
        throw fileErrorOf(error, path, 'write');
      }
      if (!d.isDirectory()) throw new FileError(path, `cannot write: ${dirname(path)} is not a folder`, 'ENOTDIR');
      writable(dir, path);
      return { kind: 'file', path: join(realpathSync(dir), basename(full)), shown: path, mode: null };
    }
    if (st.isSymbolicLink())
      throw new FileError(path, 'is a symbolic link; loopwise does not write through links (name the file it points to)', 'SYMLINK');
    if (st.isDirectory()) throw new FileError(path, 'is a folder, not an output file', 'EISDIR');
    if (st.isBlockDevice() || st.isSocket()) throw new FileError(path, `is a ${st.isSocket() ? 'socket' : 'block device'}; loopwise writes files, character devices, FIFOs and standard output only`, 'SPECIAL');
    const input = this.inputs.find(st.dev, st.ino);
    if (input !== undefined) {
      const same = input.shown === path ? '' : ` (the same file as ${input.shown}${st.nlink > 1 ? ', through a hard link' : ''})`;
      throw new FileError(path, `is an input of this run${same}; loopwise never writes over its inputs`, 'IS_INPUT');
    }
    if (st.isCharacterDevice() || st.isFIFO()) return { kind: 'special', path: full, shown: path };
    writable(dirname(full), path);
    return { kind: 'file', path: full, shown: path, mode: st.mode & 0o7777 };
  }

  /** Writes every planned output, all or nothing (see the class). */
  async commit(): Promise<void> {
    const temps: { temp: string; target: Target & { kind: 'file' } }[] = [];
    try {
      for (const p of this.planned) {
        if (p.target.kind !== 'file') continue;
        const t = p.target;
        const temp = join(dirname(t.path), `.${basename(t.path)}.${process.pid}-${randomBytes(4).toString('hex')}.loopwise-tmp`);
        // noted before the open: the file exists as soon as the system has made it, before the
        // open's promise settles, and a signal in between must still find it to remove
        holdTemporary(temp);
        let handle: FileHandle;
        try {
          handle = await open(temp, 'wx', 0o600);
        } catch (error) {
          releaseTemporary(temp);
          throw fileErrorOf(error, t.shown, 'write');
        }
        temps.push({ temp, target: t });
        try {
          await p.content(fileSink(handle, t.shown));
          await handle.sync().catch(() => undefined);
        } finally {
          await handle.close().catch(() => undefined);
        }
        // a new file gets the usual permissions (0666 less the umask), a replaced one keeps its own
        const mode = t.mode ?? 0o666 & ~process.umask();
        try {
          chmodSync(temp, mode);
        } catch (error) {
          throw fileErrorOf(error, t.shown, 'set the permissions of the output');
        }
      }
      // special targets are written in place (they cannot be replaced, nor taken back)
      for (const p of this.planned) {
        if (p.target.kind === 'special') {
          let handle: FileHandle;
          try {
            handle = await open(p.target.path, 'w');
          } catch (error) {
            throw fileErrorOf(error, p.target.shown, 'write');
          }
          try {
            await p.content(fileSink(handle, p.target.shown));
          } finally {
            await handle.close().catch(() => undefined);
          }
        } else if (p.target.kind === 'stdout') {
          await p.content(stdoutSink(this.stdoutWrite));
        }
      }
      // everything is complete: check once more that no target became an input, then rename
      for (const { target } of temps) this.recheck(target);
      for (const { temp, target } of temps) {
        try {
          renameSync(temp, target.path);
        } catch (error) {
          throw fileErrorOf(error, target.shown, 'move the finished output into place');
        }
        releaseTemporary(temp);
      }
      noteOutputsWritten();
    } finally {
      for (const { temp } of temps) removeTemporary(temp);
    }
  }

  private recheck(t: Target & { kind: 'file' }): void {
    let st: Stats;
    try {
      st = lstatSync(t.path);
    } catch {
      return; // still no file there: the rename creates it
    }
    if (st.isSymbolicLink() || !st.isFile() || this.inputs.find(st.dev, st.ino) !== undefined)
      throw new FileError(t.shown, 'changed while the run wrote its outputs (it is now a link, a special file or an input); nothing was written', 'CHANGED');
  }
}

function sameFile(a: string, b: string): boolean {
  if (a === b) return true;
  try {
    const x = statSync(a);
    const y = statSync(b);
    return x.dev === y.dev && x.ino === y.ino;
  } catch {
    return false;
  }
}

function writable(dir: string, shown: string): void {
  try {
    accessSync(dir, constants.W_OK);
  } catch (error) {
    throw fileErrorOf(error, shown, 'write');
  }
}

function fileSink(handle: FileHandle, shown: string): OutputSink {
  return {
    async write(text: string) {
      let off = 0;
      while (off < text.length) {
        const piece = text.length - off <= WRITE_BYTES ? (off === 0 ? text : text.slice(off)) : text.slice(off, off + WRITE_BYTES);
        off += piece.length;
        try {
          await handle.writeFile(piece);
        } catch (error) {
          throw fileErrorOf(error, shown, 'write');
        }
      }
    },
  };
}

function stdoutSink(write: StdoutWrite): OutputSink {
  return {
    async write(text: string) {
      try {
        await write(text);
      } catch (error) {
        throw fileErrorOf(error, '-', 'write to standard output');
      }
    },
  };
}
