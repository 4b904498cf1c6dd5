// Shock events against a crate's limits. Limits are the instrument maker's specification
// (often 30–50 g for lab optics, common practice): always configurable per crate.
import { ScienceInputError } from "../errors";
import { requireName, requireNonNegative, requirePositive } from "../validate";

export interface ShockEvent {
  readonly peakG: number;
  /** Axis label as the logger gives it ("x", "y", "z", …). */
  readonly axis?: string;
  readonly durationS?: number;
  /** ISO 8601 time, passed through. */
  readonly time?: string;
}

export interface ShockLimits {
  readonly maxPeakG: number;
  /** Per-axis limits that replace maxPeakG on that axis. */
  readonly maxPeakGByAxis?: Readonly<Record<string, number>>;
}

export interface ShockExceedance {
  readonly index: number;
  readonly peakG: number;
  readonly limitG: number;
  readonly excessG: number;
  /** peak / limit (> 1). */
  readonly ratio: number;
  readonly axis: string | null;
  readonly time: string | null;
}

export interface ShockSummary {
  readonly checked: number;
  readonly exceedances: readonly ShockExceedance[];
  readonly worst: ShockExceedance | null;
  readonly maxPeakG: number;
}

function limitFor(limits: ShockLimits, axis: string | undefined): number {
  const byAxis = axis === undefined ? undefined : limits.maxPeakGByAxis?.[axis];
  return byAxis ?? limits.maxPeakG;
}

/** Events whose peak is above the limit (equal to the limit is within it). */
export function shockExceedances(events: readonly ShockEvent[], limits: ShockLimits): ShockSummary {
  if (!Array.isArray(events)) throw new ScienceInputError("events", "must be an array");
  requirePositive(limits.maxPeakG, "limits.maxPeakG");
  for (const [axis, g] of Object.entries(limits.maxPeakGByAxis ?? {})) {
    requirePositive(g, `limits.maxPeakGByAxis.${axis}`);
  }
  const exceedances: ShockExceedance[] = [];
  let maxPeakG = 0;
  events.forEach((e, i) => {
    const peakG = requireNonNegative(e.peakG, `events[${i}].peakG`);
    if (e.axis !== undefined) requireName(e.axis, `events[${i}].axis`);
    if (e.durationS !== undefined) requireNonNegative(e.durationS, `events[${i}].durationS`);
    maxPeakG = Math.max(maxPeakG, peakG);
    const limitG = limitFor(limits, e.axis);
    if (peakG > limitG) {
      const axis = e.axis ?? null;
      const time = e.time ?? null;
      exceedances.push({
        index: i,
        peakG,
        limitG,
        excessG: peakG - limitG,
        ratio: peakG / limitG,
        axis,
        time,
      });
    }
  });
  const worst = exceedances.reduce<ShockExceedance | null>(
    (w, x) => (w === null || x.ratio > w.ratio ? x : w),
    null,
  );
  return { checked: events.length, exceedances, worst, maxPeakG };
}
