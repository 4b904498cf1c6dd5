// The sync engine: plain TypeScript, no React. One instance per signed-in user and device.
// A run uploads waiting files, pushes the outbox in order, in batches, then pulls every campaign's
// changes until caught up. A file the server cannot store now fails the run only after that.
import { defaultPullPage, protocolVersion } from "../../shared/sync/protocol";
import type { EquipotDb, OutboxEntry } from "../db/database";
import { cursorKey, ensureClientId, readMeta, writeMeta } from "../db/meta";
import { waitingFiles } from "../db/queries";
import { applyPulledPage } from "./apply-pull";
import { uploadFiles } from "./upload-files";
import { SyncError, type SyncTransport } from "./transport";

export interface SyncStatus {
  running: boolean;
  /** Changes in the outbox, not yet confirmed by the server. */
  pending: number;
  /** Photos and files whose bytes the server does not have yet. */
  pendingFiles: number;
  oldestPendingAt: string | null;
  lastSuccessAt: string | null;
  /** Files are counted in bytes, changes one by one. */
  progress: { phase: "files" | "changes"; done: number; total: number } | null;
  /** The file being sent now, for its own progress bar. */
  upload: { key: string; sentBytes: number; totalBytes: number } | null;
  error: { kind: SyncError["kind"]; message: string } | null;
}

export type SyncEvent = { type: "status"; status: SyncStatus } | { type: "synced"; pulled: number };

export interface SyncEngineOptions {
  db: EquipotDb;
  transport: SyncTransport;
  campaignIds: () => string[];
  pushBatch?: number;
  pullPage?: number;
  /** Runs `work` while holding a lock shared by every tab (Web Locks in the browser). */
  exclusive?: <T>(work: () => Promise<T>) => Promise<T>;
}

const lastSuccessKey = "lastSyncSuccessAt";

/** Arguments per push, in JSON characters: well under the server's 1 MB body limit. */
export const pushBudgetChars = 600_000;

/**
 * Consecutive outbox entries of one campaign: one push each, so mutation ids stay contiguous. A
 * batch also ends before its arguments outgrow the budget (imported logger files are large).
 */
export function batches(entries: OutboxEntry[], size: number): OutboxEntry[][] {
  const out: OutboxEntry[][] = [];
  let chars = 0;
  for (const entry of entries) {
    const current = out.at(-1);
    const length = JSON.stringify(entry.args).length;
    const fits = current && current.length < size && chars + length <= pushBudgetChars;
    if (fits && current[0]?.campaignId === entry.campaignId) {
      current.push(entry);
      chars += length;
    } else {
      out.push([entry]);
      chars = length;
    }
  }
  return out;
}

export function createSyncEngine(options: SyncEngineOptions) {
  const { db, transport, pushBatch = 200, pullPage = defaultPullPage } = options;
  const exclusive = options.exclusive ?? (<T>(work: () => Promise<T>) => work());
  const listeners = new Set<(event: SyncEvent) => void>();
  let status: SyncStatus = {
    running: false,
    pending: 0,
    pendingFiles: 0,
    oldestPendingAt: null,
    lastSuccessAt: null,
    progress: null,
    upload: null,
    error: null,
  };
  let current: Promise<void> | undefined;

  const emit = (event: SyncEvent) => listeners.forEach((listener) => listener(event));
  const setStatus = (patch: Partial<SyncStatus>) => {
    status = { ...status, ...patch };
    emit({ type: "status", status });
  };

  async function refreshCounts(): Promise<void> {
    const pending = await db.outbox.count();
    const oldest = await db.outbox.orderBy("mutationId").first();
    const files = await waitingFiles(db);
    const lastSuccessAt = await readMeta<string | null>(db, lastSuccessKey, null);
    const times = [oldest?.createdAt, files.oldestAt].filter((t): t is string => !!t);
    setStatus({
      pending,
      pendingFiles: files.count,
      oldestPendingAt: times.sort()[0] ?? null,
      lastSuccessAt,
    });
  }

  async function pushAll(clientId: string): Promise<void> {
    const unsent = (await db.outbox.orderBy("mutationId").toArray()).filter((e) => !e.result);
    const groups = batches(unsent, pushBatch);
    let done = 0;
    for (const group of groups) {
      const campaignId = group[0]?.campaignId ?? "";
      const mutations = group.map((e) => ({
        mutationId: e.mutationId,
        name: e.name,
        args: e.args,
        createdAt: e.createdAt,
      }));
      const response = await transport.push({ protocolVersion, clientId, campaignId, mutations });
      await db.outbox.bulkUpdate(
        response.results.map((result) => ({ key: result.mutationId, changes: { result } })),
      );
      done += group.length;
      setStatus({ progress: { phase: "changes", done, total: unsent.length } });
    }
  }

  async function pullCampaign(clientId: string, campaignId: string): Promise<number> {
    let pulled = 0;
    for (;;) {
      const cursor = await readMeta<number>(db, cursorKey(campaignId), 0);
      const pendingFrom = (await db.outbox.orderBy("mutationId").first())?.mutationId;
      const page = await transport.pull({
        campaign: campaignId,
        clientId,
        cursor,
        limit: pullPage,
        pendingFrom,
      });
      await applyPulledPage(db, campaignId, page);
      pulled += page.changes.length;
      if (!page.hasMore) return pulled;
    }
  }

  async function runOnce(): Promise<void> {
    setStatus({ running: true, error: null, progress: null });
    try {
      const clientId = await ensureClientId(db);
      // Bytes first, so that colleagues who pull a link can usually fetch its file at once.
      // A file the server cannot store now waits; the changes still go, then the run reports it.
      const fileProblem = transport.files
        ? await uploadFiles(db, transport.files, setStatus)
        : null;
      await pushAll(clientId);
      let pulled = 0;
      for (const campaignId of options.campaignIds())
        pulled += await pullCampaign(clientId, campaignId);
      await writeMeta(db, lastSuccessKey, new Date().toISOString());
      emit({ type: "synced", pulled });
      if (fileProblem) throw fileProblem;
    } catch (error) {
      const known =
        error instanceof SyncError
          ? error
          : new SyncError(
              "Sync failed: the server could not be reached or answered with an error.",
              "server",
            );
      setStatus({ error: { kind: known.kind, message: known.message } });
      throw known;
    } finally {
      await refreshCounts();
      setStatus({ running: false, progress: null, upload: null });
    }
  }

  return {
    /** Runs a sync now, or joins the one already running in this tab. */
    sync(): Promise<void> {
      current ??= exclusive(runOnce).finally(() => (current = undefined));
      return current;
    },
    refreshCounts,
    getStatus: () => status,
    subscribe(listener: (event: SyncEvent) => void): () => void {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
  };
}

export type SyncEngine = ReturnType<typeof createSyncEngine>;
