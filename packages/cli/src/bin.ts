#!/usr/bin/env node
import { main } from './cli/main';
import { installCleanup } from './cli/temporaries';

// temporaries (outputs being written, a copy of standard input) go at exit and on SIGINT/SIGTERM
installCleanup((t) => process.stderr.write(t));

main(process.argv.slice(2)).then(
  (code) => {
    process.exitCode = code;
  },
  (error) => {
    process.stderr.write(`loopwise: ${error instanceof Error ? error.message : String(error)}\n`);
    process.exitCode = 1;
  },
);
