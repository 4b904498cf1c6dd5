// Every local write: the outbox entries, anything written beside them, and the rebuilt working
// copies in one transaction. The promise resolves only after it committed, so "saved" is never
// shown early, and a write of several entries (an imported file's parts) is all or nothing.
import type { Table } from "dexie";
import type { EquipotDb, OutboxEntry } from "./database";
import { readMeta, takeMutationId } from "./meta";
import { rebuildViews, viewTables, type Touched } from "./views";
import { viewKindOf } from "./working-copy";

/** An outbox entry before it has its id, time and push answer. */
export type LocalMutation = Omit<OutboxEntry, "mutationId" | "createdAt" | "result">;

export async function recordMutations(
  db: EquipotDb,
  mutations: readonly LocalMutation[],
  alongside?: { tables: Table[]; write: () => Promise<unknown> },
): Promise<void> {
  const tables = [db.meta, ...viewTables(db), ...(alongside?.tables ?? [])];
  await db.transaction("rw", tables, async () => {
    const touched: Record<string, string[]> = {};
    for (const mutation of mutations) {
      const mutationId = await takeMutationId(db);
      await db.outbox.add({ ...mutation, mutationId, createdAt: new Date().toISOString() });
      (touched[viewKindOf(mutation.name)] ??= []).push(mutation.entityId);
    }
    await alongside?.write();
    await rebuildViews(db, touched as Touched);
  });
}

export const recordMutation = (
  db: EquipotDb,
  mutation: LocalMutation,
  alongside?: { tables: Table[]; write: () => Promise<unknown> },
) => recordMutations(db, [mutation], alongside);

/** The signed-in person's name, shown as the author of entries not yet confirmed by the server. */
export const authorNameKey = "authorName";
export const readAuthorName = (db: EquipotDb) => readMeta<string | null>(db, authorNameKey, null);
