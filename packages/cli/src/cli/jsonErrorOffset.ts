/**
 * The offset of the first character at which `text` stops being JSON (RFC 8259), or the text's
 * length when it ends too early; -1 when it is valid. For messages that locate a fault without
 * quoting the file (the engine's own message quotes it, and says no offset).
 */
export function jsonErrorOffset(text: string): number {
  let i = 0;
  const n = text.length;
  const space = () => {
    while (i < n && (text[i] === ' ' || text[i] === '\t' || text[i] === '\n' || text[i] === '\r')) i++;
  };
  const fail = (): never => {
    throw i;
  };
  const literal = (word: string) => {
    if (text.startsWith(word, i)) i += word.length;
    else fail();
  };
  const string = () => {
    i++; // the opening quote
    while (i < n && text[i] !== '"') {
      const c = text.charCodeAt(i);
      if (c < 0x20) fail();
      if (text[i] === '\\') {
        i++;
        if (text[i] === 'u') {
          if (!/^[0-9a-fA-F]{4}$/.test(text.slice(i + 1, i + 5))) fail();
          i += 5;
        } else if ('"\\/bfnrt'.includes(text[i] ?? 'x')) i++;
        else fail();
      } else i++;
    }
    if (i >= n) fail();
    i++;
  };
  const number = () => {
    const m = /^-?(0|[1-9]\d*)(\.\d+)?([eE][+-]?\d+)?/.exec(text.slice(i, i + 400));
    if (!m) fail();
    i += (m as RegExpExecArray)[0].length;
  };
  const value = (): void => {
    space();
    const c = text[i];
    if (c === '{') {
      i++;
      space();
      if (text[i] === '}') {
        i++;
        return;
      }
      for (;;) {
        space();
        if (text[i] !== '"') fail();
        string();
        space();
        if (text[i] !== ':') fail();
        i++;
        value();
        space();
        if (text[i] === ',') i++;
        else if (text[i] === '}') {
          i++;
          return;
        } else fail();
      }
    }
    if (c === '[') {
      i++;
      space();
      if (text[i] === ']') {
        i++;
        return;
      }
      for (;;) {
        value();
        space();
        if (text[i] === ',') i++;
        else if (text[i] === ']') {
          i++;
          return;
        } else fail();
      }
    }
    if (c === '"') return string();
    if (c === 't') return literal('true');
    if (c === 'f') return literal('false');
    if (c === 'n') return literal('null');
    number();
  };
  try {
    if (text.charCodeAt(0) === 0xfeff) i = 1;
    value();
    space();
    return i < n ? i : -1;
  } catch (at) {
    if (typeof at === 'number') return Math.min(at, n);
    throw at;
  }
}
