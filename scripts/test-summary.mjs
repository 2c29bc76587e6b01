#!/usr/bin/env node
// Prints the closing line of a test run, `N passed, N failed`, from vitest's JSON report, and
// fails when no test ran (a run that executes nothing must not look green).
import { readFileSync } from 'node:fs';

const report = JSON.parse(readFileSync(new URL('../test-results/vitest.json', import.meta.url), 'utf8'));
const { numPassedTests: passed, numFailedTests: failed, numPendingTests: skipped, numTotalTests: total } = report;
console.log(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}`);
if (total === 0) {
  console.error('no test ran');
  process.exit(1);
}
if (failed > 0 || !report.success) process.exit(1);
