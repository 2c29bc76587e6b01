// The page: the form, the worker that reads and assesses, what the result shows, and the exports.
import { designLifeText, formatNumber, repeatsText, unitLifeText, type JobFile } from '@loopwise/cli/browser';
import { ASSUMPTIONS, CAUTION } from '@loopwise/engine';
import { surveyColumns, type ColumnSurvey } from '@loopwise/ingest';
import { handbookSteels } from '@loopwise/material';
import { drawHistory, drawHysteresis, drawMatrix, drawTimeline, type HistoryView } from './plots';
import { dialectOf, FormError, jobFileOf, type FormText } from './pageJob';
import type { ChannelView, ExportKind, FromWorker, ToWorker } from './protocol';

const $ = <T extends HTMLElement = HTMLElement>(id: string) => document.getElementById(id) as T;
const form = $<HTMLFormElement>('job');
const status = $<HTMLOutputElement>('status');
const progress = $<HTMLProgressElement>('progress');
const runButton = $<HTMLButtonElement>('run');
const cancelButton = $<HTMLButtonElement>('cancel');

/** Bytes of the file's head that the column survey reads (as the command). */
const SURVEY_BYTES = 1 << 16;

/** The chosen files: one measured file, or the events of a duty cycle in order. */
let files: File[] = [];
let columns: ColumnSurvey[] = [];
let worker: Worker | null = null;
let lastJob: JobFile | null = null;
let shown: ChannelView | null = null;
let view: HistoryView = { from: 0, to: 1 };
let startedAt = 0;

// the caution and the assumptions, from the engine (the same words as every report)
$('caution-text').textContent = `${CAUTION} The page states what its model assumes; the result is an estimate, not a certificate.`;
for (const a of ASSUMPTIONS) {
  const li = document.createElement('li');
  li.textContent = a;
  $('assumptions').append(li);
}
for (const m of handbookSteels) {
  const o = new Option(m.name ?? '', m.name ?? '');
  if ((m.name ?? '').startsWith('SAE 1045')) o.selected = true;
  $<HTMLSelectElement>('handbook').add(o);
}

function setState(state: 'idle' | 'running' | 'done' | 'error' | 'cancelled', text: string): void {
  document.body.dataset.state = state;
  status.textContent = text;
  runButton.disabled = state === 'running';
  cancelButton.disabled = state !== 'running';
}

// ---- the file: pick, drop, survey its columns

async function takeFiles(list: File[]): Promise<void> {
  files = list;
  const f = list[0];
  eventRows(list);
  const head = new Uint8Array(await f.slice(0, SURVEY_BYTES).arrayBuffer());
  setState('idle', '');
  try {
    columns = surveyColumns(head, dialectOf(formText()) ?? {}, f.name).columns;
  } catch (error) {
    columns = [];
    setState('error', `${f.name}: ${(error as Error).message}`);
  }
  const mib = list.reduce((a, x) => a + x.size, 0) / 1048576;
  $('file-info').textContent = `${list.length === 1 ? f.name : `${list.length} files (${list.map((x) => x.name).join(', ')})`}: ${formatNumber(mib, 3)} MiB, ${columns.length} column${columns.length === 1 ? '' : 's'}${list.length > 1 ? ` (surveyed in ${f.name})` : ''}`;
  const time = $<HTMLSelectElement>('time');
  time.replaceChildren(new Option('none (sample index)', 'none'), new Option('a sample rate', 'rate'));
  for (const c of columns) if (c.increasing) time.add(new Option(`column ${columnText(c)}`, String(c.column)));
  // as the command: the one numeric column that is not a time base; a time-like increasing column is the time base
  const signal = columns.find((c) => c.numeric && !c.increasing && !c.timeLike) ?? columns.find((c) => c.numeric) ?? columns[0];
  const base = columns.find((c) => c.increasing && c.timeLike && c !== signal);
  time.value = base ? String(base.column) : 'none';
  channelRows(signal);
  showFields();
  if (document.body.dataset.state !== 'error') setState('idle', `Ready: ${list.length === 1 ? f.name : `a duty cycle of ${list.length} events`}. Choose the channels, material and model, then Assess.`);
}

function columnText(c: ColumnSurvey): string {
  return `${c.column}: ${c.name}${c.unit ? ` [${c.unit}]` : ''}`;
}

const UNITS: Record<string, [string, string][]> = {
  strain: [['microstrain', 'microstrain (µε)'], ['strain', 'strain (m/m)']],
  stress: [['MPa', 'MPa'], ['ksi', 'ksi']],
  load: [],
};

/** With several files, one row per event: its name (the file's, without the extension), repeats and service per repeat. */
function eventRows(list: File[]): void {
  $('events-set').hidden = list.length < 2;
  const body = $('events').querySelector('tbody') as HTMLTableSectionElement;
  body.replaceChildren();
  if (list.length < 2) return;
  list.forEach((f, k) => {
    const name = Object.assign(document.createElement('input'), { type: 'text', id: `event-name-${k}`, value: f.name.replace(/\.[^.]*$/, '') });
    name.setAttribute('aria-label', `Name of event ${k + 1} (file ${f.name})`);
    const repeats = Object.assign(document.createElement('input'), { type: 'number', step: 'any', min: '1', id: `event-repeats-${k}`, value: '1' });
    repeats.setAttribute('aria-label', `Repeats of event ${k + 1} in a row`);
    const duration = Object.assign(document.createElement('input'), { type: 'number', step: 'any', min: '0', id: `event-duration-${k}`, value: '' });
    duration.setAttribute('aria-label', `Service per repeat of event ${k + 1} (empty: none)`);
    const tr = document.createElement('tr');
    for (const input of [name, repeats, duration]) {
      const td = document.createElement('td');
      td.append(input);
      tr.append(td);
    }
    body.append(tr);
  });
}

/** One row per numeric column: assess it or not, its quantity and unit (preset from the file's unit), a factor for loads. */
function channelRows(signal: ColumnSurvey | undefined): void {
  const body = $('channels').querySelector('tbody') as HTMLTableSectionElement;
  body.replaceChildren();
  for (const c of columns.filter((x) => x.numeric || x === signal)) {
    const k = c.column;
    const tr = document.createElement('tr');
    const use = Object.assign(document.createElement('input'), { type: 'checkbox', id: `use-${k}`, checked: c === signal });
    const useLabel = Object.assign(document.createElement('label'), { htmlFor: `use-${k}`, textContent: columnText(c) });
    const quantity = Object.assign(document.createElement('select'), { id: `quantity-${k}` });
    quantity.setAttribute('aria-label', `Quantity of column ${columnText(c)}`);
    quantity.append(new Option('strain (gauge at the notch root)', 'strain'), new Option('stress (nominal; times Kt)', 'stress'), new Option('load (times a factor)', 'load'));
    const unit = Object.assign(document.createElement('select'), { id: `unit-${k}` });
    unit.setAttribute('aria-label', `Unit of column ${columnText(c)}`);
    const factor = Object.assign(document.createElement('input'), { type: 'number', step: 'any', id: `mpa-${k}`, value: '1', className: 'factor' });
    factor.setAttribute('aria-label', `Nominal stress in MPa per unit of load of column ${columnText(c)}`);
    const r = c.reading;
    quantity.value = r?.quantity === 'strain' || r?.quantity === 'stress' || r?.quantity === 'load' ? r.quantity : 'stress';
    const units = () => {
      unit.replaceChildren(...UNITS[quantity.value].map(([v, t]) => new Option(t, v)));
      unit.hidden = quantity.value === 'load';
      factor.hidden = quantity.value !== 'load';
    };
    units();
    if (r?.quantity === 'strain' || r?.quantity === 'stress') unit.value = r.unit;
    quantity.addEventListener('change', () => {
      units();
      showFields();
    });
    use.addEventListener('change', showFields);
    const cells = [[use, useLabel], [quantity], [unit, factor]].map((parts) => {
      const td = document.createElement('td');
      td.append(...parts);
      return td;
    });
    tr.append(...cells);
    body.append(tr);
  }
}

/** The mean-stress corrections of each route (the command's names). */
const CORRECTIONS: Record<string, [string, string][]> = {
  strain: [['smithWatsonTopper', 'Smith-Watson-Topper'], ['morrow', 'Morrow'], ['modifiedMorrow', 'modified Morrow'], ['walker', 'Walker'], ['none', 'none'], ['all', 'all, side by side']],
  stress: [['none', 'none'], ['goodman', 'Goodman'], ['gerber', 'Gerber'], ['morrow', 'Morrow (σf′)'], ['smithWatsonTopper', 'Smith-Watson-Topper'], ['walker', 'Walker (γ)'], ['iiw', 'IIW f(R)'], ['all', 'all, side by side']],
};
let shownRoute = '';

/** The quantities of the ticked columns. */
function chosenQuantities(): string[] {
  return [...document.querySelectorAll<HTMLInputElement>('#channels input[type=checkbox]')].filter((u) => u.checked).map((u) => $<HTMLSelectElement>(u.id.replace('use-', 'quantity-')).value);
}

function showFields(): void {
  const quantities = chosenQuantities();
  const route = $<HTMLSelectElement>('route').value;
  if (route !== shownRoute) {
    shownRoute = route;
    $<HTMLSelectElement>('mean-stress').replaceChildren(...CORRECTIONS[route].map(([v, t]) => new Option(t, v)));
  }
  for (const el of document.querySelectorAll<HTMLElement>('.stress-only')) el.hidden = route !== 'stress';
  for (const el of document.querySelectorAll<HTMLElement>('.strain-only')) el.hidden = route !== 'strain';
  $<HTMLFieldSetElement>('notch-set').disabled = quantities.length > 0 && quantities.every((q) => q === 'strain');
  for (const el of document.querySelectorAll<HTMLElement>('.rate-only')) el.hidden = $<HTMLSelectElement>('time').value !== 'rate';
  for (const el of document.querySelectorAll<HTMLElement>('.offset-given')) el.hidden = $<HTMLSelectElement>('subtract-offset').value !== 'given';
  const src = $<HTMLSelectElement>('material-source').value;
  for (const kind of ['handbook', 'constants', 'su', 'hardness']) for (const el of document.querySelectorAll<HTMLElement>(`.src-${kind}`)) el.hidden = kind !== src;
}

showFields();
$('file').addEventListener('change', () => {
  const list = [...($<HTMLInputElement>('file').files ?? [])];
  if (list.length > 0) void takeFiles(list);
});
for (const id of ['time', 'material-source', 'route', 'subtract-offset']) $(id).addEventListener('change', showFields);

// a material file (the command's `material --out`, or any JSON with the constants) fills the
// constants' fields; the job then carries them inline, as typed ones
const MATERIAL_FIELDS = ['E', 'sigmaF', 'b', 'epsilonF', 'c', 'K', 'n'] as const;
$('material-file').addEventListener('change', async () => {
  const input = $<HTMLInputElement>('material-file');
  const info = $('material-file-info');
  const file = input.files?.[0];
  if (!file) return;
  let m: Record<string, unknown>;
  try {
    m = JSON.parse(await file.text()) as Record<string, unknown>;
  } catch (e) {
    info.textContent = `${file.name}: not JSON (${(e as Error).message}); the constants are unchanged`;
    return;
  }
  const missing = MATERIAL_FIELDS.filter((k) => typeof m[k] !== 'number' || !Number.isFinite(m[k] as number));
  if (m === null || typeof m !== 'object' || missing.length > 0) {
    info.textContent = `${file.name}: no finite number for ${missing.join(', ')}; the constants are unchanged`;
    return;
  }
  for (const k of MATERIAL_FIELDS) $<HTMLInputElement>(`m-${k}`).value = String(m[k]);
  info.textContent = `Constants from ${file.name}${typeof m.name === 'string' ? ` (${m.name})` : ''}${typeof m.source === 'string' ? `; source: ${m.source}` : ''}`;
  document.body.dataset.materialFile = 'loaded';
});
// a layout part set by hand: survey the file again with it
for (const id of ['skip-lines', 'delimiter', 'decimal-mark', 'header-row', 'units-row'])
  $(id).addEventListener('change', () => {
    if (files.length > 0) void takeFiles(files).catch((error: unknown) => setState('error', error instanceof Error ? error.message : String(error)));
  });
const drop = $('drop');
drop.addEventListener('click', () => $('file').click());
drop.addEventListener('keydown', (e) => {
  if (e.key === 'Enter' || e.key === ' ') {
    e.preventDefault();
    $('file').click();
  }
});
drop.addEventListener('dragover', (e) => {
  e.preventDefault();
  drop.classList.add('over');
});
drop.addEventListener('dragleave', () => drop.classList.remove('over'));
drop.addEventListener('drop', (e) => {
  e.preventDefault();
  drop.classList.remove('over');
  const list = [...(e.dataTransfer?.files ?? [])];
  if (list.length > 0) void takeFiles(list);
});

// ---- the run, in a worker

function formText(): FormText {
  const out: FormText = {};
  for (const el of form.querySelectorAll<HTMLInputElement | HTMLSelectElement>('input, select')) {
    if (el.id) out[el.id] = el instanceof HTMLInputElement && el.type === 'checkbox' ? (el.checked ? 'yes' : '') : el.value;
  }
  return out;
}

function stopWorker(): void {
  worker?.terminate();
  worker = null;
}

form.addEventListener('submit', (e) => {
  e.preventDefault();
  for (const el of form.querySelectorAll('[aria-invalid]')) el.removeAttribute('aria-invalid');
  if (files.length === 0) {
    setState('error', 'Measured file: choose or drop a file first');
    $('drop').focus();
    return;
  }
  let job: JobFile;
  try {
    job = jobFileOf(formText(), files.map((f) => f.name));
  } catch (error) {
    if (error instanceof FormError) {
      setState('error', error.message);
      $(error.field).setAttribute('aria-invalid', 'true');
      $(error.field).focus();
      return;
    }
    throw error;
  }
  stopWorker();
  lastJob = job;
  startedAt = performance.now();
  progress.value = 0;
  setState('running', `Reading ${files.map((f) => f.name).join(', ')}…`);
  const w = new Worker(new URL('./worker.ts', import.meta.url), { type: 'module' });
  worker = w;
  w.onmessage = (m: MessageEvent<FromWorker>) => onWorker(m.data);
  w.onerror = (ev) => {
    ev.preventDefault();
    setState('error', `The assessment stopped: ${ev.message || 'the worker failed'}`);
    stopWorker();
  };
  w.postMessage({ kind: 'run', files, job } satisfies ToWorker);
});

cancelButton.addEventListener('click', () => {
  stopWorker();
  progress.value = 0;
  setState('cancelled', 'Cancelled: the assessment was stopped and its worker ended.');
});

function onWorker(m: FromWorker): void {
  if (m.kind === 'progress') {
    progress.value = m.fraction;
    setState('running', `Reading ${m.what}, pass ${m.read}: ${Math.round(100 * m.fraction)} %`);
  } else if (m.kind === 'error') {
    setState('error', m.message);
  } else if (m.kind === 'result') {
    document.body.dataset.resultAt = String(performance.now());
    progress.value = 1;
    const ms = performance.now() - startedAt;
    document.body.dataset.lastRunMs = String(ms);
    showResult(m.channels);
    setState('done', `Done in ${formatNumber(ms / 1000, 3)} s (worker ${formatNumber(m.seconds, 3)} s).`);
  } else {
    download(m.blob, m.name);
  }
}

// ---- the result

function el<K extends keyof HTMLElementTagNameMap>(tag: K, text?: string, cls?: string): HTMLElementTagNameMap[K] {
  const e = document.createElement(tag);
  if (text !== undefined) e.textContent = text;
  if (cls) e.className = cls;
  return e;
}

function showResult(channels: ChannelView[]): void {
  $('results').hidden = false;
  const warnings = $('warnings');
  warnings.replaceChildren();
  const all = channels.flatMap((c) => [...c.signalWarnings.map((w) => `${c.name} (signal): ${w.message}`), ...c.report.warnings.map((w) => `${c.name}: ${w.message}`)]);
  if (all.length > 0) {
    warnings.append(el('strong', `${all.length} warning${all.length === 1 ? '' : 's'}`));
    const ul = el('ul');
    for (const w of all) ul.append(el('li', w));
    warnings.append(ul);
  }
  const lives = $('lives');
  lives.replaceChildren();
  const corrections = $('corrections');
  corrections.replaceChildren();
  for (const c of channels) {
    const life = c.report.life;
    const box = el('div', undefined, 'life');
    box.append(el('h3', `${c.name} (${c.unit}), mean-stress correction ${c.report.damage.meanStress}`));
    const dl = el('dl');
    const row = (term: string, value: string, cls: string, exact: number) => {
      const dd = el('dd', value, cls);
      dd.dataset.value = String(exact);
      dl.append(el('dt', term), dd);
    };
    row('Life', `${repeatsText(life)} repeats${life.unit ? ` = ${unitLifeText(life)}` : ''}`, 'repeats', life.repeats);
    row('Design life', designLifeText(life), 'design', life.designRepeats);
    row('Damage per repeat', `${formatNumber(c.report.damage.perRepeat)} (first pass ${formatNumber(c.report.damage.firstPass)})`, 'damage', c.report.damage.perRepeat);
    box.append(dl);
    const fixed = el('div', undefined, 'signal-corrections');
    if (c.signalCorrections.length === 0) fixed.textContent = 'Corrections of the signal: none (the samples as measured)';
    else {
      fixed.append(el('strong', 'Corrections of the signal, in order: '));
      const ol = el('ol');
      for (const k of c.signalCorrections) {
        const li = el('li', k.summary);
        li.dataset.kind = k.kind;
        ol.append(li);
      }
      fixed.append(ol);
    }
    box.append(fixed);
    box.append(el('p', `Caution: ${CAUTION}`, 'caution'));
    lives.append(box);
    if (c.corrections) {
      const t = el('table');
      t.append(el('caption', 'All corrections side by side'));
      const head = el('tr');
      for (const h of ['correction', 'damage per repeat', 'life (repeats)', 'design life (repeats)']) head.append(el('th', h));
      t.append(head);
      for (const k of c.corrections) {
        const tr = el('tr');
        tr.append(el('td', k.meanStress), el('td', formatNumber(k.damagePerRepeat), 'num'), el('td', repeatsText(k.life), 'num'), el('td', formatNumber(k.life.designRepeats), 'num'));
        t.append(tr);
      }
      corrections.append(t, el('p', `Caution: ${CAUTION}`, 'caution'));
    }
  }
  resultChannels = channels;
  const pick = $<HTMLSelectElement>('shown-channel');
  pick.replaceChildren(...channels.map((c, k) => new Option(`${c.name} (${c.unit})`, String(k))));
  $('shown-channel-box').hidden = channels.length < 2;
  showChannel(0);
}

let resultChannels: ChannelView[] = [];

/** Shows channel `k` of the result in the plots and the worst-loops table. */
/** An SVG element from the report's SVG text (made by our own report code; every text in it escaped). */
function svgOf(text: string): Element {
  const doc = new DOMParser().parseFromString(text, 'image/svg+xml');
  const bad = doc.querySelector('parsererror');
  if (bad) throw new Error(`the S-N plot could not be read: ${bad.textContent ?? ''}`);
  return document.importNode(doc.documentElement, true);
}

function showChannel(k: number): void {
  shown = resultChannels[k] ?? null;
  view = { from: 0, to: shown?.values.length ?? 1 };
  $('history-note').textContent = shown
    ? `${formatNumber(shown.values.length)} samples, drawn as the smallest and largest sample of each pixel column. Bands: the five worst loops (start to turn), numbered by damage. Keys on the plot: ← → pan, + − zoom, Home whole history.`
    : '';
  // the stress-life route has no local strain: its S-N curve stands where the hysteresis loops do
  const sn = shown?.snCurve ?? null;
  $('sn-figure').hidden = sn === null;
  $('hysteresis-figure').hidden = sn !== null;
  $('sn').replaceChildren(...(sn === null ? [] : [svgOf(sn)]));
  const worst = $('worst');
  worst.replaceChildren();
  if (shown && shown.report.worstLoops.length > 0) {
    const t = el('table');
    t.append(el('caption', 'Worst loops'));
    const head = el('tr');
    const inFile = shown.worstInFile;
    for (const h of ['rank', inFile ? 'samples (kept, joined)' : 'samples', ...(inFile ? ['samples of the file'] : []), 'stress (MPa)', 'strain', 'share of damage']) head.append(el('th', h));
    t.append(head);
    shown.report.worstLoops.slice(0, 5).forEach((w, i) => {
      const tr = el('tr');
      tr.append(
        el('td', String(i + 1)),
        el('td', `${w.startIndex}–${w.turnIndex}`),
        ...(inFile ? [el('td', `${inFile[i].startIndex}–${inFile[i].turnIndex}${inFile[i].acrossCut ? ' (across a cut)' : ''}`)] : []),
        el('td', `${formatNumber(w.stressMin)} … ${formatNumber(w.stressMax)}`, 'num'),
        el('td', w.strainMin === null || w.strainMax === null ? '—' : `${formatNumber(w.strainMin)} … ${formatNumber(w.strainMax)}`, 'num'),
        el('td', `${formatNumber(100 * w.share, 3)} %`, 'num'),
      );
      t.append(tr);
    });
    worst.append(t);
  }
  const damage = $('event-damage');
  damage.replaceChildren();
  if (shown && shown.report.events.length > 1) {
    const t = el('table');
    t.append(el('caption', `Damage by event (${shown.name})`));
    const head = el('tr');
    for (const h of ['event', 'repeats', 'samples', 'damage per repeat of the schedule', 'share']) head.append(el('th', h));
    t.append(head);
    for (const e of shown.report.events) {
      const tr = el('tr');
      const share = el('td', undefined, 'num');
      const bar = el('span', undefined, 'share');
      bar.style.width = `${Math.round(120 * e.share)}px`;
      share.append(bar, document.createTextNode(`${formatNumber(100 * e.share, 3)} %`));
      tr.append(el('td', e.name), el('td', formatNumber(e.repeats), 'num'), el('td', formatNumber(e.samples), 'num'), el('td', formatNumber(e.damage), 'num'), share);
      t.append(tr);
    }
    damage.append(t);
  }
  redraw();
}

let frame = 0;
function redraw(): void {
  if (frame) return;
  frame = requestAnimationFrame(() => {
    frame = 0;
    if (!shown) return;
    const canvas = $<HTMLCanvasElement>('history');
    const t0 = performance.now();
    drawHistory(canvas, shown.values, shown.levels, view, shown.report.worstLoops, shown.unit, shown.sampleRate, shown.time, shown.eventStarts);
    // what is drawn and how long it took, for the tests and the benchmark
    canvas.dataset.from = String(view.from);
    canvas.dataset.to = String(view.to);
    canvas.dataset.drawMs = String(performance.now() - t0);
    drawMatrix($<HTMLCanvasElement>('matrix'), shown.matrix);
    drawTimeline($<HTMLCanvasElement>('timeline'), shown.report.timeline);
    drawHysteresis($<HTMLCanvasElement>('hysteresis'), shown.hysteresis, 'MPa');
  });
}
window.addEventListener('resize', redraw);
$('shown-channel').addEventListener('change', () => showChannel(Number($<HTMLSelectElement>('shown-channel').value)));

// ---- zoom and pan of the history

function zoom(factor: number, centre = 0.5): void {
  if (!shown) return;
  const n = shown.values.length;
  const span = view.to - view.from;
  const next = Math.max(Math.min(n, 10), Math.min(n, Math.round(span * factor)));
  const mid = view.from + centre * span;
  let from = Math.round(mid - centre * next);
  from = Math.max(0, Math.min(n - next, from));
  view = { from, to: from + next };
  redraw();
}

function pan(share: number): void {
  if (!shown) return;
  const n = shown.values.length;
  const span = view.to - view.from;
  const from = Math.max(0, Math.min(n - span, view.from + Math.round(share * span)));
  view = { from, to: from + span };
  redraw();
}

$('zoom-in').addEventListener('click', () => zoom(0.5));
$('zoom-out').addEventListener('click', () => zoom(2));
$('pan-left').addEventListener('click', () => pan(-0.5));
$('pan-right').addEventListener('click', () => pan(0.5));
$('zoom-reset').addEventListener('click', () => zoom(Infinity));
const history = $<HTMLCanvasElement>('history');
history.addEventListener('keydown', (e) => {
  const act: Record<string, () => void> = { ArrowLeft: () => pan(-0.25), ArrowRight: () => pan(0.25), '+': () => zoom(0.5), '=': () => zoom(0.5), '-': () => zoom(2), Home: () => zoom(Infinity) };
  const f = act[e.key];
  if (f) {
    e.preventDefault();
    f();
  }
});
history.addEventListener(
  'wheel',
  (e) => {
    e.preventDefault();
    const r = history.getBoundingClientRect();
    const centre = Math.max(0, Math.min(1, (e.clientX - r.left - 64) / Math.max(1, r.width - 76)));
    zoom(e.deltaY < 0 ? 0.8 : 1.25, centre);
  },
  { passive: false },
);
let dragFrom: { x: number; from: number } | null = null;
history.addEventListener('pointerdown', (e) => {
  dragFrom = { x: e.clientX, from: view.from };
  history.setPointerCapture(e.pointerId);
});
history.addEventListener('pointermove', (e) => {
  if (!dragFrom || !shown) return;
  const span = view.to - view.from;
  const perPixel = span / Math.max(1, history.clientWidth - 76);
  const from = Math.max(0, Math.min(shown.values.length - span, Math.round(dragFrom.from - (e.clientX - dragFrom.x) * perPixel)));
  view = { from, to: from + span };
  redraw();
});
history.addEventListener('pointerup', () => (dragFrom = null));

// ---- exports

function download(blob: Blob, name: string): void {
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 60_000);
}

function askExport(what: ExportKind): void {
  if (!worker) return setState('error', 'Exports: assess a file first');
  worker.postMessage({ kind: 'export', what } satisfies ToWorker);
}
$('export-json').addEventListener('click', () => askExport('json'));
$('export-csv').addEventListener('click', () => askExport('csv'));
$('export-html').addEventListener('click', () => askExport('html'));
$('export-job').addEventListener('click', () => {
  if (!lastJob) return setState('error', 'Job file: assess a file first');
  download(new Blob([JSON.stringify(lastJob, null, 2) + '\n'], { type: 'application/json' }), 'loopwise-job.json');
});

setState('idle', 'Choose or drop a measured file.');
