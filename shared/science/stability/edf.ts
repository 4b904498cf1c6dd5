// Equivalent degrees of freedom per statistic and noise type.
// - Overlapping ADEV: the simple formulas of NIST SP 1065 (Riley 2008) Table 5 (after Howe, Allan
//   & Barnes 1981), N phase points. Worked value: white FM, N = 1001, m = 10 → 146.18.
// - ADEV (non-overlapping), MDEV/TDEV, overlapping HDEV: Greenhall & Riley (2003), greenhall.ts.
// Every value is kept within [1, terms].
import { ScienceInputError } from "../errors";
import { requirePositiveInteger } from "../validate";
import { greenhallEdf, requireAlpha } from "./greenhall";
import type { StatisticName } from "./types";

const STATISTICS: readonly StatisticName[] = ["adev", "oadev", "mdev", "tdev", "ohdev"];

export function requireStatistic(statistic: StatisticName): StatisticName {
  if (!STATISTICS.includes(statistic)) {
    throw new ScienceInputError(
      "statistic",
      `must be one of ${STATISTICS.join(", ")}, got ${String(statistic)}`,
    );
  }
  return statistic;
}

function clampEdf(edf: number, terms: number): number {
  if (!Number.isFinite(edf)) return Math.max(1, terms);
  return Math.min(Math.max(edf, 1), Math.max(terms, 1));
}

/** SP 1065 Table 5, overlapping Allan variance; n = number of phase points, m = factor. */
export function simpleOverlappingAllanEdf(n: number, m: number, alpha: number): number {
  requirePositiveInteger(m, "m");
  requirePositiveInteger(n, "n");
  requireAlpha(alpha, 2);
  if (n < 2 * m + 1)
    throw new ScienceInputError("n", `must be at least 2m + 1 = ${2 * m + 1}, got ${n}`);
  return tableFive(n, m, alpha);
}

function tableFive(n: number, m: number, alpha: number): number {
  switch (alpha) {
    case 2:
      return ((n + 1) * (n - 2 * m)) / (2 * (n - m));
    case 1:
      return Math.exp(
        Math.sqrt(Math.log((n - 1) / (2 * m)) * Math.log(((2 * m + 1) * (n - 1)) / 4)),
      );
    case 0:
      return ((3 * (n - 1)) / (2 * m) - (2 * (n - 2)) / n) * ((4 * m * m) / (4 * m * m + 5));
    case -1:
      return m === 1 ? (2 * (n - 2) ** 2) / (2.3 * n - 4.9) : (5 * n * n) / (4 * m * (n + 3 * m));
    default:
      return ((n - 2) / (m * (n - 3) ** 2)) * ((n - 1) ** 2 - 3 * m * (n - 1) + 4 * m * m);
  }
}

/**
 * edf of one point. `terms` is the number of terms actually used; for overlapping ADEV the
 * phase-point count of an unbroken series with that many terms (terms + 2m) enters Table 5, so
 * a series with gaps is treated as one with the same number of usable terms.
 */
export function edfFor(statistic: StatisticName, alpha: number, m: number, terms: number): number {
  requireStatistic(statistic);
  requireAlpha(alpha, 2);
  requirePositiveInteger(m, "m");
  requirePositiveInteger(terms, "terms");
  switch (statistic) {
    case "oadev":
      return clampEdf(tableFive(terms + 2 * m, m, alpha), terms);
    case "adev":
      return greenhallEdf({ alpha, d: 2, m, modified: false, overlapping: false, terms });
    case "mdev":
    case "tdev":
      return greenhallEdf({ alpha, d: 2, m, modified: true, overlapping: true, terms });
    case "ohdev":
      return greenhallEdf({ alpha, d: 3, m, modified: false, overlapping: true, terms });
  }
}
