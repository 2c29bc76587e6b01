/**
 * The known name nearest to `name` (case-insensitive Levenshtein distance, a case-only
 * difference counting as the nearest of all), or undefined when none is within a third of the
 * name's length (at least 2 edits), so a suggestion is offered only when it is plausible.
 *
 * @example
 * nearestName('kt', ['Kt', 'Kf', 'rule']); // returns 'Kt'
 */
export function nearestName(name: string, known: readonly string[]): string | undefined {
  let best: string | undefined;
  let bestScore = Infinity;
  const lower = name.toLowerCase();
  for (const k of known) {
    const score = k.toLowerCase() === lower ? 0.5 : distance(lower, k.toLowerCase());
    if (score < bestScore) {
      bestScore = score;
      best = k;
    }
  }
  return bestScore <= Math.max(2, Math.floor(name.length / 3)) ? best : undefined;
}

function distance(a: string, b: string): number {
  if (Math.abs(a.length - b.length) > 8) return Infinity;
  let prev = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const row = [i];
    for (let j = 1; j <= b.length; j++) row[j] = Math.min(prev[j] + 1, row[j - 1] + 1, prev[j - 1] + (a[i - 1] === b[j - 1] ? 0 : 1));
    prev = row;
  }
  return prev[b.length];
}
