import { formatNumber, type HtmlMatrix } from '@loopwise/cli/browser';
import type { WorstLoop } from '@loopwise/engine';
import { envelopeInto, type EnvelopeLevel } from './envelope';

/** Margins of every plot, CSS pixels. */
const M = { left: 64, right: 12, top: 10, bottom: 30 };
const INK = '#1b1f24';
const MUTED = '#5b636e';
const LINE = '#0b5cad';
const MARK = 'rgba(214, 96, 0, 0.10)';
const MARK_EDGE = '#b34d00';

/** Sizes the canvas's bitmap to its CSS box at the device's pixel ratio; returns the context in CSS pixels. */
function prepare(canvas: HTMLCanvasElement): { g: CanvasRenderingContext2D; w: number; h: number } {
  const ratio = window.devicePixelRatio || 1;
  const w = Math.max(50, canvas.clientWidth);
  const h = Math.max(50, canvas.clientHeight);
  if (canvas.width !== Math.round(w * ratio) || canvas.height !== Math.round(h * ratio)) {
    canvas.width = Math.round(w * ratio);
    canvas.height = Math.round(h * ratio);
  }
  const g = canvas.getContext('2d') as CanvasRenderingContext2D;
  g.setTransform(ratio, 0, 0, ratio, 0, 0);
  g.clearRect(0, 0, w, h);
  g.font = '12px system-ui, sans-serif';
  return { g, w, h };
}

function axes(g: CanvasRenderingContext2D, w: number, h: number, x: [string, string, string], y: [string, string, string]): void {
  g.strokeStyle = MUTED;
  g.lineWidth = 1;
  g.strokeRect(M.left + 0.5, M.top + 0.5, w - M.left - M.right, h - M.top - M.bottom);
  g.fillStyle = INK;
  g.textBaseline = 'top';
  g.textAlign = 'left';
  g.fillText(x[0], M.left, h - M.bottom + 4);
  g.textAlign = 'right';
  g.fillText(x[1], w - M.right, h - M.bottom + 4);
  g.textAlign = 'center';
  g.fillStyle = MUTED;
  g.fillText(x[2], (M.left + w - M.right) / 2, h - M.bottom + 14);
  g.fillStyle = INK;
  g.textAlign = 'right';
  g.textBaseline = 'top';
  g.fillText(y[1], M.left - 4, M.top);
  g.textBaseline = 'bottom';
  g.fillText(y[0], M.left - 4, h - M.bottom);
  g.save();
  g.translate(12, (M.top + h - M.bottom) / 2);
  g.rotate(-Math.PI / 2);
  g.textAlign = 'center';
  g.textBaseline = 'top';
  g.fillStyle = MUTED;
  g.fillText(y[2], 0, -8);
  g.restore();
}

/** A view of the history: samples `[from, to)`. */
export interface HistoryView {
  from: number;
  to: number;
}

/**
 * Draws samples `[view.from, view.to)` of a history as its min/max envelope per pixel column,
 * with the worst loops marked (a band from the loop's start to its turn, numbered by rank).
 */
export function drawHistory(canvas: HTMLCanvasElement, values: Float32Array, levels: EnvelopeLevel[], view: HistoryView, worst: readonly WorstLoop[], unit: string, sampleRate: number | null, time: Float64Array | null, events: readonly { name: string; start: number }[] = []): void {
  const { g, w, h } = prepare(canvas);
  const pw = Math.max(1, Math.floor(w - M.left - M.right));
  const ph = h - M.top - M.bottom;
  const n = Math.max(1, Math.min(pw, view.to - view.from));
  const lo = new Float32Array(n);
  const hi = new Float32Array(n);
  envelopeInto(values, levels, view.from, view.to, n, lo, hi);
  let ymin = Infinity;
  let ymax = -Infinity;
  for (let p = 0; p < n; p++) {
    if (lo[p] < ymin) ymin = lo[p];
    if (hi[p] > ymax) ymax = hi[p];
  }
  if (!(ymax > ymin)) {
    ymin -= 1;
    ymax += 1;
  }
  const pad = 0.04 * (ymax - ymin);
  ymin -= pad;
  ymax += pad;
  const X = (i: number) => M.left + ((i - view.from) / (view.to - view.from)) * pw;
  const Y = (v: number) => M.top + (1 - (v - ymin) / (ymax - ymin)) * ph;
  // the worst loops, under the signal
  g.save();
  g.beginPath();
  g.rect(M.left, M.top, pw, ph);
  g.clip();
  worst.slice(0, 5).forEach((l, rank) => {
    const spans: [number, number][] = l.startIndex <= l.turnIndex ? [[Math.max(0, l.startIndex), l.turnIndex]] : [[l.startIndex, values.length - 1], [0, l.turnIndex]];
    for (const [a, b] of spans) {
      if (b < view.from || a >= view.to) continue;
      const xa = X(a);
      const xb = Math.max(xa + 2, X(b + 1));
      g.fillStyle = MARK;
      g.fillRect(xa, M.top, xb - xa, ph);
      // the loop's start and turn: lines with the rank
      g.fillStyle = MARK_EDGE;
      g.fillRect(xa - 1, M.top, 2, ph);
      g.fillRect(xb - 1, M.top, 2, ph);
      g.textAlign = 'left';
      g.textBaseline = 'top';
      g.fillText(String(rank + 1), xa + 3, M.top + 2 + 12 * rank);
    }
  });
  // the events of a duty cycle: a line where each starts, with its name
  if (events.length > 1) {
    g.fillStyle = MUTED;
    g.textAlign = 'left';
    g.textBaseline = 'bottom';
    for (const e of events) {
      if (e.start < view.from || e.start >= view.to) continue;
      const x = X(e.start);
      g.fillRect(x, M.top, 1, ph);
      g.fillText(e.name, x + 3, M.top + ph - 2);
    }
  }
  g.strokeStyle = LINE;
  g.fillStyle = LINE;
  g.lineWidth = 1;
  if (n === pw || view.to - view.from > pw) {
    for (let p = 0; p < n; p++) {
      const x = M.left + p * (pw / n);
      const y0 = Y(hi[p]);
      const y1 = Y(lo[p]);
      g.fillRect(x, y0, Math.max(1, pw / n), Math.max(1, y1 - y0));
    }
  } else {
    // fewer samples than pixels: a line through the samples
    g.beginPath();
    for (let i = view.from; i < view.to; i++) {
      const x = X(i + 0.5);
      if (i === view.from) g.moveTo(x, Y(values[i]));
      else g.lineTo(x, Y(values[i]));
    }
    g.stroke();
  }
  g.restore();
  const at = (i: number) => (time ? `${formatNumber(time[i])} s` : sampleRate ? `${formatNumber(i / sampleRate)} s` : `sample ${i}`);
  const xLabel = time ? 'time (from the time column)' : sampleRate ? 'time (from the sample rate)' : 'sample index';
  axes(g, w, h, [at(view.from), at(view.to - 1), xLabel], [formatNumber(ymin), formatNumber(ymax), unit]);
}

/** The colour of a share 0…1 of the largest count (light to dark blue). */
function shade(share: number): string {
  const t = Math.max(0, Math.min(1, share));
  const r = Math.round(235 - t * (235 - 8));
  const gg = Math.round(243 - t * (243 - 48));
  const b = Math.round(251 - t * (251 - 107));
  return `rgb(${r},${gg},${b})`;
}

/** Draws the range-mean matrix of the loops (the HTML report's): cells shaded by log count. */
export function drawMatrix(canvas: HTMLCanvasElement, m: HtmlMatrix | null): void {
  const { g, w, h } = prepare(canvas);
  if (m === null) {
    g.fillStyle = MUTED;
    g.fillText('no loops were counted', M.left, M.top + 14);
    return;
  }
  const rows = m.rowEdges.length - 1;
  const cols = m.columnEdges.length - 1;
  const pw = w - M.left - M.right;
  const ph = h - M.top - M.bottom;
  let most = 0;
  for (const c of m.counts) most = Math.max(most, c);
  for (let i = 0; i < rows; i++) {
    for (let j = 0; j < cols; j++) {
      const c = m.counts[i * cols + j];
      if (!(c > 0)) continue;
      g.fillStyle = shade(0.15 + (0.85 * Math.log1p(c)) / Math.log1p(most));
      const x = M.left + (j / cols) * pw;
      const y = M.top + (1 - (i + 1) / rows) * ph;
      g.fillRect(x, y, pw / cols + 0.5, ph / rows + 0.5);
    }
  }
  axes(g, w, h, [formatNumber(m.columnEdges[0]), formatNumber(m.columnEdges[cols]), m.columnLabel], [formatNumber(m.rowEdges[0]), formatNumber(m.rowEdges[rows]), m.rowLabel]);
}

/** Draws the damage timeline: damage per repeat of each bin of samples, as bars. */
export function drawTimeline(canvas: HTMLCanvasElement, timeline: { binSize: number; samples: number; damage: ArrayLike<number> }): void {
  const { g, w, h } = prepare(canvas);
  const n = timeline.damage.length;
  const pw = w - M.left - M.right;
  const ph = h - M.top - M.bottom;
  let most = 0;
  for (let i = 0; i < n; i++) most = Math.max(most, timeline.damage[i]);
  g.fillStyle = LINE;
  if (most > 0) {
    for (let i = 0; i < n; i++) {
      const d = timeline.damage[i];
      if (!(d > 0)) continue;
      const bh = (d / most) * ph;
      g.fillRect(M.left + (i / n) * pw, M.top + ph - bh, Math.max(1, pw / n - 0.5), bh);
    }
  }
  axes(g, w, h, ['sample 0', `sample ${timeline.samples}`, `bins of ${timeline.binSize} samples`], ['0', formatNumber(most), 'damage per bin']);
}

/** Colours of the ranks 1 … 5 (distinct in colour and lightness). */
const RANK_COLOURS = ['#b34d00', '#0b5cad', '#2e7d32', '#7b1fa2', '#5b636e'];

/**
 * Draws the hysteresis loops of the worst cycles in local stress against local strain (µε): the
 * report's corners joined by Masing branches of the cyclic curve (the HTML report's loops).
 */
export function drawHysteresis(canvas: HTMLCanvasElement, loops: { strain: Float64Array; stress: Float64Array; share: number }[] | null, stressUnit: string): void {
  const { g, w, h } = prepare(canvas);
  if (loops === null || loops.length === 0) {
    g.fillStyle = MUTED;
    g.fillText(loops === null ? 'no local strain on this route: no hysteresis loops' : 'no closed loops', M.left, M.top + 14);
    return;
  }
  let e0 = Infinity;
  let e1 = -Infinity;
  let s0 = Infinity;
  let s1 = -Infinity;
  for (const l of loops)
    for (let i = 0; i < l.strain.length; i++) {
      e0 = Math.min(e0, l.strain[i] * 1e6);
      e1 = Math.max(e1, l.strain[i] * 1e6);
      s0 = Math.min(s0, l.stress[i]);
      s1 = Math.max(s1, l.stress[i]);
    }
  const pe = 0.05 * (e1 - e0 || 1);
  const ps = 0.05 * (s1 - s0 || 1);
  e0 -= pe;
  e1 += pe;
  s0 -= ps;
  s1 += ps;
  const pw = w - M.left - M.right;
  const ph = h - M.top - M.bottom;
  const X = (e: number) => M.left + ((e * 1e6 - e0) / (e1 - e0)) * pw;
  const Y = (s: number) => M.top + (1 - (s - s0) / (s1 - s0)) * ph;
  // the worst loop last, on top
  for (let k = loops.length - 1; k >= 0; k--) {
    const l = loops[k];
    g.strokeStyle = RANK_COLOURS[k % RANK_COLOURS.length];
    g.lineWidth = k === 0 ? 2.5 : 1.5;
    g.beginPath();
    for (let i = 0; i < l.strain.length; i++) {
      if (i === 0) g.moveTo(X(l.strain[i]), Y(l.stress[i]));
      else g.lineTo(X(l.strain[i]), Y(l.stress[i]));
    }
    g.closePath();
    g.stroke();
    g.fillStyle = g.strokeStyle;
    g.textAlign = 'left';
    g.textBaseline = 'top';
    g.fillText(`${k + 1}: ${formatNumber(100 * l.share, 3)} %`, M.left + 6, M.top + 4 + 14 * k);
  }
  axes(g, w, h, [formatNumber(e0), formatNumber(e1), 'local strain ε (µε)'], [formatNumber(s0), formatNumber(s1), `local stress σ (${stressUnit})`]);
}
