// One local database, sync engine and scheduler per signed-in person on this device: two people on
// one tablet never share a working copy or a client id.
import { useEffect, useState, type ReactNode } from "react";
import { openDatabase } from "../db/database";
import { writeMeta } from "../db/meta";
import { authorNameKey } from "../db/outbox";
import { getHealth } from "../features/health/api/get-health";
import { apiRequest } from "../lib/api";
import { askPersistence, refreshEstimate } from "../lib/device-storage";
import { attachmentExists, uploadAttachment } from "../lib/file-api";
import { getSession } from "../lib/session";
import { LocalSyncContext, type LocalSync } from "../lib/sync-context";
import { createSyncEngine } from "../sync/engine";
import { createHttpTransport } from "../sync/http-transport";
import { createSyncScheduler, webLockExclusive } from "../sync/scheduler";

export const localDatabaseName = (userId: string) => `equipot-${userId}`;

function campaignIds(): string[] {
  const session = getSession();
  return session.status === "signed-in" ? session.memberships.map((m) => m.campaignId) : [];
}

function createLocalSync(userId: string): LocalSync {
  const db = openDatabase(localDatabaseName(userId));
  const engine = createSyncEngine({
    db,
    transport: createHttpTransport(apiRequest, {
      exists: attachmentExists,
      upload: uploadAttachment,
    }),
    campaignIds,
    exclusive: webLockExclusive,
  });
  const scheduler = createSyncScheduler({
    sync: () => engine.sync(),
    probe: () =>
      getHealth().then(
        () => true,
        () => false,
      ),
  });
  const afterWrite = () => {
    void engine.refreshCounts();
    scheduler.notifyWrite();
  };
  return { userId, db, engine, scheduler, afterWrite };
}

/** Give it `key={userId}` so that another person signing in gets a fresh instance. */
export function SyncProvider({ userId, children }: { userId: string; children: ReactNode }) {
  const [local] = useState(() => createLocalSync(userId));

  useEffect(() => {
    const session = getSession();
    if (session.status === "signed-in" && session.user.id === userId)
      void writeMeta(local.db, authorNameKey, session.user.name);
    void local.engine.refreshCounts();
    local.scheduler.start();
    void askPersistence().then(refreshEstimate);
    const onSynced = local.engine.subscribe((event) => {
      if (event.type === "synced") void refreshEstimate();
    });
    return () => {
      onSynced();
      local.scheduler.stop();
      // Reopens by itself if the provider mounts again (React's development double mount).
      local.db.close({ disableAutoOpen: false });
    };
  }, [local, userId]);

  return <LocalSyncContext.Provider value={local}>{children}</LocalSyncContext.Provider>;
}
