/**
 * Sample numbers across cut-out ranges. After `--exclude-samples` or `--exclude-time` the history
 * assessed is the kept samples joined, numbered 0, 1, 2, … without gaps; the reports give the
 * worst loops in the file's own sample numbers as well, so they can be found in the file.
 * `cutOut` is flat [first, length] pairs of the places cut out, in the file's sample numbers,
 * sorted and apart (the cut's correction record).
 */

/**
 * The file's sample number of sample `i` of the joined history (`i` < 0, the initial state, is kept).
 *
 * @example
 * fileSampleOf([1000, 1000, 8000, 1001], 4717);
 * // returns 5717
 */
export function fileSampleOf(cutOut: ArrayLike<number>, i: number): number {
  if (i < 0) return i;
  let f = i;
  for (let p = 0; p + 1 < cutOut.length && cutOut[p] <= f; p += 2) f += cutOut[p + 1];
  return f;
}

/** A loop's start and turn in the file's sample numbers, and whether a cut lies between them (in time order, over the seam too). */
export function loopInFile(loop: { startIndex: number; turnIndex: number }, cutOut: ArrayLike<number>): { startIndex: number; turnIndex: number; acrossCut: boolean } {
  const startIndex = fileSampleOf(cutOut, loop.startIndex);
  const turnIndex = fileSampleOf(cutOut, loop.turnIndex);
  const inside = (a: number, b: number) => {
    for (let p = 0; p + 1 < cutOut.length; p += 2) if (cutOut[p] > a && cutOut[p] < b) return true;
    return false;
  };
  // over the seam of a repeating history the loop runs from its start to the end and on from 0
  const acrossCut = startIndex < 0 ? inside(-1, turnIndex) : startIndex <= turnIndex ? inside(startIndex, turnIndex) : inside(startIndex, Infinity) || inside(-1, turnIndex);
  return { startIndex, turnIndex, acrossCut };
}
