// Checklists: templates (kept by administrators) and runs at a site, whose item results are
// append-only entries with their author and time. A run copies its template's items when it
// starts, so editing a template never changes a run already under way.
import { z } from "zod";

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
