// Viridis (van der Walt and Smith, matplotlib, 2015): perceptually uniform, readable by people
// with the common colour-vision deficiencies, and monotone in lightness so it prints in grey.
const STOPS = ['#440154', '#472d7b', '#3b528b', '#2c728e', '#21918c', '#28ae80', '#5ec962', '#addc30', '#fde725'];
const RGB = STOPS.map((h) => [1, 3, 5].map((i) => parseInt(h.slice(i, i + 2), 16)));

function hex(v: number): string {
  return Math.round(v).toString(16).padStart(2, '0');
}

/** The colour of t in [0, 1] on the sequential (viridis) scale, as '#rrggbb'. */
export function sequentialColour(t: number): string {
  const u = Number.isFinite(t) ? Math.min(1, Math.max(0, t)) : 0;
  const p = u * (RGB.length - 1);
  const i = Math.min(RGB.length - 2, Math.floor(p));
  const w = p - i;
  const a = RGB[i];
  const b = RGB[i + 1];
  return `#${hex(a[0] + (b[0] - a[0]) * w)}${hex(a[1] + (b[1] - a[1]) * w)}${hex(a[2] + (b[2] - a[2]) * w)}`;
}

/** The stops of the scale, for a legend gradient: [offset 0 … 1, colour]. */
export function sequentialStops(): Array<[number, string]> {
  return STOPS.map((c, i) => [i / (STOPS.length - 1), c]);
}
