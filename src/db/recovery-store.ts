// What a person may let go of on this device, once they have it elsewhere: a refused change, a
// refused file, or everything of theirs on a shared tablet.
import { fileKey, type EquipotDb } from "./database";

export async function dismissRecovery(db: EquipotDb, id: number): Promise<void> {
  await db.recovery.delete(id);
}

/** Only a file the server refused; a waiting one is still on its way and is never dropped here. */
export async function forgetRefusedFile(db: EquipotDb, campaignId: string, sha256: string) {
  const key = fileKey(campaignId, sha256);
  await db.transaction("rw", db.files, async () => {
    if ((await db.files.get(key))?.state === "refused") await db.files.delete(key);
  });
}

/** Deletes this person's whole local database; it stays closed so nothing writes into it again. */
export async function eraseLocalData(db: EquipotDb): Promise<void> {
  await db.delete({ disableAutoOpen: true });
}
