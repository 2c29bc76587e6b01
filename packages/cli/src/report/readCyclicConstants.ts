import type { CyclicConstants } from './masingLoop.js';

/** E, K' and n' from a report's `inputs.material`, or null when any is missing or out of range. */
export function readCyclicConstants(inputs: Record<string, unknown>): CyclicConstants | null {
  const m = inputs.material as Record<string, unknown> | null | undefined;
  if (m === null || typeof m !== 'object') return null;
  const { E, K, n } = m;
  if (typeof E !== 'number' || typeof K !== 'number' || typeof n !== 'number') return null;
  if (!(E > 0 && E < Infinity && K > 0 && K < Infinity && n > 0 && n < 1)) return null;
  return { E, K, n };
}
