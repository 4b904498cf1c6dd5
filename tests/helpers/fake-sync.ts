// A small in-memory stand-in for the server's sync and file API, for unit tests of the store and
// the engine on fake-indexeddb. It numbers changes like the server and checks file hashes.
import { createHash } from "node:crypto";
import { IDBFactory, IDBKeyRange } from "fake-indexeddb";
import type { AttachmentLinkView } from "../../shared/schemas/attachments";
import type { SiteView } from "../../shared/schemas/sites";
import type {
  ChangeRecord,
  PullResponse,
  PushRequest,
  PushResponse,
} from "../../shared/sync/protocol";
import type { CrateView } from "../../shared/schemas/crates";
import { openDatabase, type LocalSite } from "../../src/db/database";
import { createSyncEngine } from "../../src/sync/engine";
import { SyncError, type PullParams, type SyncTransport } from "../../src/sync/transport";

export const newDb = () =>
  openDatabase(`t-${crypto.randomUUID()}`, { indexedDB: new IDBFactory(), IDBKeyRange });

/** A site and a crate (with the demo's cavity-crate limits) as a pull leaves them on a tablet. */
export function localSiteAndCrate(campaignId: string, siteId: string, crateId: string) {
  const updatedAt = "2027-06-01T00:00:00.000Z";
  const site: LocalSite = {
    id: siteId,
    campaignId,
    name: "Ridge hut",
    kind: "mountain",
    latitudeDeg: 47,
    longitudeDeg: 11,
    approxHeightM: 2870,
    notes: "",
    version: 1,
    updatedAt,
    updatedBy: null,
    deletedAt: null,
    pendingChanges: 0,
  };
  const crate: CrateView = {
    id: crateId,
    campaignId,
    label: "KR-03",
    contents: "Cavity",
    weightKg: 35,
    maxShockG: 15,
    temperatureMinC: 18,
    temperatureMaxC: 25,
    notes: "",
    instrument: "",
    maxTiltDeg: null,
    state: "arrived",
    version: 1,
    updatedAt,
    deletedAt: null,
  };
  return { site, crate };
}

type Seq = { seq: number };

export function fakeServer(campaignId: string) {
  const sites = new Map<string, SiteView & Seq>();
  const links = new Map<string, AttachmentLinkView & Seq>();
  const files = new Map<string, Buffer>();
  const last = new Map<string, number>();
  const rejections = new Map<number, string>();
  let seq = 0;
  const pushes: PushRequest[] = [];
  const uploads: string[] = [];
  const controls = { loseNextResponse: false, refuseFiles: null as string | null, offline: false };

  function apply(m: PushRequest["mutations"][number]) {
    const args = m.args as { id: string; changes?: Partial<SiteView> };
    const existing = sites.get(args.id);
    if (m.name === "site.create")
      sites.set(args.id, {
        ...(m.args as SiteView),
        campaignId,
        version: 1,
        updatedAt: m.createdAt,
        updatedBy: null,
        deletedAt: null,
        seq: ++seq,
      });
    if (m.name === "site.update" && existing)
      sites.set(args.id, {
        ...existing,
        ...args.changes,
        version: existing.version + 1,
        seq: ++seq,
      });
    if (m.name === "site.delete" && existing)
      sites.set(args.id, { ...existing, deletedAt: m.createdAt, seq: ++seq });
    if (m.name === "attachment.add") {
      const link = m.args as Omit<AttachmentLinkView, "campaignId" | "createdAt">;
      links.set(link.id, {
        ...link,
        campaignId,
        createdAt: m.createdAt,
        createdBy: null,
        removedAt: null,
        seq: ++seq,
      });
    }
    const link = links.get(args.id);
    if (m.name === "attachment.remove" && link)
      links.set(args.id, { ...link, removedAt: m.createdAt, seq: ++seq });
  }

  const transport: SyncTransport = {
    async push(request): Promise<PushResponse> {
      if (controls.offline) throw new SyncError("No connection", "offline");
      pushes.push(request);
      let applied = last.get(request.clientId) ?? 0;
      const results = request.mutations.map((m) => {
        if (m.mutationId <= applied)
          return { mutationId: m.mutationId, status: "duplicate" as const };
        applied = m.mutationId;
        const refusal = rejections.get(m.mutationId);
        if (refusal !== undefined)
          return { mutationId: m.mutationId, status: "rejected" as const, message: refusal };
        apply(m);
        return { mutationId: m.mutationId, status: "applied" as const };
      });
      last.set(request.clientId, applied);
      if (controls.loseNextResponse) {
        controls.loseNextResponse = false;
        throw new Error("response lost");
      }
      return { results, lastMutationId: applied };
    },
    async pull({ cursor, limit, clientId, pendingFrom }: PullParams): Promise<PullResponse> {
      if (controls.offline) throw new SyncError("No connection", "offline");
      const all: ChangeRecord[] = [
        ...[...sites.values()].map(({ seq: s, ...data }) => ({
          entity: "site" as const,
          seq: s,
          id: data.id,
          data,
        })),
        ...[...links.values()].map(({ seq: s, ...data }) => ({
          entity: "attachment" as const,
          seq: s,
          id: data.id,
          data,
        })),
      ]
        .filter((c) => c.seq > cursor)
        .sort((a, b) => a.seq - b.seq);
      const changes = all.slice(0, limit);
      const lastMutationId = last.get(clientId) ?? 0;
      const hasMore = all.length > limit;
      return {
        changes,
        cursor: changes.at(-1)?.seq ?? cursor,
        hasMore,
        lastMutationId,
        rejections:
          hasMore || pendingFrom === undefined
            ? []
            : [...rejections]
                .filter(([id]) => id >= pendingFrom && id <= lastMutationId)
                .map(([mutationId, reason]) => ({ mutationId, reason })),
      };
    },
    files: {
      async exists(_campaign, sha256) {
        if (controls.offline) throw new SyncError("No connection", "offline");
        return files.has(sha256);
      },
      async upload(file, onProgress) {
        if (controls.offline) throw new SyncError("No connection", "offline");
        if (controls.refuseFiles !== null) throw new SyncError(controls.refuseFiles, "refused");
        const bytes = Buffer.from(file.bytes);
        // The real server recomputes the hash; so does this stand-in.
        if (createHash("sha256").update(bytes).digest("hex") !== file.sha256)
          throw new SyncError("checksum differs", "server");
        onProgress(bytes.length / 2);
        onProgress(bytes.length);
        uploads.push(file.sha256);
        files.set(file.sha256, bytes);
      },
    },
  };
  return {
    transport,
    sites,
    links,
    files,
    pushes,
    uploads,
    controls,
    /** The next push answers "rejected" for this mutation id, and the server keeps the reason. */
    rejectMutation: (mutationId: number, reason: string) => rejections.set(mutationId, reason),
  };
}

export type FakeServer = ReturnType<typeof fakeServer>;

export const engineFor = (
  db: ReturnType<typeof openDatabase>,
  server: FakeServer,
  campaignId: string,
  options: { pushBatch?: number; pullPage?: number } = {},
) =>
  createSyncEngine({
    db,
    transport: server.transport,
    campaignIds: () => [campaignId],
    ...options,
  });
