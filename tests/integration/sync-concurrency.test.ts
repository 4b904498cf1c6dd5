// The sequence-gap bug: a reader must never move its cursor past a change whose transaction commits
// later. Writers here hold their transactions open for random times after taking a position.
// EQUIPOT_PROVE_GAP=1 takes the position outside the transaction (as a plain sequence would) and
// makes this test fail, which shows that it can.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestContext, signInAs, type TestContext } from "../helpers/app";
import request from "supertest";
import { newSite } from "../helpers/sync";
import { nextChangeSeq } from "../../server/db/change-seq";
import { sites } from "../../server/db/schema";
import { protocolVersion } from "../../shared/sync/protocol";

let ctx: TestContext;
let campaignId: string;

beforeAll(async () => {
  ctx = await createTestContext();
  campaignId = (await signInAs(ctx.app, "field")).memberships[0]?.campaignId ?? "";
});
afterAll(async () => {
  await ctx.close();
});

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe("pull while others write", () => {
  it("never skips a change that committed after a later position was read", async () => {
    const { token } = await signInAs(ctx.app, "field");
    const writers = 6;
    const perWriter = 25;
    const written = new Set<string>();
    const writer = async (w: number) => {
      for (let i = 0; i < perWriter; i += 1) {
        const site = newSite({ name: `w${w}-${i}` });
        await ctx.database.db.transaction(async (tx) => {
          const changeSeq = await (process.env.EQUIPOT_PROVE_GAP
            ? nextChangeSeq(ctx.database.db, campaignId)
            : nextChangeSeq(tx, campaignId));
          await tx.insert(sites).values({ ...site, kind: "other", campaignId, changeSeq });
          await sleep(Math.random() * 20);
        });
        written.add(site.id);
      }
    };
    const seen = new Set<string>();
    let cursor = 0;
    let done = false;
    const reader = async () => {
      while (!done) {
        const res = await pullFrom(cursor);
        for (const c of res.changes) seen.add(c.id);
        cursor = res.cursor;
        await sleep(1);
      }
    };
    const pullFrom = async (from: number) => {
      const r = await request(ctx.app)
        .get("/api/sync/pull")
        .query({ protocolVersion, campaign: campaignId, cursor: from, limit: 5 })
        .set("Authorization", `Bearer ${token}`);
      return r.body as { changes: { id: string }[]; cursor: number };
    };
    const readerRun = reader();
    await Promise.all(Array.from({ length: writers }, (_, w) => writer(w)));
    done = true;
    await readerRun;
    // Catch up once more after the writers are done, from the cursor the reader reached.
    for (;;) {
      const res = await pullFrom(cursor);
      for (const c of res.changes) seen.add(c.id);
      if (res.changes.length === 0) break;
      cursor = res.cursor;
    }
    const missing = [...written].filter((id) => !seen.has(id));
    expect(written.size).toBe(writers * perWriter);
    expect(missing).toEqual([]);
  });
});
