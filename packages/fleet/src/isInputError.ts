import { LoopwiseError } from '@loopwise/base';
import { FileError, IngestError, IngestOptionError, JobFieldError, UsageError } from '@loopwise/cli';

/**
 * True when an error says the input is wrong (a file, a job, a manifest row, a sample, an
 * option), so the command exits with code 2 and a queue does not retry it; false for anything
 * else (a fault of the program or the machine, which a queue may retry).
 */
export function isInputError(error: unknown): boolean {
  return (
    error instanceof LoopwiseError ||
    error instanceof UsageError ||
    error instanceof FileError ||
    error instanceof IngestError ||
    error instanceof IngestOptionError ||
    error instanceof JobFieldError
  );
}
