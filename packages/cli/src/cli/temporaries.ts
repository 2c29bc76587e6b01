import { rmSync } from 'node:fs';

/**
 * The temporary files and folders of the run (outputs being written, standard input spooled
 * to disk). They are removed when the run ends in any way the process can see: success,
 * failure, SIGINT, SIGTERM, SIGHUP (a SIGKILL cannot be seen; see the CLI README).
 */
const live = new Set<string>();

/** Notes a temporary path; it is removed at exit unless {@link release}d first. */
export function holdTemporary(path: string): void {
  live.add(path);
}

/** The path is no longer temporary (it was renamed into place, or removed). */
export function releaseTemporary(path: string): void {
  live.delete(path);
}

/** Removes one temporary now (never throws). */
export function removeTemporary(path: string): void {
  try {
    rmSync(path, { force: true, recursive: true });
  } catch {
    // nothing more can be done here; the path stays noted for the exit handler
    return;
  }
  live.delete(path);
}

/** Removes every temporary now (never throws). */
export function removeAllTemporaries(): void {
  for (const p of [...live]) removeTemporary(p);
}

let written = false;

/** The run's outputs are in place (a signal from now on stops a run that left complete outputs). */
export function noteOutputsWritten(): void {
  written = true;
}

const SIGNAL_EXIT: Record<string, number> = { SIGINT: 130, SIGTERM: 143, SIGHUP: 129 };
let installed = false;

/**
 * Removes the temporaries on exit and on SIGINT, SIGTERM and SIGHUP (then exits with 128 + the
 * signal's number, after one line on stderr). For the command's process only (bin).
 */
export function installCleanup(stderr: (text: string) => void): void {
  if (installed) return;
  installed = true;
  process.on('exit', removeAllTemporaries);
  for (const signal of Object.keys(SIGNAL_EXIT) as NodeJS.Signals[]) {
    process.on(signal, () => {
      removeAllTemporaries();
      stderr(
        written
          ? `loopwise: stopped by ${signal} after its outputs were written (they are complete)\n`
          : `loopwise: stopped by ${signal}; no output was written and its temporary files were removed\n`,
      );
      process.exit(SIGNAL_EXIT[signal]);
    });
  }
}
