// Crate journeys through push and pull on the real server and PostgreSQL: a leg is planned, departs
// and arrives (moving the crate's state), steps out of order are refused and repeats are harmless;
// handovers build each crate's custody chain in time order, from the last holder only, even when
// two tablets hand over the same crate at once.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { createTestContext, signInAs, type TestContext } from "../helpers/app";
import {
  foreignCampaignWithSite,
  insertCrate,
  pullAll,
  pushAs,
  syncClient,
  type TestSyncClient,
} from "../helpers/sync";
import { auditEvents, handovers, legs } from "../../server/db/schema";
import type { CrateView } from "../../shared/schemas/crates";
import { legState, type HandoverView, type LegView } from "../../shared/schemas/logistics";
import { changeRecord } from "../../shared/sync/protocol";

let ctx: TestContext;
let campaignId: string;
let logisticsToken: string;
let fieldToken: string;
let geodesistToken: string;
let reviewerToken: string;
let lab: string;
let hut: string;
let tide: string;
let seededLegs: LegView[];
let seededCrates: CrateView[];

beforeAll(async () => {
  ctx = await createTestContext();
  const logistics = await signInAs(ctx.app, "logistics");
  logisticsToken = logistics.token;
  campaignId = logistics.memberships[0]?.campaignId ?? "";
  fieldToken = (await signInAs(ctx.app, "field")).token;
  geodesistToken = (await signInAs(ctx.app, "geodesist")).token;
  reviewerToken = (await signInAs(ctx.app, "reviewer")).token;
  const { changes } = await pullAll(ctx.app, fieldToken, campaignId);
  const site = (name: string) => {
    const found = changes.find((c) => c.entity === "site" && c.data.name === name);
    if (!found) throw new Error(`demo site ${name} was not pulled`);
    return found.id;
  };
  lab = site("Brennmoor reference laboratory");
  hut = site("Kestrel Ridge hut");
  tide = site("Saltmere tide station");
  const parsed = changes.map((c) => changeRecord.parse(c));
  seededLegs = parsed.flatMap((c) => (c.entity === "leg" ? [c.data] : []));
  seededCrates = parsed.flatMap((c) => (c.entity === "crate" ? [c.data] : []));
});
afterAll(async () => {
  await ctx.close();
});

type Mutation = ReturnType<TestSyncClient["mutation"]>;
const push = (client: TestSyncClient, mutations: Mutation[], as = fieldToken) =>
  pushAs(ctx.app, as, { clientId: client.clientId, campaignId, mutations });
const outcomes = (res: Awaited<ReturnType<typeof push>>) =>
  res.body.results.map((r) => [r.status, r.message]);

const plan = (client: TestSyncClient, id: string, crateId: string, overrides = {}) =>
  client.mutation("leg.plan", {
    id,
    crateId,
    fromSiteId: lab,
    toSiteId: hut,
    vehicle: "Air-sprung van",
    plannedDepartAt: "2027-06-02T06:00:00.000Z",
    plannedArriveAt: "2027-06-03T14:30:00.000Z",
    ...overrides,
  });
const step = (
  client: TestSyncClient,
  name: "leg.depart" | "leg.arrive" | "leg.cancel",
  id: string,
  at: string,
  note?: string,
) => client.mutation(name, { id, at, ...(note ? { note } : {}) });

const handover = (
  client: TestSyncClient,
  crateId: string,
  fromName: string,
  toName: string,
  at: string,
  overrides: Record<string, unknown> = {},
) =>
  client.mutation("handover.record", {
    id: crypto.randomUUID(),
    crateId,
    fromName,
    toName,
    at,
    condition: "intact",
    ...overrides,
  });

async function pulled() {
  const { changes } = await pullAll(ctx.app, fieldToken, campaignId);
  return changes.map((c) => changeRecord.parse(c));
}
const latestCrate = async (id: string): Promise<CrateView | undefined> =>
  (await pulled()).flatMap((c) => (c.entity === "crate" && c.id === id ? [c.data] : [])).at(-1);
const latestLeg = async (id: string): Promise<LegView | undefined> =>
  (await pulled()).flatMap((c) => (c.entity === "leg" && c.id === id ? [c.data] : [])).at(-1);
const handoversOf = async (crateId: string): Promise<HandoverView[]> =>
  (await pulled()).flatMap((c) =>
    c.entity === "handover" && c.data.crateId === crateId ? [c.data] : [],
  );
const storedHandovers = (crateId: string) =>
  ctx.database.db.select().from(handovers).where(eq(handovers.crateId, crateId));

describe("legs through sync", () => {
  it("plans, departs and arrives, moving the crate from ready to moving to arrived", async () => {
    const crateId = await insertCrate(ctx.database.db, campaignId, { label: "KR-31" });
    const planner = syncClient();
    const id = crypto.randomUUID();
    expect(outcomes(await push(planner, [plan(planner, id, crateId)], logisticsToken))).toEqual([
      ["applied", undefined],
    ]);
    const planned = await latestLeg(id);
    expect(planned).toMatchObject({ crateId, fromSiteId: lab, toSiteId: hut, departedAt: null });
    expect(planned && legState(planned)).toBe("planned");
    expect((await latestCrate(crateId))?.state).toBe("ready");

    const crew = syncClient();
    const tooEarly = step(crew, "leg.arrive", id, "2027-06-03T14:00:00.000Z");
    const depart = step(crew, "leg.depart", id, "2027-06-02T06:10:00.000Z", "Left 10 min late");
    const res = await push(crew, [
      tooEarly,
      depart,
      step(crew, "leg.depart", id, "2027-06-02T06:20:00.000Z"),
    ]);
    expect(outcomes(res)).toEqual([
      ["rejected", "This leg has not departed yet: record the departure first"],
      ["applied", undefined],
      ["applied", "Already departed"],
    ]);
    const underWay = await latestLeg(id);
    expect(underWay).toMatchObject({ departedAt: "2027-06-02T06:10:00.000Z", arrivedAt: null });
    expect(underWay?.note).toBe("Departure: Left 10 min late");
    expect((await latestCrate(crateId))?.state).toBe("moving");
    // The same mutations sent again (an answer lost on the way) change nothing.
    const again = await pushAs(ctx.app, fieldToken, {
      clientId: crew.clientId,
      campaignId,
      mutations: [depart],
    });
    expect(again.body.results.map((r) => r.status)).toEqual(["duplicate"]);

    const [beforeArrival] = await ctx.database.db.select().from(legs).where(eq(legs.id, id));
    const arrived = await push(crew, [
      step(crew, "leg.arrive", id, "2027-06-02T05:00:00.000Z"),
      step(crew, "leg.arrive", id, "2027-06-03T14:20:00.000Z"),
      step(crew, "leg.arrive", id, "2027-06-03T15:00:00.000Z"),
    ]);
    expect(outcomes(arrived)).toEqual([
      [
        "rejected",
        "The arrival at 2027-06-02 05:00:00 UTC is before the departure at 2027-06-02 06:10:00 UTC",
      ],
      ["applied", undefined],
      ["applied", "Already arrived"],
    ]);
    const [afterArrival] = await ctx.database.db.select().from(legs).where(eq(legs.id, id));
    expect(afterArrival?.changeSeq).toBeGreaterThan(beforeArrival?.changeSeq ?? Infinity);
    const done = await latestLeg(id);
    expect(done && legState(done)).toBe("arrived");
    expect(done?.arrivedAt).toBe("2027-06-03T14:20:00.000Z");
    const crate = await latestCrate(crateId);
    expect(crate).toMatchObject({ state: "arrived", version: 3 });

    const crateAudit = await ctx.database.db
      .select()
      .from(auditEvents)
      .where(eq(auditEvents.entityId, crateId));
    expect(crateAudit.map((a) => (a.after as CrateView).state)).toEqual(
      expect.arrayContaining(["moving", "arrived"]),
    );
    const legAudit = await ctx.database.db
      .select()
      .from(auditEvents)
      .where(eq(auditEvents.entityId, id));
    expect(legAudit.map((a) => a.action).sort()).toEqual(["arrive", "create", "depart"]);
  });

  it("cancels only a planned leg; a cancelled leg neither departs nor cancels twice", async () => {
    const crateId = await insertCrate(ctx.database.db, campaignId, { label: "KR-32" });
    const planner = syncClient();
    const gone = crypto.randomUUID();
    const dropped = crypto.randomUUID();
    const at = "2027-06-10T08:00:00.000Z";
    const res = await push(
      planner,
      [
        plan(planner, gone, crateId),
        plan(planner, dropped, crateId, { toSiteId: tide }),
        step(planner, "leg.depart", gone, at),
        step(planner, "leg.cancel", gone, at),
        step(planner, "leg.cancel", dropped, at, "Weather window closed"),
        step(planner, "leg.cancel", dropped, at),
        step(planner, "leg.depart", dropped, at),
      ],
      logisticsToken,
    );
    expect(outcomes(res)).toEqual([
      ["applied", undefined],
      ["applied", undefined],
      ["applied", undefined],
      ["rejected", "This leg has already departed; only a planned leg can be cancelled"],
      ["applied", undefined],
      ["applied", "Already cancelled"],
      ["rejected", "This leg was cancelled; plan a new leg for the journey"],
    ]);
    const cancelled = await latestLeg(dropped);
    expect(cancelled && legState(cancelled)).toBe("cancelled");
    expect(cancelled?.note).toBe("Cancelled: Weather window closed");
    expect((await latestLeg(gone))?.cancelledAt).toBeNull();
  });

  it("lets the field crew record steps but not plan or cancel", async () => {
    const crateId = await insertCrate(ctx.database.db, campaignId, { label: "KR-33" });
    const crew = syncClient();
    const id = crypto.randomUUID();
    const res = await push(crew, [plan(crew, id, crateId)]);
    expect(outcomes(res)).toEqual([
      [
        "rejected",
        "Your role in this campaign does not allow this change; it is kept for recovery",
      ],
    ]);
  });

  it("refuses a taken id, a foreign or deleted crate and a foreign site; pulls nothing foreign", async () => {
    const db = ctx.database.db;
    const foreign = await foreignCampaignWithSite(db, "Q");
    const foreignCrate = await insertCrate(db, foreign.campaignId, { label: "Q-secret-crate" });
    const deleted = await insertCrate(db, campaignId, { label: "KR-34", deletedAt: new Date() });
    const crateId = await insertCrate(db, campaignId, { label: "KR-35" });
    const foreignLeg = crypto.randomUUID();
    await db.insert(legs).values({
      id: foreignLeg,
      campaignId: foreign.campaignId,
      crateId: foreignCrate,
      fromSiteId: foreign.siteId,
      toSiteId: foreign.siteId,
      plannedDepartAt: new Date("2027-06-01T00:00:00Z"),
      plannedArriveAt: new Date("2027-06-01T00:00:00Z"),
      note: "Q-secret-leg",
      changeSeq: 2,
    });
    const planner = syncClient();
    const id = crypto.randomUUID();
    const res = await push(
      planner,
      [
        plan(planner, id, crateId),
        plan(planner, id, crateId),
        plan(planner, foreignLeg, crateId),
        plan(planner, crypto.randomUUID(), foreignCrate),
        plan(planner, crypto.randomUUID(), deleted),
        plan(planner, crypto.randomUUID(), crateId, { fromSiteId: foreign.siteId }),
        plan(planner, crypto.randomUUID(), crateId, { toSiteId: foreign.siteId }),
        plan(planner, crypto.randomUUID(), crateId, { toSiteId: lab }),
        step(planner, "leg.depart", foreignLeg, "2027-06-01T00:00:00Z"),
        handover(planner, foreignCrate, "A", "B", "2027-06-01T00:00:00Z"),
        handover(planner, crateId, "A", "B", "2027-06-01T00:00:00Z", { siteId: foreign.siteId }),
        handover(planner, crateId, "A", "B", "2027-06-01T00:00:00Z", { legId: foreignLeg }),
      ],
      logisticsToken,
    );
    expect(outcomes(res)).toEqual([
      ["applied", undefined],
      ["rejected", "A leg with this id already exists"],
      ["rejected", "A leg with this id already exists"],
      ["rejected", "The crate of this leg is not in this campaign"],
      ["rejected", "The crate of this leg is not in this campaign"],
      ["rejected", "The place this leg starts from is not a site of this campaign"],
      ["rejected", "The place this leg ends at is not a site of this campaign"],
      ["rejected", "Invalid leg.plan: toSiteId: A leg ends somewhere else than it starts"],
      ["rejected", "This leg is not in this campaign"],
      ["rejected", "The crate of this handover is not in this campaign"],
      ["rejected", "The site of this handover is not in this campaign"],
      ["rejected", "The leg of this handover is not a leg of KR-35"],
    ]);
    const everything = JSON.stringify(await pulled());
    expect(everything).not.toContain("Q-secret");
    expect(everything).not.toContain(foreign.siteId);
    // The deleted crate is pulled as a tombstone.
    expect((await latestCrate(deleted))?.deletedAt).not.toBeNull();
    const [foreignRow] = await db.select().from(legs).where(eq(legs.id, foreignLeg));
    expect(foreignRow?.departedAt).toBeNull();
  });
});

describe("handovers through sync", () => {
  it("builds the custody chain in time order, pulled in order with who recorded each", async () => {
    const crateId = await insertCrate(ctx.database.db, campaignId, { label: "KR-41" });
    const planner = syncClient();
    const legId = crypto.randomUUID();
    await push(planner, [plan(planner, legId, crateId)], logisticsToken);
    const crew = syncClient();
    const res = await push(crew, [
      handover(crew, crateId, "Jonas Weilgart", "Courier Team North", "2027-06-02T06:00:00Z", {
        legId,
        siteId: lab,
        place: "Loading bay",
      }),
      // The giver's name matches the last receiver's, trimmed and in any case.
      handover(crew, crateId, "  courier team NORTH ", "Mira Castell", "2027-06-03T14:25:00Z", {
        legId,
        siteId: hut,
        condition: "marked",
        note: "Scuff on the lid, indicator not tripped",
      }),
    ]);
    expect(outcomes(res)).toEqual([
      ["applied", undefined],
      ["applied", undefined],
    ]);
    const chain = await handoversOf(crateId);
    expect(chain.map((h) => [h.fromName, h.toName, h.at])).toEqual([
      ["Jonas Weilgart", "Courier Team North", "2027-06-02T06:00:00.000Z"],
      ["courier team NORTH", "Mira Castell", "2027-06-03T14:25:00.000Z"],
    ]);
    expect(chain.every((h) => h.recordedByName === "Mira Castell" && h.legId === legId)).toBe(true);
    expect(chain[1]).toMatchObject({ siteId: hut, condition: "marked" });
  });

  it("refuses a handover out of time order or from someone who does not hold the crate", async () => {
    const crateId = await insertCrate(ctx.database.db, campaignId, { label: "KR-42" });
    const crew = syncClient();
    const late = handover(crew, crateId, "Ana Roesch", "Beat Olander", "2027-06-05T10:00:00Z");
    const early = handover(crew, crateId, "Beat Olander", "Cleo Marr", "2027-06-05T09:30:00Z");
    const same = handover(crew, crateId, "Beat Olander", "Cleo Marr", "2027-06-05T10:00:00Z");
    const wrongGiver = handover(crew, crateId, "Dario Fenn", "Cleo Marr", "2027-06-05T11:00:00Z");
    const next = handover(crew, crateId, "Beat Olander", "Cleo Marr", "2027-06-05T11:00:00Z");
    const res = await push(crew, [late, early, same, wrongGiver, next]);
    expect(outcomes(res)).toEqual([
      ["applied", undefined],
      [
        "rejected",
        "The handover at 2027-06-05 09:30:00 UTC is earlier than the last handover of KR-42 at 2027-06-05 10:00:00 UTC; custody is recorded in time order",
      ],
      [
        "rejected",
        "The handover at 2027-06-05 10:00:00 UTC is at the same time as the last handover of KR-42 at 2027-06-05 10:00:00 UTC; custody is recorded in time order",
      ],
      ["rejected", "KR-42 is held by Beat Olander, not Dario Fenn"],
      ["applied", undefined],
    ]);
    // The queue moved past the refusals, and nothing of them was stored.
    expect(res.body.lastMutationId).toBe(5);
    const stored = (await storedHandovers(crateId)).map((h) => h.id).sort();
    expect(stored).toEqual(
      [(late.args as { id: string }).id, (next.args as { id: string }).id].sort(),
    );
    const more = await push(crew, [
      handover(crew, crateId, "Cleo Marr", "Dario Fenn", "2027-06-05T12:00:00Z"),
    ]);
    expect(more.body.results).toEqual([{ mutationId: 6, status: "applied" }]);
  });

  it("refuses handovers from a reviewer or a geodesist (their role records none)", async () => {
    const crateId = await insertCrate(ctx.database.db, campaignId, { label: "KR-43" });
    for (const as of [reviewerToken, geodesistToken]) {
      const client = syncClient();
      const res = await push(
        client,
        [handover(client, crateId, "Ana Roesch", "Beat Olander", "2027-06-05T10:00:00Z")],
        as,
      );
      expect(outcomes(res)).toEqual([
        [
          "rejected",
          "Your role in this campaign does not allow this change; it is kept for recovery",
        ],
      ]);
    }
    expect(await storedHandovers(crateId)).toHaveLength(0);
  });

  it("keeps two tablets handing over the same crate at once in one chain", async () => {
    for (let round = 0; round < 6; round++) {
      const crateId = await insertCrate(ctx.database.db, campaignId, { label: `KR-5${round}` });
      const first = syncClient();
      const held = await push(first, [
        handover(first, crateId, "Depot desk", "Ana Roesch", "2027-06-06T08:00:00Z"),
      ]);
      expect(held.body.results[0]?.status).toBe("applied");
      // Both tablets think Ana still holds the crate; only one handover can follow hers.
      const a = syncClient();
      const b = syncClient();
      const [toBeat, toCleo] = await Promise.all([
        push(a, [handover(a, crateId, "Ana Roesch", "Beat Olander", "2027-06-06T09:00:00Z")]),
        push(
          b,
          [handover(b, crateId, "Ana Roesch", "Cleo Marr", "2027-06-06T09:30:00Z")],
          logisticsToken,
        ),
      ]);
      const statuses = [toBeat.body.results[0]?.status, toCleo.body.results[0]?.status];
      expect(statuses.filter((s) => s === "applied")).toHaveLength(1);
      const chain = (await storedHandovers(crateId)).sort((x, y) => x.changeSeq - y.changeSeq);
      expect(chain).toHaveLength(2);
      // Whichever came second was refused against the one that really came first.
      if (statuses[0] === "applied") {
        expect(toCleo.body.results[0]?.message).toBe(
          `KR-5${round} is held by Beat Olander, not Ana Roesch`,
        );
      } else {
        expect(toBeat.body.results[0]?.message).toMatch(/is earlier than the last handover/);
      }
      for (let i = 1; i < chain.length; i++) {
        const [prev, cur] = [chain[i - 1], chain[i]];
        expect(cur?.at.getTime()).toBeGreaterThan(prev?.at.getTime() ?? Infinity);
        expect(cur?.fromName).toBe(prev?.toName);
      }
    }
  });

  it("attaches a photo to a handover, and refuses an unknown handover", async () => {
    const crateId = await insertCrate(ctx.database.db, campaignId, { label: "KR-44" });
    const crew = syncClient();
    const given = handover(crew, crateId, "Ana Roesch", "Beat Olander", "2027-06-05T10:00:00Z", {
      condition: "damaged",
    });
    const link = (subjectId: string) => ({
      id: crypto.randomUUID(),
      sha256: "ab".repeat(32),
      contentType: "image/jpeg",
      sizeBytes: 2048,
      subject: { kind: "handover", id: subjectId },
    });
    const res = await push(crew, [
      given,
      crew.mutation("attachment.add", link((given.args as { id: string }).id)),
      crew.mutation("attachment.add", link(crypto.randomUUID())),
    ]);
    expect(outcomes(res)).toEqual([
      ["applied", undefined],
      ["applied", undefined],
      ["rejected", "The handover this file belongs to is not in this campaign"],
    ]);
    const attachment = (await pulled()).find(
      (c) => c.entity === "attachment" && c.data.subject.id === (given.args as { id: string }).id,
    );
    expect(attachment).toBeDefined();
  });
});

describe("the demo scenario", () => {
  it("plans two legs out of the laboratory, and every crate is ready with its instrument", () => {
    expect(seededLegs.map((l) => [l.fromSiteId, l.toSiteId]).sort()).toEqual(
      [
        [lab, hut],
        [lab, tide],
      ].sort(),
    );
    expect(new Set(seededLegs.map((l) => l.crateId)).size).toBe(2);
    expect(seededLegs.every((l) => legState(l) === "planned")).toBe(true);
    expect(seededLegs.every((l) => l.plannedDepartAt.startsWith("2027-06-"))).toBe(true);
    expect(seededCrates).toHaveLength(5);
    expect(seededCrates.every((c) => c.state === "ready" && c.instrument !== "")).toBe(true);
  });
});
