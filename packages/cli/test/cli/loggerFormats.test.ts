import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, test } from 'vitest';
import { cli } from './runCli';

// Issue 11, item 4 (logger formats), through the command in-process: a tab-delimited logger
// export with a two-line preamble, a header, a units row under it, decimal commas, a time column
// and two gauges in µε. The file is invented for the test (a 500 Hz record of two gauges on a
// bracket: sines, not a measurement).
let dir = '';


beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'loopwise-logger-'));
  const rows = ['Export of logger 17', 'Channels: 2; rate: 500 Hz', 'Zeit_s\tSG1_ue\tSG2_ue', 's\tµε\tµε'];
  for (let i = 0; i < 4000; i++) {
    const t = (i / 500).toFixed(3).replace('.', ',');
    const a = (900 * Math.sin(i / 13.7) + 250 * Math.sin(i / 3.1)).toFixed(1).replace('.', ',');
    const b = (600 * Math.sin(i / 9.3)).toFixed(1).replace('.', ',');
    rows.push(`${t}\t${a}\t${b}`);
  }
  writeFileSync(join(dir, 'bracket_run.txt'), rows.join('\r\n') + '\r\n');
  const one = ['time;SG1'];
  for (let i = 0; i < 2000; i++) one.push(`${(i / 100).toFixed(2).replace('.', ',')};${(300 * Math.sin(i / 7.7)).toFixed(2).replace('.', ',')}`);
  writeFileSync(join(dir, 'one.csv'), one.join('\n') + '\n');
});

const MODEL = ['--material', 'SAE 1045', '--kt', '1.6'];

describe('loopwise reads a logger export with a preamble, a header and a units row', () => {
  test('without --column it refuses to guess between the two gauges and lists them; the time column is never offered', async () => {
    const r = await cli(['assess', join(dir, 'bracket_run.txt'), '--skip-lines', '2', ...MODEL]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('has 2 columns that could be the signal: 2 "SG1_ue" (µε), 3 "SG2_ue" (µε); choose with --column');
    expect(r.stderr).not.toContain('Zeit_s');
  });

  test('with --column, the unit comes from the units row and the time base from the time column, and the summary says so', async () => {
    const r = await cli(['assess', join(dir, 'bracket_run.txt'), '--skip-lines', '2', '--column', 'SG1_ue', ...MODEL]);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('input: column 2 "SG1_ue" (µε): strain in microstrain, from the file\'s unit "µε"');
    expect(r.stdout).toContain('input: time base: column 1 "Zeit_s" (s), by its unit');
    expect(r.stdout).toMatch(/read {19}\S+bracket_run\.txt: 4000 rows, tab-delimited, decimal comma, header on line 3, units row on line 4, 2 lines skipped by option, CRLF, all detected, fast reader/);
    // the same life as with every part given by hand
    const explicit = await cli(['assess', join(dir, 'bracket_run.txt'), '--skip-lines', '2', '--delimiter', 'tab', '--decimal-mark', 'comma', '--header-row', 'yes', '--units-row', 'yes', '--column', '2', '--quantity', 'strain', '--unit', 'microstrain', '--time-column', '1', ...MODEL, '--json']);
    expect(explicit.code).toBe(0);
    const auto = await cli(['assess', join(dir, 'bracket_run.txt'), '--skip-lines', '2', '--column', 'SG1_ue', ...MODEL, '--json']);
    const damage = (text: string) => JSON.parse(text).channels[0].report.damage.perRepeat;
    expect(damage(auto.stdout)).toBe(damage(explicit.stdout));
    expect(damage(auto.stdout)).toBeGreaterThan(0);
  });

  test('a unit given against the units row is an error naming the column', async () => {
    const r = await cli(['assess', join(dir, 'bracket_run.txt'), '--skip-lines', '2', '--column', 'SG1_ue', '--quantity', 'strain', '--unit', 'strain', ...MODEL]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('--unit: column 2 "SG1_ue" (µε) is in µε by the file (strain in microstrain), not strain in strain');
  });

  test('without the preamble skipped, the layout options say what is wrong instead of a parse error deep in the file', async () => {
    const r = await cli(['assess', join(dir, 'bracket_run.txt'), '--column', 'SG1_ue', ...MODEL]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('unknown column "SG1_ue": the file has no header');
    expect(r.stderr).toContain('skip those (dialect.skipLines; --skip-lines on the command line)');
  });

  test('one signal column beside a time column is chosen by itself, with a note', async () => {
    const r = await cli(['assess', join(dir, 'one.csv'), ...MODEL]);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('input: column 2 "SG1" assessed: the only numeric column that is not a time base');
    expect(r.stdout).toContain('input: column 2 "SG1": no unit in the file or the options; read as stress in MPa');
    expect(r.stdout).toContain('input: time base: column 1 "time", by its name');
  });

  test('bad layout options name the option', async () => {
    expect((await cli(['assess', join(dir, 'one.csv'), '--skip-lines=-1', ...MODEL])).stderr).toContain('--skip-lines: a whole number of lines, got "-1"');
    expect((await cli(['assess', join(dir, 'one.csv'), '--delimiter', 'pipe', ...MODEL])).stderr).toContain('--delimiter: one of comma, semicolon, tab, whitespace, got "pipe"');
    expect((await cli(['assess', join(dir, 'one.csv'), '--units-row', 'maybe', ...MODEL])).stderr).toContain('--units-row: yes or no, got "maybe"');
    expect((await cli(['assess', join(dir, 'one.csv'), '--decimal-mark', ',', ...MODEL])).code).toBe(2);
  });

  test('a job file carries the layout as "dialect", checked field by field', async () => {
    const job = { format: 'loopwise-job', version: 1, material: 'SAE 1045', notch: { Kt: 1.6 }, file: 'bracket_run.txt', dialect: { skipLines: 2 }, channels: [{ column: 'SG1_ue', quantity: 'strain', unit: 'microstrain' }] };
    writeFileSync(join(dir, 'job.json'), JSON.stringify(job));
    const r = await cli(['assess', '--job', join(dir, 'job.json'), '--json']);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    writeFileSync(join(dir, 'bad.json'), JSON.stringify({ ...job, dialect: { skipLine: 2 } }));
    const bad = await cli(['assess', '--job', join(dir, 'bad.json')]);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toContain('dialect.skipLine');
  });
});
