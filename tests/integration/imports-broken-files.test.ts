// Broken files through every server import on the real server and PostgreSQL: benchmarks (CSV and
// GeoJSON, in a JSON body), height ties (CSV, in a JSON body) and comparison series (the file's
// bytes as the body). Each gets a lone 0xFF, a Latin-1 "é" (0xE9), a UTF-16 file with its
// byte-order mark, wrong or missing columns, a file cut short mid-line or mid-JSON and an empty
// file: each is refused with a 4xx whose rows (or message) name the line, and the column or field
// where there is one, and the tables are queried afterwards to show nothing was stored. A UTF-8
// byte-order mark is accepted: spreadsheets write one when saving "CSV UTF-8".
//
// Bytes in a JSON body: the text is put into the JSON as Latin-1, so each byte above 0x7F goes
// over the wire unchanged, as a browser's request would carry it; the server decodes the body as
// UTF-8 (a bad byte becomes U+FFFD), as it does for every request.
import { count, eq } from "drizzle-orm";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { benchmarks, comparisonChunks, comparisonFiles, heightTies } from "../../server/db/schema";
import { createTestContext, type TestContext } from "../helpers/app";
import { createComparisonRun, geodesistWithSite } from "../helpers/comparison-run";

let ctx: TestContext;
let token: string;
let campaignId: string;
let base: string;
let siteId: string;

const auth = () => ({ Authorization: `Bearer ${token}` });
const utf8 = (text: string) => Buffer.from(text, "utf8");
const bom8 = (bytes: Buffer) => Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), bytes]);
const utf16WithBom = (text: string) =>
  Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(text, "utf16le")]);
/** `text` with the bytes `bad` in place of its "@". */
const withBytes = (text: string, bad: number[]) => {
  const [before = "", after = ""] = text.split("@");
  return Buffer.concat([utf8(before), Buffer.from(bad), utf8(after)]);
};
/** 1-based character of the "@" within its line, counted on the text itself. */
const charOfMark = (text: string) => {
  const line = text.split("\n").find((l) => l.includes("@")) ?? "";
  return line.indexOf("@") + 1;
};

/** A JSON body whose `content` is the file's bytes as they are. */
const jsonBody = (fields: Record<string, string>, content: Buffer) =>
  Buffer.from(JSON.stringify({ ...fields, content: content.toString("latin1") }), "latin1");

/** Sent as it is: superagent would otherwise write a Buffer as JSON of its own. */
const asIs = (body: unknown) => body as string;

const countOf = async (table: typeof benchmarks | typeof heightTies) =>
  (
    await ctx.database.db.select({ n: count() }).from(table).where(eq(table.campaignId, campaignId))
  )[0]?.n ?? -1;

type Refusal = { row: number; field: string; message: string };

/** A file import sent as JSON to `path`, and the check that it was refused whole. */
function fileImport(
  path: string,
  fields: Record<string, string>,
  table: typeof benchmarks | typeof heightTies,
) {
  const send = (content: Buffer) =>
    request(ctx.app)
      .post(`${base}/${path}`)
      .set(auth())
      .set("Content-Type", "application/json")
      .serialize(asIs)
      .send(jsonBody(fields, content));
  /** 422 with the rows at fault, and nothing added to the table. */
  async function refusedWhole(content: Buffer): Promise<{ rows: Refusal[]; message: string }> {
    const before = await countOf(table);
    const res = await send(content);
    expect(res.status, JSON.stringify(res.body)).toBe(422);
    expect(res.body.error.code).toBe("invalid_file");
    expect(await countOf(table)).toBe(before);
    return { rows: res.body.error.rows as Refusal[], message: res.body.error.message as string };
  }
  return { send, refusedWhole };
}

beforeAll(async () => {
  ctx = await createTestContext();
  ({ token, campaignId, base, siteId } = await geodesistWithSite(ctx));
});
afterAll(async () => {
  await ctx.close();
});

describe("benchmark CSV", () => {
  const header =
    "code,description,latitude_deg,longitude_deg,height_m,height_sigma_mm,height_system";
  const good = (code: string) =>
    `${header}\n${code}-1,Hut door,46.1,9.2,2410.5,3,DHHN2016\n${code}-2,Col,46.2,9.3,2411,3,DHHN2016\n`;
  const { send, refusedWhole } = fileImport(
    "benchmarks/import",
    { format: "csv", fileName: "marks.csv" },
    benchmarks,
  );
  async function refused(content: Buffer) {
    const { rows, message } = await refusedWhole(content);
    expect(message).toMatch(/in marks\.csv; nothing was imported$/);
    return rows;
  }

  it("refuses a lone 0xFF and a Latin-1 é at their line and column", async () => {
    const text = good("BAD").replace("Col,", "C@ol,");
    expect(await refused(withBytes(text, [0xff]))).toEqual([
      {
        row: 3,
        field: "description",
        message: `Not valid UTF-8 text at character ${charOfMark(text)}; save the file as UTF-8 and import again`,
      },
    ]);
    const latin1 = Buffer.from(good("BAD").replace("Hut door", "Caf\u00e9 door"), "latin1");
    expect((await refused(latin1)).map((r) => [r.row, r.field])).toEqual([[2, "description"]]);
  });

  it("refuses a UTF-16 file on line 1", async () => {
    expect(await refused(utf16WithBom(good("BAD")))).toEqual([
      {
        row: 1,
        field: "file",
        message: "The file is UTF-16 text (or not text); save the file as UTF-8 and import again",
      },
    ]);
  });

  it("names missing columns on line 1 and a last line cut short", async () => {
    const missing = "code,latitude_deg,longitude_deg,height_m\nBAD-1,46.1,9.2,2410\n";
    expect((await refused(utf8(missing))).map((r) => [r.row, r.field])).toEqual([
      [1, "height_system"],
      [1, "height_sigma_mm"],
    ]);
    const cut = good("BAD").trimEnd().slice(0, -12); // "…,46.2,9.3,24"
    expect(await refused(utf8(cut))).toEqual([
      {
        row: 3,
        field: "row",
        message: "The last line is cut short: 5 of 7 columns (is the file complete?)",
      },
    ]);
  });

  it("refuses an empty file by its field, and takes a file with a UTF-8 byte-order mark", async () => {
    const before = await countOf(benchmarks);
    const empty = await send(Buffer.alloc(0));
    expect(empty.status).toBe(400);
    expect(empty.body.error.details).toEqual([{ path: "content", message: "The file is empty" }]);
    expect(await countOf(benchmarks)).toBe(before);
    const res = await send(bom8(utf8(good("BOM"))));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.benchmarks.map((b: { code: string }) => b.code)).toEqual(["BOM-1", "BOM-2"]);
    expect(await countOf(benchmarks)).toBe(before + 2);
  });
});

describe("benchmark GeoJSON", () => {
  const feature = (code: string) =>
    `{"type":"Feature","geometry":{"type":"Point","coordinates":[9.2,46.1]},"properties":{"code":"${code}","height_m":2410.5,"height_sigma_mm":3,"height_system":"DHHN2016"}}`;
  const collection = (...features: string[]) =>
    `{"type":"FeatureCollection",\n"features":[\n${features.join(",\n")}\n]}\n`;
  const { send, refusedWhole } = fileImport("benchmarks/import", { format: "geojson" }, benchmarks);
  const refused = async (content: Buffer) => (await refusedWhole(content)).rows;

  it("refuses bytes that are not UTF-8 and UTF-16, naming the line", async () => {
    const text = collection(feature("GJ-1"), feature("GJ-@2"));
    expect(await refused(withBytes(text, [0xe9]))).toEqual([
      {
        row: 0,
        field: "file",
        message: `Line 4: not valid UTF-8 text at character ${charOfMark(text)}; save the file as UTF-8 and import again`,
      },
    ]);
    expect((await refused(utf16WithBom(collection(feature("GJ-1")))))[0]?.message).toBe(
      "The file is UTF-16 text (or not text); save the file as UTF-8 and import again",
    );
  });

  it("names the line and column where a file cut short mid-JSON stops", async () => {
    const text = collection(feature("GJ-1"), feature("GJ-2"));
    const cut = text.slice(0, text.indexOf("GJ-2") + 20);
    const lastLine = cut.split("\n").at(-1) ?? "";
    expect(await refused(utf8(cut))).toEqual([
      {
        row: 0,
        field: "file",
        message: `The file is not valid JSON: it ends early, at line 4, column ${lastLine.length + 1} (is the file complete?)`,
      },
    ]);
  });

  it("names a missing property at its feature, and takes a UTF-8 byte-order mark", async () => {
    const noHeight = feature("GJ-2").replace(',"height_m":2410.5', "");
    expect(await refused(utf8(collection(feature("GJ-1"), noHeight)))).toEqual([
      { row: 2, field: "height_m", message: "Height must be a number" },
    ]);
    const before = await countOf(benchmarks);
    const res = await send(bom8(utf8(collection(feature("GJ-BOM")))));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(await countOf(benchmarks)).toBe(before + 1);
  });
});

describe("height ties", () => {
  const good =
    "from,to,dh_m,length_km,sigma_mm\nKR-01,KR-02,1.2345,2.1,0.8\nKR-02,KR-03,0.5,1.0,0.5\n";
  const { send, refusedWhole } = fileImport(
    "height-ties/import",
    { fileName: "ties.csv" },
    heightTies,
  );
  const refused = async (content: Buffer) => (await refusedWhole(content)).rows;

  it("refuses a lone 0xFF and a Latin-1 é at their line and column", async () => {
    const text = good.replace("KR-03", "KR@-03");
    expect(await refused(withBytes(text, [0xff]))).toEqual([
      {
        row: 3,
        field: "to",
        message: `Not valid UTF-8 text at character ${charOfMark(text)}; save the file as UTF-8 and import again`,
      },
    ]);
    const latin1 = Buffer.from(good.replace("KR-01,", "Caf\u00e9,"), "latin1");
    expect((await refused(latin1)).map((r) => [r.row, r.field])).toEqual([[2, "from"]]);
  });

  it("refuses a UTF-16 file on line 1", async () => {
    expect(await refused(utf16WithBom(good))).toEqual([
      {
        row: 1,
        field: "file",
        message: "The file is UTF-16 text (or not text); save the file as UTF-8 and import again",
      },
    ]);
  });

  it("names a missing or unknown column on line 1, a line cut short and an unclosed quote", async () => {
    const wrong = "from,to,dh,length_km\nKR-01,KR-02,1.2,2.1\n";
    expect((await refused(utf8(wrong))).filter((r) => r.row === 1)).toEqual([
      { row: 1, field: "dh_m", message: 'The column "dh_m" is missing' },
      {
        row: 1,
        field: "dh",
        message: 'Unknown column "dh" (expected from, to, dh_m, length_km, sigma_mm)',
      },
    ]);
    expect(await refused(utf8(good.trimEnd().slice(0, -8)))).toEqual([
      {
        row: 3,
        field: "row",
        message: "The last line is cut short: 3 of 5 columns (is the file complete?)",
      },
    ]);
    expect(await refused(utf8(`${good}KR-03,"KR-04`))).toEqual([
      { row: 4, field: "row", message: "A quoted value is not closed (is the file complete?)" },
    ]);
  });

  it("refuses an empty file by its field, and takes a file with a UTF-8 byte-order mark", async () => {
    const before = await countOf(heightTies);
    const empty = await send(Buffer.alloc(0));
    expect(empty.status).toBe(400);
    expect(empty.body.error.details).toEqual([{ path: "content", message: "The file is empty" }]);
    const res = await send(bom8(utf8(good)));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(await countOf(heightTies)).toBe(before + 2);
  });
});

describe("comparison series", () => {
  const rows = Array.from(
    { length: 8 },
    (_, i) => `2027-06-02T08:00:${String(i).padStart(2, "0")}Z,${(i + 1) * 1e-17},1`,
  );
  const good = `time,fractional,valid\n${rows.join("\n")}\n`;

  const makeRun = () => createComparisonRun(ctx.app, base, token, siteId, "Broken files");

  const stored = async () => {
    const db = ctx.database.db;
    const [files] = await db.select({ n: count() }).from(comparisonFiles);
    const [chunks] = await db.select({ n: count() }).from(comparisonChunks);
    return { files: files?.n ?? -1, chunks: chunks?.n ?? -1 };
  };
  const send = (runId: string, bytes: Buffer) =>
    request(ctx.app)
      .post(`${base}/comparison-runs/${runId}/files?fileName=series.csv`)
      .set(auth())
      .set("Content-Type", "text/csv")
      .send(bytes);

  async function refused(bytes: Buffer) {
    const runId = await makeRun();
    const before = await stored();
    const res = await send(runId, bytes);
    expect(res.status, JSON.stringify(res.body)).toBe(422);
    expect(res.body.error.code).toBe("invalid_file");
    expect(await stored()).toEqual(before);
    return res.body.error as {
      message: string;
      badRows: number;
      rows: { line: number; field: string; message: string }[];
    };
  }

  it("refuses a lone 0xFF (in a fast row) and a Latin-1 é (in a comment) at their line", async () => {
    const text = good.replace(",4e-17,", ",4e-17@,");
    const ff = await refused(withBytes(text, [0xff]));
    expect(ff.message).toBe("1 row is not readable; nothing was stored");
    expect(ff.rows).toEqual([
      {
        line: 5,
        field: "fractional",
        message: `not valid UTF-8 text at character ${charOfMark(text)}: save the file as UTF-8`,
      },
    ]);
    const latin1 = await refused(Buffer.from(`# Kl\u00e9 run\n${good}`, "latin1"));
    expect(latin1.rows.map((r) => [r.line, r.field])).toEqual([[1, "text"]]);
  });

  it("refuses a UTF-16 file with one line-1 error, counting every line", async () => {
    const error = await refused(utf16WithBom(good));
    expect(error.rows).toEqual([
      {
        line: 1,
        field: "file",
        message: "the file is UTF-16 text (or not text): save it as UTF-8",
      },
    ]);
    expect(error.badRows).toBe(10);
  });

  it("names wrong columns on the header and a last line cut short", async () => {
    const wrong = await refused(utf8(`when,what\n${rows.join("\n")}\n`));
    expect(wrong.rows[0]).toEqual({
      line: 1,
      field: "header",
      message: "the header names no time column (time, timestamp, utc or mjd)",
    });
    const cut = await refused(utf8(`${good}2027-06-02T08:00:0`));
    expect(cut.rows).toEqual([
      {
        line: 10,
        field: "row",
        message: "expected time, value and an optional validity flag; found 1 column(s)",
      },
    ]);
  });

  it("refuses an empty file, and stores a file with a UTF-8 byte-order mark", async () => {
    const empty = await refused(Buffer.alloc(0));
    expect(empty.message).toBe("File refused: the file holds no data rows");
    const runId = await makeRun();
    const before = await stored();
    const res = await send(runId, bom8(utf8(good)));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.file).toMatchObject({ rowCount: 8, validCount: 8 });
    expect((await stored()).files).toBe(before.files + 1);
  });
});
