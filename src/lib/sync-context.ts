// The local store and sync engine of the signed-in person, handed to React by one provider
// (src/app/sync-provider.tsx). Features read it through these hooks only.
import { createContext, useContext, useSyncExternalStore } from "react";
import type { EquipotDb } from "../db/database";
import type { SyncEngine, SyncStatus } from "../sync/engine";
import type { SyncScheduler } from "../sync/scheduler";

export interface LocalSync {
  userId: string;
  db: EquipotDb;
  engine: SyncEngine;
  scheduler: SyncScheduler;
  /** Call after every committed local write: updates the counts and sends it soon. */
  afterWrite: () => void;
}

export const LocalSyncContext = createContext<LocalSync | null>(null);

export function useLocalSync(): LocalSync {
  const value = useContext(LocalSyncContext);
  if (value === null)
    throw new Error("useLocalSync needs the sync provider (signed-in pages only)");
  return value;
}

/** The signed-in person's local database. */
export function useLocalDb(): EquipotDb {
  return useLocalSync().db;
}

export function useSyncStatus(): SyncStatus {
  const { engine } = useLocalSync();
  return useSyncExternalStore(engine.subscribe, engine.getStatus, engine.getStatus);
}
