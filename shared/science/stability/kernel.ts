// Result of one statistic's sums at one averaging factor.
export interface KernelResult {
  /** The variance (σ² for ADEV/MDEV/HDEV). 0 when count is 0. */
  readonly variance: number;
  /** Terms used. */
  readonly count: number;
  /** Terms dropped because they span a missing sample. */
  readonly dropped: number;
}

/** True when y_i is missing for some i in [from, to). */
export function spansGap(gaps: Int32Array, from: number, to: number): boolean {
  return (gaps[to] ?? 0) !== (gaps[from] ?? 0);
}
