// Plain words for a target that averaging cannot reach: which term holds the floor up, and how
// small it would have to be.
import type { TimeToTargetResult } from "../science";

/** Metres as millimetres, with enough digits for a sub-millimetre term. */
export function formatMm(heightM: number): string {
  const mm = heightM * 1000;
  return `${mm < 10 ? mm.toFixed(2) : mm.toFixed(1)} mm`;
}

export function explainUnreachable(
  t: TimeToTargetResult,
  targetM: number,
): { reason: string; improve: string } {
  const dominantM = t.budget.find((r) => r.term === t.dominant)?.heightM ?? 0;
  const reason =
    `The floor ${formatMm(t.floorM)} is above the target ${formatMm(targetM)}: ` +
    `no averaging time reaches it. The largest term that does not average down is ${t.dominant} (${formatMm(dominantM)}).`;
  const othersM = Math.sqrt(Math.max(t.floorM ** 2 - dominantM ** 2, 0));
  if (othersM >= targetM) {
    return {
      reason,
      improve: `The other floor terms alone (${formatMm(othersM)}) exceed the target: more than ${t.dominant} must improve.`,
    };
  }
  const allowedM = Math.sqrt(targetM ** 2 - othersM ** 2);
  const row = t.budget.find((r) => r.term === t.dominant);
  const fractional =
    row !== undefined && row.heightM > 0
      ? ` (${((row.fractional * allowedM) / row.heightM).toExponential(1)} fractional)`
      : "";
  return {
    reason,
    improve: `${t.dominant} would have to be below ${formatMm(allowedM)}${fractional} for the target to be reachable, and then only with time to average.`,
  };
}
