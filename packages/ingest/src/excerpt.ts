/** Characters of file content a message may quote, at most. */
export const EXCERPT_CHARACTERS = 24;

/**
 * A short, safe quotation of file content for a one-line message: at most
 * {@link EXCERPT_CHARACTERS} characters (then `…`), control and format characters and anything
 * outside printable text shown as `\u….` escapes, in double quotes. A message never carries
 * more of a file than this, and never raw bytes that a terminal would interpret.
 *
 * @example
 * excerpt('12\u001b[2J;x'); // returns '"12\\u001b[2J;x"'
 */
export function excerpt(text: string, max = EXCERPT_CHARACTERS): string {
  const chars = Array.from(text);
  const cut = chars.length > max ? chars.slice(0, max).join('') + '…' : text;
  // JSON.stringify escapes C0 controls, quotes and backslashes; the rest are escaped here
  return JSON.stringify(cut).replace(/[\u007f-\u009f\u00ad\u061c\u200b-\u200f\u2028-\u202e\u2060-\u206f\ufeff\ufff9-\ufffb]/g, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);
}
