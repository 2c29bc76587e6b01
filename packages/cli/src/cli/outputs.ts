import type { LifeReport } from '@loopwise/engine';
import { CAUTION } from '@loopwise/engine';
import { describeDialect, MICROSTRAIN_PER_STRAIN } from '@loopwise/ingest';
import type { ChannelResult } from './assessStream';
import { formatCount, formatNumber } from '../report/formatNumber.js';
import { loopPlaceText } from '../report/loopPlace.js';
import { loopInFile } from '../report/cutNumbering.js';
import { timeText } from './timeBase';
import { cyclesCsvRow } from './cyclesCsvRow';
import { signalWarningsOf } from './renderChannelsHtml';
import type { OutputSink } from './OutputSet';

/** Version of the JSON report format written by `--json` (documented in the CLI README). */
export const JSON_REPORT_VERSION = 1;

/** One row of the results table: a channel under one correction. */
export interface ResultRow {
  channel: string;
  meanStress: string;
  damagePerRepeat: number;
  repeats: number;
  designRepeats: number;
  unit: string | null;
  service: number | null;
  designService: number | null;
}

/** The results table of all channels (and all corrections when compared). */
export function resultRows(results: ChannelResult[]): ResultRow[] {
  const rows: ResultRow[] = [];
  for (const r of results) {
    const list = r.corrections ?? [{ meanStress: r.report.damage.meanStress, damagePerRepeat: r.report.damage.perRepeat, life: r.report.life }];
    for (const c of list) {
      rows.push({
        channel: r.name,
        meanStress: c.meanStress,
        damagePerRepeat: c.damagePerRepeat,
        repeats: c.life.repeats,
        designRepeats: c.life.designRepeats,
        unit: c.life.unit ?? null,
        service: c.life.service ?? null,
        designService: c.life.designService ?? null,
      });
    }
  }
  return rows;
}

/** JSON with typed arrays as arrays and non-finite numbers as strings (JSON has no Infinity). */
export function stableJson(value: unknown): string {
  return JSON.stringify(
    value,
    (_key, v) => {
      if (ArrayBuffer.isView(v) && !(v instanceof DataView)) return Array.from(v as unknown as ArrayLike<number>, finiteOrText);
      if (typeof v === 'number') return finiteOrText(v);
      return v;
    },
    2,
  );
}

function finiteOrText(x: number): number | string {
  if (Number.isFinite(x)) return Object.is(x, -0) ? 0 : x;
  return x !== x ? 'NaN' : x > 0 ? 'Infinity' : '-Infinity';
}

/** The `--json` document: versioned, deterministic (no dates), byte-identical for the same input. */
export function jsonReport(command: string, tool: string, results: ChannelResult[]): string {
  return (
    stableJson({
      format: 'loopwise-cli-report',
      version: JSON_REPORT_VERSION,
      tool,
      command,
      results: resultRows(results),
      channels: results.map((r) => ({
        name: r.name,
        unit: r.unit,
        sources: r.sources.map((s) => ({
          file: s.file,
          samples: s.samples,
          reader: s.reader,
          delimiter: s.dialect.delimiter,
          header: s.dialect.header,
          layout: describeDialect(s.dialect),
          channels: s.channels.map((c) => ({ name: c.name, column: c.column, conversion: c.conversion.statement })),
          warnings: s.warnings.map((w) => w.message),
        })),
        corrections: r.corrections,
        signalCorrections: r.signalCorrections.map(correctionJson),
        ...(r.artefactStudy ? { artefactStudy: r.artefactStudy } : {}),
        // after a cut, the worst loops (in the report's order) in the file's sample numbers
        ...(r.cutOut !== undefined && r.cutOut.length > 0 ? { worstLoopsInFile: r.report.worstLoops.map((w) => { const f = loopInFile(w, r.cutOut as Float64Array); return { startSample: f.startIndex, turnSample: f.turnIndex, acrossCut: f.acrossCut }; }) } : {}),
        report: r.report,
      })),
      // every channel's warnings in one list: about the measured signal, then the assessment's
      warnings: results.flatMap((r) => [
        ...signalWarningsOf(r).map((w) => ({ channel: r.name, source: 'signal', code: w.kind, message: w.message })),
        ...r.report.warnings.map((w) => ({ channel: r.name, source: 'assessment', code: w.code, message: w.message })),
      ]),
      caution: CAUTION,
    }) + '\n'
  );
}

/** A correction record for the JSON report (and count's summary): its kind, one line, the samples it touched, its settings and places (sample number and length of each). */
export function correctionJson(c: ChannelResult['signalCorrections'][number]): { kind: string; summary: string; samples: number; parameters: Readonly<Record<string, number | string>>; places: { first: number; length: number }[] } {
  return { kind: c.kind, summary: c.summary, samples: c.samples, parameters: c.parameters, places: Array.from(c.first, (first, k) => ({ first, length: c.length[k] })) };
}

/** A worst loop's local strains for the summary: in µε for a microstrain channel, else as strain; empty on the stress-life route. */
function strainText(w: LifeReport['worstLoops'][number], unit: string): string {
  if (w.strainMin === null || w.strainMax === null) return '';
  const k = unit === 'µε' ? MICROSTRAIN_PER_STRAIN : 1;
  return `, ε ${formatNumber(w.strainMin * k)} … ${formatNumber(w.strainMax * k)}${k === 1 ? '' : ' µε'}`;
}

/** The header of the cycles CSV. */
export const CYCLES_CSV_HEADER = [
  'channel', 'start_sample', 'turn_sample', 'close_sample', 'start_event', 'turn_event', 'count', 'stress_max', 'stress_min',
  'strain_max', 'strain_min', 'damage_parameter', 'cycles_to_failure', 'damage_per_repeat',
].join(',');

/** Rows of the cycles CSV per piece handed to the sink (bounded memory whatever the table). */
const CSV_ROWS_PER_PIECE = 8192;

/**
 * Writes the cycles CSV: one row per counted loop of every channel (its loop table, kept for
 * this output), with its local values and damage, a piece of rows at a time.
 */
export async function writeCyclesCsv(results: ChannelResult[], sink: OutputSink): Promise<void> {
  await sink.write(CYCLES_CSV_HEADER + '\n');
  for (const r of results) {
    if (r.loopStream) {
      await r.loopStream.copyTo(sink, `${csvText(r.name)},`);
      continue;
    }
    const l = r.loops;
    if (l === null) continue;
    const events = (r.report.inputs.events as { name: string }[]).map((e) => csvText(e.name));
    const name = csvText(r.name);
    const n = l.count.length;
    for (let from = 0; from < n; from += CSV_ROWS_PER_PIECE) {
      const lines: string[] = [];
      for (let i = from; i < Math.min(n, from + CSV_ROWS_PER_PIECE); i++) lines.push(`${name},${cyclesCsvRow(l, i, events)}`);
      await sink.write(lines.join('\n') + '\n');
    }
  }
}

function csvText(s: string): string {
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** The human summary on stdout. */
export function summaryText(results: ChannelResult[], title: string | null): string {
  const out: string[] = [];
  if (title) out.push(title, '');
  for (const r of results) {
    const rep: LifeReport = r.report;
    const life = rep.life;
    out.push(`channel ${r.name} (${r.unit}), mean-stress correction ${rep.damage.meanStress}`);
    for (const src of r.sources) out.push(`  read                   ${src.file}: ${src.samples} rows, ${describeDialect(src.dialect)}, ${src.reader} reader`);
    if (r.signalCorrections.length > 0) for (const c of r.signalCorrections) out.push(`  corrected              ${c.summary}`);
    else out.push('  corrected              none: the samples as measured');
    const mat = rep.inputs.material as { name?: string } | null | undefined;
    if (rep.damage.route !== 'stress-life' && mat) out.push(`  material               ${mat.name ?? '(own constants, unnamed)'}`);
    if (rep.damage.route === 'stress-life') out.push(`  route                  stress-life, S-N curve ${r.curveLabel ?? '(given)'} (cycles on the curve; no local strain)`);
    out.push(`  damage per repeat      ${formatNumber(rep.damage.perRepeat)} (first pass ${formatNumber(rep.damage.firstPass)})`);
    out.push(`  life                   ${formatNumber(life.repeats)} repeats${life.unit ? ` = ${formatNumber(life.service as number)} ${life.unit}` : ''}`);
    if (life.scatterFactor > 1) {
      out.push(`  ${`design life (÷${life.scatterFactor})`.padEnd(22)} ${formatNumber(life.designRepeats)} repeats${life.unit ? ` = ${formatNumber(life.designService as number)} ${life.unit}` : ''}`);
    }
    const events = [...rep.events].sort((a, b) => b.damage - a.damage).slice(0, 5);
    if (rep.events.length > 1) {
      out.push('  worst events');
      for (const e of events) out.push(`    ${e.name.padEnd(20)} ${formatNumber(100 * e.share, 3).padStart(6)} % of the damage (${e.repeats} repeats)`);
    }
    const worst = rep.worstLoops.slice(0, 3);
    if (worst.length > 0) {
      out.push('  worst loops');
      const cut = r.cutOut !== undefined && r.cutOut.length > 0 ? r.cutOut : null;
      if (cut !== null) out.push("    (samples of the file; the history assessed is joined across the cuts)");
      for (const w of worst) {
        const perRepeat = rep.events.length > 1 && w.count !== 1 ? `, ${formatCount(w.count)} per repeat` : '';
        // after a cut: the file's sample numbers (and so its times), and whether the loop spans a cut
        const f = cut !== null ? loopInFile(w, cut) : null;
        const at = f ?? w;
        const across = f?.acrossCut ? ', across a cut' : '';
        out.push(
          `    ${loopPlaceText(at, rep.events)}${perRepeat}${r.timeBase ? ` (t ${at.startIndex < 0 ? 'start' : timeText(r.timeBase, at.startIndex)} – ${timeText(r.timeBase, at.turnIndex)}${across})` : across ? ` (${across.slice(2)})` : ''}: σ ${formatNumber(w.stressMin)} … ${formatNumber(w.stressMax)} MPa${strainText(w, r.unit)}, ${formatNumber(100 * w.share, 3)} % of the damage`,
        );
      }
    }
    for (const w of signalWarningsOf(r)) out.push(`  warning (signal): ${w.message}`);
    for (const w of rep.warnings) out.push(`  warning: ${w.message}`);
    if (r.corrections) {
      out.push('  all corrections');
      for (const c of r.corrections) out.push(`    ${c.meanStress.padEnd(18)} ${formatNumber(c.life.repeats)} repeats`);
    }
    out.push('');
  }
  out.push(`Caution: ${CAUTION}`);
  return out.join('\n') + '\n';
}
