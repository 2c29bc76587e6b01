#!/usr/bin/env node
// The test step of `pnpm test` (after the build and the type check): runs vitest once over the
// workspace, with its terminal report and a JSON report in test-results/vitest.json, then prints
// the closing line `N passed, N failed` from that report, whether the tests passed or failed.
// Exits non-zero when vitest did, when a test or a test file failed, when no test ran (a run that
// executes nothing must not look green), or when the report is missing or unreadable (vitest
// stopped before writing it, or was cut off while writing it).
import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync, rmSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = new URL('..', import.meta.url);
const REPORT = 'test-results/vitest.json';

/**
 * The closing lines of a run from the text of vitest's JSON report (undefined when there is no
 * report) and vitest's exit status. Returns `{ lines, errors, ok }`: `lines` for stdout (the
 * `N passed, N failed` line when the report can be read), `errors` for stderr.
 */
export function summarise(reportText, vitestStatus) {
  const errors = [];
  const lines = [];
  if (reportText === undefined) errors.push(`no test report at ${REPORT}: vitest stopped before writing it`);
  const counts = reportText === undefined ? null : readCounts(reportText, errors);
  let ok = vitestStatus === 0 && counts !== null;
  if (counts) {
    const { passed, failed, skipped, total, filesFailed, success } = counts;
    const parts = [`${passed} passed`, `${failed} failed`];
    if (skipped) parts.push(`${skipped} skipped`);
    if (filesFailed) parts.push(`${filesFailed} ${filesFailed === 1 ? 'file' : 'files'} failed to run`);
    lines.push(parts.join(', '));
    if (total === 0) errors.push('no test ran');
    if (total === 0 || failed > 0 || filesFailed > 0 || !success) ok = false;
    else if (vitestStatus !== 0) {
      errors.push(`vitest exited with ${vitestStatus === null ? 'a signal' : `code ${vitestStatus}`} (an error outside the tests; see above)`);
    }
  }
  return { lines, errors, ok };
}

/** Counts from a whole report, or from its per-file results when the totals are missing. */
function readCounts(text, errors) {
  let report;
  try {
    report = JSON.parse(text);
  } catch (e) {
    errors.push(`the test report ${REPORT} is not complete JSON (${e.message}): vitest was cut off while writing it`);
    return null;
  }
  const files = Array.isArray(report?.testResults) ? report.testResults : null;
  const filesFailed = files ? files.filter((f) => f?.status === 'failed' && (f.assertionResults ?? []).every((t) => t?.status !== 'failed')).length : 0;
  const totals = ['numPassedTests', 'numFailedTests', 'numPendingTests', 'numTotalTests'];
  if (totals.every((k) => Number.isInteger(report?.[k]))) {
    return {
      passed: report.numPassedTests,
      failed: report.numFailedTests,
      skipped: report.numPendingTests + (Number.isInteger(report.numTodoTests) ? report.numTodoTests : 0),
      total: report.numTotalTests,
      filesFailed,
      success: report.success === true,
    };
  }
  if (!files) {
    errors.push(`the test report ${REPORT} has neither totals nor per-file results`);
    return null;
  }
  errors.push(`the test report ${REPORT} has no totals; counted from its per-file results`);
  const tests = files.flatMap((f) => (Array.isArray(f?.assertionResults) ? f.assertionResults : []));
  const passed = tests.filter((t) => t?.status === 'passed').length;
  const failed = tests.filter((t) => t?.status === 'failed').length;
  return { passed, failed, skipped: tests.length - passed - failed, total: tests.length, filesFailed, success: false };
}

function main() {
  const reportPath = fileURLToPath(new URL(REPORT, root));
  // A report left by an earlier run must never be read as this run's.
  rmSync(reportPath, { force: true });
  const vitest = fileURLToPath(new URL('node_modules/vitest/vitest.mjs', root));
  const run = spawnSync(process.execPath, [vitest, 'run', '--reporter=default', '--reporter=json', `--outputFile.json=${REPORT}`], {
    cwd: fileURLToPath(root),
    stdio: 'inherit',
  });
  if (run.error) console.error(`could not start vitest: ${run.error.message}`);
  const status = run.error ? 1 : run.status;
  const { lines, errors, ok } = summarise(existsSync(reportPath) ? readFileSync(reportPath, 'utf8') : undefined, status);
  for (const e of errors) console.error(e);
  for (const l of lines) console.log(l);
  process.exit(ok ? 0 : 1);
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) main();
