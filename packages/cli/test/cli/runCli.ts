import { main, type Io } from '../../src/cli/main';

/** What one in-process run of the command printed and returned. */
export interface CliRun {
  code: number;
  stdout: string;
  stderr: string;
}

/** Runs `loopwise <args>` in this process (`main`), collecting stdout and stderr; `terminal` says whether stderr is a terminal (progress shows). */
export async function cli(args: string[], terminal = false): Promise<CliRun> {
  let stdout = '';
  let stderr = '';
  const io: Io = { stdout: (t) => (stdout += t), stderr: (t) => (stderr += t), stderrIsTerminal: terminal };
  const code = await main(args, io);
  return { code, stdout, stderr };
}
