// A comparison run through the API, with two fresh clocks: the start of every series-upload test.
import type { Express } from "express";
import request from "supertest";
import { expect } from "vitest";
import { signInAs, type TestContext } from "./app";
import { pullAll } from "./sync";

/** A geodesist of the demo campaign, its API base and one of its sites (as a tablet pulled it). */
export async function geodesistWithSite(ctx: TestContext) {
  const { token, memberships } = await signInAs(ctx.app, "geodesist");
  const campaignId = memberships[0]?.campaignId ?? "";
  const field = (await signInAs(ctx.app, "field")).token;
  const { changes } = await pullAll(ctx.app, field, campaignId);
  const siteId = changes.find((c) => c.entity === "site")?.id ?? "";
  return { token, campaignId, base: `/api/campaigns/${campaignId}`, siteId };
}

export async function createComparisonRun(
  app: Express,
  base: string,
  token: string,
  siteId: string,
  name: string,
): Promise<string> {
  const auth = { Authorization: `Bearer ${token}` };
  const clock = async (clockName: string) => {
    const id = crypto.randomUUID();
    const res = await request(app)
      .post(`${base}/instruments`)
      .set(auth)
      .send({
        id,
        instrument: { kind: "clock", name: clockName, instabilityAt1s: 1e-15, systematic: [] },
      });
    expect(res.status).toBe(201);
    return id;
  };
  const [remote, reference] = [await clock(`U ${crypto.randomUUID()}`), await clock("U ref")];
  const id = crypto.randomUUID();
  const res = await request(app)
    .post(`${base}/comparison-runs`)
    .set(auth)
    .send({
      id,
      run: {
        name: `${name} ${id.slice(0, 4)}`,
        remoteSiteId: siteId,
        remoteClockId: remote,
        referenceClockId: reference,
        linkName: "fibre link",
        targetHeightUncertaintyM: 0.01,
      },
    });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return id;
}
