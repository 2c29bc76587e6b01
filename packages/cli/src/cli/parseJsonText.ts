import { UsageError } from './CliError';
import { jsonErrorOffset } from './jsonErrorOffset';

/**
 * `JSON.parse` with a message that locates the fault by line and column and quotes none of the
 * file (the engine's message quotes its text).
 */
export function parseJsonText(text: string, shown: string, what: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    const at = jsonErrorOffset(text);
    let where = '';
    if (at >= text.length) where = ': it ends too early';
    else if (at >= 0) {
      const before = text.slice(0, at);
      where = ` at line ${before.split('\n').length}, column ${at - before.lastIndexOf('\n')}`;
    }
    throw new UsageError(`${shown}: invalid JSON in the ${what}${where}`);
  }
}
