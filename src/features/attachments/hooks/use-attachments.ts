// Photos and files of one record, live from this device's store; the bytes come from the device
// or, when another tablet took them, from the server once (then kept here for offline viewing).
import { useEffect, useMemo, useState } from "react";
import { useLiveQuery } from "dexie-react-hooks";
import type { AttachmentSubjectKind } from "../../../../shared/schemas/attachments";
import type { LocalAttachment, LocalFile } from "../../../db/database";
import {
  addAttachmentLocally,
  keepDownloadedFile,
  removeAttachmentLocally,
} from "../../../db/attachment-store";
import { findFile, listAttachments } from "../../../db/queries";
import { ApiError } from "../../../lib/api-error";
import { fetchAttachment } from "../../../lib/file-api";
import type { PreparedFile } from "../../../lib/prepare-file";
import { useLocalSync } from "../../../lib/sync-context";

export function useAttachments(campaignId: string, subjectId: string) {
  const { db } = useLocalSync();
  return useLiveQuery(
    () => listAttachments(db, campaignId, subjectId),
    [db, campaignId, subjectId],
  );
}

export function useLocalFile(campaignId: string, sha256: string): LocalFile | null | undefined {
  const { db } = useLocalSync();
  return useLiveQuery(() => findFile(db, campaignId, sha256), [db, campaignId, sha256]);
}

export type FileView =
  | { status: "reading" }
  | { status: "here"; url: string; file: LocalFile }
  | { status: "not-here"; reason: string };

/** An object URL for the bytes, fetched from the server when this device lacks them. */
export function useFileView(attachment: LocalAttachment): FileView {
  const { db } = useLocalSync();
  const file = useLocalFile(attachment.campaignId, attachment.sha256);
  const [fetchError, setFetchError] = useState<string | null>(null);

  const url = useMemo(
    () => (file ? URL.createObjectURL(new Blob([file.bytes], { type: file.contentType })) : null),
    [file],
  );
  useEffect(() => () => (url === null ? undefined : URL.revokeObjectURL(url)), [url]);

  const { campaignId, sha256, contentType, name, pending } = attachment;
  useEffect(() => {
    if (file !== null || pending) return;
    let live = true;
    fetchAttachment(campaignId, sha256).then(
      (bytes) =>
        keepDownloadedFile(db, {
          campaignId,
          sha256,
          contentType,
          sizeBytes: bytes.byteLength,
          name,
          bytes,
        }),
      (error: unknown) => {
        if (!live) return;
        const missing = error instanceof ApiError && error.status === 404;
        setFetchError(
          missing
            ? "Not on the server yet: the tablet that took it has not sent it."
            : "Not on this device; it is fetched when the server can be reached.",
        );
      },
    );
    return () => {
      live = false;
    };
  }, [db, file, campaignId, sha256, contentType, name, pending]);

  if (file && url !== null) return { status: "here", url, file };
  if (file === null && fetchError !== null) return { status: "not-here", reason: fetchError };
  return { status: "reading" };
}

export function useAttachmentWrites(campaignId: string) {
  const { db, afterWrite } = useLocalSync();
  return {
    async add(
      subject: { kind: AttachmentSubjectKind; id: string },
      prepared: PreparedFile,
      caption: string,
    ): Promise<string> {
      const id = await addAttachmentLocally(db, campaignId, { subject, ...prepared, caption });
      afterWrite();
      return id;
    },
    async remove(id: string): Promise<void> {
      await removeAttachmentLocally(db, campaignId, id);
      afterWrite();
    },
  };
}
