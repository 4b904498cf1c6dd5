// The server's file storage is full (507) or out of reach (503) while a tablet sends a photo. The
// file transport below answers as src/lib/file-api.ts does (an ApiError with the server's status),
// wrapped by the real HTTP transport; pushes and pulls go to the in-memory stand-in. The photo's
// record and bytes stay untouched, the other changes still go, the person reads why, the next
// sync tries again (with the scheduler's backoff, not in a loop), and with space back the bytes
// go exactly once.
import { renderToStaticMarkup } from "react-dom/server";
import { createElement } from "react";
import { describe, expect, it } from "vitest";
import { addAttachmentLocally } from "../../../src/db/attachment-store";
import { findFile, listAttachments } from "../../../src/db/queries";
import { createSiteLocally } from "../../../src/db/site-store";
import { Problem } from "../../../src/features/sync/components/sync-bar";
import {
  ApiError,
  serverStorageFullMessage,
  serverStorageUnavailableMessage,
} from "../../../src/lib/api-error";
import { createSyncEngine } from "../../../src/sync/engine";
import { createHttpTransport } from "../../../src/sync/http-transport";
import { createSyncScheduler } from "../../../src/sync/scheduler";
import type { FileTransport, SyncTransport } from "../../../src/sync/transport";
import { fakeServer, newDb } from "../../helpers/fake-sync";

const campaignId = crypto.randomUUID();
const site = {
  name: "Col depot",
  kind: "mountain" as const,
  latitudeDeg: 46.2,
  longitudeDeg: 8.1,
  approxHeightM: 2410,
  notes: "",
};
const bytesOf = (text: string) => new TextEncoder().encode(text).buffer as ArrayBuffer;

type Disk = "full" | "unavailable" | "ok";

async function setUp() {
  const db = newDb();
  const server = fakeServer(campaignId);
  const disk = { state: "full" as Disk, attempts: 0 };
  const real = server.transport.files;
  if (!real) throw new Error("the stand-in has no file calls");
  // What src/lib/file-api.ts throws for the server's 507 and 503 answers.
  const fileCalls: FileTransport = {
    exists: (campaign, sha) => real.exists(campaign, sha),
    async upload(file, onProgress) {
      disk.attempts += 1;
      if (disk.state === "full")
        throw new ApiError(507, "storage_full", "The server's file storage is full");
      if (disk.state === "unavailable")
        throw new ApiError(503, "unavailable", "The file storage is not available right now");
      await real.upload(file, onProgress);
    },
  };
  const noRequest = () => Promise.reject(new Error("pushes and pulls go to the stand-in"));
  const transport: SyncTransport = {
    ...server.transport,
    files: createHttpTransport(noRequest, fileCalls).files,
  };
  const engine = createSyncEngine({ db, transport, campaignIds: () => [campaignId] });
  const siteId = await createSiteLocally(db, campaignId, site);
  const attach = (text: string) =>
    addAttachmentLocally(db, campaignId, {
      subject: { kind: "site", id: siteId },
      bytes: bytesOf(text),
      contentType: "image/jpeg",
      name: `${text}.jpg`,
    });
  return { db, server, disk, engine, siteId, attach };
}

/** The files table in the order they were added. */
const filesOf = async (db: ReturnType<typeof newDb>) =>
  (await db.files.toArray()).sort((a, b) => a.addedAt.localeCompare(b.addedAt));

const failureOf = (p: Promise<unknown>) =>
  p.then(
    () => null,
    (e: unknown) => e as Error,
  );

describe("the server's file storage is full", () => {
  it("keeps the photo untouched, sends the other changes, says why, and sends it once later", async () => {
    const { db, server, disk, engine, siteId, attach } = await setUp();
    await attach("north-door");
    await attach("south-door");
    const before = await filesOf(db);
    expect(before.map((f) => f.state)).toEqual(["waiting", "waiting"]);

    const failure = await failureOf(engine.sync());
    expect(failure?.message).toBe(serverStorageFullMessage);
    // One attempt, not one per file: the second would meet the same full storage.
    expect(disk.attempts).toBe(1);
    // Record and bytes exactly as they were.
    expect(await filesOf(db)).toEqual(before);
    // The site and both links went out all the same.
    expect(server.sites.has(siteId)).toBe(true);
    expect(server.links.size).toBe(2);
    expect(await db.outbox.count()).toBe(0);
    const status = engine.getStatus();
    expect(status).toMatchObject({
      running: false,
      pending: 0,
      pendingFiles: 2,
      upload: null,
      error: { kind: "server", message: serverStorageFullMessage },
    });
    expect(status.lastSuccessAt).toEqual(expect.any(String));

    // The person reads it in the sync bar's alert.
    const html = renderToStaticMarkup(createElement(Problem, { status }));
    expect(html).toContain('role="alert"');
    expect(html).toContain("storage for photos and files is full");
    expect(html).toContain("kept on this tablet");

    // Still full: a change made meanwhile is not held back by the waiting photo.
    const later = await createSiteLocally(db, campaignId, { ...site, name: "Col depot annex" });
    expect((await failureOf(engine.sync()))?.message).toBe(serverStorageFullMessage);
    expect(server.sites.has(later)).toBe(true);
    expect(disk.attempts).toBe(2);
    expect(await filesOf(db)).toEqual(before);

    // Space again: each file goes once, oldest first, and is then marked sent.
    disk.state = "ok";
    await engine.sync();
    expect(server.uploads).toEqual(before.map((f) => f.sha256));
    for (const file of before)
      expect(Buffer.from(server.files.get(file.sha256) ?? [])).toEqual(Buffer.from(file.bytes));
    expect(engine.getStatus()).toMatchObject({ pendingFiles: 0, error: null });
    const sha = before[0]?.sha256 ?? "";
    expect(await findFile(db, campaignId, sha)).toMatchObject({ state: "sent", refusal: null });
    const links = await listAttachments(db, campaignId, siteId);
    expect(links.map((l) => l.pending)).toEqual([false, false]);
    // Nothing left to send: another sync uploads nothing more.
    await engine.sync();
    expect(server.uploads).toHaveLength(2);
    expect(disk.attempts).toBe(4);
  });

  it("treats 503 the same way, with its own words", async () => {
    const { db, server, disk, engine, attach } = await setUp();
    await attach("tilt-meter");
    const [before] = await db.files.toArray();
    disk.state = "unavailable";
    const failure = await failureOf(engine.sync());
    expect(failure?.message).toBe(serverStorageUnavailableMessage);
    expect(await db.files.toArray()).toEqual([before]);
    expect(server.links.size).toBe(1);
    expect(engine.getStatus().error?.message).toMatch(/kept on this tablet/);
    disk.state = "ok";
    await engine.sync();
    expect(server.uploads).toEqual([before?.sha256]);
  });

  it("retries on later syncs with the scheduler's backoff, not in a loop", async () => {
    const { disk, engine, attach } = await setUp();
    await attach("hut-roof");
    const scheduler = createSyncScheduler({
      sync: () => engine.sync(),
      probe: async () => false,
      environment: { onOnline: () => () => undefined, isVisible: () => true },
      probeIntervalMs: 60_000,
      backoffStartMs: 40,
      backoffMaxMs: 160,
      random: () => 0.99,
    });
    scheduler.start();
    try {
      // Backoff waits about 40, 80, 160, 160 … ms: some 5 runs in 600 ms; a loop would do hundreds.
      await new Promise((resolve) => setTimeout(resolve, 600));
      expect(disk.attempts).toBeGreaterThanOrEqual(2);
      expect(disk.attempts).toBeLessThanOrEqual(8);
      expect(scheduler.retryAt()).toEqual(expect.any(Number));
      // Space again: the next retry sends it, and then the scheduler rests.
      disk.state = "ok";
      const deadline = Date.now() + 2_000;
      while (engine.getStatus().pendingFiles > 0 && Date.now() < deadline)
        await new Promise((resolve) => setTimeout(resolve, 20));
      expect(engine.getStatus().pendingFiles).toBe(0);
      const attempts = disk.attempts;
      await new Promise((resolve) => setTimeout(resolve, 300));
      expect(disk.attempts).toBe(attempts);
      expect(scheduler.retryAt()).toBeNull();
    } finally {
      scheduler.stop();
    }
  });
});
