const SUPERSCRIPT: Record<string, string> = {
  '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹', '-': '⁻',
};

/** Writes an integer exponent in superscript digits, e.g. -6 → '⁻⁶'. */
export function superscript(exponent: number): string {
  return String(exponent).replace(/[-0-9]/g, (c) => SUPERSCRIPT[c]);
}

function trimZeros(mantissa: string): string {
  return mantissa.includes('.') ? mantissa.replace(/\.?0+$/, '') : mantissa;
}

/**
 * Formats a number for people, deterministically: `digits` significant digits (default 4) with
 * trailing zeros dropped; integers from 1000 to below 10^6 in full; outside 10^-3 … 10^6 as
 * `m × 10ⁿ`. The minus sign is U+2212. Infinity is '∞', NaN is '—' (never 'NaN'), ±0 is '0'.
 *
 * @example
 * formatNumber(1234567) // returns '1.235 × 10⁶'
 * formatNumber(0.5) // returns '0.5'
 */
export function formatNumber(x: number, digits = 4): string {
  if (Number.isNaN(x)) return '—';
  if (x === Infinity) return '∞';
  if (x === -Infinity) return '−∞';
  if (x === 0) return '0';
  const sign = x < 0 ? '−' : '';
  const a = Math.abs(x);
  let body: string;
  if (a >= 1e-3 && a < 1e6) {
    body = a >= 1000 ? String(Math.round(a)) : trimZeros(a.toPrecision(digits));
    // toPrecision can round up into the next decade (999.95 → '1000'): still plain.
    if (body.includes('e')) body = String(Math.round(a));
    if (body === '1000000') body = `1 × 10${superscript(6)}`;
  } else {
    const [m, e] = a.toExponential(digits - 1).split('e');
    body = `${trimZeros(m)} × 10${superscript(Number(e))}`;
  }
  return sign + body;
}

/** A share (0 … 1) as a percentage with three significant digits, e.g. 0.4567 → '45.7 %'. */
export function formatPercent(share: number): string {
  return `${formatNumber(share * 100, 3)} %`;
}

/** A count or sample index in full (no grouping, no exponent); other numbers as {@link formatNumber}. */
export function formatInteger(x: number): string {
  return Number.isSafeInteger(x) ? (x < 0 ? `−${-x}` : String(x)) : formatNumber(x);
}

/**
 * A count of cycles or loops as it is, not rounded: whole and half counts in full (13397.5),
 * other fractions (from fractional repeats) to 12 significant digits; an infinite or huge count
 * as {@link formatNumber}.
 */
export function formatCount(x: number): string {
  if (!Number.isFinite(x) || Math.abs(x) >= 1e15) return formatNumber(x);
  const text = Number.isInteger(2 * x) ? String(x) : String(Number(x.toPrecision(12)));
  return text.startsWith('-') ? `−${text.slice(1)}` : text;
}
