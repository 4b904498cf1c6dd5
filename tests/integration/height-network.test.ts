// The levelling network on the real server and PostgreSQL: ties imported from a file (a bad file
// refused by line, nothing stored), closed field-book sections as observations, the adjustment run
// in the worker pool and kept whole, left-out observations, a blunder flagged, roles refused.
import { readFile } from "node:fs/promises";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { and, eq } from "drizzle-orm";
import { createTestContext, signInAs, type TestContext } from "../helpers/app";
import { pullAll, pushAs, syncClient } from "../helpers/sync";
import { auditEvents, benchmarks, heightTies, levellingAdjustments } from "../../server/db/schema";
import { latestAdjustment } from "../../server/db/repositories/height-network";
import type { AdjustmentView, HeightTieView } from "../../shared/schemas/height-network";

let ctx: TestContext;
let campaignId: string;
let geodesist: string;
let field: string;
let base: string;
let siteId: string;

const fixture = (name: string) =>
  readFile(new URL(`../fixtures/geodesy/${name}`, import.meta.url), "utf8");
const auth = (token: string) => ({ Authorization: `Bearer ${token}` });

beforeAll(async () => {
  ctx = await createTestContext();
  const g = await signInAs(ctx.app, "geodesist");
  geodesist = g.token;
  campaignId = g.memberships[0]?.campaignId ?? "";
  base = `/api/campaigns/${campaignId}`;
  field = (await signInAs(ctx.app, "field")).token;
  const { changes } = await pullAll(ctx.app, field, campaignId);
  siteId = changes.find((c) => c.entity === "site")?.id ?? "";
  // The demo may come with ties of its own: this test starts from an empty network.
  await removeAllTies();
});
afterAll(async () => {
  await ctx.close();
});

async function listTies(): Promise<HeightTieView[]> {
  const res = await request(ctx.app).get(`${base}/height-ties`).set(auth(field));
  expect(res.status).toBe(200);
  return (res.body as { ties: HeightTieView[] }).ties;
}

async function removeAllTies() {
  for (const tie of await listTies()) {
    const res = await request(ctx.app).delete(`${base}/height-ties/${tie.id}`).set(auth(geodesist));
    expect(res.status).toBe(204);
  }
}

const importFile = async (name: string, token = geodesist) =>
  request(ctx.app)
    .post(`${base}/height-ties/import`)
    .set(auth(token))
    .send({ fileName: name, content: await fixture(name) });

const adjust = (options: Record<string, unknown> = {}, token = geodesist) =>
  request(ctx.app).post(`${base}/levelling-adjustments`).set(auth(token)).send(options);

const heightOf = (view: AdjustmentView, mark: string) =>
  view.points.find((p) => p.mark === mark)?.heightM ?? Number.NaN;

describe("the levelling network", () => {
  it("says clearly when there is nothing to adjust yet", async () => {
    const none = await adjust();
    expect(none.status).toBe(422);
    expect((none.body as { error: { message: string } }).error.message).toMatch(/no observations/);
    const latest = await request(ctx.app)
      .get(`${base}/levelling-adjustments/latest`)
      .set(auth(field));
    expect(latest.status).toBe(200);
    expect(latest.body).toEqual({ adjustment: null });
  });

  it("refuses the field crew's import, adjustment and delete but lets them read", async () => {
    expect((await importFile("ties-loop.csv", field)).status).toBe(403);
    expect((await adjust({}, field)).status).toBe(403);
    const someId = crypto.randomUUID();
    expect(
      (await request(ctx.app).delete(`${base}/height-ties/${someId}`).set(auth(field))).status,
    ).toBe(403);
    expect(
      (await request(ctx.app).get(`${base}/height-network/observations`).set(auth(field))).status,
    ).toBe(200);
    expect(
      (await request(ctx.app).get(`${base}/levelling-adjustments`).set(auth(field))).status,
    ).toBe(200);
  });

  it("refuses a bad file with every bad row by line, field and message, and stores nothing", async () => {
    const res = await importFile("ties-bad.csv");
    expect(res.status).toBe(422);
    const body = res.body as { error: { code: string; message: string; rows: unknown[] } };
    expect(body.error.code).toBe("invalid_file");
    expect(body.error.message).toBe("4 problems in ties-bad.csv; nothing was imported");
    // Lines as in the file, the header as line 1 (line 6 is empty and skipped); messages from
    // heightTieFields, the field named by the file's column.
    expect(body.error.rows).toEqual([
      { row: 3, field: "to", message: "From and to marks must differ" },
      { row: 4, field: "dh_m", message: "Height difference must be a number" },
      { row: 5, field: "length_km", message: "Length must be a number" },
      { row: 7, field: "sigma_mm", message: "Standard deviation must be above 0" },
    ]);
    const stored = await ctx.database.db
      .select()
      .from(heightTies)
      .where(eq(heightTies.campaignId, campaignId));
    expect(stored.filter((t) => t.deletedAt === null)).toEqual([]);
  });

  it("reports missing columns on line 1", async () => {
    const res = await request(ctx.app)
      .post(`${base}/height-ties/import`)
      .set(auth(geodesist))
      .send({ content: "from,to,dh\nA,B,1.0\n" });
    expect(res.status).toBe(422);
    const rows = (res.body as { error: { rows: { row: number; field: string }[] } }).error.rows;
    expect(rows.filter((r) => r.row === 1).map((r) => r.field)).toEqual([
      "dh_m",
      "length_km",
      "dh",
    ]);
  });

  it("imports ties (header any case, σ in mm) and audits each", async () => {
    const res = await importFile("ties-loop.csv");
    expect(res.status).toBe(201);
    const ties = (res.body as { ties: HeightTieView[] }).ties;
    expect(ties).toHaveLength(6);
    const ab = ties.find((t) => t.fromMark === "A" && t.toMark === "B");
    expect(ab).toMatchObject({
      deltaM: 10.509,
      lengthKm: 1.2,
      sigmaM: 0.006,
      source: "ties-loop.csv",
    });
    expect(ab?.importedByName).toBe("Ines Varodi");
    const audits = await ctx.database.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entity, "height-tie"), eq(auditEvents.action, "create")));
    expect(audits.filter((a) => ties.some((t) => t.id === a.entityId))).toHaveLength(6);
  });

  it("names the missing benchmark when no mark of the network is one", async () => {
    const res = await adjust();
    expect(res.status).toBe(422);
    expect((res.body as { error: { message: string } }).error.message).toMatch(/No benchmark/);
  });

  it("reproduces Ghilani & Wolf Example 12.1 and keeps the result whole", async () => {
    await ctx.database.db.insert(benchmarks).values({
      id: crypto.randomUUID(),
      campaignId,
      code: "A",
      latitudeDeg: 47.1,
      longitudeDeg: 11.2,
      heightM: 437.596,
      heightSigmaM: 0.003,
      heightSystem: "Normal heights",
      changeSeq: 100000,
    });
    const res = await adjust();
    expect(res.status).toBe(201);
    const view = (res.body as { adjustment: AdjustmentView }).adjustment;
    // Ghilani & Wolf, "Adjustment Computations", 4th ed., Example 12.1 (REFERENCES.md §4):
    // published B 448.1087, C 453.4685, D 444.9436 m; computed vᵀWv 1.2721, dof 3, S0 0.6512.
    expect(heightOf(view, "B").toFixed(4)).toBe("448.1087");
    expect(heightOf(view, "C").toFixed(4)).toBe("453.4685");
    expect(heightOf(view, "D").toFixed(4)).toBe("444.9436");
    expect(view.dof).toBe(3);
    expect(view.sigma0?.toFixed(4)).toBe("0.6512");
    expect(view.globalTest?.statistic.toFixed(4)).toBe("1.2721");
    expect(view.globalTest?.passed).toBe(true);
    expect(view.points.find((p) => p.mark === "A")).toMatchObject({
      fixed: true,
      heightM: 437.596,
      benchmarkSigmaM: 0.003,
    });
    expect(view.observations.every((o) => !o.flagged && o.source === "imported")).toBe(true);
    expect(view.unconnected).toEqual([]);
    expect(view.observationCount).toBe(6);
    expect(view.computedByName).toBe("Ines Varodi");
    // Stored exactly as answered: the comparison runs read it from the table.
    expect(await latestAdjustment(ctx.database.db, campaignId)).toEqual(view);
    const latest = await request(ctx.app)
      .get(`${base}/levelling-adjustments/latest`)
      .set(auth(field));
    expect((latest.body as { adjustment: AdjustmentView }).adjustment).toEqual(view);
    const list = await request(ctx.app).get(`${base}/levelling-adjustments`).set(auth(field));
    expect((list.body as { adjustments: unknown[] }).adjustments[0]).toEqual({
      id: view.id,
      computedAt: view.computedAt,
      computedByName: "Ines Varodi",
      dof: 3,
      sigma0: view.sigma0,
      passed: true,
    });
  });

  it("leaves out an excluded observation", async () => {
    const ac = (await listTies()).find((t) => t.fromMark === "A" && t.toMark === "C");
    const res = await adjust({ excluded: [ac?.id], sigmaPerSqrtKmMm: 2 });
    expect(res.status).toBe(201);
    const view = (res.body as { adjustment: AdjustmentView }).adjustment;
    expect(view.observations.map((o) => o.sourceId)).not.toContain(ac?.id);
    expect(view.observations).toHaveLength(5);
    expect(view.dof).toBe(2);
    expect(view.options).toEqual({ sigmaPerSqrtKmMm: 2, significance: 0.05, excluded: [ac?.id] });
    expect(view.observationCount).toBe(6);
  });

  it("takes a closed field-book section as the mean of its runs, the forward length", async () => {
    const client = syncClient();
    const id = crypto.randomUUID();
    const at = "2027-06-05T06:00:00.000Z";
    const setup = (run: "forward" | "backward", number: number, bs: number, fs: number) =>
      client.mutation("levelling.setup", {
        id: crypto.randomUUID(),
        sectionId: id,
        run,
        number,
        backsightM: bs,
        foresightM: fs,
        backsightDistanceM: 40,
        foresightDistanceM: 40,
        recordedAt: at,
      });
    const pushed = await pushAs(ctx.app, field, {
      clientId: client.clientId,
      campaignId,
      mutations: [
        client.mutation("levelling.open", {
          id,
          siteId,
          fromMark: "B",
          toMark: "Hut pillar",
          classId: "fgcc-1984-second-order-class-i",
          instrument: "",
          openedAt: at,
        }),
        setup("forward", 1, 1.5, 1.2),
        setup("forward", 2, 1.4, 1.15),
        setup("backward", 1, 1.1, 1.35),
        setup("backward", 2, 1.2, 1.5005),
        client.mutation("levelling.close", { id, closedAt: "2027-06-05T07:00:00.000Z" }),
      ],
    });
    expect(pushed.body.results.map((r) => r.status)).toEqual(Array(6).fill("applied"));
    const res = await request(ctx.app).get(`${base}/height-network/observations`).set(auth(field));
    const section = (
      res.body as { observations: { sourceId: string; deltaM: number; lengthKm: number }[] }
    ).observations.find((o) => o.sourceId === id);
    // By hand: forward +0.3000 +0.2500 = +0.5500 m, backward −0.2500 −0.3005 = −0.5505 m, mean
    // +0.55025 m; the forward run is 2 setups × 80 m = 0.16 km.
    expect(section).toMatchObject({ source: "field-book", deltaM: 0.55025, lengthKm: 0.16 });
    const adjusted = (await adjust()).body as { adjustment: AdjustmentView };
    const view = adjusted.adjustment;
    expect(view.observationCount).toBe(7);
    // A spur: no redundancy, so the pillar is B plus the section's mean exactly.
    expect(heightOf(view, "Hut pillar") - heightOf(view, "B")).toBeCloseTo(0.55025, 9);
    expect(view.sigma0?.toFixed(4)).toBe("0.6512");
  });

  it("flags a blunder of 1 m in one tie", async () => {
    await removeAllTies();
    expect((await importFile("ties-blunder.csv")).status).toBe(201);
    const view = ((await adjust()).body as { adjustment: AdjustmentView }).adjustment;
    expect(view.globalTest?.passed).toBe(false);
    const flagged = view.observations.filter((o) => o.flagged);
    expect(flagged.map((o) => `${o.fromMark}→${o.toMark}`)).toContain("B→C");
  });

  it("adjusts without tests at 0 degrees of freedom and lists unconnected marks", async () => {
    await removeAllTies();
    const content = "from,to,dh_m,length_km\nA,B,10.509,1.2\nX1,X2,0.5,0.3\n";
    const imported = await request(ctx.app)
      .post(`${base}/height-ties/import`)
      .set(auth(geodesist))
      .send({ content });
    expect(imported.status).toBe(201);
    const res = await adjust();
    expect(res.status).toBe(201);
    const view = (res.body as { adjustment: AdjustmentView }).adjustment;
    expect(view.dof).toBe(0);
    expect(view.globalTest).toBeNull();
    expect(view.sigma0).toBeNull();
    expect(view.unconnected).toEqual(["X1", "X2"]);
    expect(heightOf(view, "B")).toBeCloseTo(437.596 + 10.509, 9);
    const rows = await ctx.database.db
      .select()
      .from(levellingAdjustments)
      .where(eq(levellingAdjustments.campaignId, campaignId));
    expect(rows.length).toBeGreaterThanOrEqual(4);
  });
});
