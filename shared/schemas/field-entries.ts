// Field entries: what the crew records about crates and the site — shock indicators, shock-logger
// events, temperatures, the dew-point check before unpacking, free observations. Entries are
// append-only (a correction is a newer entry), so they never conflict. An imported logger file
// that is longer than one entry holds is split into parts sharing an import id.
import { z } from "zod";
import { hasNul, nulMessage } from "./text";

export const fieldEntryKinds = [
  "shock-indicator",
  "shock-log",
  "temperatures",
  "dew-point",
  "observation",
] as const;
export const fieldEntryKind = z.enum(fieldEntryKinds);
export type FieldEntryKind = z.infer<typeof fieldEntryKind>;

export const fieldEntryKindLabels: Record<FieldEntryKind, string> = {
  "shock-indicator": "Shock indicator",
  "shock-log": "Shock logger",
  temperatures: "Temperatures",
  "dew-point": "Dew-point check",
  observation: "Observation",
};

// Ranges from the handbook's plausible ranges (DOMAIN.md §3); outside them is refused.
export const fieldEntryLimits = {
  shockG: { min: 0, max: 1000 },
  temperatureC: { min: -50, max: 85 },
  humidityPct: { min: 0, max: 100 },
  durationMs: { min: 0, max: 10_000 },
  /** Per entry: one push stays well under the server's 1 MB body limit. */
  eventsMax: 2000,
  samplesMax: 5000,
  textMax: 2000,
  labelMax: 120,
} as const;

const inRange = (field: string, { min, max }: { min: number; max: number }, unit: string) =>
  z
    .number({ error: `${field} must be a number` })
    .finite(`${field} must be a number`)
    .min(min, `${field} must be between ${min} and ${max} ${unit}`)
    .max(max, `${field} must be between ${min} and ${max} ${unit}`);

const plainText = (field: string, max: number) =>
  z
    .string()
    .trim()
    .max(max, `${field} must be at most ${max} characters`)
    .refine((v) => !hasNul(v), nulMessage(field));

const when = (field: string) => z.iso.datetime({ offset: true, error: `${field} must be a time` });

const peak = (axis: string) => inRange(`Peak ${axis}`, fieldEntryLimits.shockG, "g").nullable();

/** One shock pulse as a logger reports it: peak per axis (an axis it does not give is null). */
export const shockEvent = z
  .strictObject({
    at: when("Time"),
    xG: peak("x"),
    yG: peak("y"),
    zG: peak("z"),
    durationMs: inRange("Duration", fieldEntryLimits.durationMs, "ms").nullable(),
  })
  .refine((e) => e.xG !== null || e.yG !== null || e.zG !== null, {
    message: "A shock event needs a peak on at least one axis",
    path: ["xG"],
  });
export type ShockEventInput = z.infer<typeof shockEvent>;

export const temperatureSample = z.strictObject({
  at: when("Time"),
  celsius: inRange("Temperature", fieldEntryLimits.temperatureC, "°C"),
  humidityPct: inRange("Relative humidity", fieldEntryLimits.humidityPct, "%").nullable(),
});
export type TemperatureSample = z.infer<typeof temperatureSample>;

export const entrySources = ["manual", "logger"] as const;

/** Where an imported part came from, so the parts of one file are shown as one. */
const importPart = z
  .strictObject({
    importId: z.uuid("importId must be a UUID"),
    fileName: plainText("File name", 200),
    part: z.number().int().min(1),
    parts: z.number().int().min(1),
  })
  .refine((p) => p.part <= p.parts, { message: "part must not exceed parts", path: ["part"] })
  .nullable()
  .default(null);

export const fieldEntryData = z.discriminatedUnion("kind", [
  z.strictObject({
    kind: z.literal("shock-indicator"),
    /** The g level the label trips at, as printed on it. */
    ratingG: inRange("Rating", fieldEntryLimits.shockG, "g").positive("Rating must be above 0 g"),
    tripped: z.boolean({ error: "Say whether the indicator has tripped" }),
    indicatorLabel: plainText("Indicator", fieldEntryLimits.labelMax).default(""),
  }),
  z.strictObject({
    kind: z.literal("shock-log"),
    source: z.enum(entrySources),
    loggerModel: plainText("Logger model", fieldEntryLimits.labelMax).default(""),
    import: importPart,
    events: z
      .array(shockEvent)
      .min(1, "At least one shock event")
      .max(fieldEntryLimits.eventsMax, `At most ${fieldEntryLimits.eventsMax} events per entry`),
  }),
  z.strictObject({
    kind: z.literal("temperatures"),
    source: z.enum(entrySources),
    loggerModel: plainText("Logger model", fieldEntryLimits.labelMax).default(""),
    import: importPart,
    samples: z
      .array(temperatureSample)
      .min(1, "At least one temperature")
      .max(fieldEntryLimits.samplesMax, `At most ${fieldEntryLimits.samplesMax} samples per entry`),
  }),
  z.strictObject({
    kind: z.literal("dew-point"),
    /** The unpacking checklist run this check belongs to, when there is one. */
    runId: z.uuid("runId must be a UUID").nullable().default(null),
    roomTemperatureC: inRange("Room temperature", { min: -40, max: 60 }, "°C"),
    roomHumidityPct: inRange("Room relative humidity", fieldEntryLimits.humidityPct, "%").refine(
      (v) => v > 0,
      "Room relative humidity must be above 0 %",
    ),
    surfaceTemperatureC: inRange("Crate surface temperature", fieldEntryLimits.temperatureC, "°C"),
    marginK: inRange("Margin", { min: 0, max: 20 }, "K").default(3),
    /** Why the crate is opened although the check did not pass; empty when it passed. */
    overrideReason: plainText("Reason", fieldEntryLimits.textMax).default(""),
  }),
  z.strictObject({
    kind: z.literal("observation"),
    text: plainText("Observation", fieldEntryLimits.textMax).pipe(
      z.string().min(1, "Observation must not be empty"),
    ),
  }),
]);
export type FieldEntryData = z.output<typeof fieldEntryData>;
export type FieldEntryDataInput = z.input<typeof fieldEntryData>;

/** Kinds that are about one crate and cannot be recorded without it. */
export const crateKinds: readonly FieldEntryKind[] = ["shock-indicator", "shock-log", "dew-point"];

export const fieldEntryInput = z
  .strictObject({
    id: z.uuid("id must be a UUID"),
    siteId: z.uuid("siteId must be a UUID"),
    crateId: z.uuid("crateId must be a UUID").nullable().default(null),
    /** When it was seen or measured (the first sample for a series). */
    observedAt: when("observedAt"),
    /** When it was written down on the tablet. */
    recordedAt: when("recordedAt"),
    note: plainText("Note", fieldEntryLimits.textMax).default(""),
    data: fieldEntryData,
  })
  .refine((e) => e.crateId !== null || !crateKinds.includes(e.data.kind), {
    message: "Choose the crate this entry is about",
    path: ["crateId"],
  });
export type FieldEntryInput = z.input<typeof fieldEntryInput>;

/** What the server concluded about an entry against its crate's limits, kept with the entry. */
export const entryFlags = z.object({
  /** A tripped indicator, a peak or a temperature beyond the crate's limits, a failed check. */
  exceeded: z.boolean(),
  summary: z.string(),
});
export type EntryFlags = z.infer<typeof entryFlags>;

export const fieldEntryView = z.object({
  id: z.uuid(),
  campaignId: z.uuid(),
  siteId: z.uuid(),
  crateId: z.uuid().nullable(),
  kind: fieldEntryKind,
  observedAt: z.string(),
  note: z.string(),
  data: fieldEntryData,
  flags: entryFlags,
  recordedAt: z.string(),
  recordedBy: z.uuid().nullable(),
  recordedByName: z.string().nullable(),
});
export type FieldEntryView = z.infer<typeof fieldEntryView>;
