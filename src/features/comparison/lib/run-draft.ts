// The run form as typed (text, in the units people use: heights' σ and the target in mm, uptime in
// %) and the run as stored (SI: metres, a fraction). parseDecimal accepts a decimal comma.
import type { ComparisonRunFields, ComparisonRunView } from "../../../../shared/schemas/comparison";
import { parseDecimal } from "../../../lib/format";

export interface RunDraft {
  name: string;
  remoteSiteId: string;
  remoteClockId: string;
  referenceClockId: string;
  /** "" for none. */
  linkId: string;
  linkName: string;
  remoteMark: string;
  /** m */
  referenceHeightM: string;
  /** mm (stored in m) */
  referenceHeightSigmaM: string;
  /** mm (stored in m) */
  targetHeightUncertaintyM: string;
  /** % (stored as a fraction) */
  plannedUptime: string;
  notes: string;
}

const optional = (text: string, scale: number): number | null =>
  text.trim() === "" ? null : parseDecimal(text) * scale;

/** Rounds away binary noise from unit changes (0.1 mm × 1e-3 must read 0.0001, not 0.00010000000000000002). */
const clean = (value: number) => Number(value.toPrecision(12));

/** Keeps the typed text as it is where it is not a number, so the schema names the field. */
export function fieldsFromDraft(d: RunDraft): ComparisonRunFields {
  const mmToM = (text: string) => {
    const v = optional(text, 1e-3);
    return v === null ? null : clean(v);
  };
  return {
    name: d.name,
    remoteSiteId: d.remoteSiteId,
    remoteClockId: d.remoteClockId,
    referenceClockId: d.referenceClockId,
    linkId: d.linkId === "" ? null : d.linkId,
    linkName: d.linkName,
    remoteMark: d.remoteMark,
    referenceHeightM: optional(d.referenceHeightM, 1),
    referenceHeightSigmaM: mmToM(d.referenceHeightSigmaM),
    targetHeightUncertaintyM: mmToM(d.targetHeightUncertaintyM) ?? Number.NaN,
    plannedUptime: clean(parseDecimal(d.plannedUptime) / 100),
    notes: d.notes,
  };
}

const shown = (value: number | null, scale: number) =>
  value === null ? "" : String(Number((value * scale).toPrecision(12)));

export function draftFromRun(run: ComparisonRunView | null): RunDraft {
  return {
    name: run?.name ?? "",
    remoteSiteId: run?.remoteSiteId ?? "",
    remoteClockId: run?.remoteClockId ?? "",
    referenceClockId: run?.referenceClockId ?? "",
    linkId: run?.linkId ?? "",
    linkName: run?.linkName ?? "",
    remoteMark: run?.remoteMark ?? "",
    referenceHeightM: shown(run?.referenceHeightM ?? null, 1),
    referenceHeightSigmaM: shown(run?.referenceHeightSigmaM ?? null, 1e3),
    targetHeightUncertaintyM: shown(run?.targetHeightUncertaintyM ?? null, 1e3),
    plannedUptime: shown(run?.plannedUptime ?? 0.7, 100),
    notes: run?.notes ?? "",
  };
}
