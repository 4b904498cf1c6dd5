// The rescue copy of what the server does not have: the changes as JSON and each file's bytes,
// named by hash, in one ZIP (stored, not compressed: photos are compressed already).
import { strToU8, zipSync } from "fflate";
import type { LocalFile, OutboxEntry } from "../../db/database";
import type { DeviceExport } from "../../db/export";

const extensions: Record<LocalFile["contentType"], string> = {
  "image/jpeg": "jpg",
  "image/png": "png",
  "image/webp": "webp",
  "application/pdf": "pdf",
  "text/csv": "csv",
};

export const archivedFileName = (file: Pick<LocalFile, "sha256" | "contentType">) =>
  `files/${file.sha256}.${extensions[file.contentType]}`;

export function zipUnsent(changes: DeviceExport<OutboxEntry>, files: LocalFile[]): Blob {
  const index = files.map((f) => ({
    path: archivedFileName(f),
    name: f.name,
    campaignId: f.campaignId,
    sha256: f.sha256,
    contentType: f.contentType,
    state: f.state,
    refusal: f.refusal,
    addedAt: f.addedAt,
  }));
  const entries: Record<string, Uint8Array> = {
    "unsent-changes.json": strToU8(JSON.stringify({ ...changes, files: index }, null, 2)),
  };
  for (const file of files) entries[archivedFileName(file)] = new Uint8Array(file.bytes);
  const zipped = zipSync(entries, { level: 0 });
  return new Blob([zipped.buffer as ArrayBuffer], { type: "application/zip" });
}
