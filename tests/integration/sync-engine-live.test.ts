// The client's engine (on fake-indexeddb) against the real server and PostgreSQL over HTTP.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { IDBFactory, IDBKeyRange } from "fake-indexeddb";
import type { z } from "zod";
import { openDatabase } from "../../src/db/database";
import { addAttachmentLocally } from "../../src/db/attachment-store";
import {
  latestResults,
  recordResultLocally,
  signOffLocally,
  startChecklistLocally,
} from "../../src/db/checklist-store";
import {
  findChecklistRun,
  listAttachments,
  listChecklistTemplates,
  listRefusedFiles,
} from "../../src/db/queries";
import { createSiteLocally, updateSiteLocally } from "../../src/db/site-store";
import { createSyncEngine } from "../../src/sync/engine";
import { createHttpTransport } from "../../src/sync/http-transport";
import type { FileTransport } from "../../src/sync/transport";
import { ApiError } from "../../src/lib/api-error";
import { demoPassword } from "../../server/seed/demo";
import { startServer, type RunningServer } from "../../server/index";
import { seedDemo } from "../../server/seed/demo";
import { testConfig } from "../helpers/config";
import { createTestDatabase, type TestDatabase } from "../helpers/db";

let database: TestDatabase;
let server: RunningServer;
let campaignId: string;

async function signIn(role: string): Promise<string> {
  const res = await fetch(`${server.url}/api/auth/sign-in`, {
    method: "POST",
    headers: { "content-type": "application/json", "x-equipot-request": "1" },
    body: JSON.stringify({ email: `${role}@demo.equipot.test`, password: demoPassword }),
  });
  const body = (await res.json()) as { accessToken: string; memberships: { campaignId: string }[] };
  campaignId = body.memberships[0]?.campaignId ?? "";
  return body.accessToken;
}

function requester(token: string) {
  return async <S extends z.ZodType>(
    path: string,
    options: { method?: "GET" | "POST"; body?: unknown; schema: S },
  ) => {
    let res: Response;
    try {
      res = await fetch(`${server.url}/api${path}`, {
        method: options.method ?? "GET",
        headers: { "content-type": "application/json", authorization: `Bearer ${token}` },
        body: options.body === undefined ? undefined : JSON.stringify(options.body),
      });
    } catch (cause) {
      throw ApiError.network(cause);
    }
    const body = (await res.json()) as { error?: { code: "conflict"; message: string } };
    if (!res.ok)
      throw new ApiError(
        res.status,
        body.error?.code ?? "internal",
        body.error?.message ?? "error",
      );
    return options.schema.parse(body) as z.output<S>;
  };
}

/** Files over fetch (Node has no XMLHttpRequest); counts the uploads that really went out. */
function fileCalls(token: string, uploads: string[]): FileTransport {
  const url = (campaign: string, sha: string) =>
    `${server.url}/api/campaigns/${campaign}/attachments/${sha}`;
  const fail = async (res: Response) => {
    const body = (await res.json().catch(() => ({}))) as { error?: { message?: string } };
    throw new ApiError(res.status, "bad_request", body.error?.message ?? `status ${res.status}`);
  };
  return {
    async exists(campaign, sha) {
      const res = await fetch(url(campaign, sha), {
        method: "HEAD",
        headers: { authorization: `Bearer ${token}` },
      });
      if (res.status === 404) return false;
      if (!res.ok) await fail(res);
      return true;
    },
    async upload(file, onProgress) {
      const res = await fetch(url(file.campaignId, file.sha256), {
        method: "PUT",
        headers: {
          authorization: `Bearer ${token}`,
          "content-type": "application/octet-stream",
          "x-file-name": encodeURIComponent(file.name),
        },
        body: file.bytes,
      });
      if (!res.ok) await fail(res);
      uploads.push(file.sha256);
      onProgress(file.bytes.byteLength);
    },
  };
}

// A 1×1 PNG: the server decides the type from these bytes, not from anything the client says.
const tinyPng = Buffer.from(
  "iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==",
  "base64",
);

beforeAll(async () => {
  database = await createTestDatabase();
  await seedDemo(database.db, "test");
  server = await startServer(testConfig({ DATABASE_URL: database.url }));
});
afterAll(async () => {
  await server.close();
  await database.drop();
});

const newDb = () =>
  openDatabase(`live-${crypto.randomUUID()}`, { indexedDB: new IDBFactory(), IDBKeyRange });

describe("engine against the real server", () => {
  it("brings offline work of two tablets to the server and to each other, conflicts included", async () => {
    const tokenA = await signIn("field");
    const tokenB = await signIn("geodesist");
    const dbA = newDb();
    const dbB = newDb();
    const engineA = createSyncEngine({
      db: dbA,
      transport: createHttpTransport(requester(tokenA)),
      campaignIds: () => [campaignId],
      pushBatch: 3,
      pullPage: 4,
    });
    const engineB = createSyncEngine({
      db: dbB,
      transport: createHttpTransport(requester(tokenB)),
      campaignIds: () => [campaignId],
      pullPage: 4,
    });

    const ids = [];
    for (let i = 0; i < 5; i += 1) {
      ids.push(
        await createSiteLocally(dbA, campaignId, {
          name: `Offline ${i}`,
          kind: "coastal",
          latitudeDeg: 54.1,
          longitudeDeg: 8.0,
          approxHeightM: 3 + i,
          notes: "",
        }),
      );
    }
    await engineA.sync();
    await engineB.sync();
    const firstId = ids[0] ?? "";
    expect(await dbB.sites.get(firstId)).toMatchObject({ name: "Offline 0", pendingChanges: 0 });
    // The three demo sites plus the five new ones.
    expect(await dbB.sites.where("campaignId").equals(campaignId).count()).toBe(8);

    await updateSiteLocally(dbA, campaignId, firstId, { name: "Edited on A", notes: "A's note" });
    await updateSiteLocally(dbB, campaignId, firstId, { name: "Edited on B", approxHeightM: 4.5 });
    await engineA.sync();
    await engineB.sync();
    await engineA.sync();
    for (const db of [dbA, dbB]) {
      expect(await db.sites.get(firstId)).toMatchObject({
        name: "Edited on A",
        notes: "A's note",
        approxHeightM: 4.5,
      });
      const conflicts = await db.conflicts.where("entityId").equals(firstId).toArray();
      expect(conflicts).toHaveLength(1);
      expect(conflicts[0]).toMatchObject({
        field: "name",
        serverValue: "Edited on A",
        clientValue: "Edited on B",
      });
    }
    expect(await dbA.outbox.count()).toBe(0);
    expect(await dbB.outbox.count()).toBe(0);
  });

  it("moves a refused change to recovery instead of dropping it", async () => {
    const token = await signIn("reviewer");
    const db = newDb();
    const engine = createSyncEngine({
      db,
      transport: createHttpTransport(requester(token)),
      campaignIds: () => [campaignId],
    });
    await createSiteLocally(db, campaignId, {
      name: "Reviewer tried",
      kind: "other",
      latitudeDeg: 1,
      longitudeDeg: 1,
      approxHeightM: 1,
      notes: "",
    });
    await engine.sync();
    expect(await db.outbox.count()).toBe(0);
    const kept = await db.recovery.toArray();
    expect(kept).toHaveLength(1);
    expect(kept[0]).toMatchObject({ name: "site.create", reason: expect.stringMatching(/role/) });
    expect(await db.sites.filter((s) => s.name === "Reviewer tried").count()).toBe(0);
  });

  it("sends a photo's bytes once, links it to a site, and another tablet fetches the same bytes", async () => {
    const tokenA = await signIn("field");
    const tokenB = await signIn("logistics");
    const uploadsA: string[] = [];
    const uploadsB: string[] = [];
    const dbA = newDb();
    const dbB = newDb();
    const engineA = createSyncEngine({
      db: dbA,
      transport: createHttpTransport(requester(tokenA), fileCalls(tokenA, uploadsA)),
      campaignIds: () => [campaignId],
    });
    const engineB = createSyncEngine({
      db: dbB,
      transport: createHttpTransport(requester(tokenB), fileCalls(tokenB, uploadsB)),
      campaignIds: () => [campaignId],
    });
    const siteId = await createSiteLocally(dbA, campaignId, {
      name: "Photo site",
      kind: "mountain",
      latitudeDeg: 46,
      longitudeDeg: 9,
      approxHeightM: 2000,
      notes: "",
    });
    const bytes = tinyPng.buffer.slice(tinyPng.byteOffset, tinyPng.byteOffset + tinyPng.length);
    const photo = {
      subject: { kind: "site" as const, id: siteId },
      bytes,
      contentType: "image/png" as const,
      name: "plinth.png",
      caption: "Plinth before levelling",
    };
    const linkId = await addAttachmentLocally(dbA, campaignId, photo);
    await engineA.sync();
    expect(uploadsA).toHaveLength(1);
    expect(await dbA.outbox.count()).toBe(0);

    await engineB.sync();
    const [seen] = await listAttachments(dbB, campaignId, siteId);
    expect(seen).toMatchObject({ id: linkId, caption: "Plinth before levelling", pending: false });
    const res = await fetch(
      `${server.url}/api/campaigns/${campaignId}/attachments/${seen?.sha256}`,
      {
        headers: { authorization: `Bearer ${tokenB}` },
      },
    );
    expect(res.headers.get("content-type")).toBe("image/png");
    expect(Buffer.from(await res.arrayBuffer()).equals(tinyPng)).toBe(true);

    // The same bytes attached on B are already on the server: no second upload.
    await addAttachmentLocally(dbB, campaignId, { ...photo, caption: "Same photo from B" });
    await engineB.sync();
    expect(uploadsB).toEqual([]);
    expect((await dbB.files.toArray()).map((f) => f.state)).toEqual(["sent"]);
  });

  it("keeps a file whose bytes the server refuses, with its reason", async () => {
    const token = await signIn("field");
    const db = newDb();
    const engine = createSyncEngine({
      db,
      transport: createHttpTransport(requester(token), fileCalls(token, [])),
      campaignIds: () => [campaignId],
    });
    const siteId = await createSiteLocally(db, campaignId, {
      name: "Script site",
      kind: "other",
      latitudeDeg: 1,
      longitudeDeg: 1,
      approxHeightM: 1,
      notes: "",
    });
    // Declared a JPEG, but the bytes are a script: the server sniffs and refuses it.
    await addAttachmentLocally(db, campaignId, {
      subject: { kind: "site", id: siteId },
      bytes: new TextEncoder().encode("<script>alert(1)</script>").buffer as ArrayBuffer,
      contentType: "image/jpeg",
      name: "not-a-photo.jpg",
    });
    await engine.sync();
    const [file] = await listRefusedFiles(db, campaignId);
    expect(file?.refusal).toMatch(/Accepted:/);
    expect(engine.getStatus().pendingFiles).toBe(0);
  });

  it("brings a checklist worked offline to the server and to another tablet", async () => {
    const tokenA = await signIn("field");
    const tokenB = await signIn("geodesist");
    const dbA = newDb();
    const dbB = newDb();
    const engineA = createSyncEngine({
      db: dbA,
      transport: createHttpTransport(requester(tokenA)),
      campaignIds: () => [campaignId],
    });
    const engineB = createSyncEngine({
      db: dbB,
      transport: createHttpTransport(requester(tokenB)),
      campaignIds: () => [campaignId],
    });
    await engineA.sync();
    const [template] = (await listChecklistTemplates(dbA, campaignId)).filter(
      (t) => t.purpose === "vacuum-bakeout",
    );
    const site = await dbA.sites.where("campaignId").equals(campaignId).first();
    if (!template || !site) throw new Error("the demo template or site was not pulled");
    const runId = await startChecklistLocally(dbA, campaignId, template.id, site.id);
    const flagged = await recordResultLocally(dbA, campaignId, runId, "pressure", 3e-7);
    expect(flagged.outOfRange).toBe(true);
    await recordResultLocally(dbA, campaignId, runId, "bake-temp", 120);
    await recordResultLocally(dbA, campaignId, runId, "ion-pump", true);
    await signOffLocally(dbA, campaignId, runId, "Pump down slow; watched overnight");
    await engineA.sync();
    expect(await dbA.outbox.count()).toBe(0);
    expect(await findChecklistRun(dbA, campaignId, runId)).toMatchObject({ pending: false });

    await engineB.sync();
    expect(await findChecklistRun(dbB, campaignId, runId)).toMatchObject({
      title: "Vacuum and bake-out",
      signOffNote: "Pump down slow; watched overnight",
      signedOffAt: expect.any(String),
    });
    const results = await latestResults(dbB, runId);
    expect(results.get("pressure")).toMatchObject({ value: 3e-7, outOfRange: true });
    expect([...results.keys()].sort()).toEqual(["bake-temp", "ion-pump", "pressure"]);
  });

  it("explains an unreachable server in plain words and keeps the outbox", async () => {
    const db = newDb();
    const transport = createHttpTransport(async () => {
      throw ApiError.network(new Error("ECONNREFUSED"));
    });
    const engine = createSyncEngine({ db, transport, campaignIds: () => [campaignId] });
    await createSiteLocally(db, campaignId, {
      name: "Waiting",
      kind: "other",
      latitudeDeg: 1,
      longitudeDeg: 1,
      approxHeightM: 1,
      notes: "",
    });
    await expect(engine.sync()).rejects.toThrow(/No connection/);
    expect(engine.getStatus()).toMatchObject({ pending: 1, error: { kind: "offline" } });
  });
});
