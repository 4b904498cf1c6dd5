// The levelling field book: a section between two marks, levelled forward and back, setup by setup.
// Setups are append-only (a correction is a newer setup with the same run and number; the latest
// counts), so two tablets never conflict; a section is opened once and closed once.
import { z } from "zod";
import { FGCC_1984_LEVELLING_CLASSES } from "../science/levelling/misclosure";
import { hasNul, nulMessage } from "./text";

export const levellingRuns = ["forward", "backward"] as const;
export const levellingRun = z.enum(levellingRuns);
export type LevellingRun = z.infer<typeof levellingRun>;

// Ranges from the handbook (DOMAIN.md §3): staff readings 0 … 5 m, sights 0 … 100 m. Outside is
// refused; the field-book checks warn well inside them.
export const levellingLimits = {
  readingM: { min: 0, max: 5 },
  sightM: { min: 0, max: 100 },
  setupsMax: 400,
  markMax: 60,
  noteMax: 500,
} as const;

const classIds = FGCC_1984_LEVELLING_CLASSES.map((c) => c.id) as [string, ...string[]];

const text = (field: string, max: number) =>
  z
    .string()
    .trim()
    .max(max, `${field} must be at most ${max} characters`)
    .refine((v) => !hasNul(v), nulMessage(field));
const mark = (field: string) =>
  text(field, levellingLimits.markMax).pipe(z.string().min(1, `${field} is required`));
const when = (field: string) => z.iso.datetime({ offset: true, error: `${field} must be a time` });
const metres = (field: string, { min, max }: { min: number; max: number }) =>
  z
    .number({ error: `${field} must be a number` })
    .finite(`${field} must be a number`)
    .min(min, `${field} must be between ${min} and ${max} m`)
    .max(max, `${field} must be between ${min} and ${max} m`);

export const levellingOpenInput = z.strictObject({
  id: z.uuid("id must be a UUID"),
  siteId: z.uuid("siteId must be a UUID"),
  fromMark: mark("From mark"),
  toMark: mark("To mark"),
  classId: z.enum(classIds, { error: "Choose a levelling class" }),
  instrument: text("Instrument", 120).default(""),
  openedAt: when("openedAt"),
});

export const levellingSetupInput = z.strictObject({
  id: z.uuid("id must be a UUID"),
  sectionId: z.uuid("sectionId must be a UUID"),
  run: levellingRun,
  /** 1, 2, … within the run; a second setup with the same number corrects the first. */
  number: z.number().int().min(1).max(levellingLimits.setupsMax),
  backsightM: metres("Backsight", levellingLimits.readingM),
  foresightM: metres("Foresight", levellingLimits.readingM),
  backsightDistanceM: metres("Backsight distance", levellingLimits.sightM),
  foresightDistanceM: metres("Foresight distance", levellingLimits.sightM),
  note: text("Note", levellingLimits.noteMax).default(""),
  recordedAt: when("recordedAt"),
});
export type LevellingSetupInput = z.input<typeof levellingSetupInput>;

export const levellingCloseInput = z.strictObject({
  id: z.uuid("id must be a UUID"),
  closedAt: when("closedAt"),
  /** Required when the misclosure is beyond the class tolerance: why it is closed anyway. */
  note: text("Note", levellingLimits.noteMax).default(""),
});

/** What was concluded when the section was closed, from its setups then. */
export const levellingClosure = z.object({
  forwardDeltaM: z.number(),
  backwardDeltaM: z.number(),
  lengthKm: z.number(),
  misclosureM: z.number(),
  toleranceM: z.number(),
  withinTolerance: z.boolean(),
});
export type LevellingClosure = z.infer<typeof levellingClosure>;

export const levellingSectionView = z.object({
  id: z.uuid(),
  campaignId: z.uuid(),
  siteId: z.uuid(),
  fromMark: z.string(),
  toMark: z.string(),
  classId: z.string(),
  instrument: z.string(),
  openedAt: z.string(),
  openedBy: z.uuid().nullable(),
  closedAt: z.string().nullable(),
  closedBy: z.uuid().nullable(),
  closeNote: z.string(),
  closure: levellingClosure.nullable(),
});
export type LevellingSectionView = z.infer<typeof levellingSectionView>;

export const levellingSetupView = z.object({
  id: z.uuid(),
  campaignId: z.uuid(),
  sectionId: z.uuid(),
  run: levellingRun,
  number: z.number().int(),
  backsightM: z.number(),
  foresightM: z.number(),
  backsightDistanceM: z.number(),
  foresightDistanceM: z.number(),
  note: z.string(),
  recordedAt: z.string(),
  recordedBy: z.uuid().nullable(),
  recordedByName: z.string().nullable(),
});
export type LevellingSetupView = z.infer<typeof levellingSetupView>;
