/**
 * A file the command could not read or write, for a reason of the system (permissions, a full
 * or read-only file system, a missing folder). The message is one plain line naming the path
 * and the cause; the command exits with code 2, as for every input error.
 */
export class FileError extends Error {
  /** `LW_FILE_` and the system's code (`LW_FILE_EACCES`, `LW_FILE_ENOSPC`, …), or a reason of ours. */
  readonly code: string;
  constructor(
    readonly path: string,
    readonly reason: string,
    code: string,
  ) {
    super(`${path}: ${reason}`);
    this.name = 'FileError';
    this.code = `LW_FILE_${code}`;
  }
}

/** The system's error codes in plain words. */
const PLAIN: Record<string, string> = {
  EACCES: 'permission denied',
  EPERM: 'operation not permitted',
  EROFS: 'the file system is read-only',
  ENOSPC: 'no space left on the device',
  EDQUOT: 'the disk quota is exhausted',
  ENOENT: 'no such file or folder',
  ENOTDIR: 'a part of the path is not a folder',
  EISDIR: 'is a folder, not a file',
  ENAMETOOLONG: 'the name is too long',
  ELOOP: 'too many symbolic links in the path',
  EMFILE: 'too many open files',
  ENFILE: 'too many open files in the system',
  EIO: 'input/output error of the device',
  EFBIG: 'the file would be too large for this file system',
  EPIPE: 'the reading end of the pipe was closed',
  EBUSY: 'the file is busy',
  ETXTBSY: 'the file is busy',
  EXDEV: 'the temporary file and the target are on different file systems',
  EEXIST: 'the file exists already',
  EAGAIN: 'the resource is temporarily unavailable',
  ENXIO: 'no reader is connected (a FIFO without a reader, or a missing device)',
};

/** A system error (an `ErrnoException`) as a {@link FileError} about `path`, with `doing` as context. */
export function fileErrorOf(error: unknown, path: string, doing: string): Error {
  const code = (error as NodeJS.ErrnoException | null)?.code;
  if (typeof code !== 'string' || !/^E[A-Z]+$/.test(code)) return error instanceof Error ? error : new Error(String(error));
  return new FileError(path, `cannot ${doing}: ${PLAIN[code] ?? `system error ${code}`}`, code);
}
