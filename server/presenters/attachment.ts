import { attachmentContentType, type AttachmentView } from "../../shared/schemas/attachments";
import type { AttachmentRow } from "../db/repositories/attachments";

export function presentAttachment(row: AttachmentRow): AttachmentView {
  return {
    campaignId: row.campaignId,
    sha256: row.sha256,
    // Rows are only written with a sniffed, allowed type; parsing keeps the view honest.
    contentType: attachmentContentType.parse(row.contentType),
    sizeBytes: row.sizeBytes,
    originalName: row.originalName,
    createdBy: row.createdBy,
    createdAt: row.createdAt.toISOString(),
  };
}
