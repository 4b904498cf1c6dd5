// Rebuilds the working copy of attachment links: the server's record with this tablet's pending
// adds and removes on top. Links are append-only, so there is nothing to merge.
import type { AttachmentLinkInput, AttachmentLinkView } from "../../shared/schemas/attachments";
import type { EquipotDb, LocalAttachment, OutboxEntry } from "./database";

function applyPending(
  record: AttachmentLinkView | undefined,
  entry: OutboxEntry,
): AttachmentLinkView | undefined {
  if (entry.name === "attachment.add") {
    const args = entry.args as Required<AttachmentLinkInput>;
    return {
      id: args.id,
      campaignId: entry.campaignId,
      sha256: args.sha256,
      contentType: args.contentType,
      sizeBytes: args.sizeBytes,
      name: args.name,
      subject: args.subject,
      caption: args.caption,
      takenAt: args.takenAt,
      createdAt: entry.createdAt,
      createdBy: null,
      removedAt: null,
    };
  }
  if (entry.name === "attachment.remove" && record)
    return { ...record, removedAt: entry.createdAt };
  return record;
}

/** Call inside a transaction over serverAttachments, outbox and attachments. */
export async function rebuildAttachmentViews(db: EquipotDb, ids: Iterable<string>): Promise<void> {
  for (const id of new Set(ids)) {
    const server = await db.serverAttachments.get(id);
    const pending = (await db.outbox.where("entityId").equals(id).sortBy("mutationId")).filter(
      (e) => e.name.startsWith("attachment.") && e.result?.status !== "rejected",
    );
    let view = server;
    for (const entry of pending) view = applyPending(view, entry);
    if (!view) await db.attachments.delete(id);
    else
      await db.attachments.put({ ...view, pending: pending.length > 0 } satisfies LocalAttachment);
  }
}
