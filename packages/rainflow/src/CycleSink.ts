/**
 * Receiver of counted cycles. A rainflow counter calls `addCycle` once per full cycle (count 1)
 * or half cycle (count 0.5); the cycle table and the matrices implement it, so a long stream can
 * be counted straight into bins without keeping its cycles.
 */
export interface CycleSink {
  /**
   * @param from value at the cycle's first reversal (b in the four-point rule)
   * @param to value at its second reversal (c)
   * @param count 1 for a full cycle, 0.5 for a half cycle
   * @param startIndex sample index of `from`
   * @param turnIndex sample index of `to`, the cycle's second reversal point (where the loop turns)
   * @param closeIndex sample index of the turning point that closed the cycle (d); for a half
   *   cycle of the residue, `turnIndex`
   */
  addCycle(
    from: number,
    to: number,
    count: number,
    startIndex: number,
    turnIndex: number,
    closeIndex: number,
  ): void;
}
