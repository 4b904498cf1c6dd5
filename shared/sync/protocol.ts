// The sync wire protocol: push mutations in per-client order, pull changes in commit order.
// Version it: a client with another protocol version is told to update and keeps its outbox.
import { z } from "zod";
import type { Action } from "../permissions";
import { attachmentLinkInput, attachmentLinkView } from "../schemas/attachments";
import {
  checklistRecordInput,
  checklistResultView,
  checklistRunView,
  checklistSignOffInput,
  checklistStartInput,
  checklistTemplateView,
} from "../schemas/checklists";
import { crateView } from "../schemas/crates";
import { fieldEntryInput, fieldEntryView } from "../schemas/field-entries";
import {
  levellingCloseInput,
  levellingOpenInput,
  levellingSectionView,
  levellingSetupInput,
  levellingSetupView,
} from "../schemas/levelling";
import {
  alertAcknowledgeInput,
  alertView,
  handoverInput,
  handoverView,
  legPlanInput,
  legStepInput,
  legView,
} from "../schemas/logistics";
import { reviewView } from "../schemas/reviews";
import { siteCreateInput, sitePatchSchema, siteView } from "../schemas/sites";

/** 2: review decisions travel in the pull (entity "review"). */
export const protocolVersion = 2;
export const maxPushBatch = 500;
export const maxPullPage = 1000;
export const defaultPullPage = 500;

/** Every kind of mutation a client may send, each with its own argument schema. */
export const mutationSchemas = {
  "site.create": siteCreateInput.required({ id: true }),
  "site.update": z
    .strictObject({
      id: z.uuid(),
      // Only the fields the user changed, with the value they saw before changing them (for the merge).
      changes: sitePatchSchema,
      base: sitePatchSchema,
    })
    .refine((a) => Object.keys(a.changes).every((k) => k in a.base), {
      message: "base must hold the value seen before each changed field",
      path: ["base"],
    }),
  "site.delete": z.strictObject({ id: z.uuid() }),
  // A person's choice for one conflicted field; the value is checked by the entity's field schema.
  "conflict.resolve": z.strictObject({ id: z.uuid(), value: z.unknown() }),
  // Attachments are append-only: added once, removed once, never edited, so they never conflict.
  "attachment.add": attachmentLinkInput,
  "attachment.remove": z.strictObject({ id: z.uuid() }),
  // Checklist results are append-only; a run is started once and signed off once.
  "checklist.start": checklistStartInput,
  "checklist.record": checklistRecordInput,
  "checklist.signOff": checklistSignOffInput,
  // Field entries (shock, temperatures, dew point, observations) are append-only.
  "entry.add": fieldEntryInput,
  // A levelling section is opened once and closed once; its setups are append-only.
  "levelling.open": levellingOpenInput,
  "levelling.setup": levellingSetupInput,
  "levelling.close": levellingCloseInput,
  // A leg is planned once and then departs, arrives or is cancelled, each once.
  "leg.plan": legPlanInput,
  "leg.depart": legStepInput,
  "leg.arrive": legStepInput,
  "leg.cancel": legStepInput,
  // Handovers are append-only: the chain of custody only grows.
  "handover.record": handoverInput,
  "alert.acknowledge": alertAcknowledgeInput,
} as const;

export const mutationNames = Object.keys(mutationSchemas) as [
  keyof typeof mutationSchemas,
  ...(keyof typeof mutationSchemas)[],
];
export const mutationNameSchema = z.enum(mutationNames);
export type MutationName = z.infer<typeof mutationNameSchema>;
export type MutationArgs<N extends MutationName> = z.input<(typeof mutationSchemas)[N]>;

/** The permission each mutation needs, checked again at push time with the user's current role. */
export const mutationActions: Record<MutationName, Action> = {
  "site.create": "site.write",
  "site.update": "site.write",
  "site.delete": "site.delete",
  "conflict.resolve": "site.write",
  "attachment.add": "attachment.write",
  "attachment.remove": "attachment.write",
  "checklist.start": "checklist.record",
  "checklist.record": "checklist.record",
  "checklist.signOff": "checklist.record",
  "entry.add": "entry.record",
  "levelling.open": "levelling.record",
  "levelling.setup": "levelling.record",
  "levelling.close": "levelling.record",
  "leg.plan": "leg.plan",
  "leg.depart": "leg.record",
  "leg.arrive": "leg.record",
  "leg.cancel": "leg.plan",
  "handover.record": "handover.record",
  "alert.acknowledge": "alert.acknowledge",
};

export const mutationEnvelope = z.strictObject({
  mutationId: z.number().int().positive(),
  name: mutationNameSchema,
  // Checked against mutationSchemas[name] when applied, so one bad mutation does not void the batch.
  args: z.unknown(),
  createdAt: z.iso.datetime({ offset: true }),
});
export type MutationEnvelope = z.infer<typeof mutationEnvelope>;

export const pushRequest = z.strictObject({
  protocolVersion: z.number().int(),
  clientId: z.uuid(),
  campaignId: z.uuid(),
  mutations: z
    .array(mutationEnvelope)
    .max(maxPushBatch, `At most ${maxPushBatch} mutations per push`),
});
export type PushRequest = z.infer<typeof pushRequest>;

export const mutationStatuses = ["applied", "duplicate", "conflict", "rejected"] as const;
export const mutationResult = z.object({
  mutationId: z.number().int(),
  status: z.enum(mutationStatuses),
  message: z.string().optional(),
});
export type MutationResult = z.infer<typeof mutationResult>;

export const pushResponse = z.object({
  results: z.array(mutationResult),
  lastMutationId: z.number().int(),
});
export type PushResponse = z.infer<typeof pushResponse>;

export const syncEntities = [
  "site",
  "conflict",
  "attachment",
  "checklistTemplate",
  "checklistRun",
  "checklistResult",
  "crate",
  "fieldEntry",
  "levellingSection",
  "levellingSetup",
  "leg",
  "handover",
  "alert",
  "review",
] as const;
export const syncEntitySchema = z.enum(syncEntities);
export type SyncEntity = z.infer<typeof syncEntitySchema>;

export const conflictView = z.object({
  id: z.uuid(),
  entity: z.enum(["site"]),
  entityId: z.uuid(),
  field: z.string(),
  baseValue: z.unknown(),
  serverValue: z.unknown(),
  clientValue: z.unknown(),
  openedAt: z.string(),
  openedBy: z.uuid().nullable(),
  resolvedAt: z.string().nullable(),
  resolvedValue: z.unknown(),
});
export type ConflictView = z.infer<typeof conflictView>;

export const changeRecord = z.discriminatedUnion("entity", [
  z.object({ entity: z.literal("site"), seq: z.number().int(), id: z.uuid(), data: siteView }),
  z.object({
    entity: z.literal("conflict"),
    seq: z.number().int(),
    id: z.uuid(),
    data: conflictView,
  }),
  z.object({
    entity: z.literal("attachment"),
    seq: z.number().int(),
    id: z.uuid(),
    data: attachmentLinkView,
  }),
  z.object({
    entity: z.literal("checklistTemplate"),
    seq: z.number().int(),
    id: z.uuid(),
    data: checklistTemplateView,
  }),
  z.object({
    entity: z.literal("checklistRun"),
    seq: z.number().int(),
    id: z.uuid(),
    data: checklistRunView,
  }),
  z.object({
    entity: z.literal("checklistResult"),
    seq: z.number().int(),
    id: z.uuid(),
    data: checklistResultView,
  }),
  z.object({ entity: z.literal("crate"), seq: z.number().int(), id: z.uuid(), data: crateView }),
  z.object({
    entity: z.literal("fieldEntry"),
    seq: z.number().int(),
    id: z.uuid(),
    data: fieldEntryView,
  }),
  z.object({
    entity: z.literal("levellingSection"),
    seq: z.number().int(),
    id: z.uuid(),
    data: levellingSectionView,
  }),
  z.object({
    entity: z.literal("levellingSetup"),
    seq: z.number().int(),
    id: z.uuid(),
    data: levellingSetupView,
  }),
  z.object({ entity: z.literal("leg"), seq: z.number().int(), id: z.uuid(), data: legView }),
  z.object({
    entity: z.literal("handover"),
    seq: z.number().int(),
    id: z.uuid(),
    data: handoverView,
  }),
  z.object({ entity: z.literal("alert"), seq: z.number().int(), id: z.uuid(), data: alertView }),
  z.object({ entity: z.literal("review"), seq: z.number().int(), id: z.uuid(), data: reviewView }),
]);
export type ChangeRecord = z.infer<typeof changeRecord>;

export const pullQuery = z.strictObject({
  protocolVersion: z.coerce.number().int(),
  campaign: z.uuid("campaign must be a campaign id"),
  clientId: z.uuid("clientId must be a UUID").optional(),
  cursor: z.coerce.number().int().min(0).default(0),
  limit: z.coerce.number().int().min(1).max(maxPullPage).default(defaultPullPage),
  // The lowest mutation id still in the client's outbox: the last page names the refused ones
  // from there on, so a refusal whose push answer was lost still reaches the recovery list.
  pendingFrom: z.coerce.number().int().min(1).optional(),
});

export const pullResponse = z.object({
  changes: z.array(changeRecord),
  cursor: z.number().int(),
  hasMore: z.boolean(),
  lastMutationId: z.number().int().nullable(),
  rejections: z.array(z.object({ mutationId: z.number().int(), reason: z.string() })).default([]),
});
export type PullResponse = z.infer<typeof pullResponse>;

export const registerClientInput = z.strictObject({
  clientId: z.uuid(),
  label: z.string().trim().max(120).default(""),
});
