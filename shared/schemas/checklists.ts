// Checklists: templates (kept by administrators) and runs at a site, whose item results are
// append-only entries with their author and time. A run copies its template's items when it
// starts, so editing a template never changes a run already under way.
import { z } from "zod";
import { hasNul, nulMessage } from "./text";

export const checklistItemKinds = ["check", "number", "text", "choice", "photo"] as const;
export type ChecklistItemKind = (typeof checklistItemKinds)[number];

/** Where a step can hurt someone; each comes with a caution that defers to local rules. */
export const hazardKinds = [
  "lifting",
  "laser",
  "hot-surface",
  "high-voltage",
  "battery",
  "weather",
] as const;
export const hazardKind = z.enum(hazardKinds);
export type HazardKind = z.infer<typeof hazardKind>;

export const hazardLabels: Record<HazardKind, string> = {
  lifting: "Heavy lifting",
  laser: "Laser radiation",
  "hot-surface": "Hot surfaces",
  "high-voltage": "High voltage",
  battery: "Lithium batteries",
  weather: "Mountain or coastal weather",
};

export const checklistPurposes = [
  "arrival",
  "unpacking",
  "vacuum-bakeout",
  "laser-lockup",
  "comparison-start",
  "pack-down",
  "other",
] as const;
export const checklistPurpose = z.enum(checklistPurposes);
export type ChecklistPurpose = z.infer<typeof checklistPurpose>;

export const checklistLimits = {
  itemsMax: 100,
  labelMax: 200,
  helpMax: 500,
  textResultMax: 2000,
  choicesMax: 12,
  unitMax: 20,
} as const;

const finite = (field: string) => z.number({ error: `${field} must be a number` }).finite();

const itemCommon = {
  /** Stable within the template, so results stay tied to their item across template versions. */
  id: z
    .string()
    .regex(/^[a-z0-9][a-z0-9-]{0,39}$/, "Item id must be 1–40 lowercase letters, digits or dashes"),
  label: z
    .string()
    .trim()
    .min(1, "Label is required")
    .max(checklistLimits.labelMax, `Label must be at most ${checklistLimits.labelMax} characters`),
  help: z.string().trim().max(checklistLimits.helpMax).default(""),
  required: z.boolean().default(true),
  caution: z
    .strictObject({
      hazard: hazardKind,
      text: z.string().trim().min(1).max(checklistLimits.helpMax),
    })
    .nullable()
    .default(null),
};

export const checklistItem = z.discriminatedUnion("kind", [
  z.strictObject({ kind: z.literal("check"), ...itemCommon }),
  z
    .strictObject({
      kind: z.literal("number"),
      ...itemCommon,
      unit: z.string().trim().max(checklistLimits.unitMax).default(""),
      min: finite("Lowest allowed value").nullable().default(null),
      max: finite("Highest allowed value").nullable().default(null),
    })
    .refine((i) => i.min === null || i.max === null || i.min <= i.max, {
      message: "The lowest allowed value must not be above the highest",
      path: ["max"],
    }),
  z.strictObject({ kind: z.literal("text"), ...itemCommon }),
  z.strictObject({
    kind: z.literal("choice"),
    ...itemCommon,
    options: z
      .array(z.string().trim().min(1).max(checklistLimits.labelMax))
      .min(2, "A choice needs at least two options")
      .max(checklistLimits.choicesMax),
  }),
  z.strictObject({ kind: z.literal("photo"), ...itemCommon }),
]);
export type ChecklistItem = z.output<typeof checklistItem>;

export const checklistItems = z
  .array(checklistItem)
  .min(1, "A checklist needs at least one item")
  .max(checklistLimits.itemsMax, `At most ${checklistLimits.itemsMax} items`)
  .refine((items) => new Set(items.map((i) => i.id)).size === items.length, {
    message: "Item ids must be unique within a checklist",
  });

/** A result as typed at the item: its kind decides the value's shape. */
export const checklistValue = z.union([
  z.boolean(),
  finite("Value"),
  z.string().max(checklistLimits.textResultMax),
]);
export type ChecklistValue = z.infer<typeof checklistValue>;

const noteText = z
  .string()
  .trim()
  .max(checklistLimits.helpMax, `Note must be at most ${checklistLimits.helpMax} characters`)
  .refine((v) => !hasNul(v), nulMessage("Note"))
  .default("");
const when = (field: string) => z.iso.datetime({ offset: true, error: `${field} must be a time` });

/** Starts a run of a template at a site; the server copies the template's items into the run. */
export const checklistStartInput = z.strictObject({
  id: z.uuid("id must be a UUID"),
  templateId: z.uuid("templateId must be a UUID"),
  siteId: z.uuid("siteId must be a UUID"),
  startedAt: when("startedAt"),
});

/** One result at one item: append-only, so a correction is a newer result, never an overwrite. */
export const checklistRecordInput = z.strictObject({
  id: z.uuid("id must be a UUID"),
  runId: z.uuid("runId must be a UUID"),
  itemId: z.string().min(1).max(40),
  value: checklistValue.refine((v) => typeof v !== "string" || !hasNul(v), nulMessage("value")),
  note: noteText,
  recordedAt: when("recordedAt"),
});

export const checklistSignOffInput = z.strictObject({
  id: z.uuid("id must be a UUID"),
  signedOffAt: when("signedOffAt"),
  note: noteText,
});

export const checklistTemplateView = z.object({
  id: z.uuid(),
  campaignId: z.uuid(),
  title: z.string(),
  purpose: checklistPurpose,
  items: z.array(checklistItem),
  version: z.number().int(),
  updatedAt: z.string(),
  deletedAt: z.string().nullable(),
});
export type ChecklistTemplateView = z.infer<typeof checklistTemplateView>;

export const checklistRunView = z.object({
  id: z.uuid(),
  campaignId: z.uuid(),
  templateId: z.uuid(),
  siteId: z.uuid(),
  title: z.string(),
  purpose: checklistPurpose,
  items: z.array(checklistItem),
  startedAt: z.string(),
  startedBy: z.uuid().nullable(),
  signedOffAt: z.string().nullable(),
  signedOffBy: z.uuid().nullable(),
  signOffNote: z.string(),
});
export type ChecklistRunView = z.infer<typeof checklistRunView>;

export const checklistResultView = z.object({
  id: z.uuid(),
  campaignId: z.uuid(),
  runId: z.uuid(),
  itemId: z.string(),
  value: checklistValue,
  outOfRange: z.boolean(),
  note: z.string(),
  recordedAt: z.string(),
  recordedBy: z.uuid().nullable(),
  /** The author's name as the server knows it (absent from servers before it was added). */
  recordedByName: z.string().nullable().default(null),
});
export type ChecklistResultView = z.infer<typeof checklistResultView>;
