// "Photos and files" of a record: take a photo with the tablet's camera or add a file, each kept
// on this device at once and sent with the next sync.
import { useId, useState, type ChangeEvent } from "react";
import type { AttachmentSubjectKind } from "../../../../shared/schemas/attachments";
import { buttonClasses } from "../../../components/button";
import { TextField } from "../../../components/form-field";
import { Notice } from "../../../components/notice";
import { messageOf } from "../../../lib/api-error";
import { prepareFile } from "../../../lib/prepare-file";
import { useAttachments, useAttachmentWrites } from "../hooks/use-attachments";
import { AttachmentItem } from "./attachment-item";

const fileTypes = "image/jpeg,image/png,image/webp,application/pdf,text/csv,.csv,.pdf";

interface AttachmentPanelProps {
  campaignId: string;
  subject: { kind: AttachmentSubjectKind; id: string; label: string };
  canAdd: boolean;
}

export function AttachmentPanel({ campaignId, subject, canAdd }: AttachmentPanelProps) {
  const attachments = useAttachments(campaignId, subject.id);
  const writes = useAttachmentWrites(campaignId);
  const [caption, setCaption] = useState("");
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ tone: "info" | "danger"; text: string } | null>(null);
  const headingId = useId();

  const onPicked = async (event: ChangeEvent<HTMLInputElement>) => {
    const files = [...(event.target.files ?? [])];
    event.target.value = "";
    if (files.length === 0) return;
    setBusy(true);
    setMessage(null);
    try {
      for (const file of files) {
        const prepared = await prepareFile(file);
        await writes.add({ kind: subject.kind, id: subject.id }, prepared, caption);
      }
      setCaption("");
      setMessage({
        tone: "info",
        text: `${files.length === 1 ? "It is" : `${files.length} files are`} on this device now and go to the server with the next sync.`,
      });
    } catch (error) {
      setMessage({ tone: "danger", text: messageOf(error) });
    } finally {
      setBusy(false);
    }
  };

  return (
    <section
      aria-labelledby={headingId}
      className="mt-10 flex flex-col gap-4 border-t-2 border-line pt-6"
    >
      <h2 id={headingId} className="text-xl font-semibold">
        Photos and files
      </h2>
      {canAdd && (
        <div className="flex flex-col gap-3">
          <TextField
            label="Caption for the next photo or file"
            hint="Optional. Photos are made smaller on this device before they are kept."
            value={caption}
            maxLength={500}
            onChange={(e) => setCaption(e.target.value)}
          />
          <div className="flex flex-wrap gap-3">
            <label
              className={buttonClasses(
                "primary",
                "cursor-pointer focus-within:outline focus-within:outline-4",
              )}
            >
              <input
                type="file"
                accept="image/*"
                capture="environment"
                className="sr-only"
                disabled={busy}
                onChange={(e) => void onPicked(e)}
              />
              {busy ? "Keeping…" : "Take photo"}
            </label>
            <label
              className={buttonClasses(
                "secondary",
                "cursor-pointer focus-within:outline focus-within:outline-4",
              )}
            >
              <input
                type="file"
                accept={fileTypes}
                multiple
                className="sr-only"
                disabled={busy}
                onChange={(e) => void onPicked(e)}
              />
              Add file…
            </label>
          </div>
          {message !== null && (
            <Notice
              tone={message.tone}
              title={message.tone === "danger" ? "Not kept" : "Kept"}
              live
            >
              {message.text}
            </Notice>
          )}
        </div>
      )}
      {attachments !== undefined && attachments.length === 0 && (
        <p className="text-muted">No photos or files for {subject.label} yet.</p>
      )}
      {attachments !== undefined && attachments.length > 0 && (
        <ul
          aria-label={`Photos and files of ${subject.label}`}
          className="grid grid-cols-1 gap-3 sm:grid-cols-2 lg:grid-cols-3"
        >
          {attachments.map((attachment) => (
            <AttachmentItem
              key={attachment.id}
              attachment={attachment}
              canRemove={canAdd}
              onRemove={writes.remove}
            />
          ))}
        </ul>
      )}
    </section>
  );
}
