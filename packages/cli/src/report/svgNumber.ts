/**
 * A coordinate for SVG markup: rounded to 0.1 user units (enough at report size, and keeps the
 * file small), without '-0'. Non-finite values become 0 so markup never holds NaN.
 */
export function svgNumber(x: number): string {
  if (!Number.isFinite(x)) return '0';
  const r = Math.round(x * 10) / 10;
  return r === 0 ? '0' : String(r);
}

/**
 * A value for a `data-*` attribute: the shortest string that reads back to the same double
 * (`String`), so tests can recompute sums exactly; 'Infinity' stays, NaN becomes ''.
 */
export function dataNumber(x: number): string {
  return Number.isNaN(x) ? '' : String(x);
}
