// The access-control matrix, generated: every route read off the app (tests/helpers/route-table.ts)
// × every role in shared/permissions.ts × the caller's own campaign and a foreign one. The expected
// answer of each cell comes from the permission table alone: a foreign campaign is 404 "Campaign
// not found" for everyone, an action the role lacks is 403, an action it has is let through (the
// handler then answers 2xx, or 400/404/409 for the made-up ids and empty bodies it is given). No
// refused answer carries anything of the foreign campaign: only the error object, no id or name.
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { can, roles, type Role } from "../../shared/permissions";
import {
  createTestContext,
  outsiderToken,
  signInAs,
  withHeader,
  type TestContext,
} from "../helpers/app";
import { routeTable, type RouteEntry } from "../helpers/route-table";
import { pushAs, syncClient } from "../helpers/sync";

let ctx: TestContext;
let own: string;
let foreign: string;
/** Strings that would betray the foreign campaign: its id, name, and its sites' and crates' names. */
let foreignMarks: string[];
const tokens = {} as Record<Role, string>;

// Routes outside any campaign, each with why it needs no campaign role. A new one fails the test
// until it is added here, on purpose.
const outsideCampaigns: Record<string, string> = {
  "GET /api/health/": "public: the load balancer's probe",
  "POST /api/auth/sign-in": "public: signs in",
  "POST /api/auth/refresh": "the refresh cookie is the credential",
  "POST /api/auth/sign-out": "the refresh cookie is the credential",
  "GET /api/auth/me": "the caller's own account",
  "POST /api/invites/accept": "the invite token is the credential",
  "GET /api/campaigns/": "lists the caller's own memberships only",
  "POST /api/campaigns/import/": "needs the admin role somewhere; makes a new campaign",
  "POST /api/sync/push": "membership checked per mutation",
  "GET /api/sync/pull": "membership checked for the campaign asked",
};

/** A request path with the campaign and made-up ids for the other parameters. */
function fill(path: string, campaignId: string): string {
  return path
    .replace(":campaignId", campaignId)
    .replace(":table.csv", "sites.csv")
    .replace(":kind", "leg")
    .replace(":entity", "site")
    .replace(":sha256", "0".repeat(64))
    .replace(/:[A-Za-z]+/g, () => crypto.randomUUID());
}

function send(route: RouteEntry, campaignId: string, token: string) {
  const path = fill(route.path, campaignId);
  const method = route.method.toLowerCase() as "get" | "head" | "post" | "put" | "patch" | "delete";
  const req = withHeader(request(ctx.app)[method](path)).set("Authorization", `Bearer ${token}`);
  // A JSON body of its own, whatever the route parses: an empty object.
  return method === "get" || method === "head" || method === "delete"
    ? req
    : req.set("Content-Type", "application/json").send("{}");
}

/** A HEAD answer has no body to look at, by definition. */
function expectNothingForeign(res: request.Response, method: string) {
  if (method === "HEAD") return;
  const text = res.text;
  expect(Object.keys(res.body as object)).toEqual(["error"]);
  for (const mark of foreignMarks) expect(text).not.toContain(mark);
}

beforeAll(async () => {
  ctx = await createTestContext();
  const admin = await signInAs(ctx.app, "admin");
  const field = await signInAs(ctx.app, "field");
  own = field.memberships[0]?.campaignId ?? "";
  foreign = admin.memberships.find((m) => m.campaignId !== own)?.campaignId ?? "";
  if (!own || !foreign) throw new Error("the demo needs two campaigns");
  // Something of its own to leak: a site, made by its administrator.
  const made = await withHeader(request(ctx.app).post(`/api/campaigns/${foreign}/sites`))
    .set("Authorization", `Bearer ${admin.token}`)
    .send({
      name: "Quillmoor hut",
      kind: "mountain",
      latitudeDeg: 45.9,
      longitudeDeg: 6.9,
      approxHeightM: 2210,
    });
  expect(made.status, made.text).toBe(201);
  const rows = await ctx.database.pool.query<{ mark: string }>(
    `select name as mark from sites where campaign_id = $1
     union all select label from crates where campaign_id = $1
     union all select name from campaigns where id = $1`,
    [foreign],
  );
  foreignMarks = [foreign, ...rows.rows.map((r) => r.mark)];
  if (foreignMarks.length < 3) throw new Error("the foreign campaign holds nothing to leak");
  // A person per role, a member of the own campaign only.
  for (const role of roles) tokens[role] = await outsiderToken(ctx, own, role);
}, 60_000);
afterAll(() => ctx.close());

describe("the route table", () => {
  it("puts every route either behind the campaign check with its action, or on the known list", () => {
    const table = routeTable(ctx.app);
    const outside = table
      .filter((r) => !r.campaignScoped)
      .map((r) => `${r.method} ${r.path}`)
      .sort();
    expect(outside).toEqual(Object.keys(outsideCampaigns).sort());
    const unguarded = table.filter((r) => r.campaignScoped && r.actions.length === 0);
    expect(unguarded).toEqual([]);
    // Enough routes that a walker missing a router would show (counted by hand: 54 today).
    expect(table.filter((r) => r.campaignScoped).length).toBeGreaterThanOrEqual(54);
  });
});

describe("every campaign route × every role × own and foreign campaign", () => {
  const cases = () =>
    routeTable(ctx.app)
      .filter((r) => r.campaignScoped)
      .flatMap((route) => roles.map((role) => ({ route, role })));

  it("answers as the permission table says, and refusals carry nothing of the foreign campaign", async () => {
    const wrong: string[] = [];
    for (const { route, role } of cases()) {
      const name = `${route.method} ${route.path} as ${role}`;
      const allowed = route.actions.every((action) => can(role, action));

      const away = await send(route, foreign, tokens[role]);
      const notFound =
        away.status === 404 &&
        (route.method === "HEAD" || away.body?.error?.message === "Campaign not found");
      if (!notFound)
        wrong.push(`${name}, foreign: ${away.status} ${(away.text ?? "").slice(0, 120)}`);
      expectNothingForeign(away, route.method);

      const home = await send(route, own, tokens[role]);
      const refused =
        home.status === 401 ||
        home.status === 403 ||
        (home.status === 404 && home.body?.error?.message === "Campaign not found");
      if (home.status >= 500)
        wrong.push(`${name}, own: ${home.status} ${(home.text ?? "").slice(0, 120)}`);
      else if (allowed && refused) wrong.push(`${name}, own: refused with ${home.status}`);
      else if (!allowed && home.status !== 403)
        wrong.push(`${name}, own: ${home.status} instead of 403`);
      if (!allowed) expectNothingForeign(home, route.method);
    }
    expect(wrong).toEqual([]);
  }, 120_000);

  it("refuses every campaign route without a token, before anything else", async () => {
    for (const route of routeTable(ctx.app).filter((r) => r.campaignScoped)) {
      const res = await withHeader(
        request(ctx.app)[route.method.toLowerCase() as "get"](fill(route.path, own)),
      );
      expect(res.status, `${route.method} ${route.path}`).toBe(401);
      if (route.method !== "HEAD")
        expect(res.body, `${route.method} ${route.path}`).toHaveProperty("error");
    }
  });
});

describe("routes outside campaigns", () => {
  it("lists only the caller's own campaigns", async () => {
    for (const role of roles) {
      const res = await request(ctx.app)
        .get("/api/campaigns")
        .set("Authorization", `Bearer ${tokens[role]}`);
      expect(res.status).toBe(200);
      const ids = (res.body as { campaigns: { id: string }[] }).campaigns.map((c) => c.id);
      expect(ids).toEqual([own]);
    }
  });

  it("pulls nothing of a foreign campaign, for any role", async () => {
    for (const role of roles) {
      const res = await request(ctx.app)
        .get("/api/sync/pull")
        .query({ protocolVersion: 2, campaign: foreign, cursor: 0 })
        .set("Authorization", `Bearer ${tokens[role]}`);
      expect(res.status).toBe(404);
      expectNothingForeign(res, "GET");
    }
  });

  it("applies no push to a foreign campaign, for any role, and names nothing of it", async () => {
    const count = async () =>
      Number(
        (
          await ctx.database.pool.query<{ n: string }>(
            "select count(*) as n from sites where campaign_id = $1",
            [foreign],
          )
        ).rows[0]?.n,
      );
    const before = await count();
    for (const role of roles) {
      const tablet = syncClient();
      const res = await pushAs(ctx.app, tokens[role], {
        clientId: tablet.clientId,
        campaignId: foreign,
        mutations: [
          tablet.mutation("site.create", {
            id: crypto.randomUUID(),
            name: "Smuggled hut",
            kind: "mountain",
            latitudeDeg: 46,
            longitudeDeg: 7,
            approxHeightM: 1000,
            notes: "",
          }),
        ],
      });
      expect(res.body.results.map((r) => r.status)).toEqual(["rejected"]);
      const text = JSON.stringify(res.body);
      for (const mark of foreignMarks) expect(text).not.toContain(mark);
    }
    expect(await count()).toBe(before);
  });

  it("refuses an archive import to someone who administers no campaign", async () => {
    const res = await withHeader(request(ctx.app).post("/api/campaigns/import"))
      .set("Authorization", `Bearer ${tokens.reviewer}`)
      .set("Content-Type", "application/zip")
      .send(Buffer.from("PK"));
    expect(res.status).toBe(403);
  });
});
