// Drizzle schema: the campaign's record of truth. Migrations in drizzle/ are generated from this file.
import { sql } from "drizzle-orm";
import {
  bigint,
  bigserial,
  boolean,
  check,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from "drizzle-orm/pg-core";
import { roles } from "../../shared/permissions";
import { attachmentSubjectKinds } from "../../shared/schemas/attachments";
import { checklistPurposes } from "../../shared/schemas/checklists";
import { fieldEntryKinds } from "../../shared/schemas/field-entries";
import { levellingRuns } from "../../shared/schemas/levelling";
import { crateStates, handoverConditions } from "../../shared/schemas/logistics";
import { instrumentKinds } from "../../shared/schemas/instruments";
import { seriesValueKinds, analysisStates } from "../../shared/schemas/comparison";
import { siteKinds } from "../../shared/schemas/sites";
import { reviewDecisions, reviewSubjectKinds } from "../../shared/schemas/reviews";

const createdAt = () => timestamp("created_at", { withTimezone: true }).notNull().defaultNow();
/** The campaign a row belongs to; the row goes with the campaign. */
const campaignRef = () =>
  uuid("campaign_id")
    .notNull()
    .references(() => campaigns.id, { onDelete: "cascade" });
/** Position in the campaign's change stream (db/change-seq.ts). */
const changeSeq = () => bigint("change_seq", { mode: "number" }).notNull();
/** Who did it; kept as null when the person's account is deleted. */
const userRef = (column: string) =>
  uuid(column).references(() => users.id, { onDelete: "set null" });

export const roleEnum = pgEnum("role", roles);
export const siteKindEnum = pgEnum("site_kind", siteKinds);

export const users = pgTable(
  "users",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    email: text("email").notNull(),
    name: text("name").notNull(),
    passwordHash: text("password_hash"),
    createdAt: createdAt(),
    disabledAt: timestamp("disabled_at", { withTimezone: true }),
  },
  (t) => [uniqueIndex("users_email_key").on(sql`lower(${t.email})`)],
);

export const campaigns = pgTable("campaigns", {
  id: uuid("id").primaryKey().defaultRandom(),
  name: text("name").notNull(),
  description: text("description").notNull().default(""),
  createdAt: createdAt(),
  /** The last position handed out in this campaign's change stream (see db/change-seq.ts). */
  changeSeq: bigint("change_seq", { mode: "number" }).notNull().default(0),
});

export const memberships = pgTable(
  "memberships",
  {
    campaignId: campaignRef(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    role: roleEnum("role").notNull(),
    createdAt: createdAt(),
  },
  (t) => [
    primaryKey({ columns: [t.campaignId, t.userId] }),
    index("memberships_user_idx").on(t.userId),
  ],
);

export const refreshTokens = pgTable(
  "refresh_tokens",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    familyId: uuid("family_id").notNull(),
    tokenHash: text("token_hash").notNull(),
    createdAt: createdAt(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    rotatedAt: timestamp("rotated_at", { withTimezone: true }),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
  },
  (t) => [
    uniqueIndex("refresh_tokens_hash_key").on(t.tokenHash),
    index("refresh_tokens_family_idx").on(t.familyId),
  ],
);

export const invites = pgTable(
  "invites",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    campaignId: campaignRef(),
    email: text("email").notNull(),
    role: roleEnum("role").notNull(),
    tokenHash: text("token_hash").notNull(),
    invitedBy: userRef("invited_by"),
    createdAt: createdAt(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    acceptedAt: timestamp("accepted_at", { withTimezone: true }),
  },
  (t) => [uniqueIndex("invites_token_key").on(t.tokenHash)],
);

/** Failed sign-ins per key ("account:<email>" or "address:<ip>"), kept in the database so every instance agrees. */
export const authThrottle = pgTable("auth_throttle", {
  key: text("key").primaryKey(),
  failures: integer("failures").notNull().default(0),
  windowStartedAt: timestamp("window_started_at", { withTimezone: true }).notNull().defaultNow(),
  blockedUntil: timestamp("blocked_until", { withTimezone: true }),
});

export const sites = pgTable(
  "sites",
  {
    id: uuid("id").primaryKey(),
    campaignId: campaignRef(),
    name: text("name").notNull(),
    kind: siteKindEnum("kind").notNull(),
    latitudeDeg: doublePrecision("latitude_deg").notNull(),
    longitudeDeg: doublePrecision("longitude_deg").notNull(),
    approxHeightM: doublePrecision("approx_height_m").notNull(),
    notes: text("notes").notNull().default(""),
    version: integer("version").notNull().default(1),
    changeSeq: changeSeq(),
    createdAt: createdAt(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
    updatedBy: userRef("updated_by"),
    deletedAt: timestamp("deleted_at", { withTimezone: true }),
  },
  (t) => [index("sites_change_idx").on(t.campaignId, t.changeSeq)],
);

export const auditEvents = pgTable(
  "audit_events",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    campaignId: uuid("campaign_id").references(() => campaigns.id, { onDelete: "cascade" }),
    userId: userRef("user_id"),
    /** The sync client (tablet) the change came from, when it came through sync. */
    clientId: uuid("client_id"),
    action: text("action").notNull(),
    entity: text("entity").notNull(),
    entityId: text("entity_id").notNull(),
    before: jsonb("before"),
    after: jsonb("after"),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("audit_events_entity_idx").on(t.entity, t.entityId)],
);

/** E-mail is written here in the same transaction as its cause and sent by a worker: nothing lost. */
export const emailOutbox = pgTable(
  "email_outbox",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    toAddress: text("to_address").notNull(),
    subject: text("subject").notNull(),
    textBody: text("text_body").notNull(),
    createdAt: createdAt(),
    attempts: integer("attempts").notNull().default(0),
    nextAttemptAt: timestamp("next_attempt_at", { withTimezone: true }).notNull().defaultNow(),
    sentAt: timestamp("sent_at", { withTimezone: true }),
    lastError: text("last_error"),
    /** Set for messages that must be queued once only (e.g. `alert:<alert>:<user>`). */
    messageKey: text("message_key"),
  },
  (t) => [
    index("email_outbox_due_idx")
      .on(t.nextAttemptAt)
      .where(sql`${t.sentAt} is null`),
    uniqueIndex("email_outbox_message_key").on(t.messageKey),
  ],
);

/** A tablet (or browser profile) registered to a user, with the last mutation id the server applied. */
export const syncClients = pgTable("sync_clients", {
  id: uuid("id").primaryKey(),
  userId: uuid("user_id")
    .notNull()
    .references(() => users.id, { onDelete: "cascade" }),
  label: text("label").notNull().default(""),
  lastMutationId: bigint("last_mutation_id", { mode: "number" }).notNull().default(0),
  createdAt: createdAt(),
  lastSeenAt: timestamp("last_seen_at", { withTimezone: true }).notNull().defaultNow(),
});

/** Mutations refused at push time, kept whole so that nothing typed in the field is lost. */
export const syncRejections = pgTable(
  "sync_rejections",
  {
    id: bigserial("id", { mode: "number" }).primaryKey(),
    clientId: uuid("client_id")
      .notNull()
      .references(() => syncClients.id, { onDelete: "cascade" }),
    userId: userRef("user_id"),
    campaignId: uuid("campaign_id"),
    mutationId: bigint("mutation_id", { mode: "number" }).notNull(),
    name: text("name").notNull(),
    args: jsonb("args"),
    reason: text("reason").notNull(),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("sync_rejections_client_idx").on(t.clientId, t.mutationId)],
);

/** The same field edited on two sides: both values kept until a person chooses. */
export const conflicts = pgTable(
  "conflicts",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    campaignId: campaignRef(),
    entity: text("entity").notNull(),
    entityId: uuid("entity_id").notNull(),
    field: text("field").notNull(),
    baseValue: jsonb("base_value"),
    serverValue: jsonb("server_value"),
    clientValue: jsonb("client_value"),
    clientId: uuid("client_id"),
    mutationId: bigint("mutation_id", { mode: "number" }),
    openedBy: userRef("opened_by"),
    openedAt: timestamp("opened_at", { withTimezone: true }).notNull().defaultNow(),
    resolvedAt: timestamp("resolved_at", { withTimezone: true }),
    resolvedBy: userRef("resolved_by"),
    resolvedValue: jsonb("resolved_value"),
    version: integer("version").notNull().default(1),
    changeSeq: changeSeq(),
  },
  (t) => [index("conflicts_change_idx").on(t.campaignId, t.changeSeq)],
);

/** Files stored content-addressed per campaign; the row is written only after its object is stored. */
export const attachments = pgTable(
  "attachments",
  {
    campaignId: campaignRef(),
    /** SHA-256 of the bytes as 64 lowercase hex digits, recomputed by the server. */
    sha256: text("sha256").notNull(),
    /** Decided from the bytes, never taken from the request. */
    contentType: text("content_type").notNull(),
    sizeBytes: bigint("size_bytes", { mode: "number" }).notNull(),
    /** Generated from campaign and hash, never from a name the user supplied. */
    storageKey: text("storage_key").notNull(),
    /** Sanitised, for display only. */
    originalName: text("original_name"),
    createdBy: userRef("created_by"),
    createdAt: createdAt(),
  },
  (t) => [
    primaryKey({ columns: [t.campaignId, t.sha256] }),
    check("attachments_sha256_hex", sql`${t.sha256} ~ '^[0-9a-f]{64}$'`),
    check("attachments_size_nonnegative", sql`${t.sizeBytes} >= 0`),
  ],
);

/** A transport crate with the limits its contents must stay within. */
export const attachmentSubjectKindEnum = pgEnum("attachment_subject_kind", attachmentSubjectKinds);

/** A file attached to a record. Append-only: added once, removed once (a tombstone), never edited. */
export const attachmentLinks = pgTable(
  "attachment_links",
  {
    id: uuid("id").primaryKey(),
    campaignId: campaignRef(),
    /** The bytes may arrive before or after the link: no foreign key to attachments. */
    sha256: text("sha256").notNull(),
    contentType: text("content_type").notNull(),
    sizeBytes: bigint("size_bytes", { mode: "number" }).notNull(),
    name: text("name").notNull().default(""),
    subjectKind: attachmentSubjectKindEnum("subject_kind").notNull(),
    subjectId: uuid("subject_id").notNull(),
    caption: text("caption").notNull().default(""),
    takenAt: timestamp("taken_at", { withTimezone: true }),
    createdBy: userRef("created_by"),
    createdAt: createdAt(),
    removedAt: timestamp("removed_at", { withTimezone: true }),
    removedBy: userRef("removed_by"),
    changeSeq: changeSeq(),
  },
  (t) => [
    index("attachment_links_change_idx").on(t.campaignId, t.changeSeq),
    index("attachment_links_subject_idx").on(t.campaignId, t.subjectKind, t.subjectId),
    check("attachment_links_sha256_hex", sql`${t.sha256} ~ '^[0-9a-f]{64}$'`),
  ],
);

export const checklistPurposeEnum = pgEnum("checklist_purpose", checklistPurposes);

/** Kept by administrators; runs copy the items when they start. */
export const checklistTemplates = pgTable(
  "checklist_templates",
  {
    id: uuid("id").primaryKey(),
    campaignId: campaignRef(),
    title: text("title").notNull(),
    purpose: checklistPurposeEnum("purpose").notNull(),
    items: jsonb("items").notNull(),
    version: integer("version").notNull().default(1),
    changeSeq: changeSeq(),
    createdAt: createdAt(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
    updatedBy: userRef("updated_by"),
    deletedAt: timestamp("deleted_at", { withTimezone: true }),
  },
  (t) => [index("checklist_templates_change_idx").on(t.campaignId, t.changeSeq)],
);

/** A checklist worked through at a site, with the template's items as they were at the start. */
export const checklistRuns = pgTable(
  "checklist_runs",
  {
    id: uuid("id").primaryKey(),
    campaignId: campaignRef(),
    templateId: uuid("template_id")
      .notNull()
      .references(() => checklistTemplates.id),
    siteId: uuid("site_id")
      .notNull()
      .references(() => sites.id),
    title: text("title").notNull(),
    purpose: checklistPurposeEnum("purpose").notNull(),
    items: jsonb("items").notNull(),
    startedAt: timestamp("started_at", { withTimezone: true }).notNull(),
    startedBy: userRef("started_by"),
    signedOffAt: timestamp("signed_off_at", { withTimezone: true }),
    signedOffBy: userRef("signed_off_by"),
    signOffNote: text("sign_off_note").notNull().default(""),
    changeSeq: changeSeq(),
  },
  (t) => [
    index("checklist_runs_change_idx").on(t.campaignId, t.changeSeq),
    index("checklist_runs_site_idx").on(t.campaignId, t.siteId),
  ],
);

/** Append-only: every result as entered, with its author and time; the latest per item counts. */
export const checklistResults = pgTable(
  "checklist_results",
  {
    id: uuid("id").primaryKey(),
    campaignId: campaignRef(),
    runId: uuid("run_id")
      .notNull()
      .references(() => checklistRuns.id),
    itemId: text("item_id").notNull(),
    value: jsonb("value").notNull(),
    outOfRange: boolean("out_of_range").notNull(),
    note: text("note").notNull().default(""),
    recordedAt: timestamp("recorded_at", { withTimezone: true }).notNull(),
    recordedBy: userRef("recorded_by"),
    changeSeq: changeSeq(),
  },
  (t) => [
    index("checklist_results_change_idx").on(t.campaignId, t.changeSeq),
    index("checklist_results_run_idx").on(t.runId),
  ],
);

export const crateStateEnum = pgEnum("crate_state", crateStates);

export const crates = pgTable(
  "crates",
  {
    id: uuid("id").primaryKey(),
    campaignId: campaignRef(),
    label: text("label").notNull(),
    contents: text("contents").notNull(),
    weightKg: doublePrecision("weight_kg").notNull(),
    maxShockG: doublePrecision("max_shock_g").notNull(),
    temperatureMinC: doublePrecision("temperature_min_c").notNull(),
    temperatureMaxC: doublePrecision("temperature_max_c").notNull(),
    notes: text("notes").notNull().default(""),
    instrument: text("instrument").notNull().default(""),
    maxTiltDeg: doublePrecision("max_tilt_deg"),
    state: crateStateEnum("state").notNull().default("ready"),
    version: integer("version").notNull().default(1),
    changeSeq: changeSeq(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
    updatedBy: userRef("updated_by"),
    deletedAt: timestamp("deleted_at", { withTimezone: true }),
  },
  (t) => [index("crates_change_idx").on(t.campaignId, t.changeSeq)],
);

/** A surveyed mark of the national height network, with its published height. */
export const benchmarks = pgTable(
  "benchmarks",
  {
    id: uuid("id").primaryKey(),
    campaignId: campaignRef(),
    code: text("code").notNull(),
    description: text("description").notNull().default(""),
    latitudeDeg: doublePrecision("latitude_deg").notNull(),
    longitudeDeg: doublePrecision("longitude_deg").notNull(),
    heightM: doublePrecision("height_m").notNull(),
    heightSigmaM: doublePrecision("height_sigma_m").notNull(),
    heightSystem: text("height_system").notNull(),
    /** The realisation of the height system the height belongs to (name and epoch). */
    datum: text("datum").notNull().default(""),
    source: text("source").notNull().default(""),
    version: integer("version").notNull().default(1),
    changeSeq: changeSeq(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
    updatedBy: userRef("updated_by"),
    deletedAt: timestamp("deleted_at", { withTimezone: true }),
  },
  (t) => [index("benchmarks_change_idx").on(t.campaignId, t.changeSeq)],
);

export const fieldEntryKindEnum = pgEnum("field_entry_kind", fieldEntryKinds);

/**
 * Append-only: what the crew recorded about a crate or the site, with its author and time. `data`
 * holds the kind's fields as validated (shared/schemas/field-entries.ts); `flags` what the server
 * concluded against the crate's limits when the entry arrived.
 */
export const fieldEntries = pgTable(
  "field_entries",
  {
    id: uuid("id").primaryKey(),
    campaignId: campaignRef(),
    siteId: uuid("site_id")
      .notNull()
      .references(() => sites.id),
    crateId: uuid("crate_id").references(() => crates.id),
    kind: fieldEntryKindEnum("kind").notNull(),
    observedAt: timestamp("observed_at", { withTimezone: true }).notNull(),
    note: text("note").notNull().default(""),
    data: jsonb("data").notNull(),
    exceeded: boolean("exceeded").notNull(),
    summary: text("summary").notNull(),
    recordedAt: timestamp("recorded_at", { withTimezone: true }).notNull(),
    recordedBy: userRef("recorded_by"),
    changeSeq: changeSeq(),
  },
  (t) => [
    index("field_entries_change_idx").on(t.campaignId, t.changeSeq),
    index("field_entries_site_idx").on(t.campaignId, t.siteId),
    index("field_entries_crate_idx").on(t.crateId),
  ],
);

export const levellingRunEnum = pgEnum("levelling_run", levellingRuns);

/** A levelling section between two marks, levelled forward and back; closed once. */
export const levellingSections = pgTable(
  "levelling_sections",
  {
    id: uuid("id").primaryKey(),
    campaignId: campaignRef(),
    siteId: uuid("site_id")
      .notNull()
      .references(() => sites.id),
    fromMark: text("from_mark").notNull(),
    toMark: text("to_mark").notNull(),
    classId: text("class_id").notNull(),
    instrument: text("instrument").notNull().default(""),
    openedAt: timestamp("opened_at", { withTimezone: true }).notNull(),
    openedBy: userRef("opened_by"),
    closedAt: timestamp("closed_at", { withTimezone: true }),
    closedBy: userRef("closed_by"),
    closeNote: text("close_note").notNull().default(""),
    /** The misclosure and its tolerance as computed at closing (shared/levelling-book.ts). */
    closure: jsonb("closure"),
    changeSeq: changeSeq(),
  },
  (t) => [
    index("levelling_sections_change_idx").on(t.campaignId, t.changeSeq),
    index("levelling_sections_site_idx").on(t.campaignId, t.siteId),
  ],
);

/** Append-only: one instrument setup as read; the latest per run and number counts. */
export const levellingSetups = pgTable(
  "levelling_setups",
  {
    id: uuid("id").primaryKey(),
    campaignId: campaignRef(),
    sectionId: uuid("section_id")
      .notNull()
      .references(() => levellingSections.id),
    run: levellingRunEnum("run").notNull(),
    number: integer("number").notNull(),
    backsightM: doublePrecision("backsight_m").notNull(),
    foresightM: doublePrecision("foresight_m").notNull(),
    backsightDistanceM: doublePrecision("backsight_distance_m").notNull(),
    foresightDistanceM: doublePrecision("foresight_distance_m").notNull(),
    note: text("note").notNull().default(""),
    recordedAt: timestamp("recorded_at", { withTimezone: true }).notNull(),
    recordedBy: userRef("recorded_by"),
    changeSeq: changeSeq(),
  },
  (t) => [
    index("levelling_setups_change_idx").on(t.campaignId, t.changeSeq),
    index("levelling_setups_section_idx").on(t.sectionId),
  ],
);

/** A crate's movement from one place (a site of the campaign) to another: planned, then its steps. */
export const legs = pgTable(
  "legs",
  {
    id: uuid("id").primaryKey(),
    campaignId: campaignRef(),
    crateId: uuid("crate_id")
      .notNull()
      .references(() => crates.id),
    fromSiteId: uuid("from_site_id")
      .notNull()
      .references(() => sites.id),
    toSiteId: uuid("to_site_id")
      .notNull()
      .references(() => sites.id),
    vehicle: text("vehicle").notNull().default(""),
    plannedDepartAt: timestamp("planned_depart_at", { withTimezone: true }).notNull(),
    plannedArriveAt: timestamp("planned_arrive_at", { withTimezone: true }).notNull(),
    departedAt: timestamp("departed_at", { withTimezone: true }),
    departedBy: userRef("departed_by"),
    arrivedAt: timestamp("arrived_at", { withTimezone: true }),
    arrivedBy: userRef("arrived_by"),
    cancelledAt: timestamp("cancelled_at", { withTimezone: true }),
    cancelledBy: userRef("cancelled_by"),
    note: text("note").notNull().default(""),
    createdBy: userRef("created_by"),
    createdAt: createdAt(),
    changeSeq: changeSeq(),
  },
  (t) => [
    index("legs_change_idx").on(t.campaignId, t.changeSeq),
    index("legs_crate_idx").on(t.crateId),
  ],
);

export const handoverConditionEnum = pgEnum("handover_condition", handoverConditions);

/** Append-only: custody of a crate passing from one person to the next, in time order per crate. */
export const handovers = pgTable(
  "handovers",
  {
    id: uuid("id").primaryKey(),
    campaignId: campaignRef(),
    crateId: uuid("crate_id")
      .notNull()
      .references(() => crates.id),
    legId: uuid("leg_id").references(() => legs.id),
    fromName: text("from_name").notNull(),
    /** The receiver's name as they typed it: their signature. */
    toName: text("to_name").notNull(),
    at: timestamp("at", { withTimezone: true }).notNull(),
    siteId: uuid("site_id").references(() => sites.id),
    place: text("place").notNull().default(""),
    condition: handoverConditionEnum("condition").notNull(),
    note: text("note").notNull().default(""),
    recordedBy: userRef("recorded_by"),
    recordedAt: timestamp("recorded_at", { withTimezone: true }).notNull(),
    changeSeq: changeSeq(),
  },
  (t) => [
    index("handovers_change_idx").on(t.campaignId, t.changeSeq),
    index("handovers_crate_idx").on(t.crateId, t.at),
  ],
);

/** An entry beyond its crate's limits, raised once per entry, until someone acknowledges it. */
export const alerts = pgTable(
  "alerts",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    campaignId: campaignRef(),
    crateId: uuid("crate_id").references(() => crates.id),
    siteId: uuid("site_id").references(() => sites.id),
    entryId: uuid("entry_id").references(() => fieldEntries.id),
    kind: text("kind").notNull(),
    summary: text("summary").notNull(),
    createdAt: createdAt(),
    acknowledgedAt: timestamp("acknowledged_at", { withTimezone: true }),
    acknowledgedBy: userRef("acknowledged_by"),
    acknowledgeNote: text("acknowledge_note").notNull().default(""),
    changeSeq: changeSeq(),
  },
  (t) => [
    index("alerts_change_idx").on(t.campaignId, t.changeSeq),
    uniqueIndex("alerts_entry_key").on(t.entryId),
  ],
);

export const instrumentKindEnum = pgEnum("instrument_kind", instrumentKinds);

/**
 * A clock or a link with its stated instability at 1 s (white FM) and its systematic uncertainty as
 * named terms. Edited online by geodesists; every change is an audit event (the history).
 */
export const instruments = pgTable(
  "instruments",
  {
    id: uuid("id").primaryKey(),
    campaignId: campaignRef(),
    kind: instrumentKindEnum("kind").notNull(),
    name: text("name").notNull(),
    description: text("description").notNull().default(""),
    instabilityAt1s: doublePrecision("instability_at_1s").notNull(),
    /** [{ name, value }] fractional, combined in quadrature. */
    systematic: jsonb("systematic").notNull(),
    notes: text("notes").notNull().default(""),
    version: integer("version").notNull().default(1),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
    updatedBy: userRef("updated_by"),
    deletedAt: timestamp("deleted_at", { withTimezone: true }),
  },
  (t) => [index("instruments_campaign_idx").on(t.campaignId)],
);

/** A section height difference brought in from a file (another crew's or an older levelling). */
export const heightTies = pgTable(
  "height_ties",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    campaignId: campaignRef(),
    fromMark: text("from_mark").notNull(),
    toMark: text("to_mark").notNull(),
    deltaM: doublePrecision("delta_m").notNull(),
    lengthKm: doublePrecision("length_km").notNull(),
    /** Stated standard deviation, m; null: from the length with the adjustment's σ per √km. */
    sigmaM: doublePrecision("sigma_m"),
    source: text("source").notNull().default(""),
    importedAt: createdAt(),
    importedBy: userRef("imported_by"),
    deletedAt: timestamp("deleted_at", { withTimezone: true }),
  },
  (t) => [index("height_ties_campaign_idx").on(t.campaignId)],
);

/** One least-squares adjustment of the campaign's levelling network, kept as computed. */
export const levellingAdjustments = pgTable(
  "levelling_adjustments",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    campaignId: campaignRef(),
    computedAt: createdAt(),
    computedBy: userRef("computed_by"),
    options: jsonb("options").notNull(),
    /** The AdjustmentView (shared/schemas/height-network.ts). */
    result: jsonb("result").notNull(),
  },
  (t) => [index("levelling_adjustments_campaign_idx").on(t.campaignId, t.computedAt)],
);

/** A remote clock compared with a reference clock over a link, until a target height uncertainty. */
export const comparisonRuns = pgTable(
  "comparison_runs",
  {
    id: uuid("id").primaryKey(),
    campaignId: campaignRef(),
    name: text("name").notNull(),
    remoteSiteId: uuid("remote_site_id")
      .notNull()
      .references(() => sites.id),
    remoteClockId: uuid("remote_clock_id")
      .notNull()
      .references(() => instruments.id),
    referenceClockId: uuid("reference_clock_id")
      .notNull()
      .references(() => instruments.id),
    linkId: uuid("link_id").references(() => instruments.id),
    linkName: text("link_name").notNull(),
    /** The levelling mark at the remote clock's reference point ("" when not tied). */
    remoteMark: text("remote_mark").notNull().default(""),
    referenceHeightM: doublePrecision("reference_height_m"),
    referenceHeightSigmaM: doublePrecision("reference_height_sigma_m"),
    targetHeightUncertaintyM: doublePrecision("target_height_uncertainty_m").notNull(),
    plannedUptime: doublePrecision("planned_uptime").notNull(),
    notes: text("notes").notNull().default(""),
    /** Grows with every data file added or removed; the analysis names the one it used. */
    dataRevision: integer("data_revision").notNull().default(0),
    version: integer("version").notNull().default(1),
    createdAt: createdAt(),
    createdBy: userRef("created_by"),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
    updatedBy: userRef("updated_by"),
    deletedAt: timestamp("deleted_at", { withTimezone: true }),
  },
  (t) => [
    index("comparison_runs_campaign_idx").on(t.campaignId),
    index("comparison_runs_site_idx").on(t.remoteSiteId),
  ],
);

export const seriesValueKindEnum = pgEnum("series_value_kind", seriesValueKinds);

/** One uploaded file of a run's series: what was in it; the samples are in comparison_chunks. */
export const comparisonFiles = pgTable(
  "comparison_files",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    campaignId: campaignRef(),
    runId: uuid("run_id")
      .notNull()
      .references(() => comparisonRuns.id, { onDelete: "cascade" }),
    fileName: text("file_name").notNull(),
    byteSize: bigint("byte_size", { mode: "number" }).notNull(),
    valueKind: seriesValueKindEnum("value_kind").notNull(),
    /** The nominal ratio as typed (decimal text, kept exact) for frequency-ratio files. */
    nominalRatio: text("nominal_ratio"),
    tau0S: doublePrecision("tau0_s").notNull(),
    rowCount: integer("row_count").notNull(),
    validCount: integer("valid_count").notNull(),
    firstAt: timestamp("first_at", { withTimezone: true, precision: 6 }).notNull(),
    lastAt: timestamp("last_at", { withTimezone: true, precision: 6 }).notNull(),
    /** { count, missingSamples, list: [{ fromAt, toAt, missing }] } (first ones only). */
    gaps: jsonb("gaps").notNull(),
    uploadedAt: createdAt(),
    uploadedBy: userRef("uploaded_by"),
  },
  (t) => [index("comparison_files_run_idx").on(t.runId, t.firstAt)],
);

/**
 * The samples, in chunks of consecutive rows: times as Unix seconds and values as fractional
 * frequency, both float8[] (one row per chunk instead of one per sample: see README, series storage).
 */
export const comparisonChunks = pgTable(
  "comparison_chunks",
  {
    fileId: uuid("file_id")
      .notNull()
      .references(() => comparisonFiles.id, { onDelete: "cascade" }),
    chunkNo: integer("chunk_no").notNull(),
    times: doublePrecision("times").array().notNull(),
    values: doublePrecision("values").array().notNull(),
  },
  (t) => [primaryKey({ columns: [t.fileId, t.chunkNo] })],
);

export const analysisStateEnum = pgEnum("analysis_state", analysisStates);

/** The stability analysis of a run's whole series at one data revision (computed in a worker). */
export const comparisonAnalyses = pgTable("comparison_analyses", {
  runId: uuid("run_id")
    .primaryKey()
    .references(() => comparisonRuns.id, { onDelete: "cascade" }),
  campaignId: campaignRef(),
  dataRevision: integer("data_revision").notNull(),
  state: analysisStateEnum("state").notNull(),
  error: text("error"),
  startedAt: timestamp("started_at", { withTimezone: true }).notNull(),
  finishedAt: timestamp("finished_at", { withTimezone: true }),
  /** The SeriesAnalysis (shared/schemas/comparison.ts) when done. */
  result: jsonb("result"),
});

export const reviewSubjectKindEnum = pgEnum("review_subject_kind", reviewSubjectKinds);
export const reviewDecisionEnum = pgEnum("review_decision", reviewDecisions);

/**
 * Append-only: one reviewer's decision on one field record. The latest per subject counts; an
 * approved subject is read-only until a later "reopened" decision. `reviewedSeq` is the subject's
 * newest change position the reviewer saw, so a later change brings it back to the queue.
 */
export const entryReviews = pgTable(
  "entry_reviews",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    campaignId: campaignRef(),
    subjectKind: reviewSubjectKindEnum("subject_kind").notNull(),
    subjectId: uuid("subject_id").notNull(),
    decision: reviewDecisionEnum("decision").notNull(),
    comment: text("comment").notNull().default(""),
    reviewedSeq: bigint("reviewed_seq", { mode: "number" }).notNull(),
    decidedBy: userRef("decided_by"),
    decidedAt: timestamp("decided_at", { withTimezone: true }).notNull().defaultNow(),
    changeSeq: changeSeq(),
  },
  (t) => [
    index("entry_reviews_change_idx").on(t.campaignId, t.changeSeq),
    index("entry_reviews_subject_idx").on(t.campaignId, t.subjectKind, t.subjectId, t.changeSeq),
  ],
);

/** Reviewers who asked for the weekly summary of a campaign, and the last week it went out. */
export const reviewSummarySubscriptions = pgTable(
  "review_summary_subscriptions",
  {
    campaignId: campaignRef(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    createdAt: createdAt(),
    /** ISO week ("2027-W07") of the last summary queued. */
    lastWeek: text("last_week"),
  },
  (t) => [primaryKey({ columns: [t.campaignId, t.userId] })],
);
