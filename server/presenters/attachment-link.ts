import { attachmentContentType, type AttachmentLinkView } from "../../shared/schemas/attachments";
import type { AttachmentLinkRow } from "../db/repositories/attachment-links";

export function presentAttachmentLink(row: AttachmentLinkRow): AttachmentLinkView {
  return {
    id: row.id,
    campaignId: row.campaignId,
    sha256: row.sha256,
    // Rows are only written from a validated mutation; parsing keeps the view honest.
    contentType: attachmentContentType.parse(row.contentType),
    sizeBytes: row.sizeBytes,
    name: row.name,
    subject: { kind: row.subjectKind, id: row.subjectId },
    caption: row.caption,
    takenAt: row.takenAt?.toISOString() ?? null,
    createdAt: row.createdAt.toISOString(),
    createdBy: row.createdBy,
    removedAt: row.removedAt?.toISOString() ?? null,
  };
}
