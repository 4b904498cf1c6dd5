// Changes after the cursor, in change-stream order, one page at a time (see db/change-seq.ts for
// why a cursor can never skip a change that committed late).
import type { z } from "zod";
import type { ChangeRecord, PullResponse, pullQuery } from "../../../shared/sync/protocol";
import type { PgColumn, PgTable } from "drizzle-orm/pg-core";
import type { Db } from "../../db/client";
import { changeFeed, type FeedTable } from "../../db/repositories/change-feed";
import { rejectionsBetween } from "../../db/repositories/sync";
import {
  alerts,
  attachmentLinks,
  checklistResults,
  checklistRuns,
  checklistTemplates,
  conflicts,
  crates,
  entryReviews,
  fieldEntries,
  handovers,
  legs,
  levellingSections,
  levellingSetups,
  sites,
} from "../../db/schema";
import { forbidden, notFound } from "../../http-errors";
import { presentAlert } from "../../presenters/alert";
import { presentAttachmentLink } from "../../presenters/attachment-link";
import { presentResult, presentRun, presentTemplate } from "../../presenters/checklist";
import { presentConflict } from "../../presenters/conflict";
import { presentCrate } from "../../presenters/crate-benchmark";
import { presentFieldEntry } from "../../presenters/field-entry";
import { presentSection, presentSetup } from "../../presenters/levelling";
import { presentHandover, presentLeg } from "../../presenters/logistics";
import { presentReview } from "../../presenters/review";
import { presentSite } from "../../presenters/site";
import { assertProtocol } from "./push";

type PullQuery = z.output<typeof pullQuery>;
type Entity = ChangeRecord["entity"];
type Data<E extends Entity> = Extract<ChangeRecord, { entity: E }>["data"];

interface Source extends FeedTable {
  readonly present: (row: Record<string, unknown>) => unknown;
}

/** A table read as drizzle's select gives its rows; the presenter is checked against that shape. */
const source = <E extends Entity, T extends PgTable>(
  entity: E,
  table: T,
  present: (row: T["$inferSelect"]) => Data<E>,
): Source => ({ entity, table, present: present as (row: Record<string, unknown>) => unknown });

/** Likewise, with the name of the user in column `by` under the key `as`. */
const authored = <E extends Entity, T extends PgTable, K extends string>(
  entity: E,
  table: T,
  present: (row: T["$inferSelect"] & Record<K, string | null>) => Data<E>,
  by: PgColumn,
  as: K,
): Source => ({
  entity,
  table,
  author: { by, as },
  present: present as (row: Record<string, unknown>) => unknown,
});

const by = "recordedByName";

/** Every synced table; a new entity adds one line here. */
const sources = [
  source("site", sites, presentSite),
  source("conflict", conflicts, presentConflict),
  source("attachment", attachmentLinks, presentAttachmentLink),
  source("checklistTemplate", checklistTemplates, presentTemplate),
  source("checklistRun", checklistRuns, presentRun),
  authored("checklistResult", checklistResults, presentResult, checklistResults.recordedBy, by),
  // Edited over REST by logistics; deleted crates come as tombstones (deletedAt set).
  source("crate", crates, presentCrate),
  authored("fieldEntry", fieldEntries, presentFieldEntry, fieldEntries.recordedBy, by),
  source("levellingSection", levellingSections, presentSection),
  authored("levellingSetup", levellingSetups, presentSetup, levellingSetups.recordedBy, by),
  source("leg", legs, presentLeg),
  authored("handover", handovers, presentHandover, handovers.recordedBy, by),
  source("alert", alerts, presentAlert),
  // Review decisions, so the author sees a send-back and an approved record turns read-only.
  authored("review", entryReviews, presentReview, entryReviews.decidedBy, "decidedByName"),
];

const presenters = new Map(sources.map((s) => [s.entity, s.present]));
const readFeed = changeFeed(sources);

export async function pull(db: Db, userId: string, query: PullQuery): Promise<PullResponse> {
  assertProtocol(query.protocolVersion);
  const { campaign, cursor, limit } = query;
  // One row past the page, so "more" is known without a count; the device in the same snapshot.
  const page = await readFeed(db, campaign, cursor, limit + 1, query.clientId ?? null, userId);
  // Non-members learn nothing, not even whether the campaign exists.
  if (!page.member) throw notFound("Campaign not found");
  const hasMore = page.rows.length > limit;
  const changes = page.rows.slice(0, limit).map((r) => {
    // The feed only returns the entities it was given, so the presenter is always there.
    const present = presenters.get(r.entity) as Source["present"];
    return { entity: r.entity, seq: r.seq, id: r.row.id, data: present(r.row) } as ChangeRecord;
  });
  let lastMutationId: number | null = null;
  let rejections: PullResponse["rejections"] = [];
  if (query.clientId) {
    const { client } = page;
    if (client && client.userId !== userId)
      throw forbidden("This device is registered to another user");
    lastMutationId = client?.lastMutationId ?? 0;
    // Named on the last page only: that is where the client lets confirmed entries go. Refusals
    // are only ever added, and the range ends at the position read with the page.
    if (client && !hasMore && query.pendingFrom !== undefined)
      rejections = await rejectionsBetween(db, query.clientId, query.pendingFrom, lastMutationId);
  }
  return {
    changes,
    cursor: changes.at(-1)?.seq ?? cursor,
    hasMore,
    lastMutationId,
    rejections,
  };
}
