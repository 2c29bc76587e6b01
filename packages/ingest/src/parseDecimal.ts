/** 2^53: integers below it are exact in a double. */
const TWO_TO_53 = 9007199254740992;
/** The mantissa accumulator may take one more digit while it stays below this (m·10 + 9 < 2^53). */
const MANTISSA_LIMIT = (TWO_TO_53 - 9) / 10;

/** 10^0 … 10^22: every one is exact in a double (10^22 = 2^22 · 5^22 and 5^22 < 2^53). */
const POW10 = new Float64Array(23);
for (let k = 0; k < 23; k++) POW10[k] = Number(`1e${k}`);

/**
 * Parses the decimal number in `bytes[start, end)` (ASCII) exactly as `Number()` parses the same
 * text, or returns NaN when the text is not a plain decimal number.
 *
 * Accepted grammar: `[+-]? (d+ [P d*] | P d+) ([eE] [+-]? d+)?`, where P is the decimal point
 * `.`, or the comma `,` when `decimalComma` is true (then `.` is not accepted). Rejected (NaN,
 * so the caller reports the cell): empty text, spaces anywhere (the caller trims), hexadecimal,
 * binary and octal literals, `Infinity`, `NaN`, thousands separators, underscores. These are the
 * cases in which `Number()` is more lenient than a data file should be.
 *
 * Method: the significant digits are accumulated into an integer m while m stays below 2^53,
 * with the decimal exponent e counted from the point and the exponent part. When every digit
 * fitted and |e| <= 22, m and 10^|e| are both exact doubles, so the single IEEE 754 operation
 * m · 10^e or m / 10^-e is correctly rounded and therefore equal to the correctly rounded value
 * that `Number()` returns (the fast path of W. D. Clinger, "How to read floating point numbers
 * accurately", PLDI 1990, doi:10.1145/93542.93557). Every other accepted text is handed to
 * `Number()` itself (with the decimal comma replaced by a point), so the result is bit-exact with
 * `Number()` for every accepted text, -0 included.
 *
 * Special cases: a text whose value overflows (`1e400`) returns ±Infinity exactly as `Number()`
 * does; the caller decides whether that is an error (ingestion reports it). Underflow returns
 * ±0 or a subnormal, as `Number()` does.
 *
 * @param bytes - the text as bytes (ASCII; any other byte makes the text invalid)
 * @param start - index of the first byte
 * @param end - index after the last byte
 * @param decimalComma - true when the decimal separator is `,` instead of `.`
 * @returns the value, or NaN when the text is not a plain decimal number
 *
 * @example
 * parseDecimal(new TextEncoder().encode('-12,5e-1'), 0, 8, true);
 * // returns -1.25
 */
export function parseDecimal(bytes: Uint8Array, start: number, end: number, decimalComma: boolean): number {
  let i = start;
  if (i >= end) return NaN;
  let negative = false;
  let c = bytes[i];
  if (c === 45 /* - */ || c === 43 /* + */) {
    negative = c === 45;
    i++;
  }
  const point = decimalComma ? 44 : 46;
  let m = 0;
  let exp = 0;
  let seen = 0; // digits seen in the mantissa
  let exact = true;
  while (i < end && (c = bytes[i]) >= 48 && c <= 57) {
    if (exact && m < MANTISSA_LIMIT) m = m * 10 + (c - 48);
    else {
      exact = false;
      exp++;
    }
    seen++;
    i++;
  }
  if (i < end && bytes[i] === point) {
    i++;
    while (i < end && (c = bytes[i]) >= 48 && c <= 57) {
      if (exact && m < MANTISSA_LIMIT) {
        m = m * 10 + (c - 48);
        exp--;
      } else exact = false;
      seen++;
      i++;
    }
  }
  if (seen === 0) return NaN;
  if (i < end && (bytes[i] === 101 || bytes[i] === 69) /* e E */) {
    i++;
    let eNeg = false;
    if (i < end && (bytes[i] === 45 || bytes[i] === 43)) {
      eNeg = bytes[i] === 45;
      i++;
    }
    let e = 0;
    let eDigits = 0;
    while (i < end && (c = bytes[i]) >= 48 && c <= 57) {
      if (e < 100000) e = e * 10 + (c - 48);
      eDigits++;
      i++;
    }
    if (eDigits === 0) return NaN;
    exp += eNeg ? -e : e;
  }
  if (i !== end) return NaN;
  if (exact && exp >= -22 && exp <= 22) {
    const v = exp >= 0 ? m * POW10[exp] : m / POW10[-exp];
    return negative ? -v : v;
  }
  return numberOfBytes(bytes, start, end, decimalComma);
}

/** `Number()` on the bytes as text, the decimal comma replaced by a point. */
function numberOfBytes(bytes: Uint8Array, start: number, end: number, decimalComma: boolean): number {
  let text = '';
  for (let k = start; k < end; k++) text += String.fromCharCode(decimalComma && bytes[k] === 44 ? 46 : bytes[k]);
  return Number(text);
}

const DECIMAL_POINT_TEXT = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const DECIMAL_COMMA_TEXT = /^[+-]?(?:\d+,?\d*|,\d+)(?:[eE][+-]?\d+)?$/;

/**
 * The string form of {@link parseDecimal}, for fields that arrive as strings (records split by
 * csv-parse in the CLI): the same grammar, the same result, NaN for text outside the grammar. Surrounding spaces
 * and tabs are trimmed first.
 *
 * @example
 * parseDecimalText(' 1.5e3 ', false);
 * // returns 1500
 */
export function parseDecimalText(text: string, decimalComma: boolean): number {
  const t = text.replace(/^[ \t]+|[ \t]+$/g, '');
  if (decimalComma) return DECIMAL_COMMA_TEXT.test(t) ? Number(t.replace(',', '.')) : NaN;
  return DECIMAL_POINT_TEXT.test(t) ? Number(t) : NaN;
}
