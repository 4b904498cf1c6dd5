// Logistics: crates and their state, legs (a crate's movement from place to place, planned and then
// recorded as it happens), handovers (custody passing from person to person) and alerts (an entry
// beyond a crate's limits). Legs change once per step (planned, departed, arrived or cancelled) and
// handovers are append-only, so tablets never conflict over them.
import { z } from "zod";
import { hasNul, nulMessage } from "./text";

export const crateStates = ["ready", "moving", "arrived", "unpacked", "returned", "held"] as const;
export const crateState = z.enum(crateStates);
export type CrateState = z.infer<typeof crateState>;

export const crateStateLabels: Record<CrateState, string> = {
  ready: "Packed, ready to go",
  moving: "On the way",
  arrived: "Arrived",
  unpacked: "Unpacked",
  returned: "Back home",
  held: "Held for inspection",
};

export const handoverConditions = ["intact", "marked", "damaged"] as const;
export const handoverCondition = z.enum(handoverConditions);
export type HandoverCondition = z.infer<typeof handoverCondition>;

export const handoverConditionLabels: Record<HandoverCondition, string> = {
  intact: "Intact",
  marked: "Marks or dents, contents look fine",
  damaged: "Damaged",
};

export const logisticsLimits = {
  labelMax: 40,
  textMax: 200,
  noteMax: 2000,
  nameMax: 120,
  weightKg: { min: 0, max: 2000 },
  shockG: { min: 1, max: 1000 },
  temperatureC: { min: -50, max: 85 },
  tiltDeg: { min: 1, max: 90 },
} as const;

const text = (field: string, max: number) =>
  z
    .string()
    .trim()
    .max(max, `${field} must be at most ${max} characters`)
    .refine((v) => !hasNul(v), nulMessage(field));
const required = (field: string, max: number) =>
  text(field, max).pipe(z.string().min(1, `${field} is required`));
const when = (field: string) => z.iso.datetime({ offset: true, error: `${field} must be a time` });
const between = (field: string, { min, max }: { min: number; max: number }, unit: string) =>
  z
    .number({ error: `${field} must be a number` })
    .finite(`${field} must be a number`)
    .min(min, `${field} must be between ${min} and ${max} ${unit}`)
    .max(max, `${field} must be between ${min} and ${max} ${unit}`);

/** A crate as logistics edits it (REST, online); the server owns id, version and change position. */
export const crateFields = z
  .strictObject({
    label: required("Label", logisticsLimits.labelMax),
    contents: required("Contents", logisticsLimits.textMax),
    instrument: text("Instrument", logisticsLimits.textMax).default(""),
    weightKg: between("Weight", logisticsLimits.weightKg, "kg"),
    maxShockG: between("Highest shock", logisticsLimits.shockG, "g"),
    temperatureMinC: between("Lowest temperature", logisticsLimits.temperatureC, "°C"),
    temperatureMaxC: between("Highest temperature", logisticsLimits.temperatureC, "°C"),
    maxTiltDeg: between("Largest tilt", logisticsLimits.tiltDeg, "°").nullable().default(null),
    state: crateState.default("ready"),
    notes: text("Notes", logisticsLimits.noteMax).default(""),
  })
  .refine((c) => c.temperatureMinC < c.temperatureMaxC, {
    message: "The lowest temperature must be below the highest",
    path: ["temperatureMaxC"],
  });
export type CrateFields = z.input<typeof crateFields>;

export const crateCreateInput = z.strictObject({
  id: z.uuid("id must be a UUID"),
  crate: crateFields,
});
export const crateUpdateInput = z.strictObject({
  baseVersion: z.number().int().min(1),
  crate: crateFields,
});

/** Plans a crate's movement between two places (sites of the campaign: labs, depots, remote sites). */
export const legPlanInput = z
  .strictObject({
    id: z.uuid("id must be a UUID"),
    crateId: z.uuid("Choose the crate"),
    fromSiteId: z.uuid("Choose where the leg starts"),
    toSiteId: z.uuid("Choose where the leg ends"),
    /** The vehicle or carrier, as the crew names it. */
    vehicle: text("Vehicle", logisticsLimits.textMax).default(""),
    plannedDepartAt: when("Planned departure"),
    plannedArriveAt: when("Planned arrival"),
    note: text("Note", logisticsLimits.noteMax).default(""),
  })
  .refine((l) => l.fromSiteId !== l.toSiteId, {
    message: "A leg ends somewhere else than it starts",
    path: ["toSiteId"],
  })
  .refine((l) => Date.parse(l.plannedArriveAt) >= Date.parse(l.plannedDepartAt), {
    message: "The planned arrival must not be before the planned departure",
    path: ["plannedArriveAt"],
  });

/** Departure, arrival or cancellation of a leg: each happens once. */
export const legStepInput = z.strictObject({
  id: z.uuid("id must be a UUID"),
  at: when("Time"),
  note: text("Note", logisticsLimits.noteMax).default(""),
});

/** Custody of a crate passes from one person to the next; the receiver types their name as signature. */
export const handoverInput = z.strictObject({
  id: z.uuid("id must be a UUID"),
  crateId: z.uuid("Choose the crate"),
  legId: z.uuid("legId must be a UUID").nullable().default(null),
  fromName: required("Handed over by", logisticsLimits.nameMax),
  toName: required("Received by (typed name)", logisticsLimits.nameMax),
  at: when("Time"),
  siteId: z.uuid("siteId must be a UUID").nullable().default(null),
  place: text("Place", logisticsLimits.textMax).default(""),
  condition: handoverCondition,
  note: text("Note", logisticsLimits.noteMax).default(""),
});

export const alertAcknowledgeInput = z.strictObject({
  id: z.uuid("id must be a UUID"),
  at: when("Time"),
  note: text("Note", logisticsLimits.noteMax).default(""),
});

export const legStates = ["planned", "under-way", "arrived", "cancelled"] as const;
export type LegState = (typeof legStates)[number];

export const legView = z.object({
  id: z.uuid(),
  campaignId: z.uuid(),
  crateId: z.uuid(),
  fromSiteId: z.uuid(),
  toSiteId: z.uuid(),
  vehicle: z.string(),
  plannedDepartAt: z.string(),
  plannedArriveAt: z.string(),
  departedAt: z.string().nullable(),
  arrivedAt: z.string().nullable(),
  cancelledAt: z.string().nullable(),
  note: z.string(),
  createdBy: z.uuid().nullable(),
});
export type LegView = z.infer<typeof legView>;

/** Where a leg stands, from its steps. */
export function legState(leg: Pick<LegView, "departedAt" | "arrivedAt" | "cancelledAt">): LegState {
  if (leg.cancelledAt !== null) return "cancelled";
  if (leg.arrivedAt !== null) return "arrived";
  if (leg.departedAt !== null) return "under-way";
  return "planned";
}

export const handoverView = z.object({
  id: z.uuid(),
  campaignId: z.uuid(),
  crateId: z.uuid(),
  legId: z.uuid().nullable(),
  fromName: z.string(),
  toName: z.string(),
  at: z.string(),
  siteId: z.uuid().nullable(),
  place: z.string(),
  condition: handoverCondition,
  note: z.string(),
  recordedBy: z.uuid().nullable(),
  recordedByName: z.string().nullable(),
  recordedAt: z.string(),
});
export type HandoverView = z.infer<typeof handoverView>;

export const alertView = z.object({
  id: z.uuid(),
  campaignId: z.uuid(),
  crateId: z.uuid().nullable(),
  siteId: z.uuid().nullable(),
  entryId: z.uuid().nullable(),
  kind: z.string(),
  summary: z.string(),
  createdAt: z.string(),
  acknowledgedAt: z.string().nullable(),
  acknowledgedBy: z.uuid().nullable(),
  acknowledgeNote: z.string(),
});
export type AlertView = z.infer<typeof alertView>;
