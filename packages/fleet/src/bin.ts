#!/usr/bin/env node
import { fleetMain } from './main';

fleetMain(process.argv.slice(2)).then((code) => {
  process.exitCode = code;
});
