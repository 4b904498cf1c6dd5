// Sight-length balance: equal backsight and foresight lengths cancel the collimation error of
// the level and most of the curvature and refraction effect (common practice). The limits are
// defaults a user can change. Sights up to 50 m for precise work (practice, DOMAIN.md);
// 5 m per setup and 10 m cumulative per section are the second-order limits of FGCC 1984 (memory).
import { requireNonEmpty, requirePositive, requireRange } from "../validate";

export interface SightBalanceLimits {
  readonly maxSightM: number;
  readonly maxSetupImbalanceM: number;
  readonly maxCumulativeImbalanceM: number;
}

export const DEFAULT_SIGHT_BALANCE_LIMITS: SightBalanceLimits = {
  maxSightM: 50,
  maxSetupImbalanceM: 5,
  maxCumulativeImbalanceM: 10,
};

export interface SightBalanceRow {
  readonly index: number;
  /** Backsight − foresight distance of this setup, m. */
  readonly imbalanceM: number;
  readonly cumulativeImbalanceM: number;
  readonly longSight: boolean;
  readonly setupImbalanceExceeded: boolean;
  readonly cumulativeImbalanceExceeded: boolean;
}

export interface SightBalance {
  readonly rows: readonly SightBalanceRow[];
  readonly cumulativeImbalanceM: number;
  readonly longestSightM: number;
  /** True when no limit is exceeded anywhere. */
  readonly ok: boolean;
  readonly limits: SightBalanceLimits;
}

export function sightBalance(
  setups: readonly { readonly backsightDistanceM: number; readonly foresightDistanceM: number }[],
  limits: Partial<SightBalanceLimits> = {},
): SightBalance {
  requireNonEmpty(setups, "setups");
  const l: SightBalanceLimits = { ...DEFAULT_SIGHT_BALANCE_LIMITS, ...limits };
  requirePositive(l.maxSightM, "limits.maxSightM");
  requirePositive(l.maxSetupImbalanceM, "limits.maxSetupImbalanceM");
  requirePositive(l.maxCumulativeImbalanceM, "limits.maxCumulativeImbalanceM");
  let cumulative = 0;
  let longest = 0;
  const rows = setups.map((s, i): SightBalanceRow => {
    const bs = requireRange(s.backsightDistanceM, `setups[${i}].backsightDistanceM`, 0, 200);
    const fs = requireRange(s.foresightDistanceM, `setups[${i}].foresightDistanceM`, 0, 200);
    const imbalanceM = bs - fs;
    cumulative += imbalanceM;
    longest = Math.max(longest, bs, fs);
    return {
      index: i,
      imbalanceM,
      cumulativeImbalanceM: cumulative,
      longSight: Math.max(bs, fs) > l.maxSightM,
      setupImbalanceExceeded: Math.abs(imbalanceM) > l.maxSetupImbalanceM,
      cumulativeImbalanceExceeded: Math.abs(cumulative) > l.maxCumulativeImbalanceM,
    };
  });
  const ok = rows.every(
    (r) => !r.longSight && !r.setupImbalanceExceeded && !r.cumulativeImbalanceExceeded,
  );
  return { rows, cumulativeImbalanceM: cumulative, longestSightM: longest, ok, limits: l };
}
