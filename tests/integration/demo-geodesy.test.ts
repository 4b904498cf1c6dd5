// The demo's geodesy tells a coherent story: with the network adjusted by the seed, the run's clock
// height agrees with the levelled one within its uncertainty, and the target is reachable.
import request from "supertest";
import { afterAll, beforeAll, expect, it } from "vitest";
import type { HeightResultView } from "../../shared/schemas/comparison";
import { seedDemoGeodesy } from "../../server/seed/demo-geodesy";
import { createTestContext, signInAs, type TestContext } from "../helpers/app";
import { pullAll } from "../helpers/sync";

let ctx: TestContext;
let base: string;
let geodesist: string;

beforeAll(async () => {
  ctx = await createTestContext();
  const g = await signInAs(ctx.app, "geodesist");
  geodesist = g.token;
  const campaignId = g.memberships[0]?.campaignId ?? "";
  base = `/api/campaigns/${campaignId}`;
  const { changes } = await pullAll(ctx.app, geodesist, campaignId);
  const hut = changes.find(
    (c) => c.entity === "site" && (c.data as { name?: string }).name === "Kestrel Ridge hut",
  );
  const data = hut?.data as { latitudeDeg: number };
  const me = (g.body as { user: { id: string } }).user.id;
  await seedDemoGeodesy(
    ctx.database.db,
    campaignId,
    { id: hut?.id ?? "", latitudeDeg: data.latitudeDeg },
    me,
  );
});
afterAll(async () => {
  await ctx.close();
});

const auth = () => ({ Authorization: `Bearer ${geodesist}` });

it("gives a reachable target and a clock height within its σ of the levelled one", async () => {
  const runs = await request(ctx.app).get(`${base}/comparison-runs`).set(auth());
  const runId = (runs.body.runs as { id: string }[])[0]?.id ?? "";
  let result: HeightResultView | null = null;
  for (let i = 0; i < 300 && result?.analysis.state !== "done"; i++) {
    result = (await request(ctx.app).get(`${base}/comparison-runs/${runId}/result`).set(auth()))
      .body as HeightResultView;
    if (result.analysis.state !== "done") await new Promise((r) => setTimeout(r, 100));
  }
  if (result === null || result.clock === null || result.comparison === null)
    throw new Error(`no full result: ${JSON.stringify(result).slice(0, 400)}`);
  expect(result.levelled?.mark).toBe("KR-CRP");
  // The series was made 8 mm above the levelled height; its statistical σ is a few cm.
  expect(result.comparison.consistent).toBe(true);
  expect(Math.abs(result.comparison.differenceM)).toBeLessThan(2 * result.comparison.sigmaM);
  expect(result.timeToTarget.reachable).toBe(true);
  expect(result.timeToTarget.eta).not.toBeNull();
  expect(result.timeToTarget.input.uptime).toBeGreaterThan(0.9);
  expect(result.budget.map((r) => r.kind)).toEqual([
    "statistical",
    "systematic",
    "systematic",
    "systematic",
    "levelling-tie",
    "benchmark",
    "reference-height",
  ]);
});
