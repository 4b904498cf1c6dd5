// Attachment rows; every query is scoped by campaign.
import { and, eq } from "drizzle-orm";
import type { Queryable } from "../client";
import { attachments } from "../schema";

export type AttachmentRow = typeof attachments.$inferSelect;
export type NewAttachmentRow = typeof attachments.$inferInsert;

export async function findAttachment(
  q: Queryable,
  campaignId: string,
  sha256: string,
): Promise<AttachmentRow | undefined> {
  const [row] = await q
    .select()
    .from(attachments)
    .where(and(eq(attachments.campaignId, campaignId), eq(attachments.sha256, sha256)));
  return row;
}

/** Inserts unless the same campaign already holds this hash; undefined means it was already there. */
export async function insertAttachment(
  q: Queryable,
  row: NewAttachmentRow,
): Promise<AttachmentRow | undefined> {
  const [inserted] = await q.insert(attachments).values(row).onConflictDoNothing().returning();
  return inserted;
}
