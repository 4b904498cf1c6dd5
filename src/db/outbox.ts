// Every local write: the outbox entry, anything written beside it, and the rebuilt working copy in
// one transaction. The promise resolves only after it committed, so "saved" is never shown early.
import type { Table } from "dexie";
import type { EquipotDb, OutboxEntry } from "./database";
import { takeMutationId } from "./meta";
import { rebuildViews, viewTables } from "./views";
import { viewKindOf } from "./working-copy";

/** An outbox entry before it has its id, time and push answer. */
export type LocalMutation = Omit<OutboxEntry, "mutationId" | "createdAt" | "result">;

export async function recordMutation(
  db: EquipotDb,
  mutation: LocalMutation,
  alongside?: { tables: Table[]; write: () => Promise<unknown> },
): Promise<void> {
  const tables = [db.meta, ...viewTables(db), ...(alongside?.tables ?? [])];
  await db.transaction("rw", tables, async () => {
    const mutationId = await takeMutationId(db);
    await db.outbox.add({ ...mutation, mutationId, createdAt: new Date().toISOString() });
    await alongside?.write();
    await rebuildViews(db, { [viewKindOf(mutation.name)]: [mutation.entityId] });
  });
}
