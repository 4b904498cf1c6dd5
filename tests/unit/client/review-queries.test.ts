// Office decisions on the tablet, on fake-indexeddb: they arrive with a pulled page, the newest
// decision per record counts, and a campaign's decisions stay in that campaign.
import { describe, expect, it } from "vitest";
import { IDBFactory, IDBKeyRange } from "fake-indexeddb";
import type { ReviewView } from "../../../shared/schemas/reviews";
import { openDatabase } from "../../../src/db/database";
import { approvedRecordIds, reviewOfRecord, sentBackRecords } from "../../../src/db/review-queries";
import { applyPulledPage } from "../../../src/sync/apply-pull";

const campaignId = crypto.randomUUID();
const otherCampaign = crypto.randomUUID();
const newDb = () =>
  openDatabase(`r-${crypto.randomUUID()}`, { indexedDB: new IDBFactory(), IDBKeyRange });

let seq = 0;
const decision = (
  subjectId: string,
  decision: ReviewView["decision"],
  decidedAt: string,
  comment = "",
): ReviewView => ({
  id: crypto.randomUUID(),
  subjectKind: "fieldEntry",
  subjectId,
  decision,
  comment,
  reviewedSeq: 1,
  decidedBy: null,
  decidedByName: "Reviewer",
  decidedAt,
});

async function pull(db: ReturnType<typeof newDb>, campaign: string, reviews: ReviewView[]) {
  await applyPulledPage(db, campaign, {
    changes: reviews.map((data) => ({ entity: "review", seq: ++seq, id: data.id, data })),
    cursor: seq,
    hasMore: false,
    lastMutationId: null,
    rejections: [],
  });
}

describe("review decisions on the tablet", () => {
  it("keeps the newest decision per record", async () => {
    const db = newDb();
    const [a, b, c] = [crypto.randomUUID(), crypto.randomUUID(), crypto.randomUUID()];
    await pull(db, campaignId, [
      decision(a, "sentBack", "2027-06-01T08:00:00.000Z", "Photo missing"),
      decision(b, "approved", "2027-06-01T08:00:00.000Z"),
      decision(c, "approved", "2027-06-01T08:00:00.000Z"),
    ]);
    await pull(db, campaignId, [
      decision(a, "approved", "2027-06-02T08:00:00.000Z"),
      decision(c, "reopened", "2027-06-02T09:00:00.000Z", "Add the seal number"),
    ]);
    expect((await reviewOfRecord(db, campaignId, a))?.decision).toBe("approved");
    expect((await reviewOfRecord(db, campaignId, c))?.comment).toBe("Add the seal number");
    expect(await reviewOfRecord(db, campaignId, crypto.randomUUID())).toBeNull();
    expect([...(await approvedRecordIds(db, campaignId))].sort()).toEqual([a, b].sort());
    expect(await sentBackRecords(db, campaignId)).toEqual([]);
  });

  it("lists the send-backs in force, and keeps campaigns apart", async () => {
    const db = newDb();
    const [a, b] = [crypto.randomUUID(), crypto.randomUUID()];
    await pull(db, campaignId, [decision(a, "sentBack", "2027-06-01T08:00:00.000Z", "Redo")]);
    await pull(db, otherCampaign, [decision(b, "sentBack", "2027-06-01T08:00:00.000Z", "x")]);
    const here = await sentBackRecords(db, campaignId);
    expect(here.map((r) => [r.subjectId, r.comment])).toEqual([[a, "Redo"]]);
    expect(await reviewOfRecord(db, campaignId, b)).toBeNull();
    expect((await approvedRecordIds(db, otherCampaign)).size).toBe(0);
  });
});
