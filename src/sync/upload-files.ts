// Sends the bytes of waiting photos and files, one at a time, oldest first. A file leaves the
// "waiting" state only when the server has it (it recomputes the hash); a file the server refuses
// for good stays on the device, marked refused with the reason. A failure worth another try (the
// server's storage full or out of reach, a server error) leaves the file waiting, untouched, ends
// the file phase and is returned, so the engine still sends the changes and reports it after.
// Being offline, signed out or too old an app version stops the whole run.
import type { EquipotDb } from "../db/database";
import type { SyncStatus } from "./engine";
import { SyncError, type FileTransport } from "./transport";

export async function uploadFiles(
  db: EquipotDb,
  files: FileTransport,
  setStatus: (patch: Partial<SyncStatus>) => void,
): Promise<SyncError | null> {
  // Keys and sizes only are kept: the bytes are read one file at a time.
  const waiting: { key: string; sizeBytes: number; addedAt: string }[] = [];
  await db.files
    .where("state")
    .equals("waiting")
    .each(({ key, sizeBytes, addedAt }) => waiting.push({ key, sizeBytes, addedAt }));
  waiting.sort((a, b) => a.addedAt.localeCompare(b.addedAt));
  const total = waiting.reduce((sum, f) => sum + f.sizeBytes, 0);
  let done = 0;
  for (const { key } of waiting) {
    const file = await db.files.get(key);
    if (file?.state !== "waiting") continue;
    const report = (sentBytes: number) =>
      setStatus({
        progress: { phase: "files", done: done + Math.min(sentBytes, file.sizeBytes), total },
        upload: { key: file.key, sentBytes, totalBytes: file.sizeBytes },
      });
    report(0);
    try {
      if (!(await files.exists(file.campaignId, file.sha256))) await files.upload(file, report);
      await db.files.update(file.key, { state: "sent", sentAt: new Date().toISOString() });
    } catch (error) {
      if (!(error instanceof SyncError)) throw error;
      if (error.kind === "refused") {
        await db.files.update(file.key, { state: "refused", refusal: error.message });
      } else if (error.kind === "server") {
        // The next files would meet the same full or absent storage: try them at a later sync.
        setStatus({ upload: null });
        return error;
      } else throw error;
    }
    report(file.sizeBytes);
    done += file.sizeBytes;
  }
  setStatus({ upload: null });
  return null;
}
