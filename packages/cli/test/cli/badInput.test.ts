import { spawnSync } from 'node:child_process';
import { chmodSync, closeSync, openSync, existsSync, linkSync, lstatSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, statSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { fileErrorOf } from '../../src/cli/FileError';

// The bad-input table of issue 16, end to end through the built binary (pnpm test builds first):
// each case runs in a folder of its own holding data.csv (columns time,stress; 200 rows),
// steel.json and job.json, and checks the exit code, the one line on stderr and the files left
// in the folder afterwards (every name, temporaries included). Data invented for the tests.
const bin = new URL('../../dist/bin.js', import.meta.url).pathname;
let root = '';
const ROWS = 200;
const DATA = ['time,stress', ...Array.from({ length: ROWS }, (_, i) => `${(i / 100).toFixed(2)},${(300 * Math.sin(i * 0.37) + 90 * Math.sin(i * 1.9)).toFixed(3)}`)].join('\n') + '\n';
const STEEL = { E: 206000, sigmaF: 948, b: -0.092, epsilonF: 0.26, c: -0.445, K: 1258, n: 0.208, Su: 750 };
const JOB = {
  format: 'loopwise-job',
  version: 1,
  material: { file: 'steel.json' },
  notch: { Kt: 2 },
  channels: [{ column: 'stress', quantity: 'stress', unit: 'MPa' }],
  file: 'data.csv',
};
const BASE = ['data.csv', 'job.json', 'steel.json'];
const MODEL = ['--column', 'stress', '--material', 'steel.json', '--kt', '2'];

interface Run {
  code: number | null;
  stdout: string;
  stderr: string;
}

function run(args: string[], cwd: string, options: { input?: string | Buffer; stdinFile?: string; uid?: number } = {}): Run {
  const fd = options.stdinFile === undefined ? undefined : openSync(options.stdinFile, 'r');
  const stdio = fd === undefined ? undefined : ([fd, 'pipe', 'pipe'] as const);
  const r = spawnSync(process.execPath, [bin, ...args], { cwd, encoding: 'utf8', input: options.input, stdio: stdio as never, uid: options.uid, gid: options.uid, timeout: 60000 });
  if (fd !== undefined) closeSync(fd);
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

function folder(name: string): string {
  const d = join(root, name.replace(/[^\w]+/g, '-'));
  mkdirSync(d, { recursive: true });
  writeFileSync(join(d, 'data.csv'), DATA);
  writeFileSync(join(d, 'steel.json'), JSON.stringify(STEEL));
  writeFileSync(join(d, 'job.json'), JSON.stringify(JOB));
  return d;
}

const job = (d: string, patch: Record<string, unknown>, name = 'job.json') => writeFileSync(join(d, name), JSON.stringify({ ...JOB, ...patch }));

interface Case {
  name: string;
  /** Prepares the folder; returns the arguments. */
  args: (d: string) => string[];
  code: number;
  /** What stderr says (one line), or null for a run that succeeds (stderr empty). */
  message: RegExp | null;
  /** Every file in the folder afterwards (sorted). */
  left: string[];
  /** Further checks of the folder afterwards. */
  after?: (d: string, r: Run) => void;
  input?: (d: string) => string | Buffer;
  /** A file of the folder given as standard input (a redirect, not a pipe). */
  stdinFile?: string;
  uid?: number;
}

const cases: Case[] = [
  // inputs are protected by identity
  { name: 'the job file as --json-out', args: () => ['assess', '--job', 'job.json', '--json-out', 'job.json'], code: 2, message: /^loopwise assess: job\.json: is an input of this run; loopwise never writes over its inputs$/, left: BASE, after: (d) => expect(JSON.parse(readFileSync(join(d, 'job.json'), 'utf8'))).toEqual(JOB) },
  { name: 'the material file as --json-out', args: () => ['assess', 'data.csv', ...MODEL, '--json-out', 'steel.json'], code: 2, message: /steel\.json: is an input of this run/, left: BASE, after: (d) => expect(JSON.parse(readFileSync(join(d, 'steel.json'), 'utf8'))).toEqual(STEEL) },
  { name: 'the data file as --cycles-out', args: () => ['assess', 'data.csv', ...MODEL, '--cycles-out', 'data.csv'], code: 2, message: /data\.csv: is an input of this run/, left: BASE, after: (d) => expect(readFileSync(join(d, 'data.csv'), 'utf8')).toBe(DATA) },
  { name: 'the material of a job as --html-out', args: () => ['assess', '--job', 'job.json', '--html-out', './steel.json'], code: 2, message: /\.\/steel\.json: is an input of this run \(the same file as steel\.json\)/, left: BASE },
  { name: 'a hard link to the data file as output', args: (d) => { linkSync(join(d, 'data.csv'), join(d, 'link.csv')); return ['assess', 'data.csv', ...MODEL, '--json-out', 'link.csv']; }, code: 2, message: /link\.csv: is an input of this run \(the same file as data\.csv, through a hard link\)/, left: [...BASE, 'link.csv'], after: (d) => expect(readFileSync(join(d, 'link.csv'), 'utf8')).toBe(DATA) },
  { name: 'a path to the data file through a folder link', args: (d) => { symlinkSync('.', join(d, 'here')); return ['assess', 'data.csv', ...MODEL, '--json-out', 'here/data.csv']; }, code: 2, message: /here\/data\.csv: is an input of this run/, left: [...BASE, 'here'] },
  { name: 'standard input redirected from the file written', args: () => ['assess', '-', ...MODEL, '--json-out', 'data.csv'], stdinFile: 'data.csv', code: 2, message: /data\.csv: is an input of this run/, left: BASE },
  // all or nothing
  { name: 'a second output into a missing folder', args: () => ['assess', 'data.csv', ...MODEL, '--json-out', 'ok.json', '--html-out', 'nodir/x.html'], code: 2, message: /^loopwise assess: nodir\/x\.html: cannot write: the folder nodir does not exist$/, left: BASE },
  { name: 'a full device as the last output (ENOSPC)', args: () => ['assess', 'data.csv', ...MODEL, '--json-out', 'ok.json', '--cycles-out', 'ok.csv', '--html-out', '/dev/full'], code: 2, message: /^loopwise assess: \/dev\/full: cannot write: no space left on the device$/, left: BASE },
  { name: 'an unwritable folder (EACCES, run as nobody)', args: (d) => { mkdirSync(join(d, 'locked')); chmodSync(join(d, 'locked'), 0o555); return ['assess', 'data.csv', ...MODEL, '--json-out', 'ok.json', '--html-out', 'locked/x.html']; }, uid: 65534, code: 2, message: /^loopwise assess: locked\/x\.html: cannot write: permission denied$/, left: [...BASE, 'locked'] },
  { name: 'an unreadable data file (EACCES, run as nobody)', args: (d) => { chmodSync(join(d, 'data.csv'), 0o600); return ['assess', 'data.csv', ...MODEL, '--json-out', 'ok.json']; }, uid: 65534, code: 2, message: /^loopwise assess: data\.csv: cannot read the file: permission denied$/, left: BASE },
  { name: 'an output that is a folder', args: (d) => { mkdirSync(join(d, 'out')); return ['assess', 'data.csv', ...MODEL, '--json-out', 'ok.json', '--cycles-out', 'out']; }, code: 2, message: /out: is a folder, not an output file/, left: [...BASE, 'out'] },
  { name: 'two outputs naming one file', args: () => ['assess', 'data.csv', ...MODEL, '--json-out', 'r.out', '--html-out', './r.out'], code: 2, message: /\.\/r\.out: --html-out and --json-out name the same file/, left: BASE },
  { name: 'an error in the data leaves no output', args: (d) => { writeFileSync(join(d, 'bad.csv'), 'time,stress\n0,1\n1,x\n'); return ['assess', 'bad.csv', ...MODEL, '--json-out', 'ok.json', '--cycles-out', 'ok.csv']; }, code: 2, message: /^loopwise assess: bad\.csv, line 3, column 2 \("stress"\): non-numeric cell "x"$/, left: [...BASE, 'bad.csv'] },
  // special targets
  { name: 'a symbolic link as output is refused', args: (d) => { writeFileSync(join(d, 'real.json'), 'keep'); symlinkSync('real.json', join(d, 'alias.json')); return ['assess', 'data.csv', ...MODEL, '--json-out', 'alias.json']; }, code: 2, message: /alias\.json: is a symbolic link; loopwise does not write through links/, left: [...BASE, 'alias.json', 'real.json'], after: (d) => { expect(lstatSync(join(d, 'alias.json')).isSymbolicLink()).toBe(true); expect(readFileSync(join(d, 'real.json'), 'utf8')).toBe('keep'); } },
  { name: '/dev/null as output is written in place', args: () => ['assess', 'data.csv', ...MODEL, '--json-out', '/dev/null', '--cycles-out', 'c.csv'], code: 0, message: null, left: [...BASE, 'c.csv'], after: () => expect(statSync('/dev/null').isCharacterDevice()).toBe(true) },
  { name: '- as output writes the JSON to stdout, no summary', args: () => ['assess', 'data.csv', ...MODEL, '--json-out', '-'], code: 0, message: null, left: BASE, after: (_d, r) => expect(JSON.parse(r.stdout).format).toBe('loopwise-cli-report') },
  { name: '--json with an output to stdout', args: () => ['assess', 'data.csv', ...MODEL, '--json', '--cycles-out', '-'], code: 2, message: /--json: the report cannot go to standard output/, left: BASE },
  // strict job files
  { name: 'a misspelt notch field', args: (d) => { job(d, { notch: { kt: 2 } }); return ['assess', '--job', 'job.json']; }, code: 2, message: /^loopwise assess: job\.json: notch\.kt: unknown field 'kt' in notch; did you mean 'Kt'\?$/, left: BASE },
  { name: 'a misspelt channel field', args: (d) => { job(d, { channels: [{ colum: 'stress', quantity: 'stress', unit: 'MPa' }] }); return ['assess', '--job', 'job.json']; }, code: 2, message: /job\.json: channels\[0\]\.colum: unknown field 'colum' in channels\[0\]; did you mean 'column'\?/, left: BASE },
  { name: 'a misspelt event field', args: (d) => { job(d, { file: undefined, events: [{ name: 'a', file: 'data.csv', repeat: 3 }] }); return ['assess', '--job', 'job.json']; }, code: 2, message: /job\.json: events\[0\]\.repeat: unknown field 'repeat' in events\[0\]; did you mean 'repeats'\?/, left: BASE },
  { name: 'a misspelt top-level field', args: (d) => { job(d, { scatterFactr: 3 }); return ['assess', '--job', 'job.json']; }, code: 2, message: /job\.json: scatterFactr: unknown field 'scatterFactr' in the job; did you mean 'scatterFactor'\?/, left: BASE },
  { name: 'a null channel', args: (d) => { job(d, { channels: [null] }); return ['assess', '--job', 'job.json']; }, code: 2, message: /^loopwise assess: job\.json: channels\[0\]: expected an object, got null$/, left: BASE },
  { name: 'a number as file', args: (d) => { job(d, { file: 42 }); return ['assess', '--job', 'job.json']; }, code: 2, message: /^loopwise assess: job\.json: file: expected a string, got 42$/, left: BASE },
  { name: 'a string as Kt', args: (d) => { job(d, { notch: { Kt: '2' } }); return ['assess', '--job', 'job.json']; }, code: 2, message: /job\.json: notch\.Kt: expected a finite number, got "2"/, left: BASE },
  { name: 'an unknown mean-stress name', args: (d) => { job(d, { meanStress: 'smithWatsonToper' }); return ['assess', '--job', 'job.json']; }, code: 2, message: /job\.json: meanStress: must be one of .*; did you mean 'smithWatsonTopper'\?/, left: BASE },
  { name: 'a misspelt field of a material file', args: (d) => { writeFileSync(join(d, 'steel.json'), JSON.stringify({ ...STEEL, sigmaf: 1 })); return ['assess', '--job', 'job.json']; }, code: 2, message: /steel\.json: sigmaf: unknown field 'sigmaf' in the job; did you mean 'sigmaF'\?/, left: BASE },
  { name: 'invalid JSON is located, not quoted', args: (d) => { writeFileSync(join(d, 'job.json'), '{"format": "loopwise-job",\n "secret": TOPSECRET }'); return ['assess', '--job', 'job.json']; }, code: 2, message: /^loopwise assess: job\.json: invalid JSON in the job file at line 2, column \d+$/, left: BASE, after: (_d, r) => expect(r.stderr).not.toMatch(/TOPSECRET/) },
  { name: 'duplicate header names chosen by name', args: (d) => { writeFileSync(join(d, 'dup.csv'), 'stress,stress\n1,2\n3,4\n5,1\n'); return ['assess', 'dup.csv', ...MODEL]; }, code: 2, message: /dup\.csv, line 1: the header names 2 columns "stress" \(columns 1, 2\); choose one by its number/, left: [...BASE, 'dup.csv'] },
  { name: 'duplicate header names chosen by number', args: (d) => { writeFileSync(join(d, 'dup.csv'), 'stress,stress\n1,2\n3,400\n5,-100\n'); return ['assess', 'dup.csv', '--column', '2', '--material', 'steel.json', '--json-out', 'r.json']; }, code: 0, message: null, left: [...BASE, 'dup.csv', 'r.json'] },
  // untrusted job files
  { name: 'a job naming a file above its folder', args: (d) => { mkdirSync(join(d, 'jobs')); job(d, { file: '../data.csv', material: 'SAE 1045' }, 'jobs/j.json'); return ['assess', '--job', 'jobs/j.json']; }, code: 2, message: /^loopwise assess: jobs\/j\.json: file: "\.\.\/data\.csv" lies outside the job file's folder; a job reads such paths only when the command is given --job-may-read-anywhere$/, left: [...BASE, 'jobs'] },
  { name: 'a job naming /etc/passwd', args: (d) => { job(d, { file: '/etc/passwd' }); return ['assess', '--job', 'job.json']; }, code: 2, message: /job\.json: file: "\/etc\/passwd" lies outside the job file's folder/, left: BASE },
  { name: 'a job naming /proc/self/environ as its material', args: (d) => { job(d, { material: { file: '/proc/self/environ' } }); return ['assess', '--job', 'job.json']; }, code: 2, message: /job\.json: material\.file: "\/proc\/self\/environ" lies outside the job file's folder/, left: BASE },
  { name: 'a job reaching out through a link', args: (d) => { symlinkSync('/etc/passwd', join(d, 'inside.csv')); job(d, { file: 'inside.csv' }); return ['assess', '--job', 'job.json']; }, code: 2, message: /job\.json: file: "inside\.csv" leads outside the job file's folder through a link/, left: [...BASE, 'inside.csv'] },
  { name: 'an allowed outside file quotes a short sanitized excerpt', args: (d) => { writeFileSync(join(root, 'outside-secret.csv'), 'PASS\u202eWORD=hunter2hunter2hunter2hunter2\n'); job(d, { file: '../outside-secret.csv' }); return ['assess', '--job', 'job.json', '--job-may-read-anywhere']; }, code: 2, message: /unknown column "stress"; the columns are 1 "PASS\\u202eWORD=hunter2hunter2…"$/, left: BASE, after: (_d, r) => { expect(r.stderr).not.toMatch(/\u202e/); expect(r.stderr).not.toMatch(/hunter2hunter2hunter2hunter2/); } },
  { name: 'an allowed outside file is reported by the name the job gives', args: (d) => { writeFileSync(join(root, 'outside.csv'), DATA); job(d, { file: '../outside.csv' }); return ['assess', '--job', 'job.json', '--job-may-read-anywhere', '--json-out', 'r.json']; }, code: 0, message: null, left: [...BASE, 'r.json'], after: (d) => { const j = readFileSync(join(d, 'r.json'), 'utf8'); expect(JSON.parse(j).channels[0].sources[0].file).toBe('../outside.csv'); expect(j).not.toContain(root); } },
  { name: '--job-may-read-anywhere without a job', args: () => ['assess', 'data.csv', ...MODEL, '--job-may-read-anywhere'], code: 2, message: /--job-may-read-anywhere: only with --job/, left: BASE },
  // smaller items
  { name: 'CR-only line ends', args: (d) => { writeFileSync(join(d, 'mac.csv'), DATA.replace(/\n/g, '\r')); return ['assess', 'mac.csv', ...MODEL]; }, code: 2, message: /^loopwise assess: mac\.csv, line 1: the lines end in a carriage return alone \(old Mac text\)/, left: [...BASE, 'mac.csv'] },
  { name: 'CR-only line ends with --column 2', args: (d) => { writeFileSync(join(d, 'mac.csv'), DATA.replace(/\n/g, '\r')); return ['assess', 'mac.csv', '--column', '2', '--material', 'steel.json']; }, code: 2, message: /mac\.csv, line 1: the lines end in a carriage return alone/, left: [...BASE, 'mac.csv'] },
  { name: 'a number of 10^7 digits', args: (d) => { writeFileSync(join(d, 'huge.csv'), `time,stress\n0,1\n1,${'9'.repeat(1e7)}\n`); return ['assess', 'huge.csv', ...MODEL]; }, code: 2, message: /^loopwise assess: huge\.csv, line 3, column 2 \("stress"\): overflow: the number "9{24}…" \(10000000 characters\) lies beyond a double's range/, left: [...BASE, 'huge.csv'] },
  { name: 'standard input as the data file', args: () => ['assess', '-', ...MODEL, '--json-out', 'r.json'], input: () => DATA, code: 0, message: null, left: [...BASE, 'r.json'], after: (d) => expect(JSON.parse(readFileSync(join(d, 'r.json'), 'utf8')).channels[0].sources[0].file).toBe('standard input') },
  { name: 'a memory limit below the need is reported, not a crash', args: () => ['assess', 'data.csv', ...MODEL, '--memory-limit', '1', '--json-out', 'r.json'], code: 2, message: /^loopwise assess: the run reached \d+ MB of memory \(limit 1 MB, --memory-limit\) while reading data\.csv/, left: BASE },
  { name: 'a duty cycle above the memory limit is refused up front', args: (d) => { job(d, { file: undefined, events: [{ name: 'a', file: 'data.csv', repeats: 2 }] }); writeFileSync(join(d, 'data.csv'), DATA + DATA.split('\n').slice(1).join('\n').repeat(300)); return ['assess', '--job', 'job.json', '--memory-limit', '1']; }, code: 2, message: /data\.csv: a duty cycle holds every sample in memory: about .* MB .*above the limit of 1 MB/, left: BASE },
];

beforeAll(() => {
  expect(existsSync(bin), 'build the cli first (pnpm test does)').toBe(true);
  root = mkdtempSync(join(tmpdir(), 'loopwise-bad-input-'));
  chmodSync(root, 0o755); // the cases run as nobody read through it
});

afterAll(() => {
  // the folder stays for inspection only when a case failed; it lives under the system's tmp
});

describe('the bad-input table (issue 16): exit code, one line, files left', () => {
  for (const c of cases) {
    test(c.name, () => {
      const d = folder(c.name);
      chmodSync(d, 0o777);
      const args = c.args(d);
      const r = run(args, d, { input: c.input?.(d), stdinFile: c.stdinFile && join(d, c.stdinFile), uid: c.uid });
      expect(r.code, r.stderr).toBe(c.code);
      if (c.message === null) expect(r.stderr).toBe('');
      else {
        expect(r.stderr.endsWith('\n') && r.stderr.trim().split('\n').length === 1, r.stderr).toBe(true);
        expect(r.stderr.trim()).toMatch(c.message);
      }
      expect(readdirSync(d).sort()).toEqual([...c.left].sort());
      c.after?.(d, r);
    });
  }
  test('the table holds every case of the issue', () => {
    expect(cases.length).toBeGreaterThanOrEqual(40);
  });
});

describe('fileErrorOf(error, path, doing): system errors in plain words', () => {
  const table: [string, string][] = [
    ['EACCES', 'permission denied'],
    ['EROFS', 'the file system is read-only'],
    ['ENOSPC', 'no space left on the device'],
    ['EDQUOT', 'the disk quota is exhausted'],
    ['ENOENT', 'no such file or folder'],
    ['EIO', 'input/output error of the device'],
  ];
  for (const [code, words] of table) {
    test(`${code} becomes "${words}", code LW_FILE_${code}, exit 2`, () => {
      const e = fileErrorOf(Object.assign(new Error(`${code}: raw, open '/x/.y.tmp'`), { code }), 'out.json', 'write') as Error & { code: string };
      expect(e.message).toBe(`out.json: cannot write: ${words}`);
      expect(e.code).toBe(`LW_FILE_${code}`);
      expect(e.name).toBe('FileError');
    });
  }
});
