#!/usr/bin/env node
import { main } from './cli/main';

main(process.argv.slice(2)).then(
  (code) => {
    process.exitCode = code;
  },
  (error) => {
    process.stderr.write(`loopwise: ${error instanceof Error ? error.message : String(error)}\n`);
    process.exitCode = 1;
  },
);
