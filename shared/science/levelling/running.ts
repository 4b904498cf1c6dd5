// Live reduction for a field book: the running rise/fall, cumulative height difference and the
// running balance of backsight and foresight distances, tolerant of the setup being typed in.
import { requireFinite, requireNonNegative, requireRange } from "../validate";

export interface FieldBookEntry {
  readonly backsightM?: number;
  readonly foresightM?: number;
  readonly backsightDistanceM?: number;
  readonly foresightDistanceM?: number;
}

export interface RunningRow {
  readonly index: number;
  /** BS − FS of this setup, null until both readings are in. */
  readonly deltaM: number | null;
  readonly riseM: number | null;
  readonly fallM: number | null;
  /** Height difference from the start to this setup's foresight point, complete setups only. */
  readonly cumulativeM: number;
  readonly backsightDistanceSumM: number;
  readonly foresightDistanceSumM: number;
  /** Running ΣBS distance − ΣFS distance, m. */
  readonly imbalanceM: number;
  readonly complete: boolean;
}

export interface RunningReduction {
  readonly rows: readonly RunningRow[];
  readonly cumulativeM: number;
  readonly imbalanceM: number;
  readonly completeSetups: number;
  /** Sum of sight lengths so far, km. */
  readonly lengthKm: number;
}

function optional(
  value: number | undefined,
  field: string,
  min: number,
  max: number,
): number | undefined {
  if (value === undefined) return undefined;
  requireFinite(value, field);
  return requireRange(value, field, min, max);
}

export function runningReduction(entries: readonly FieldBookEntry[]): RunningReduction {
  const rows: RunningRow[] = [];
  let cumulativeM = 0;
  let bsSum = 0;
  let fsSum = 0;
  let completeSetups = 0;
  entries.forEach((e, i) => {
    const bs = optional(e.backsightM, `entries[${i}].backsightM`, -6, 6);
    const fs = optional(e.foresightM, `entries[${i}].foresightM`, -6, 6);
    const bsd = optional(e.backsightDistanceM, `entries[${i}].backsightDistanceM`, 0, 200);
    const fsd = optional(e.foresightDistanceM, `entries[${i}].foresightDistanceM`, 0, 200);
    if (bsd !== undefined) bsSum += requireNonNegative(bsd, `entries[${i}].backsightDistanceM`);
    if (fsd !== undefined) fsSum += fsd;
    const complete = bs !== undefined && fs !== undefined;
    const deltaM = complete ? bs - fs : null;
    if (deltaM !== null) {
      cumulativeM += deltaM;
      completeSetups++;
    }
    rows.push({
      index: i,
      deltaM,
      riseM: deltaM === null ? null : Math.max(deltaM, 0),
      fallM: deltaM === null ? null : Math.max(-deltaM, 0),
      cumulativeM,
      backsightDistanceSumM: bsSum,
      foresightDistanceSumM: fsSum,
      imbalanceM: bsSum - fsSum,
      complete,
    });
  });
  return {
    rows,
    cumulativeM,
    imbalanceM: bsSum - fsSum,
    completeSetups,
    lengthKm: (bsSum + fsSum) / 1000,
  };
}
