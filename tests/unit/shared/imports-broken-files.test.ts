// Broken files through the parsers that run on the tablet or on both sides: the benchmark file
// reader (CSV and GeoJSON, shared), the comparison series reader (shared) and the logger CSV
// import (tablet only). Bytes are decoded as the app decodes them, with TextDecoder("utf-8"):
// a byte that is not UTF-8 becomes U+FFFD, a UTF-8 byte-order mark is dropped, a UTF-16 file
// keeps its NULs. Each kind of damage is refused with its line (and column or character), and
// no readings, samples or benchmarks come out. A UTF-8 byte-order mark is accepted: spreadsheets
// write one when saving "CSV UTF-8", and it carries no data.
import { describe, expect, it } from "vitest";
import { readBenchmarkFile } from "../../../shared/benchmark-import";
import { createSeriesReader } from "../../../shared/comparison";
import type { ColumnMapping } from "../../../src/features/field-imports/parse/mapping";
import { parseLoggerText } from "../../../src/features/field-imports/parse/parse-csv";
import { readFileText } from "../../../src/features/field-imports/parse/read-file";

const decode = (bytes: Buffer) => new TextDecoder("utf-8").decode(bytes);
const utf8 = (text: string) => Buffer.from(text, "utf8");
const utf16WithBom = (text: string) =>
  Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(text, "utf16le")]);
/** `text` with the bytes `bad` put in place of the first "@". */
const withBytes = (text: string, bad: number[]) => {
  const [before = "", after = ""] = text.split("@");
  return Buffer.concat([utf8(before), Buffer.from(bad), utf8(after)]);
};

describe("benchmark CSV", () => {
  const header =
    "code,description,latitude_deg,longitude_deg,height_m,height_sigma_mm,height_system";
  const good = `${header}\nKR-01,Hut door,46.1,9.2,2410.5,3,DHHN2016\nKR-02,Col,46.2,9.3,2411,3,DHHN2016\n`;
  const read = (bytes: Buffer) => readBenchmarkFile("csv", decode(bytes));

  it("reads the good file, with or without a UTF-8 byte-order mark", () => {
    for (const bytes of [
      utf8(good),
      Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), utf8(good)]),
    ]) {
      const result = read(bytes);
      expect(result.ok && result.benchmarks.map((b) => [b.code, b.row])).toEqual([
        ["KR-01", 2],
        ["KR-02", 3],
      ]);
    }
  });

  it("refuses a lone 0xFF and a Latin-1 é at their line, under their column", () => {
    const ff = read(withBytes(good.replace("Col,", "C@ol,"), [0xff]));
    expect(ff).toEqual({
      ok: false,
      errorCount: 1,
      errors: [
        {
          row: 3,
          field: "description",
          message: "Not valid UTF-8 text at character 8; save the file as UTF-8 and import again",
        },
      ],
    });
    const latin1 = read(Buffer.from(good.replace("Hut door", "Caf\u00e9 door"), "latin1"));
    expect(latin1.ok ? [] : latin1.errors.map((e) => [e.row, e.field])).toEqual([
      [2, "description"],
    ]);
  });

  it("refuses a UTF-16 file as a whole, on line 1", () => {
    const result = read(utf16WithBom(good));
    expect(result.ok ? [] : result.errors).toEqual([
      {
        row: 1,
        field: "file",
        message: "The file is UTF-16 text (or not text); save the file as UTF-8 and import again",
      },
    ]);
  });

  it("names missing columns on line 1, a line cut short and an unclosed quote", () => {
    const missing = read(utf8("code,latitude_deg,longitude_deg,height_m\nKR-01,46.1,9.2,2410\n"));
    expect(missing.ok ? [] : missing.errors.map((e) => [e.row, e.field])).toEqual([
      [1, "height_system"],
      [1, "height_sigma_mm"],
    ]);
    const cut = read(utf8(good.trimEnd().slice(0, -12)));
    expect(cut.ok ? [] : cut.errors).toEqual([
      {
        row: 3,
        field: "row",
        message: "The last line is cut short: 5 of 7 columns (is the file complete?)",
      },
    ]);
    const quote = read(utf8(`${good}KR-03,"Ridge south`));
    expect(quote.ok ? [] : quote.errors).toEqual([
      { row: 4, field: "row", message: "A quoted value is not closed (is the file complete?)" },
    ]);
  });

  it("says an empty file has no header line", () => {
    expect(read(utf8("\n\n"))).toMatchObject({
      ok: false,
      errors: [{ row: 1, field: "file", message: "The file has no header line" }],
    });
  });
});

describe("benchmark GeoJSON", () => {
  const feature = (code: string, height = ',"height_m":2410.5') =>
    `{"type":"Feature","geometry":{"type":"Point","coordinates":[9.2,46.1]},"properties":{"code":"${code}"${height},"height_sigma_mm":3,"height_system":"DHHN2016"}}`;
  const collection = (...features: string[]) =>
    `{"type":"FeatureCollection",\n"features":[\n${features.join(",\n")}\n]}\n`;
  const good = collection(feature("KR-01"), feature("KR-02"));
  const read = (bytes: Buffer) => readBenchmarkFile("geojson", decode(bytes));

  it("reads the good file, with or without a UTF-8 byte-order mark", () => {
    expect(read(utf8(good))).toMatchObject({ ok: true, benchmarks: [{ row: 1 }, { row: 2 }] });
    expect(read(Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), utf8(good)])).ok).toBe(true);
  });

  it("refuses bytes that are not UTF-8, naming their line and character", () => {
    const result = read(withBytes(good.replace('"KR-02"', '"KR-@02"'), [0xe9]));
    expect(result.ok ? [] : result.errors).toEqual([
      {
        row: 0,
        field: "file",
        message:
          "Line 4: not valid UTF-8 text at character 97; save the file as UTF-8 and import again",
      },
    ]);
    expect(read(utf16WithBom(good))).toMatchObject({
      ok: false,
      errors: [{ row: 0, field: "file", message: expect.stringMatching(/^The file is UTF-16/) }],
    });
  });

  // Positions counted independently (Python str.index on the same text): 97, 124 and 119.
  it("names the line and column where a cut-short or broken file stops", () => {
    const cut = read(utf8(good.slice(0, good.indexOf("KR-02") + 30)));
    expect(cut.ok ? [] : cut.errors.map((e) => e.message)).toEqual([
      "The file is not valid JSON: it ends early, at line 4, column 124 (is the file complete?)",
    ]);
    // A comma left out in the second feature. (Where an engine's message gives no position,
    // e.g. V8's "Unexpected token", the plain sentence is all there is.)
    const second = feature("KR-02").replace(',"height_sigma_mm"', ' "height_sigma_mm"');
    const broken = read(utf8(collection(feature("KR-01"), second)));
    expect(broken.ok ? [] : broken.errors.map((e) => e.message)).toEqual([
      "The file is not valid JSON at line 4, column 119",
    ]);
  });

  it("names a missing property at its feature", () => {
    const result = read(utf8(collection(feature("KR-01"), feature("KR-02", ""))));
    expect(result.ok ? [] : result.errors).toEqual([
      { row: 2, field: "height_m", message: "Height must be a number" },
    ]);
  });
});

describe("comparison series (shared reader)", () => {
  const rows = Array.from(
    { length: 8 },
    (_, i) => `2027-06-02T08:00:${String(i).padStart(2, "0")}Z,${(i + 1) * 1e-17},1`,
  );
  const good = `time,fractional,valid\n${rows.join("\n")}\n`;
  function read(bytes: Buffer) {
    const samples: number[] = [];
    const reader = createSeriesReader({
      valueKind: "fractional",
      onSample: (t) => samples.push(t),
    });
    decode(bytes)
      .split(/\r\n|\n|\r/)
      .forEach((line, i) => reader.line(line, i + 1));
    return { summary: reader.finish(), samples };
  }

  it("reads the good file, with or without a UTF-8 byte-order mark", () => {
    expect(read(utf8(good)).samples).toHaveLength(8);
    expect(read(Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), utf8(good)])).samples).toHaveLength(
      8,
    );
  });

  it("refuses bytes that are not UTF-8 at their line, under their column", () => {
    const { summary } = read(withBytes(good.replace(",4e-17", ",4e-17@"), [0xff]));
    expect(summary.errors).toEqual([
      {
        line: 5,
        field: "fractional",
        message: "not valid UTF-8 text at character 27: save the file as UTF-8",
      },
    ]);
    const latin1 = read(Buffer.from(`# Kl\u00e9 run\n${good}`, "latin1")).summary;
    expect(latin1.errors.map((e) => [e.line, e.field])).toEqual([[1, "text"]]);
  });

  it("refuses a UTF-16 file with one error on line 1, counting every line", () => {
    const { summary, samples } = read(utf16WithBom(good));
    expect(summary.errors).toEqual([
      {
        line: 1,
        field: "file",
        message: "the file is UTF-16 text (or not text): save it as UTF-8",
      },
    ]);
    expect(summary.badRows).toBe(10);
    expect(samples).toEqual([]);
  });

  it("names wrong columns on the header, a line cut short, and says when nothing is there", () => {
    expect(read(utf8(`when,what\n${rows.join("\n")}\n`)).summary.errors[0]).toEqual({
      line: 1,
      field: "header",
      message: "the header names no time column (time, timestamp, utc or mjd)",
    });
    const cut = read(utf8(`${good}2027-06-02T08:00:0`)).summary;
    expect(cut.errors.map((e) => [e.line, e.field])).toEqual([[10, "row"]]);
    expect(read(utf8("")).summary).toMatchObject({
      badRows: 0,
      problem: "the file holds no data rows",
    });
  });
});

describe("logger CSV on the tablet", () => {
  const mapping: ColumnMapping = {
    headerLine: 1,
    delimiter: ",",
    decimalSeparator: ".",
    time: { column: "time", format: "iso", utcOffsetMinutes: 0 },
    values: {
      kind: "temperatures",
      temperature: "temperature",
      humidity: null,
      temperatureUnit: "degC",
    },
  };
  const good = "time,temperature\n2027-06-02T08:00:00Z,21.5\n2027-06-02T08:05:00Z,21.7\n";
  const parse = async (bytes: Buffer) =>
    parseLoggerText(await readFileText(new Blob([new Uint8Array(bytes)])), mapping);
  const texts = (p: Awaited<ReturnType<typeof parse>>) => p.errors.map((e) => e.text);
  const readings = (p: Awaited<ReturnType<typeof parse>>) =>
    p.kind === "temperatures" ? p.samples.length : -1;

  it("reads the good file, with or without a UTF-8 byte-order mark", async () => {
    expect(readings(await parse(utf8(good)))).toBe(2);
    expect(
      readings(await parse(Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), utf8(good)]))),
    ).toBe(2);
  });

  it("refuses bytes that are not UTF-8 and a UTF-16 file, by line, importing nothing", async () => {
    const ff = await parse(withBytes(good.replace("21.7", "21.7@"), [0xff]));
    expect(texts(ff)).toEqual(["Line 3: the file is not valid UTF-8 text"]);
    expect(readings(ff)).toBe(0);
    const utf16 = await parse(utf16WithBom(good));
    expect(texts(utf16)).toEqual([
      "Line 1: the file is UTF-16 text (or not text); save it as UTF-8",
    ]);
    expect(readings(utf16)).toBe(0);
  });

  it("names a missing column, a line cut short and an empty file", async () => {
    expect(texts(await parse(utf8("when,temperature\n2027-06-02T08:00:00Z,21.5\n")))).toEqual([
      'Line 1: the time column "time" is not in the header (columns: when, temperature)',
    ]);
    const cut = await parse(utf8(`${good}2027-06-02T08:10:00Z`));
    expect(texts(cut)).toEqual(["Line 4: the last line is cut short (is the file complete?)"]);
    expect(readings(cut)).toBe(0);
    expect(texts(await parse(utf8("")))).toEqual(["The file is empty"]);
  });
});
