// Office decisions as pulled to this device: the newest per record counts.
import type { EquipotDb, LocalReview } from "./database";

const newestFirst = (a: LocalReview, b: LocalReview) => b.decidedAt.localeCompare(a.decidedAt);

/** The decision in force on a record, or null when the office has not decided. */
export async function reviewOfRecord(
  db: EquipotDb,
  campaignId: string,
  subjectId: string,
): Promise<LocalReview | null> {
  const all = await db.reviews.where("subjectId").equals(subjectId).toArray();
  return all.filter((r) => r.campaignId === campaignId).sort(newestFirst)[0] ?? null;
}

/** The decision in force on each record of the campaign, newest first. */
async function decisionsInForce(db: EquipotDb, campaignId: string): Promise<LocalReview[]> {
  const all = await db.reviews.where("campaignId").equals(campaignId).toArray();
  const newest = new Map<string, LocalReview>();
  for (const review of all.sort(newestFirst))
    if (!newest.has(review.subjectId)) newest.set(review.subjectId, review);
  return [...newest.values()];
}

/** Records whose decision in force is a send-back, newest first. */
export async function sentBackRecords(db: EquipotDb, campaignId: string): Promise<LocalReview[]> {
  return (await decisionsInForce(db, campaignId)).filter((r) => r.decision === "sentBack");
}

/** Ids of the records whose decision in force is an approval (read-only on this device). */
export async function approvedRecordIds(db: EquipotDb, campaignId: string): Promise<Set<string>> {
  const approved = (await decisionsInForce(db, campaignId)).filter(
    (r) => r.decision === "approved",
  );
  return new Set(approved.map((r) => r.subjectId));
}
