import { z } from "zod";
import { limits } from "./limits";
import { hasNul, nulMessage } from "./text";

export const siteKinds = [
  "reference-lab",
  "mountain",
  "coastal",
  "tunnel",
  "depot",
  "other",
] as const;
export const siteKindSchema = z.enum(siteKinds);
export type SiteKind = z.infer<typeof siteKindSchema>;

export const siteKindLabels: Record<SiteKind, string> = {
  "reference-lab": "Reference laboratory",
  mountain: "Mountain site",
  coastal: "Coastal site",
  tunnel: "Tunnel or underground lab",
  depot: "Depot",
  other: "Other",
};

const finite = (field: string) => z.number({ error: `${field} must be a number` }).finite();

const siteFields = {
  name: z
    .string()
    .trim()
    .min(1, "Name is required")
    .max(limits.nameMax, `Name must be at most ${limits.nameMax} characters`)
    .refine((v) => !hasNul(v), nulMessage("Name")),
  kind: siteKindSchema,
  latitudeDeg: finite("Latitude")
    .min(limits.latitudeDeg.min, "Latitude must be between −90° and 90°")
    .max(limits.latitudeDeg.max, "Latitude must be between −90° and 90°"),
  longitudeDeg: finite("Longitude")
    .min(limits.longitudeDeg.min, "Longitude must be between −180° and 180°")
    .max(limits.longitudeDeg.max, "Longitude must be between −180° and 180°"),
  approxHeightM: finite("Approximate height")
    .min(
      limits.siteHeightM.min,
      `Approximate height must be between ${limits.siteHeightM.min} m and ${limits.siteHeightM.max} m`,
    )
    .max(
      limits.siteHeightM.max,
      `Approximate height must be between ${limits.siteHeightM.min} m and ${limits.siteHeightM.max} m`,
    ),
  notes: z
    .string()
    .max(limits.notesMax, `Notes must be at most ${limits.notesMax} characters`)
    .refine((v) => !hasNul(v), nulMessage("Notes"))
    .default(""),
};

export const siteCreateInput = z.strictObject({
  // Made on the client so that an offline-created site keeps its identity when it syncs.
  id: z.uuid("Site id must be a UUID").optional(),
  ...siteFields,
});
export type SiteCreateInput = z.input<typeof siteCreateInput>;

export const siteUpdateInput = z.strictObject({
  baseVersion: z.number().int().positive("baseVersion must be a positive whole number"),
  name: siteFields.name.optional(),
  kind: siteFields.kind.optional(),
  latitudeDeg: siteFields.latitudeDeg.optional(),
  longitudeDeg: siteFields.longitudeDeg.optional(),
  approxHeightM: siteFields.approxHeightM.optional(),
  notes: z
    .string()
    .max(limits.notesMax, `Notes must be at most ${limits.notesMax} characters`)
    .refine((v) => !hasNul(v), nulMessage("Notes"))
    .optional(),
});
export type SiteUpdateInput = z.infer<typeof siteUpdateInput>;

export const siteView = z.object({
  id: z.uuid(),
  campaignId: z.uuid(),
  name: z.string(),
  kind: siteKindSchema,
  latitudeDeg: z.number(),
  longitudeDeg: z.number(),
  approxHeightM: z.number(),
  notes: z.string(),
  version: z.number().int(),
  updatedAt: z.string(),
  updatedBy: z.uuid().nullable(),
  deletedAt: z.string().nullable(),
});
export type SiteView = z.infer<typeof siteView>;

/** The form's shape: all site fields, no server-owned ones. */
export const siteFormSchema = z.strictObject(siteFields);
export type SiteFormValues = z.input<typeof siteFormSchema>;

/** Only the fields a person changed; no defaults, so an absent field is never overwritten. */
export const sitePatchSchema = siteUpdateInput.omit({ baseVersion: true });
export type SitePatch = z.infer<typeof sitePatchSchema>;
