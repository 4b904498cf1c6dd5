// The mapping last used per logger model, on this device (localStorage). Read back through the
// schema: a stored mapping from an older version or edited by hand is ignored, never trusted.
import { z } from "zod";
import { columnMapping, type ColumnMapping, type ImportKind } from "./parse/mapping";

const storageKey = "equipot.loggerMappings.v1";
const stored = z.record(z.string(), z.object({ loggerModel: z.string(), mapping: columnMapping }));
type Stored = z.infer<typeof stored>;

type KeyValueStore = Pick<Storage, "getItem" | "setItem">;

const keyOf = (kind: ImportKind, loggerModel: string) =>
  `${kind}:${loggerModel.trim().toLowerCase()}`;

function readAll(storage: KeyValueStore): Stored {
  try {
    const parsed = stored.safeParse(JSON.parse(storage.getItem(storageKey) ?? "{}"));
    return parsed.success ? parsed.data : {};
  } catch {
    return {};
  }
}

export function recallMapping(
  kind: ImportKind,
  loggerModel: string,
  storage: KeyValueStore = localStorage,
): ColumnMapping | null {
  if (loggerModel.trim() === "") return null;
  const found = readAll(storage)[keyOf(kind, loggerModel)]?.mapping;
  return found !== undefined && found.values.kind === kind ? found : null;
}

/** Logger models remembered for a kind, as typed the last time (for the model field's list). */
export function rememberedModels(
  kind: ImportKind,
  storage: KeyValueStore = localStorage,
): string[] {
  const prefix = `${kind}:`;
  return Object.entries(readAll(storage))
    .filter(([k]) => k.startsWith(prefix))
    .map(([, v]) => v.loggerModel)
    .sort((a, b) => a.localeCompare(b));
}

export function rememberMapping(
  loggerModel: string,
  mapping: ColumnMapping,
  storage: KeyValueStore = localStorage,
): void {
  if (loggerModel.trim() === "") return;
  const all = readAll(storage);
  all[keyOf(mapping.values.kind, loggerModel)] = { loggerModel: loggerModel.trim(), mapping };
  try {
    storage.setItem(storageKey, JSON.stringify(all));
  } catch {
    // A full storage only costs the convenience of the remembered mapping.
  }
}
