// Rebuilds the working copy of attachment links: the server's record with this tablet's pending
// adds and removes on top. Links are append-only, so there is nothing to merge.
import type { AttachmentLinkInput, AttachmentLinkView } from "../../shared/schemas/attachments";
import type { EquipotDb, LocalAttachment, OutboxEntry } from "./database";
import { rebuildWorkingCopies } from "./working-copy";

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

/** Call inside a transaction over the view tables (views.ts). */
export const rebuildAttachmentViews = (db: EquipotDb, ids: Iterable<string>) =>
  rebuildWorkingCopies(db, {
    ids,
    server: db.serverAttachments,
    working: db.attachments,
    kind: "attachments",
    apply: applyPending,
    finish: (view, pending): LocalAttachment => ({ ...view, pending: pending.length > 0 }),
  });
