// Exports on the real server and PostgreSQL: every table as CSV, the map as GeoJSON, the campaign
// archive, and its import as a new campaign compared field by field with the source.
import Papa from "papaparse";
import request from "supertest";
import { strFromU8, strToU8, unzipSync, zipSync } from "fflate";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  archiveRowSchemas,
  archiveTables,
  heightTables,
} from "../../shared/schemas/campaign-archive";
import { officialHeightsCaution } from "../../shared/schemas/comparison";
import { createTestContext, outsiderToken, signInAs, type TestContext } from "../helpers/app";
import { addExportFixtures, attachmentBytes, attachmentSha } from "../helpers/export-fixtures";
import { compareCampaigns, countAll, countRows } from "../helpers/campaign-compare";

let ctx: TestContext;
let campaignId: string;
let practiceId: string;
const tokens: Record<string, string> = {};
let seriesFileId = "";

const auth = (role: string) => ({ Authorization: `Bearer ${tokens[role] ?? ""}` });
const base = () => `/api/campaigns/${campaignId}/exports`;
const binary = (test: request.Test) =>
  test.buffer(true).parse((res, done) => {
    const chunks: Buffer[] = [];
    res.on("data", (c: Buffer) => chunks.push(c));
    res.on("end", () => done(null, Buffer.concat(chunks)));
  });
const bodyOf = (res: request.Response): Buffer =>
  Buffer.isBuffer(res.body) ? res.body : Buffer.alloc(0);
const query = (text: string, values: unknown[] = []) => ctx.database.pool.query(text, values);

beforeAll(async () => {
  ctx = await createTestContext();
  for (const role of ["field", "logistics", "geodesist", "reviewer", "admin"]) {
    const session = await signInAs(ctx.app, role);
    tokens[role] = session.token;
    if (role === "field") campaignId = session.memberships[0]?.campaignId ?? "";
    if (role === "admin")
      practiceId = session.memberships.find((m) => m.campaignId !== campaignId)?.campaignId ?? "";
  }
  seriesFileId = await addExportFixtures(ctx, campaignId, tokens);
}, 60_000);
afterAll(async () => {
  await ctx.close();
});

describe("the archive format", () => {
  it("names every column of every table, apart from the implied and internal ones", async () => {
    const left = ["campaign_id", "storage_key"];
    for (const table of archiveTables) {
      const r = await query(
        `select column_name from information_schema.columns where table_name = $1`,
        [table],
      );
      const columns = (r.rows as { column_name: string }[])
        .map((c) => c.column_name)
        .filter((c) => !left.includes(c) && !(table === "audit_events" && c === "id"));
      expect(Object.keys(archiveRowSchemas[table].shape).sort(), table).toEqual(columns.sort());
    }
  });
});

describe("CSV of each table", () => {
  it("parses back with papaparse, one row per record, names beside people, caution on heights", async () => {
    for (const table of archiveTables) {
      const res = await request(ctx.app).get(`${base()}/tables/${table}.csv`).set(auth("reviewer"));
      expect(res.status, table).toBe(200);
      expect(res.headers["content-type"]).toMatch(/^text\/csv/);
      expect(res.headers["content-disposition"]).toMatch(
        new RegExp(
          `^attachment; filename="equipot-[a-z0-9-]+-${table.replace(/_/g, "-")}-\\d{4}-\\d{2}-\\d{2}\\.csv"$`,
        ),
      );
      const parsed = Papa.parse<Record<string, string>>(res.text, {
        header: true,
        skipEmptyLines: true,
      });
      expect(parsed.errors, table).toEqual([]);
      expect(parsed.data.length, table).toBe(await countRows(ctx, table, campaignId));
      if (table === "sites")
        expect(parsed.data.map((r) => r.notes)).toContain(
          "'=Edited after the review, starts with =",
        );
      if (heightTables.includes(table)) {
        expect(parsed.meta.fields?.at(-1)).toBe("caution");
        for (const row of parsed.data) expect(row.caution).toBe(officialHeightsCaution);
      }
    }
  });

  it("writes the audit trail with who, when, device, action, entity and JSON before/after", async () => {
    const res = await request(ctx.app)
      .get(`${base()}/tables/audit_events.csv`)
      .set(auth("geodesist"));
    const parsed = Papa.parse<Record<string, string>>(res.text, {
      header: true,
      skipEmptyLines: true,
    });
    expect(parsed.meta.fields).toEqual(
      expect.arrayContaining([
        "user_name",
        "at",
        "client_id",
        "action",
        "entity",
        "entity_id",
        "before",
        "after",
      ]),
    );
    const upload = parsed.data.find((r) => r.entity === "attachment" || r.action === "create");
    expect(upload?.at).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d+)?Z$/);
    const withAfter = parsed.data.find((r) => (r.after ?? "") !== "");
    expect(() => JSON.parse(withAfter?.after ?? "") as unknown).not.toThrow();
    expect(parsed.data.some((r) => r.user_name === "Geodesist" || (r.user_name ?? "") !== "")).toBe(
      true,
    );
  });

  it("refuses a table outside the list by name", async () => {
    const res = await request(ctx.app).get(`${base()}/tables/users.csv`).set(auth("reviewer"));
    expect(res.status).toBe(400);
    expect((res.body as { error: { message: string } }).error.message).toMatch(/^table: /);
  });
});

describe("GeoJSON", () => {
  it("is one FeatureCollection of sites, benchmarks and legs in [longitude, latitude] order", async () => {
    const res = await request(ctx.app).get(`${base()}/geojson`).set(auth("geodesist"));
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toMatch(/^application\/geo\+json/);
    const collection = JSON.parse(res.text) as {
      type: string;
      features: {
        id: string;
        geometry: { type: string; coordinates: unknown };
        properties: { kind: string };
      }[];
    };
    expect(collection.type).toBe("FeatureCollection");
    const kinds = (k: string) => collection.features.filter((f) => f.properties.kind === k);
    const live = (t: string) =>
      query(`select count(*)::int as n from ${t} where campaign_id = $1 and deleted_at is null`, [
        campaignId,
      ]);
    expect(kinds("site").length).toBe((await live("sites")).rows[0]?.n);
    expect(kinds("benchmark").length).toBe((await live("benchmarks")).rows[0]?.n);
    expect(kinds("leg").length).toBe(await countRows(ctx, "legs", campaignId));
    const sites = await query(
      `select id, latitude_deg, longitude_deg from sites where campaign_id = $1`,
      [campaignId],
    );
    for (const site of sites.rows as {
      id: string;
      latitude_deg: number;
      longitude_deg: number;
    }[]) {
      const feature = kinds("site").find((f) => f.id === site.id);
      if (feature)
        expect(feature.geometry.coordinates).toEqual([site.longitude_deg, site.latitude_deg]);
    }
    const leg = await query(
      `select l.id, f.longitude_deg as lon, f.latitude_deg as lat from legs l join sites f on f.id = l.from_site_id where l.campaign_id = $1 limit 1`,
      [campaignId],
    );
    const legRow = leg.rows[0] as { id: string; lon: number; lat: number };
    const legFeature = kinds("leg").find((f) => f.id === legRow.id);
    expect(legFeature?.geometry.type).toBe("LineString");
    expect((legFeature?.geometry.coordinates as number[][])[0]).toEqual([legRow.lon, legRow.lat]);
  });
});

describe("who may export", () => {
  it("refuses field and logistics roles with 403", async () => {
    for (const role of ["field", "logistics"])
      for (const path of ["/tables/sites.csv", "/geojson", "/archive.zip"]) {
        const res = await request(ctx.app).get(`${base()}${path}`).set(auth(role));
        expect(res.status, `${role} ${path}`).toBe(403);
      }
  });

  it("answers a member of another campaign 404 with nothing of this one", async () => {
    const outsider = await outsiderToken(ctx, practiceId, "reviewer");
    const names = await query(`select name from sites where campaign_id = $1`, [campaignId]);
    for (const path of ["/tables/sites.csv", "/geojson", "/archive.zip"]) {
      const res = await request(ctx.app)
        .get(`${base()}${path}`)
        .set({ Authorization: `Bearer ${outsider}` });
      expect(res.status).toBe(404);
      for (const row of names.rows as { name: string }[]) expect(res.text).not.toContain(row.name);
    }
  });
});

async function downloadArchive(): Promise<Buffer> {
  const res = await binary(request(ctx.app).get(`${base()}/archive.zip`).set(auth("admin")));
  expect(res.status).toBe(200);
  expect(res.headers["content-type"]).toBe("application/zip");
  return bodyOf(res);
}

const importZip = (zip: Uint8Array, name: string, role = "admin") =>
  request(ctx.app)
    .post(`/api/campaigns/import?name=${encodeURIComponent(name)}`)
    .set(auth(role))
    .set("Content-Type", "application/zip")
    .send(Buffer.from(zip));

describe("the campaign archive", () => {
  it("holds campaign.json, a CSV per table, the attachment bytes, series CSVs and the README", async () => {
    const files = unzipSync(await downloadArchive());
    expect(strFromU8(files["README.txt"] ?? new Uint8Array())).toContain(officialHeightsCaution);
    const doc = JSON.parse(strFromU8(files["campaign.json"] ?? new Uint8Array())) as {
      format: string;
      formatVersion: number;
      tables: Record<string, unknown[]>;
      comparison_chunks: unknown[];
    };
    expect([doc.format, doc.formatVersion]).toEqual(["equipot-campaign-archive", 1]);
    for (const table of archiveTables) {
      expect(files[`tables/${table}.csv`], table).toBeDefined();
      expect(doc.tables[table]?.length, table).toBe(await countRows(ctx, table, campaignId));
    }
    expect(doc.comparison_chunks.length).toBeGreaterThan(0);
    expect(Buffer.from(files[`attachments/${attachmentSha}`] ?? []).equals(attachmentBytes)).toBe(
      true,
    );
    const series = Papa.parse(strFromU8(files[`series/${seriesFileId}.csv`] ?? new Uint8Array()), {
      header: true,
      skipEmptyLines: true,
    });
    expect(series.data.length).toBe(300);
    const flagged = (series.data as Record<string, string>[]).filter((r) => r.valid === "0");
    expect(flagged).toEqual([{ time: "2027-07-01T00:01:39Z", value: "", valid: "0" }]);
  });

  it("imports into a new campaign with the same records and attachments, field by field", async () => {
    const res = await importZip(await downloadArchive(), "Copy of the demo");
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const created = (res.body as { campaign: { id: string; role: string } }).campaign;
    expect(created.role).toBe("admin");
    for (const table of archiveTables)
      expect(await countRows(ctx, table, campaignId), table).toBeGreaterThan(0);
    await compareCampaigns(ctx, campaignId, created.id);
    const nan = await query(
      `select count(*)::int as n from comparison_chunks c join comparison_files f on f.id = c.file_id,
         unnest(c.values) v where f.campaign_id = $1 and v = 'NaN'`,
      [created.id],
    );
    expect(nan.rows[0]?.n).toBe(1);
    const file = await binary(
      request(ctx.app)
        .get(`/api/campaigns/${created.id}/attachments/${attachmentSha}`)
        .set(auth("admin")),
    );
    expect(file.status).toBe(200);
    expect(bodyOf(file).equals(attachmentBytes)).toBe(true);
    const list = await request(ctx.app).get("/api/campaigns").set(auth("admin"));
    expect(list.body).toMatchObject({
      campaigns: expect.arrayContaining([
        expect.objectContaining({ id: created.id, role: "admin" }),
      ]),
    });
  });

  it("refuses an import by someone who administers no campaign, and one without a name", async () => {
    const zip = await downloadArchive();
    const refused = await importZip(zip, "Not mine", "geodesist");
    expect(refused.status).toBe(403);
    expect((refused.body as { error: { message: string } }).error.message).toMatch(/admin role/);
    const unnamed = await importZip(zip, " ");
    expect(unnamed.status).toBe(400);
    expect((unnamed.body as { error: { message: string } }).error.message).toMatch(/^name: /);
  });

  it("refuses a corrupted archive naming the problem, and writes nothing", async () => {
    const files = unzipSync(await downloadArchive());
    const before = await countAll(ctx);
    const doc = JSON.parse(strFromU8(files["campaign.json"] ?? new Uint8Array())) as {
      tables: { sites: Record<string, unknown>[] };
    };
    const site = doc.tables.sites[1];
    if (site) site.latitude_deg = "north";
    const badField = await importZip(
      zipSync({ ...files, "campaign.json": strToU8(JSON.stringify(doc)) }),
      "Bad field",
    );
    expect(badField.status).toBe(400);
    expect((badField.body as { error: { message: string } }).error.message).toMatch(
      /^campaign\.json: table sites, row 2, field latitude_deg: /,
    );
    const tampered = Uint8Array.from(files[`attachments/${attachmentSha}`] ?? []);
    tampered[0] = (tampered[0] ?? 0) ^ 1;
    const badHash = await importZip(
      zipSync({ ...files, [`attachments/${attachmentSha}`]: tampered }),
      "Bad hash",
    );
    expect(badHash.status).toBe(400);
    expect((badHash.body as { error: { message: string } }).error.message).toContain(
      `attachments/${attachmentSha}: the bytes' SHA-256 is`,
    );
    const dangling = JSON.parse(strFromU8(files["campaign.json"] ?? new Uint8Array())) as {
      tables: { legs: Record<string, unknown>[] };
    };
    const leg = dangling.tables.legs[0];
    if (leg) leg.crate_id = crypto.randomUUID();
    const badRef = await importZip(
      zipSync({ ...files, "campaign.json": strToU8(JSON.stringify(dangling)) }),
      "Bad reference",
    );
    expect(badRef.status).toBe(400);
    expect((badRef.body as { error: { message: string } }).error.message).toMatch(
      /^campaign\.json: table legs, row 1, field crate_id: .* names no row of crates/,
    );
    const notZip = await importZip(strToU8("not a zip"), "Not a zip");
    expect(notZip.status).toBe(400);
    expect(await countAll(ctx)).toEqual(before);
  });
});
