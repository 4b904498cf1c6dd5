// Bad input on every route that takes a body, generated with fast-check: wrong types, missing and
// extra fields, huge strings and numbers, any unicode, nested junk. The server never answers 5xx,
// and a validation failure names its fields. Routes come from the app's own table (route-table.ts),
// so a new route is covered without being listed. 25 cases a route here; 1,000 with EQUIPOT_SOAK=1.
import fc from "fast-check";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestContext, signInAs, withHeader, type TestContext } from "../helpers/app";
import { routeTable, type RouteEntry } from "../helpers/route-table";

const runs = process.env.EQUIPOT_SOAK === "1" ? 1000 : 25;

let ctx: TestContext;
let campaignId: string;
let token: string;
let siteId: string;

const huge = fc.constantFrom(
  "x".repeat(100_000),
  "\u{1F600}".repeat(20_000),
  "\u0000\u202e\uFEFF",
  "\uD800", // a lone surrogate
);
const bigNumber = fc.constantFrom(1e308, -1e308, Number.MAX_SAFE_INTEGER + 2, -0, 5e-324);
const junk = fc.oneof(
  fc.string(),
  fc.string({ unit: "grapheme" }),
  huge,
  fc.integer(),
  fc.double(),
  bigNumber,
  fc.boolean(),
  fc.constant(null),
  fc.array(fc.integer(), { maxLength: 5 }),
);
// Fields any of our bodies use, so that generated objects hit real keys with wrong values, and
// the fields the server owns (campaign, version, author, positions), which it must ignore.
const knownKeys = fc.constantFrom(
  "id",
  "name",
  "kind",
  "label",
  "latitudeDeg",
  "longitudeDeg",
  "approxHeightM",
  "notes",
  "baseVersion",
  "email",
  "role",
  "decision",
  "subjectKind",
  "subjectId",
  "run",
  "instrument",
  "benchmark",
  "crate",
  "template",
  "items",
  "campaignId",
  "version",
  "createdBy",
  "changeSeq",
  "updatedAt",
);
const payload = fc.oneof(
  { weight: 4, arbitrary: fc.dictionary(knownKeys, junk, { maxKeys: 8 }) },
  { weight: 2, arbitrary: fc.dictionary(fc.string(), fc.anything(), { maxKeys: 6 }) },
  { weight: 1, arbitrary: fc.anything() },
  { weight: 1, arbitrary: junk },
);

function fill(path: string): string {
  return path
    .replace(":campaignId", campaignId)
    .replace(":siteId", siteId)
    .replace(":table.csv", "sites.csv")
    .replace(":kind", "leg")
    .replace(":entity", "site")
    .replace(":sha256", "0".repeat(64))
    .replace(/:[A-Za-z]+/g, () => crypto.randomUUID());
}

async function send(route: RouteEntry, body: unknown) {
  const method = route.method.toLowerCase() as "post" | "put" | "patch";
  return withHeader(request(ctx.app)[method](fill(route.path)))
    .set("Authorization", `Bearer ${token}`)
    .set("Content-Type", "application/json")
    .send(JSON.stringify(body) ?? "null");
}

beforeAll(async () => {
  ctx = await createTestContext();
  const admin = await signInAs(ctx.app, "admin");
  token = admin.token;
  campaignId = (await signInAs(ctx.app, "field")).memberships[0]?.campaignId ?? "";
  const sites = await request(ctx.app)
    .get(`/api/campaigns/${campaignId}/sites`)
    .set("Authorization", `Bearer ${token}`);
  siteId = (sites.body as { sites: { id: string }[] }).sites[0]?.id ?? "";
}, 60_000);
afterAll(() => ctx.close());

const siteCount = async () =>
  Number(
    (
      await ctx.database.pool.query<{ n: string }>(
        "select count(*) as n from sites where campaign_id = $1",
        [campaignId],
      )
    ).rows[0]?.n,
  );

const bodyRoutes = () =>
  routeTable(ctx.app).filter(
    (r) =>
      ["POST", "PUT", "PATCH"].includes(r.method) &&
      // Raw bodies (files, archives, series): covered by their own refusal tests.
      !/\/attachments\/|\/import\/?$|\/files$/.test(r.path) &&
      !r.path.startsWith("/api/auth/sign-in"),
  );

describe("generated bad input", () => {
  it("covers every JSON body route of the app", () => {
    // Counted by hand today; fewer means the table or the filter lost routes.
    expect(bodyRoutes().length).toBeGreaterThanOrEqual(21);
  });

  it(`never answers 5xx, and a refusal names its fields (${runs} cases a route)`, async () => {
    for (const route of bodyRoutes()) {
      await fc.assert(
        fc.asyncProperty(payload, async (body) => {
          const res = await send(route, body);
          const where = `${route.method} ${route.path} with ${JSON.stringify(body)?.slice(0, 200)}`;
          expect(res.status, `${where}: ${res.text?.slice(0, 300)}`).toBeLessThan(500);
          if (res.status >= 400) {
            expect(typeof res.body?.error?.message, where).toBe("string");
            if (res.body.error.code === "validation_failed") {
              const details = res.body.error.details as { path: string; message: string }[];
              expect(details.length, where).toBeGreaterThan(0);
              for (const d of details) expect(d.message.length, where).toBeGreaterThan(0);
              // An object body's refusal says which field; a non-object is refused as a whole.
              if (body !== null && typeof body === "object" && !Array.isArray(body))
                expect(
                  details.some((d) => d.path.length > 0),
                  where,
                ).toBe(true);
            }
          }
        }),
        { numRuns: runs, seed: 20261203 },
      );
    }
  }, 600_000);

  it("names an empty key as a field (found by the soak run)", async () => {
    const res = await send(
      {
        method: "POST",
        path: "/api/campaigns/:campaignId/sites/",
        actions: [],
        campaignScoped: true,
      },
      { "": {} },
    );
    expect(res.status).toBe(400);
    expect(res.body.error.details).toContainEqual({ path: '""', message: 'Unknown field: ""' });
  });

  it("refuses a campaign, version or author smuggled into a site by name, and stores nothing", async () => {
    const before = await siteCount();
    const res = await send(
      {
        method: "POST",
        path: "/api/campaigns/:campaignId/sites/",
        actions: [],
        campaignScoped: true,
      },
      {
        name: "Smuggler's col",
        kind: "mountain",
        latitudeDeg: 46.3,
        longitudeDeg: 7.4,
        approxHeightM: 2800,
        campaignId: crypto.randomUUID(),
        version: 99,
        updatedBy: crypto.randomUUID(),
      },
    );
    // Strict schemas: a server-owned field is never applied, and the caller learns it was not.
    expect(res.status).toBe(400);
    expect(res.body.error.details).toEqual([
      {
        path: "campaignId,version,updatedBy",
        message: "Unknown fields: campaignId, version, updatedBy",
      },
    ]);
    expect(await siteCount()).toBe(before);
  });
});
