// An instrument's history for people: each revision with its changed fields, the value before
// (from the revision before it) and after, in the page's own words and formats.
import {
  instrumentKindLabels,
  type InstrumentRevisionView,
  type InstrumentView,
} from "../../../../shared/schemas/instruments";
import { formatFractional } from "./fractional";

const fieldLabels: Record<string, string> = {
  kind: "Kind",
  name: "Name",
  description: "Description",
  instabilityAt1s: "Instability at 1 s",
  systematic: "Systematic terms",
  notes: "Notes",
};

export const labelOfField = (field: string) => fieldLabels[field] ?? field;

const shorten = (text: string, max = 80) =>
  text === "" ? "—" : text.length > max ? `${text.slice(0, max - 1)}…` : text;

/** One field of a view as shown in the history. */
export function valueOfField(view: InstrumentView, field: string): string {
  switch (field) {
    case "kind":
      return instrumentKindLabels[view.kind];
    case "instabilityAt1s":
      return formatFractional(view.instabilityAt1s);
    case "systematic":
      return view.systematic.length === 0
        ? "none"
        : view.systematic.map((t) => `${t.name} ${formatFractional(t.value)}`).join("; ");
    case "name":
    case "description":
    case "notes":
      return shorten(view[field]);
    default:
      return "—";
  }
}

export interface FieldChange {
  field: string;
  label: string;
  /** null for a new instrument. */
  before: string | null;
  /** null when deleted. */
  after: string | null;
}

export interface RevisionLine {
  revision: InstrumentRevisionView;
  changes: FieldChange[];
}

/** Revisions in the server's order (oldest first), each with what it changed; a creation lists
 * only the fields it stated (empty texts left out). */
export function describeRevisions(revisions: readonly InstrumentRevisionView[]): RevisionLine[] {
  let previous: InstrumentView | null = null;
  return revisions.map((revision) => {
    const before = previous;
    const changes = revision.changed
      .map((field) => ({
        field,
        label: labelOfField(field),
        before: before === null ? null : valueOfField(before, field),
        after: revision.after === null ? null : valueOfField(revision.after, field),
      }))
      .filter((c) => c.before !== null || c.after !== "—");
    previous = revision.after ?? previous;
    return { revision, changes };
  });
}
