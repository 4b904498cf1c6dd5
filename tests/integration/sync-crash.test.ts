// The server process is killed (SIGKILL) in the middle of a push; after a restart the client's
// retry completes, with nothing lost and nothing applied twice.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { ChildProcess } from "node:child_process";
import { eq, sql } from "drizzle-orm";
import { createTestDatabase, type TestDatabase } from "../helpers/db";
import { freePort, startServerProcess } from "../helpers/server-process";
import { newSite, syncClient } from "../helpers/sync";
import { seedDemo, demoPassword } from "../../server/seed/demo";
import { campaigns } from "../../server/db/schema";
import { protocolVersion } from "../../shared/sync/protocol";

let database: TestDatabase;
let server: ChildProcess | undefined;

beforeAll(async () => {
  database = await createTestDatabase();
  await seedDemo(database.db, "test");
});
afterAll(async () => {
  server?.kill("SIGKILL");
  await database.drop();
});

describe("server killed mid-push", () => {
  it("loses nothing and applies nothing twice when the client retries", async () => {
    const port = await freePort();
    const base = `http://127.0.0.1:${port}`;
    server = await startServerProcess(database.url, port);
    const signIn = await fetch(`${base}/api/auth/sign-in`, {
      method: "POST",
      headers: { "content-type": "application/json", "x-equipot-request": "1" },
      body: JSON.stringify({ email: "field@demo.equipot.test", password: demoPassword }),
    });
    const { accessToken, memberships } = (await signIn.json()) as {
      accessToken: string;
      memberships: { campaignId: string }[];
    };
    const campaignId = memberships[0]?.campaignId ?? "";
    const client = syncClient();
    const mutations = Array.from({ length: 400 }, (_, i) =>
      client.mutation("site.create", newSite({ name: `crash-${i}` })),
    );
    const body = JSON.stringify({
      protocolVersion,
      clientId: client.clientId,
      campaignId,
      mutations,
    });
    const headers = { "content-type": "application/json", authorization: `Bearer ${accessToken}` };

    const inFlight = fetch(`${base}/api/sync/push`, { method: "POST", headers, body }).then(
      (r) => r.status,
      () => "connection lost" as const,
    );
    await new Promise((r) => setTimeout(r, 60));
    server.kill("SIGKILL");
    const firstOutcome = await inFlight;
    server = await startServerProcess(database.url, port);

    const retry = await fetch(`${base}/api/sync/push`, { method: "POST", headers, body });
    expect(retry.status).toBe(200);
    const result = (await retry.json()) as {
      results: { status: string }[];
      lastMutationId: number;
    };
    expect(result.lastMutationId).toBe(400);
    const applied = result.results.filter((r) => r.status === "applied").length;
    const duplicate = result.results.filter((r) => r.status === "duplicate").length;
    expect(applied + duplicate).toBe(400);
    // Either the first push died whole (all applied now) or it had committed (all duplicates).
    expect([0, 400]).toContain(applied);
    const count = await database.db.execute<{ n: number }>(
      sql`select count(*)::int as n from sites where name like 'crash-%'`,
    );
    expect(count.rows[0]?.n).toBe(400);
    const [campaign] = await database.db
      .select()
      .from(campaigns)
      .where(eq(campaigns.id, campaignId));
    expect(campaign?.changeSeq).toBeGreaterThanOrEqual(400);
    expect(["connection lost", 200]).toContain(firstOutcome);
  });
});
