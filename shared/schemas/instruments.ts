// Instruments: the clocks of a comparison and the links between them, each with its stated
// white-FM instability at 1 s and its systematic uncertainty as named terms (fractional).
import { z } from "zod";
import { between, geodesyLimits as L, required, text } from "./geodesy-fields";

export const instrumentKinds = ["clock", "link"] as const;
export const instrumentKind = z.enum(instrumentKinds, {
  error: `Kind must be one of ${instrumentKinds.join(", ")}`,
});
export type InstrumentKind = z.infer<typeof instrumentKind>;

export const instrumentKindLabels: Record<InstrumentKind, string> = {
  clock: "Clock",
  link: "Link",
};

export const systematicTerm = z.strictObject({
  name: required("Term name", L.nameMax),
  value: between("Term value", L.systematic.min, L.systematic.max),
});
export type SystematicTerm = z.infer<typeof systematicTerm>;

export const instrumentFields = z
  .strictObject({
    kind: instrumentKind,
    name: required("Name", L.nameMax),
    description: text("Description", L.textMax).default(""),
    instabilityAt1s: between("Instability at 1 s", L.instabilityAt1s.min, L.instabilityAt1s.max),
    systematic: z
      .array(systematicTerm, { error: "Systematic terms must be a list" })
      .max(L.systematicTermsMax, `At most ${L.systematicTermsMax} systematic terms`)
      .default([]),
    notes: text("Notes", L.noteMax).default(""),
  })
  .refine(
    (i) => new Set(i.systematic.map((t) => t.name.toLowerCase())).size === i.systematic.length,
    {
      message: "Each systematic term needs its own name",
      path: ["systematic"],
    },
  );
export type InstrumentFields = z.input<typeof instrumentFields>;

export const instrumentCreateInput = z.strictObject({
  id: z.uuid("id must be a UUID"),
  instrument: instrumentFields,
});
export const instrumentUpdateInput = z.strictObject({
  baseVersion: z.number().int().positive(),
  instrument: instrumentFields,
});

export const instrumentView = z.object({
  id: z.uuid(),
  campaignId: z.uuid(),
  kind: instrumentKind,
  name: z.string(),
  description: z.string(),
  instabilityAt1s: z.number(),
  systematic: z.array(z.object({ name: z.string(), value: z.number() })),
  /** The systematic terms in quadrature. */
  systematicTotal: z.number(),
  notes: z.string(),
  version: z.number().int(),
  updatedAt: z.string(),
  updatedByName: z.string().nullable(),
});
export type InstrumentView = z.infer<typeof instrumentView>;

/** One step of an instrument's history (from the audit trail). */
export const instrumentRevisionView = z.object({
  at: z.string(),
  action: z.enum(["create", "update", "delete"]),
  byName: z.string().nullable(),
  version: z.number().int(),
  /** Field names whose value changed from the previous revision. */
  changed: z.array(z.string()),
  after: instrumentView.nullable(),
});
export type InstrumentRevisionView = z.infer<typeof instrumentRevisionView>;
