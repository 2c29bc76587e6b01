/** Deterministic, readable number formatting for reports: 4 significant digits, ∞, never NaN. */
export function formatNumber(x: number, digits = 4): string {
  if (x === Infinity) return '∞';
  if (x === -Infinity) return '-∞';
  if (x !== x) return 'n/a';
  if (x === 0) return '0';
  const a = Math.abs(x);
  if (a >= 1e-3 && a < 1e7) return Number(x.toPrecision(digits)).toString();
  return x.toExponential(digits - 1);
}
