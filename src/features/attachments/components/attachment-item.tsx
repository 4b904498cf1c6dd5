// One photo or file: the picture (or a file mark), its caption, and where its bytes are.
import { useState } from "react";
import type { LocalAttachment } from "../../../db/database";
import { Button } from "../../../components/button";
import { PendingMark } from "../../../components/pending-mark";
import { StatusShape } from "../../../components/status-shape";
import { formatBytes } from "../../../lib/device-storage";
import { formatLocalBeside, formatUtc } from "../../../lib/format";
import { useSyncStatus } from "../../../lib/sync-context";
import { fileKey } from "../../../db/database";
import { useFileView, type FileView } from "../hooks/use-attachments";

function Where({ attachment, view }: { attachment: LocalAttachment; view: FileView }) {
  const status = useSyncStatus();
  const upload = status.upload;
  if (view.status === "not-here") return <p className="text-sm text-muted">{view.reason}</p>;
  if (view.status === "reading") return <p className="text-sm text-muted">Reading…</p>;
  const { file } = view;
  if (file.state === "refused")
    return (
      <p className="flex items-start gap-2 text-sm font-semibold text-danger-ink">
        <StatusShape shape="octagon" className="mt-0.5 h-4 w-4 text-danger" />
        The server refused the file: {file.refusal}. It stays on this device.
      </p>
    );
  if (file.state === "waiting" && upload?.key === fileKey(attachment.campaignId, attachment.sha256))
    return (
      <label className="flex items-center gap-2 text-sm tabular-nums">
        Sending {Math.round((100 * upload.sentBytes) / Math.max(1, upload.totalBytes))} %
        <progress className="h-3 w-24" max={upload.totalBytes} value={upload.sentBytes} />
      </label>
    );
  if (file.state === "waiting" || attachment.pending) return <PendingMark className="self-start" />;
  return (
    <p className="flex items-center gap-2 text-sm">
      <StatusShape shape="disc" className="h-4 w-4 text-primary" />
      On the server
    </p>
  );
}

function Picture({ attachment, view }: { attachment: LocalAttachment; view: FileView }) {
  const isImage = attachment.contentType.startsWith("image/");
  if (view.status === "here" && isImage)
    return (
      <img
        src={view.url}
        alt={attachment.caption || `Photo ${attachment.name}`}
        className="h-40 w-full rounded-md border border-line bg-sunken object-cover"
      />
    );
  return (
    <div className="flex h-40 w-full items-center justify-center rounded-md border border-line bg-sunken text-lg font-semibold text-muted">
      {isImage ? "Photo" : attachment.contentType === "application/pdf" ? "PDF" : "CSV"}
    </div>
  );
}

interface AttachmentItemProps {
  attachment: LocalAttachment;
  canRemove: boolean;
  onRemove: (id: string) => Promise<void>;
}

export function AttachmentItem({ attachment, canRemove, onRemove }: AttachmentItemProps) {
  const view = useFileView(attachment);
  const [confirming, setConfirming] = useState(false);
  const when = attachment.takenAt ?? attachment.createdAt;
  return (
    <li className="flex flex-col gap-2 rounded-xl border-2 border-line bg-surface p-3">
      <Picture attachment={attachment} view={view} />
      {attachment.caption !== "" && <p className="font-semibold">{attachment.caption}</p>}
      <p className="text-sm text-muted tabular-nums">
        {attachment.name || "Unnamed"} · {formatBytes(attachment.sizeBytes)} · {formatUtc(when)} (
        {formatLocalBeside(when)})
      </p>
      <Where attachment={attachment} view={view} />
      <div className="flex flex-wrap gap-2">
        {view.status === "here" && (
          <a
            className="min-h-touch inline-flex items-center underline"
            href={view.url}
            download={attachment.name || "file"}
          >
            Save a copy
          </a>
        )}
        {canRemove && !confirming && (
          <Button tone="quiet" onClick={() => setConfirming(true)}>
            Remove…
          </Button>
        )}
        {confirming && (
          <>
            <Button tone="danger" onClick={() => void onRemove(attachment.id)}>
              Yes, remove
            </Button>
            <Button onClick={() => setConfirming(false)}>Keep it</Button>
          </>
        )}
      </div>
    </li>
  );
}
