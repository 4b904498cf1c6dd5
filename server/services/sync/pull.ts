// Changes after the cursor, in change-stream order, one page at a time (see db/change-seq.ts for
// why a cursor can never skip a change that committed late).
import type { z } from "zod";
import type { ChangeRecord, PullResponse, pullQuery } from "../../../shared/sync/protocol";
import type { Db, Tx } from "../../db/client";
import { alertsAfter } from "../../db/repositories/alerts";
import { attachmentLinksAfter } from "../../db/repositories/attachment-links";
import { resultsAfter, runsAfter, templatesAfter } from "../../db/repositories/checklists";
import { cratesAfter } from "../../db/repositories/crates-benchmarks";
import { entriesAfter } from "../../db/repositories/field-entries";
import { handoversAfter } from "../../db/repositories/handovers";
import { sectionsAfter, setupsAfter } from "../../db/repositories/levelling";
import { legsAfter } from "../../db/repositories/legs";
import { reviewsAfter } from "../../db/repositories/reviews";
import {
  conflictsAfter,
  findSyncClient,
  rejectionsBetween,
  sitesAfter,
} from "../../db/repositories/sync";
import { forbidden } from "../../http-errors";
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
type Source = (
  tx: Tx,
  campaignId: string,
  cursor: number,
  limit: number,
) => Promise<ChangeRecord[]>;

/** Every synced table, each read after the cursor; a new entity adds one line here. */
const sources: Source[] = [
  async (tx, ...range) =>
    (await sitesAfter(tx, ...range)).map((r) => ({
      entity: "site",
      seq: r.changeSeq,
      id: r.id,
      data: presentSite(r),
    })),
  async (tx, ...range) =>
    (await conflictsAfter(tx, ...range)).map((r) => ({
      entity: "conflict",
      seq: r.changeSeq,
      id: r.id,
      data: presentConflict(r),
    })),
  async (tx, ...range) =>
    (await attachmentLinksAfter(tx, ...range)).map((r) => ({
      entity: "attachment",
      seq: r.changeSeq,
      id: r.id,
      data: presentAttachmentLink(r),
    })),
  async (tx, ...range) =>
    (await templatesAfter(tx, ...range)).map((r) => ({
      entity: "checklistTemplate",
      seq: r.changeSeq,
      id: r.id,
      data: presentTemplate(r),
    })),
  async (tx, ...range) =>
    (await runsAfter(tx, ...range)).map((r) => ({
      entity: "checklistRun",
      seq: r.changeSeq,
      id: r.id,
      data: presentRun(r),
    })),
  async (tx, ...range) =>
    (await resultsAfter(tx, ...range)).map((r) => ({
      entity: "checklistResult",
      seq: r.changeSeq,
      id: r.id,
      data: presentResult(r),
    })),
  // Edited over REST by logistics; deleted crates come as tombstones (deletedAt set).
  async (tx, ...range) =>
    (await cratesAfter(tx, ...range)).map((r) => ({
      entity: "crate",
      seq: r.changeSeq,
      id: r.id,
      data: presentCrate(r),
    })),
  async (tx, ...range) =>
    (await entriesAfter(tx, ...range)).map((r) => ({
      entity: "fieldEntry",
      seq: r.changeSeq,
      id: r.id,
      data: presentFieldEntry(r),
    })),
  async (tx, ...range) =>
    (await sectionsAfter(tx, ...range)).map((r) => ({
      entity: "levellingSection",
      seq: r.changeSeq,
      id: r.id,
      data: presentSection(r),
    })),
  async (tx, ...range) =>
    (await setupsAfter(tx, ...range)).map((r) => ({
      entity: "levellingSetup",
      seq: r.changeSeq,
      id: r.id,
      data: presentSetup(r),
    })),
  async (tx, ...range) =>
    (await legsAfter(tx, ...range)).map((r) => ({
      entity: "leg",
      seq: r.changeSeq,
      id: r.id,
      data: presentLeg(r),
    })),
  async (tx, ...range) =>
    (await handoversAfter(tx, ...range)).map((r) => ({
      entity: "handover",
      seq: r.changeSeq,
      id: r.id,
      data: presentHandover(r),
    })),
  async (tx, ...range) =>
    (await alertsAfter(tx, ...range)).map((r) => ({
      entity: "alert",
      seq: r.changeSeq,
      id: r.id,
      data: presentAlert(r),
    })),
  // Review decisions, so the author sees a send-back and an approved record turns read-only.
  async (tx, ...range) =>
    (await reviewsAfter(tx, ...range)).map((r) => ({
      entity: "review",
      seq: r.changeSeq,
      id: r.id,
      data: presentReview(r),
    })),
];

export async function pull(db: Db, userId: string, query: PullQuery): Promise<PullResponse> {
  assertProtocol(query.protocolVersion);
  // One snapshot for every table read, so a page is consistent across entities.
  return db.transaction(
    async (tx) => {
      const { campaign, cursor, limit } = query;
      // Each source reads one row past the page, so "more" is known without a count.
      // One after the other: a transaction's connection runs one query at a time anyway.
      const read: ChangeRecord[] = [];
      for (const source of sources) read.push(...(await source(tx, campaign, cursor, limit + 1)));
      const all = read.sort((a, b) => a.seq - b.seq);
      const changes = all.slice(0, limit);
      const hasMore = all.length > limit;
      let lastMutationId: number | null = null;
      let rejections: PullResponse["rejections"] = [];
      if (query.clientId) {
        const client = await findSyncClient(tx, query.clientId);
        if (client && client.userId !== userId)
          throw forbidden("This device is registered to another user");
        lastMutationId = client?.lastMutationId ?? 0;
        // Named on the last page only: that is where the client lets confirmed entries go.
        if (client && !hasMore && query.pendingFrom !== undefined)
          rejections = await rejectionsBetween(tx, client.id, query.pendingFrom, lastMutationId);
      }
      return {
        changes,
        cursor: changes.at(-1)?.seq ?? cursor,
        hasMore,
        lastMutationId,
        rejections,
      };
    },
    { isolationLevel: "repeatable read", accessMode: "read only" },
  );
}
