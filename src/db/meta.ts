import type { EquipotDb } from "./database";

export async function readMeta<T>(db: EquipotDb, key: string, fallback: T): Promise<T> {
  const row = await db.meta.get(key);
  return row === undefined ? fallback : (row.value as T);
}

export const writeMeta = (db: EquipotDb, key: string, value: unknown) =>
  db.meta.put({ key, value });

/** This tablet's id, made once and kept. */
export async function ensureClientId(db: EquipotDb): Promise<string> {
  return db.transaction("rw", db.meta, async () => {
    const existing = await readMeta<string | null>(db, "clientId", null);
    if (existing) return existing;
    const made = crypto.randomUUID();
    await writeMeta(db, "clientId", made);
    return made;
  });
}

/** The next mutation id; called only inside the write's own transaction, so an id is never reused. */
export async function takeMutationId(db: EquipotDb): Promise<number> {
  const next = await readMeta<number>(db, "nextMutationId", 1);
  await writeMeta(db, "nextMutationId", next + 1);
  return next;
}

export const cursorKey = (campaignId: string) => `cursor:${campaignId}`;
