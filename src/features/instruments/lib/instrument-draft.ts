// The instrument form as typed (text, fractional values like "1e-15") and as stored (numbers).
// Unreadable text becomes NaN, so the shared schema names the field.
import type { z } from "zod";
import type {
  instrumentFields,
  InstrumentFields,
  InstrumentKind,
  InstrumentView,
} from "../../../../shared/schemas/instruments";
import { fractionalForInput, parseFractional } from "./fractional";

/** The instrument as the schema gives it back once the draft is valid. */
export type InstrumentOutput = z.output<typeof instrumentFields>;

export interface TermDraft {
  name: string;
  value: string;
}

export interface InstrumentDraft {
  kind: InstrumentKind;
  name: string;
  description: string;
  instabilityAt1s: string;
  systematic: TermDraft[];
  notes: string;
}

const isBlank = (t: TermDraft) => t.name.trim() === "" && t.value.trim() === "";

/** Empty rows left at the end are dropped; any other row is checked, so errors keep their row. */
export function fieldsFromDraft(d: InstrumentDraft): InstrumentFields {
  const terms = [...d.systematic];
  while (terms.length > 0 && isBlank(terms[terms.length - 1] ?? { name: "", value: "" }))
    terms.pop();
  return {
    kind: d.kind,
    name: d.name,
    description: d.description,
    instabilityAt1s: parseFractional(d.instabilityAt1s),
    systematic: terms.map((t) => ({ name: t.name, value: parseFractional(t.value) })),
    notes: d.notes,
  };
}

export function draftFromInstrument(i: InstrumentView | null): InstrumentDraft {
  return {
    kind: i?.kind ?? "clock",
    name: i?.name ?? "",
    description: i?.description ?? "",
    instabilityAt1s: i === null ? "" : fractionalForInput(i.instabilityAt1s),
    systematic:
      i === null
        ? [{ name: "", value: "" }]
        : i.systematic.map((t) => ({ name: t.name, value: fractionalForInput(t.value) })),
    notes: i?.notes ?? "",
  };
}

/** The terms in quadrature, as the server computes systematicTotal; NaN while a value is unreadable. */
export function quadratureOf(values: readonly number[]): number {
  return Math.sqrt(values.reduce((sum, v) => sum + v * v, 0));
}
