#!/usr/bin/env node
// Demo until the command-line tool lands: counts the bundled, INVENTED trailer-axle history
// (fixtures/demo/trailer-axle-fillet.csv) and prints its largest cycles and a range-mean matrix.
import { readFileSync } from 'node:fs';
import { RangeMeanMatrix, rainflow, rangeSpectrum } from '@loopwise/rainflow';

const file = new URL('../fixtures/demo/trailer-axle-fillet.csv', import.meta.url);
const text = readFileSync(file, 'utf8').split(/\r?\n/);
const values = [];
text.forEach((line, i) => {
  if (line === '' || line.startsWith('#') || line.startsWith('time_s')) return;
  const v = Number(line.split(',')[1]);
  if (!Number.isFinite(v)) throw new Error(`${file.pathname}:${i + 1}: column 2 is not a number: ${JSON.stringify(line)}`);
  values.push(v);
});
const history = Float64Array.from(values);

const matrix = new RangeMeanMatrix({ range: { count: 9, min: 0, max: 1800 }, mean: { count: 8, min: -200, max: 600 } });
const result = rainflow(history, { gateFraction: 0.02, residue: 'half' });
result.cycles.replayInto(matrix);
const c = result.cycles.columns();

const out = [];
out.push('loopwise demo: rainflow count of an INVENTED strain history (not a measurement)');
out.push('scenario: strain gauge at the shoulder fillet of a loaded utility-trailer axle, rough farm track, 60 s at 200 Hz');
out.push('');
out.push(`samples ${result.sampleCount}, turning points ${result.turningPointCount}, gate ${result.gate.toFixed(1)} µε (2 % of the largest range) removed ${result.removedReversals} reversals`);
out.push(`cycles: ${result.cycles.totalCount()} (full and half), residue of ${result.residue.values.length} turning points counted as half cycles (ASTM E1049-85 5.4.4)`);
out.push('');
out.push('largest ten cycles (µε):');
out.push('  range    mean     from      to   count  from sample  to sample');
const order = Array.from({ length: c.range.length }, (_, i) => i).sort((a, b) => c.range[b] - c.range[a]).slice(0, 10);
for (const i of order) {
  out.push(
    `${c.range[i].toFixed(1).padStart(7)} ${c.mean[i].toFixed(1).padStart(7)} ${c.from[i].toFixed(1).padStart(8)} ${c.to[i].toFixed(1).padStart(7)} ${String(c.count[i]).padStart(7)} ${String(c.startIndex[i]).padStart(12)} ${String(c.endIndex[i]).padStart(10)}`,
  );
}
out.push('');
out.push('range-mean matrix (cycles; rows: range bins in µε, columns: mean bins in µε):');
const head = ['range \\ mean'.padEnd(13)];
for (let j = 0; j < matrix.columns; j++) head.push(`${matrix.columnEdges[j]}..${matrix.columnEdges[j + 1]}`.padStart(10));
out.push(head.join(''));
for (let i = matrix.rows - 1; i >= 0; i--) {
  const row = [`${matrix.rowEdges[i]}..${matrix.rowEdges[i + 1]}`.padEnd(13)];
  for (let j = 0; j < matrix.columns; j++) {
    const v = matrix.at(i, j);
    row.push((v === 0 ? '.' : String(v)).padStart(10));
  }
  out.push(row.join(''));
}
out.push(`outside the bins: ${matrix.outside.count} cycles`);
const s = rangeSpectrum(result.cycles);
out.push('');
out.push(`range exceedance: ${s.exceedances[0]} cycle(s) at ${s.range[0].toFixed(1)} µε or more, ${s.exceedances[s.exceedances.length - 1]} at ${s.range[s.range.length - 1].toFixed(1)} µε or more`);
out.push('');
out.push('Caution: cycle counts are the first step of a fatigue estimate, not a life. Life estimates carry');
out.push('large scatter; validate by test, apply scatter factors, and follow the applicable design codes and');
out.push('licensed engineering review for safety-critical parts.');
console.log(out.join('\n'));
