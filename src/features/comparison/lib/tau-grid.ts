// The averaging times at which the time-to-target curve σ_H(τ) is drawn: log-spaced from 1 s to
// past both the needed time and now, so the target crossing and the marker for now are on it.

export interface TauGridSpan {
  /** The averaging time needed (s), or null when the target cannot be reached. */
  neededS: number | null;
  /** Valid averaging time accumulated so far (s). */
  accumulatedS: number;
}

/** One decade beyond the larger of needed and accumulated time, at least 10⁶ s (about 12 days). */
export function tauGridEnd({ neededS, accumulatedS }: TauGridSpan): number {
  const furthest = Math.max(neededS ?? 0, accumulatedS, 1e5);
  return 10 ** Math.ceil(Math.log10(furthest) + 1);
}

/** pointsPerDecade log-spaced times from 1 s to tauGridEnd, both ends included. */
export function tauGrid(span: TauGridSpan, pointsPerDecade = 20): number[] {
  const decades = Math.round(Math.log10(tauGridEnd(span)));
  const count = decades * pointsPerDecade;
  const out: number[] = [];
  for (let i = 0; i <= count; i++) out.push(10 ** (i / pointsPerDecade));
  return out;
}
