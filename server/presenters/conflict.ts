import type { ConflictView } from "../../shared/sync/protocol";
import type { ConflictRow } from "../db/repositories/sync";

export function presentConflict(row: ConflictRow): ConflictView {
  return {
    id: row.id,
    entity: "site",
    entityId: row.entityId,
    field: row.field,
    baseValue: row.baseValue,
    serverValue: row.serverValue,
    clientValue: row.clientValue,
    openedAt: row.openedAt.toISOString(),
    openedBy: row.openedBy,
    resolvedAt: row.resolvedAt?.toISOString() ?? null,
    resolvedValue: row.resolvedValue,
  };
}
