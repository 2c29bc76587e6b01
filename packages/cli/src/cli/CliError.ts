/**
 * A usage or input error of the command line: a bad option, a missing or unreadable file, an
 * invalid job. The command prints its one-line message and exits with code 2.
 */
export class UsageError extends Error {
  readonly code = 'LW_USAGE';
  constructor(message: string) {
    super(message);
    this.name = 'UsageError';
  }
}

/** Error classes of the packages that mean "your input is wrong" (exit 2), by name. */
const INPUT_ERRORS = new Set([
  'UsageError',
  'IngestError',
  'IngestOptionError',
  'EngineError',
  'MaterialError',
  'ArgumentError',
  'NotchOptionError',
  'NotchSampleError',
  'MeanStressError',
  'MinerError',
  'InvalidOptionError',
  'NonFiniteSampleError',
  'BinError',
  'FileError',
  'MemoryLimitError',
  'JobFieldError',
]);

/** Exit code for an error: 2 for usage and input errors, 1 for everything else. */
export function exitCodeOf(error: unknown): 1 | 2 {
  return error instanceof Error && INPUT_ERRORS.has(error.name) ? 2 : 1;
}

/** One line, for stderr: the message without stack. */
export function oneLine(error: unknown): string {
  const text = error instanceof Error ? error.message : String(error);
  return text.replace(/\s*\n\s*/g, '; ');
}
