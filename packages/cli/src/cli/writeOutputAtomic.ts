import { randomBytes } from 'node:crypto';
import { existsSync, realpathSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { UsageError } from './CliError';

/**
 * Writes an output file atomically: the content goes to a temporary file beside the target,
 * which is then renamed over it, so a reader never sees a partial file and a failure leaves no
 * partial output. Refuses to write over any of the command's input files, or into a directory.
 */
export function writeOutputAtomic(path: string, content: string, inputs: readonly string[]): void {
  const target = resolve(path);
  if (existsSync(target) && statSync(target).isDirectory()) throw new UsageError(`${path}: is a directory, not an output file`);
  const real = existsSync(target) ? realpathSync(target) : target;
  for (const input of inputs) {
    const inReal = existsSync(input) ? realpathSync(input) : resolve(input);
    if (inReal === real) throw new UsageError(`${path}: is an input of this command; loopwise never overwrites its input`);
  }
  const dir = dirname(target);
  if (!existsSync(dir)) throw new UsageError(`${path}: folder ${dir} does not exist`);
  const temp = join(dir, `.${basename(target)}.${process.pid}.${randomBytes(4).toString('hex')}.tmp`);
  try {
    writeFileSync(temp, content);
    renameSync(temp, target);
  } catch (error) {
    rmSync(temp, { force: true });
    throw error;
  }
}
