// The setup being typed: text as typed (decimal comma accepted), checked field by field against the
// schema's ranges, so the running reduction and the misclosure can show it before it is saved.
import type { BookSetup } from "../../../shared/levelling-book";
import { levellingLimits, type LevellingRun } from "../../../shared/schemas/levelling";
import type { FieldBookEntry } from "../../../shared/science/levelling/running";
import { parseDecimal } from "../../lib/format";

export const entryFields = [
  "backsightM",
  "foresightM",
  "backsightDistanceM",
  "foresightDistanceM",
] as const;
export type EntryField = (typeof entryFields)[number];

export interface EntryText {
  /** "" means the next number of the run. */
  number: string;
  backsightM: string;
  foresightM: string;
  backsightDistanceM: string;
  foresightDistanceM: string;
  /** Set when the entry was filled from a saved setup to correct it. */
  correcting: number | null;
}

export const emptyEntry: EntryText = {
  number: "",
  backsightM: "",
  foresightM: "",
  backsightDistanceM: "",
  foresightDistanceM: "",
  correcting: null,
};

export const fieldLabels: Record<EntryField | "number", string> = {
  number: "No.",
  backsightM: "BS",
  foresightM: "FS",
  backsightDistanceM: "BS dist",
  foresightDistanceM: "FS dist",
};

const rangeOf = (field: EntryField) =>
  field === "backsightM" || field === "foresightM"
    ? levellingLimits.readingM
    : levellingLimits.sightM;

export interface ParsedEntry {
  number: number | null;
  values: Partial<Record<EntryField, number>>;
  errors: Partial<Record<EntryField | "number", string>>;
  /** Every field typed and valid. */
  complete: boolean;
  /** At least one field typed. */
  started: boolean;
}

export function parseEntry(text: EntryText, nextNumber: number): ParsedEntry {
  const values: ParsedEntry["values"] = {};
  const errors: ParsedEntry["errors"] = {};
  for (const field of entryFields) {
    const typed = text[field].trim();
    if (typed === "") continue;
    const value = parseDecimal(typed);
    const { min, max } = rangeOf(field);
    if (Number.isNaN(value)) errors[field] = "Type a number, e.g. 1.2345";
    else if (value < min || value > max) errors[field] = `Between ${min} and ${max} m`;
    else values[field] = value;
  }
  let number: number | null = nextNumber;
  if (text.number.trim() !== "") {
    const n = Number(text.number.trim());
    number = Number.isInteger(n) && n >= 1 && n <= levellingLimits.setupsMax ? n : null;
    if (number === null) errors.number = `A whole number from 1 to ${levellingLimits.setupsMax}`;
  }
  const complete = number !== null && entryFields.every((f) => values[f] !== undefined);
  const started = entryFields.some((f) => text[f].trim() !== "");
  return { number, values, errors, complete, started };
}

// Sorts after any saved setup, so the preview replaces a setup of the same number.
const DRAFT_TIME = "9999-12-31T23:59:59.999Z";

/** The draft as a setup; missing fields get neutral values so only what is typed can warn. */
export function draftSetup(run: LevellingRun, parsed: ParsedEntry): BookSetup {
  const v = parsed.values;
  return {
    id: `draft-${run}`,
    run,
    number: parsed.number ?? 0,
    backsightM: v.backsightM ?? 1,
    foresightM: v.foresightM ?? 1,
    backsightDistanceM: v.backsightDistanceM ?? v.foresightDistanceM ?? 0,
    foresightDistanceM: v.foresightDistanceM ?? v.backsightDistanceM ?? 0,
    recordedAt: DRAFT_TIME,
  };
}

/** The run's entries with the draft in its place (replacing the setup it corrects), in order. */
export function entriesWithDraft(
  saved: readonly BookSetup[],
  parsed: ParsedEntry,
): { entries: FieldBookEntry[]; draftIndex: number } {
  const number = parsed.number ?? Number.POSITIVE_INFINITY;
  const before = saved.filter((s) => s.number < number);
  const after = saved.filter((s) => s.number > number);
  return { entries: [...before, parsed.values, ...after], draftIndex: before.length };
}

/** A saved setup as text in the entry, to correct it. */
export function entryFrom(setup: BookSetup): EntryText {
  return {
    number: String(setup.number),
    backsightM: setup.backsightM.toFixed(4),
    foresightM: setup.foresightM.toFixed(4),
    backsightDistanceM: setup.backsightDistanceM.toFixed(1),
    foresightDistanceM: setup.foresightDistanceM.toFixed(1),
    correcting: setup.number,
  };
}
