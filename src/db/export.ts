// What this device holds that the server does not have yet, as plain data to save as a file.
import {
  localSchemaVersion,
  type EquipotDb,
  type LocalFile,
  type OutboxEntry,
  type RecoveryEntry,
} from "./database";

export interface DeviceExport<T> {
  kind: "equipot-outbox" | "equipot-recovery";
  localSchemaVersion: number;
  exportedAt: string;
  clientId: string | null;
  entries: T[];
}

async function clientIdOf(db: EquipotDb): Promise<string | null> {
  const row = await db.meta.get("clientId");
  return typeof row?.value === "string" ? row.value : null;
}

/** Every change not yet confirmed by the server, in the order it was made. */
export async function exportOutbox(db: EquipotDb): Promise<DeviceExport<OutboxEntry>> {
  return {
    kind: "equipot-outbox",
    localSchemaVersion,
    exportedAt: new Date().toISOString(),
    clientId: await clientIdOf(db),
    entries: await db.outbox.orderBy("mutationId").toArray(),
  };
}

/** The changes the server refused for one campaign, with the reasons. */
export async function exportRecovery(
  db: EquipotDb,
  campaignId: string,
): Promise<DeviceExport<RecoveryEntry>> {
  const entries = await db.recovery.where("campaignId").equals(campaignId).toArray();
  return {
    kind: "equipot-recovery",
    localSchemaVersion,
    exportedAt: new Date().toISOString(),
    clientId: await clientIdOf(db),
    entries: entries.sort((a, b) => a.mutationId - b.mutationId),
  };
}

/** Photos and files whose bytes the server does not have, or refused: saved beside the changes. */
export async function unsentFiles(db: EquipotDb): Promise<LocalFile[]> {
  const waiting = await db.files.where("state").anyOf("waiting", "refused").toArray();
  return waiting.sort((a, b) => a.addedAt.localeCompare(b.addedAt));
}
