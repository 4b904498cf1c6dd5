// Attachment links (which file belongs to which record); every query is scoped by campaign.
import { and, eq } from "drizzle-orm";
import type { Queryable } from "../client";
import { attachmentLinks } from "../schema";
import { idTaken } from "./taken-ids";

export type AttachmentLinkRow = typeof attachmentLinks.$inferSelect;
export type NewAttachmentLinkRow = typeof attachmentLinks.$inferInsert;

/** Any campaign: a client-made id that already exists anywhere is refused. */
export const attachmentLinkIdTaken = (q: Queryable, id: string) => idTaken(q, attachmentLinks, id);

export const findAttachmentLinkForUpdate = async (q: Queryable, campaignId: string, id: string) =>
  (
    await q
      .select()
      .from(attachmentLinks)
      .where(and(eq(attachmentLinks.campaignId, campaignId), eq(attachmentLinks.id, id)))
      .for("update")
      .limit(1)
  )[0];

export async function insertAttachmentLink(
  q: Queryable,
  row: NewAttachmentLinkRow,
): Promise<AttachmentLinkRow> {
  const [inserted] = await q.insert(attachmentLinks).values(row).returning();
  if (!inserted) throw new Error("insert into attachment_links returned no row");
  return inserted;
}

export async function updateAttachmentLink(
  q: Queryable,
  id: string,
  patch: Partial<NewAttachmentLinkRow>,
): Promise<AttachmentLinkRow> {
  const [updated] = await q
    .update(attachmentLinks)
    .set(patch)
    .where(eq(attachmentLinks.id, id))
    .returning();
  if (!updated) throw new Error("update of attachment_links returned no row");
  return updated;
}
