// The levelling field book through push and pull on the real server and PostgreSQL: a section is
// opened, levelled forward and back (a newer setup with the same number corrects an older one),
// closed with its misclosure judged against the class tolerance, and takes no setups after that,
// even when the close and a setup race from two tablets.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { createTestContext, signInAs, type TestContext } from "../helpers/app";
import {
  foreignCampaignWithSite,
  pullAll,
  pushAs,
  syncClient,
  type TestSyncClient,
} from "../helpers/sync";
import { levellingSections, levellingSetups } from "../../server/db/schema";
import type { LevellingSectionView } from "../../shared/schemas/levelling";
import { changeRecord } from "../../shared/sync/protocol";

let ctx: TestContext;
let campaignId: string;
let token: string;
let geodesistToken: string;
let siteId: string;

// FGCC 1984 Second-order Class I: 6 mm·√K for a section (REFERENCES.md §4, reproduced).
const classId = "fgcc-1984-second-order-class-i";
const sectionKMm = 6;
const at = "2027-06-05T06:00:00.000Z";
const later = "2027-06-05T07:00:00.000Z";

beforeAll(async () => {
  ctx = await createTestContext();
  const field = await signInAs(ctx.app, "field");
  token = field.token;
  campaignId = field.memberships[0]?.campaignId ?? "";
  geodesistToken = (await signInAs(ctx.app, "geodesist")).token;
  const { changes } = await pullAll(ctx.app, token, campaignId);
  siteId = changes.find((c) => c.entity === "site")?.id ?? "";
});
afterAll(async () => {
  await ctx.close();
});

type Mutation = ReturnType<TestSyncClient["mutation"]>;
const push = (client: TestSyncClient, mutations: Mutation[], as = token) =>
  pushAs(ctx.app, as, { clientId: client.clientId, campaignId, mutations });

const open = (client: TestSyncClient, id: string, overrides: Record<string, unknown> = {}) =>
  client.mutation("levelling.open", {
    id,
    siteId,
    fromMark: "KR-BM-117",
    toMark: "Hut pillar",
    classId,
    instrument: "Digital level 0.3 mm/km",
    openedAt: at,
    ...overrides,
  });

/** Every sight 40 m: a setup adds 80 m to its run's length. */
const setup = (
  client: TestSyncClient,
  sectionId: string,
  run: "forward" | "backward",
  number: number,
  backsightM: number,
  foresightM: number,
  recordedAt = at,
) =>
  client.mutation("levelling.setup", {
    id: crypto.randomUUID(),
    sectionId,
    run,
    number,
    backsightM,
    foresightM,
    backsightDistanceM: 40,
    foresightDistanceM: 40,
    recordedAt,
  });

const close = (client: TestSyncClient, id: string, note?: string) =>
  client.mutation("levelling.close", { id, closedAt: later, ...(note ? { note } : {}) });

/** Forward +0.3000 +0.2500 = +0.5500 m; backward −0.2500 and a second setup given by the caller. */
const bothRuns = (client: TestSyncClient, sectionId: string, backward2: [number, number]) => [
  setup(client, sectionId, "forward", 1, 1.5, 1.2),
  setup(client, sectionId, "forward", 2, 1.4, 1.15),
  setup(client, sectionId, "backward", 1, 1.1, 1.35),
  setup(client, sectionId, "backward", 2, ...backward2),
];

// By hand: each run 2 setups × 80 m = 0.16 km, K = 0.16 km, tolerance 6 mm × √0.16 = 2.4 mm.
const toleranceM = (sectionKMm * Math.sqrt(0.16)) / 1000;

async function sectionOf(id: string): Promise<LevellingSectionView> {
  const { changes } = await pullAll(ctx.app, token, campaignId);
  const found = changes.filter((c) => c.id === id).at(-1);
  const parsed = changeRecord.parse(found);
  if (parsed.entity !== "levellingSection") throw new Error(`pulled ${parsed.entity}`);
  return parsed.data;
}

describe("levelling through sync", () => {
  it("opens a section, levels it forward and back, counts a correction, and closes it", async () => {
    const client = syncClient();
    const id = crypto.randomUUID();
    const opened = open(client, id);
    const early = close(client, id);
    const forward1 = setup(client, id, "forward", 1, 1.5, 1.2);
    const forward2 = setup(client, id, "forward", 2, 1.4, 1.15);
    const beforeBackward = close(client, id);
    const backward1 = setup(client, id, "backward", 1, 1.1, 1.35);
    // A misread backward foresight (1.5300 instead of 1.5010), corrected later under the same number.
    const misread = setup(client, id, "backward", 2, 1.2, 1.53);
    const first = await push(client, [
      opened,
      early,
      forward1,
      forward2,
      beforeBackward,
      backward1,
      misread,
      setup(client, id, "backward", 2, 1.2, 1.501, later),
    ]);
    expect(first.body.results.map((r) => [r.status, r.message])).toEqual([
      ["applied", undefined],
      ["rejected", "Not closed: the forward and the backward run both need complete setups"],
      ["applied", undefined],
      ["applied", undefined],
      ["rejected", "Not closed: the forward and the backward run both need complete setups"],
      ["applied", undefined],
      ["applied", undefined],
      ["applied", undefined],
    ]);
    const closed = await push(client, [close(client, id)]);
    expect(closed.body.results.map((r) => [r.status, r.message])).toEqual([["applied", undefined]]);

    // By hand: forward +0.5500 m, backward −0.2500 − 0.3010 = −0.5510 m, misclosure −1.0 mm.
    const view = await sectionOf(id);
    expect(view).toMatchObject({
      campaignId,
      siteId,
      fromMark: "KR-BM-117",
      toMark: "Hut pillar",
      classId,
      closedAt: later,
      closeNote: "",
    });
    expect(view.closure?.forwardDeltaM).toBeCloseTo(0.55, 9);
    expect(view.closure?.backwardDeltaM).toBeCloseTo(-0.551, 9);
    expect(view.closure?.misclosureM).toBeCloseTo(-0.001, 9);
    expect(view.closure?.lengthKm).toBeCloseTo(0.16, 9);
    expect(view.closure?.toleranceM).toBeCloseTo(toleranceM, 9);
    expect(view.closure?.withinTolerance).toBe(true);

    const { changes } = await pullAll(ctx.app, token, campaignId);
    const setups = changes.flatMap((c) =>
      c.entity === "levellingSetup" && c.data.sectionId === id ? [changeRecord.parse(c)] : [],
    );
    expect(setups).toHaveLength(5);
    expect(
      setups.every(
        (s) => s.entity === "levellingSetup" && s.data.recordedByName === "Mira Castell",
      ),
    ).toBe(true);
    expect(setups.find((s) => s.id === (misread.args as { id: string }).id)?.data).toMatchObject({
      run: "backward",
      number: 2,
      foresightM: 1.53,
    });
  });

  it("refuses a setup after the close and answers a second close as already closed", async () => {
    const client = syncClient();
    const id = crypto.randomUUID();
    const before = [open(client, id), ...bothRuns(client, id, [1.2, 1.501]), close(client, id)];
    const late = setup(client, id, "forward", 3, 1.0, 1.0);
    const res = await push(client, [...before, late, close(client, id)]);
    expect(res.body.results.slice(-3).map((r) => [r.status, r.message])).toEqual([
      ["applied", undefined],
      ["rejected", "This section was already closed; the setup is kept for recovery"],
      ["applied", "Already closed"],
    ]);
    const stored = await ctx.database.db
      .select()
      .from(levellingSetups)
      .where(eq(levellingSetups.id, (late.args as { id: string }).id));
    expect(stored).toHaveLength(0);
  });

  it("refuses an out-of-tolerance close without a reason and closes it with one", async () => {
    const client = syncClient();
    const id = crypto.randomUUID();
    // Backward −0.2500 − 0.3300 = −0.5800 m against +0.5500 m: −30.0 mm, beyond ±2.4 mm (by hand).
    const res = await push(client, [
      open(client, id),
      ...bothRuns(client, id, [1.2, 1.53]),
      close(client, id),
      close(client, id, "Staff settled in soft ground; relevelled next day as section 2"),
    ]);
    expect(res.body.results.slice(-2).map((r) => [r.status, r.message])).toEqual([
      [
        "rejected",
        expect.stringMatching(/misclosure of −30\.0 mm is beyond the tolerance of ±2\.4 mm/),
      ],
      ["applied", undefined],
    ]);
    expect(res.body.results.at(-2)?.message).toMatch(/reason/);
    const view = await sectionOf(id);
    expect(view.closeNote).toBe("Staff settled in soft ground; relevelled next day as section 2");
    expect(view.closure?.misclosureM).toBeCloseTo(-0.03, 9);
    expect(view.closure?.withinTolerance).toBe(false);
  });

  it("refuses a taken id, a site of another campaign and a section of another campaign", async () => {
    const db = ctx.database.db;
    const foreign = await foreignCampaignWithSite(db, "L");
    const foreignSection = crypto.randomUUID();
    await db.insert(levellingSections).values({
      id: foreignSection,
      campaignId: foreign.campaignId,
      siteId: foreign.siteId,
      fromMark: "L-secret-mark",
      toMark: "L2",
      classId,
      openedAt: new Date(at),
      changeSeq: 2,
    });
    const client = syncClient();
    const id = crypto.randomUUID();
    const res = await push(client, [
      open(client, id),
      open(client, id),
      open(client, crypto.randomUUID(), { siteId: foreign.siteId }),
      setup(client, foreignSection, "forward", 1, 1, 1),
      close(client, foreignSection),
      open(client, crypto.randomUUID(), { classId: "tenth-order" }),
    ]);
    expect(res.body.results.map((r) => [r.status, r.message])).toEqual([
      ["applied", undefined],
      ["rejected", "A levelling section with this id already exists"],
      ["rejected", "The site of this levelling section is not in this campaign"],
      ["rejected", "This levelling section is not in this campaign"],
      ["rejected", "This levelling section is not in this campaign"],
      ["rejected", "Invalid levelling.open: classId: Choose a levelling class"],
    ]);
    expect(JSON.stringify(res.body)).not.toContain("L-secret");
  });

  it("attaches a file to a section, and refuses an unknown one", async () => {
    const client = syncClient();
    const id = crypto.randomUUID();
    const link = (subjectId: string) => ({
      id: crypto.randomUUID(),
      sha256: "ef".repeat(32),
      contentType: "image/jpeg",
      sizeBytes: 1024,
      subject: { kind: "levellingSection", id: subjectId },
    });
    const res = await push(client, [
      open(client, id),
      client.mutation("attachment.add", link(id)),
      client.mutation("attachment.add", link(crypto.randomUUID())),
    ]);
    expect(res.body.results.map((r) => [r.status, r.message])).toEqual([
      ["applied", undefined],
      ["applied", undefined],
      ["rejected", "The levellingSection this file belongs to is not in this campaign"],
    ]);
  });

  it("keeps a close and a setup racing from two tablets in one order", async () => {
    for (let round = 0; round < 6; round++) {
      const crew = syncClient();
      const id = crypto.randomUUID();
      const ready = await push(crew, [open(crew, id), ...bothRuns(crew, id, [1.2, 1.501])]);
      expect(ready.body.results.every((r) => r.status === "applied")).toBe(true);
      // The other tablet corrects forward setup 1 (+0.3000 → +0.3005 m) as the crew closes.
      const other = syncClient();
      const correction = setup(other, id, "forward", 1, 1.5, 1.1995, later);
      const [closed, corrected] = await Promise.all([
        push(crew, [close(crew, id)]),
        push(other, [correction], geodesistToken),
      ]);
      expect(closed.body.results[0]?.status).toBe("applied");
      const outcome = corrected.body.results[0];
      const [section] = await ctx.database.db
        .select()
        .from(levellingSections)
        .where(eq(levellingSections.id, id));
      const closure = section?.closure as { forwardDeltaM: number } | null;
      if (outcome?.status === "applied") {
        // The setup came first: it is before the close in the change stream and in the closure.
        const [row] = await ctx.database.db
          .select()
          .from(levellingSetups)
          .where(eq(levellingSetups.id, (correction.args as { id: string }).id));
        expect(row?.changeSeq).toBeLessThan(section?.changeSeq ?? 0);
        expect(closure?.forwardDeltaM).toBeCloseTo(0.5505, 9);
      } else {
        expect(outcome).toEqual({
          mutationId: 1,
          status: "rejected",
          message: "This section was already closed; the setup is kept for recovery",
        });
        expect(closure?.forwardDeltaM).toBeCloseTo(0.55, 9);
      }
    }
  });
});
