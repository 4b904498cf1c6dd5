// One rebuild for every kind of working copy: the server's record with this device's pending
// mutations of that kind on top, in a few bulk reads and writes.
import type { EntityTable, IDType } from "dexie";
import type { MutationName } from "../../shared/sync/protocol";
import type { EquipotDb, OutboxEntry } from "./database";

export type ViewKind =
  | "sites"
  | "attachments"
  | "checklistRuns"
  | "checklistResults"
  | "fieldEntries"
  | "levellingSections"
  | "levellingSetups"
  | "legs"
  | "handovers"
  | "alerts";

/** Which working copy a mutation changes (a conflict's choice belongs to its site). */
export function viewKindOf(name: MutationName): ViewKind {
  if (name.startsWith("attachment.")) return "attachments";
  if (name === "checklist.record") return "checklistResults";
  if (name.startsWith("checklist.")) return "checklistRuns";
  if (name === "entry.add") return "fieldEntries";
  if (name === "levelling.setup") return "levellingSetups";
  if (name.startsWith("levelling.")) return "levellingSections";
  if (name.startsWith("leg.")) return "legs";
  if (name.startsWith("handover.")) return "handovers";
  if (name.startsWith("alert.")) return "alerts";
  return "sites";
}

interface Rebuild<S extends { id: string }, W extends { id: string }> {
  ids: Iterable<string>;
  server: EntityTable<S, "id">;
  working: EntityTable<W, "id">;
  kind: ViewKind;
  apply: (record: S | undefined, entry: OutboxEntry) => S | undefined;
  finish: (view: S, pending: OutboxEntry[]) => W;
}

/** Call inside a transaction over the view tables. */
export async function rebuildWorkingCopies<S extends { id: string }, W extends { id: string }>(
  db: EquipotDb,
  r: Rebuild<S, W>,
): Promise<void> {
  // Every view record is keyed by its string id; Dexie's generic key type cannot see that.
  const ids = [...new Set(r.ids)] as IDType<S, "id">[] & IDType<W, "id">[] & string[];
  if (ids.length === 0) return;
  const servers = await r.server.bulkGet(ids);
  const byId = new Map<string, OutboxEntry[]>();
  // Entries the server refused are not applied; they wait in recovery instead.
  for (const entry of await db.outbox.where("entityId").anyOf(ids).toArray()) {
    if (viewKindOf(entry.name) !== r.kind || entry.result?.status === "rejected") continue;
    const list = byId.get(entry.entityId) ?? [];
    list.push(entry);
    byId.set(entry.entityId, list);
  }
  const keep: W[] = [];
  const drop: typeof ids = [];
  ids.forEach((id, i) => {
    const pending = (byId.get(id) ?? []).sort((a, b) => a.mutationId - b.mutationId);
    let view = servers[i];
    for (const entry of pending) view = r.apply(view, entry);
    if (view === undefined) drop.push(id);
    else keep.push(r.finish(view, pending));
  });
  await r.working.bulkPut(keep);
  await r.working.bulkDelete(drop);
}
