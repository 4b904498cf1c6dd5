// Tablet clocks a day off: one runs a day fast, the other a day slow. The server orders changes
// by the position it hands out on arrival, never by the tablet's time, so the later edit wins and
// is pulled last; and access tokens expire by the server's clock only (the client never reads
// a token's expiry: it renews on a 401), so neither tablet is signed out early or kept late.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestContext, signInAs, type TestContext } from "../helpers/app";
import { newSite, pullAll, pushAs, syncClient, type TestSyncClient } from "../helpers/sync";

let ctx: TestContext;
let campaignId: string;
let token: string;
const day = 86_400_000;

/** A tablet whose clock is `offsetMs` off: its mutations carry that time. */
function skewed(offsetMs: number) {
  const client = syncClient();
  const mutation: TestSyncClient["mutation"] = (name, args) => ({
    ...client.mutation(name, args),
    createdAt: new Date(Date.now() + offsetMs).toISOString(),
  });
  return { ...client, mutation };
}

beforeAll(async () => {
  ctx = await createTestContext();
  const field = await signInAs(ctx.app, "field");
  token = field.token;
  campaignId = field.memberships[0]?.campaignId ?? "";
});
afterAll(() => ctx.close());

describe("tablet clocks a day off", () => {
  it("orders by arrival: the later edit from the slow tablet wins and is pulled last", async () => {
    const fast = skewed(+day);
    const slow = skewed(-day);
    const site = newSite({ name: "Skew hut", notes: "" });
    const push = (t: ReturnType<typeof skewed>, mutation: unknown) =>
      pushAs(ctx.app, token, { clientId: t.clientId, campaignId, mutations: [mutation] });
    expect((await push(fast, fast.mutation("site.create", site))).body.results[0]?.status).toBe(
      "applied",
    );
    const fromFast = fast.mutation("site.update", {
      id: site.id,
      changes: { notes: "Stove lit (fast clock)" },
      base: { notes: "" },
    });
    expect((await push(fast, fromFast)).body.results[0]?.status).toBe("applied");
    // Two days "older" by its clock, but it arrives later and saw the fast tablet's edit.
    const fromSlow = slow.mutation("site.update", {
      id: site.id,
      changes: { notes: "Stove out (slow clock)" },
      base: { notes: "Stove lit (fast clock)" },
    });
    expect(Date.parse(fromSlow.createdAt)).toBeLessThan(Date.parse(fromFast.createdAt) - day);
    expect((await push(slow, fromSlow)).body.results[0]?.status).toBe("applied");

    const { changes } = await pullAll(ctx.app, token, campaignId);
    const mine = changes.filter((c) => c.entity === "site" && c.id === site.id);
    // The pull sends a record once, as it is now: the slow tablet's later edit.
    expect(mine).toHaveLength(1);
    const last = mine[0];
    if (last?.entity !== "site") throw new Error("the site was not pulled");
    expect(last.data.notes).toBe("Stove out (slow clock)");
    expect(last.data.version).toBe(3);
    // Its position is after every change pulled before it.
    expect(last.seq).toBe(Math.max(...changes.map((c) => c.seq)));
    // No conflict was opened: the slow tablet's base matched what the server had.
    expect(changes.some((c) => c.entity === "conflict" && c.data.entityId === site.id)).toBe(false);
  });
});
