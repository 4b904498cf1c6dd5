// Conflicted values and refused changes in the crew's words: units, kinds of site, empty notes.
import { siteKindLabels, siteKindSchema } from "../../../shared/schemas";
import type { MutationName } from "../../../shared/sync/protocol";
import { formatHeightM, formatLatitude, formatLongitude } from "../../lib/format";

export const siteFieldLabels: Record<string, string> = {
  name: "Name",
  kind: "Kind of site",
  latitudeDeg: "Latitude",
  longitudeDeg: "Longitude",
  approxHeightM: "Approximate height",
  notes: "Notes",
};

export const fieldLabel = (field: string) => siteFieldLabels[field] ?? field;

/** A field's value as shown to a person. */
export function formatFieldValue(field: string, value: unknown): string {
  if (value === null || value === undefined) return "(nothing)";
  if (typeof value === "number") {
    if (field === "latitudeDeg") return formatLatitude(value);
    if (field === "longitudeDeg") return formatLongitude(value);
    if (field === "approxHeightM") return formatHeightM(value);
    return String(value);
  }
  if (field === "kind") {
    const kind = siteKindSchema.safeParse(value);
    if (kind.success) return siteKindLabels[kind.data];
  }
  if (typeof value === "string") return value === "" ? "(empty)" : value;
  return JSON.stringify(value);
}

export const changeKindLabels: Record<MutationName, string> = {
  "site.create": "New site",
  "site.update": "Change to a site",
  "site.delete": "Deletion of a site",
  "conflict.resolve": "Choice in a conflict",
  "attachment.add": "Photo or file",
  "attachment.remove": "Removal of a photo or file",
  "checklist.start": "Start of a checklist",
  "checklist.record": "Checklist result",
  "checklist.signOff": "Sign-off of a checklist",
  "entry.add": "Field entry",
  "levelling.open": "New levelling section",
  "levelling.setup": "Levelling setup",
  "levelling.close": "Closing of a levelling section",
  "leg.plan": "Planned leg of a crate",
  "leg.depart": "Departure of a crate",
  "leg.arrive": "Arrival of a crate",
  "leg.cancel": "Cancelled leg",
  "handover.record": "Handover of a crate",
  "alert.acknowledge": "Acknowledged alert",
};

/** The site a refused change was about, by its typed name or by the name known on this device. */
export function subjectOf(args: unknown, names: ReadonlyMap<string, string>): string {
  if (typeof args !== "object" || args === null) return "Unknown record";
  const record = args as { id?: unknown; name?: unknown; changes?: { name?: unknown } };
  if (typeof record.name === "string") return record.name;
  if (typeof record.changes?.name === "string") return record.changes.name;
  if (typeof record.id === "string") return names.get(record.id) ?? "A site not on this device";
  return "Unknown record";
}
