import { createWriteStream, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pipeline } from 'node:stream/promises';
import { UsageError } from './CliError';
import { fileErrorOf } from './FileError';
import { holdTemporary } from './temporaries';

/**
 * Copies standard input (a data file given as `-`) to a private temporary file and returns its
 * path: a repeating history is read twice, and a pipe can be read once only. The copy lives in
 * a folder of its own (mode 0700) under the system's temporary folder and is removed when the
 * run ends, also on SIGINT and SIGTERM. Memory stays bounded (the copy is streamed).
 */
export async function spoolStdin(): Promise<string> {
  if (process.stdin.isTTY) throw new UsageError('-: standard input is a terminal; pipe or redirect the data into loopwise');
  let dir: string;
  try {
    dir = mkdtempSync(join(tmpdir(), 'loopwise-stdin-'));
  } catch (error) {
    throw fileErrorOf(error, tmpdir(), 'make a folder for the copy of standard input');
  }
  holdTemporary(dir);
  const path = join(dir, 'stdin');
  try {
    await pipeline(process.stdin, createWriteStream(path, { mode: 0o600, flags: 'wx' }));
  } catch (error) {
    throw fileErrorOf(error, `${path} (the copy of standard input)`, 'write');
  }
  return path;
}
