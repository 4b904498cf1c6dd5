// The client's engine (on fake-indexeddb) against the real server and PostgreSQL over HTTP.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { IDBFactory, IDBKeyRange } from "fake-indexeddb";
import type { z } from "zod";
import { openDatabase } from "../../src/db/database";
import { createSiteLocally, updateSiteLocally } from "../../src/db/site-store";
import { createSyncEngine } from "../../src/sync/engine";
import { createHttpTransport } from "../../src/sync/http-transport";
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
