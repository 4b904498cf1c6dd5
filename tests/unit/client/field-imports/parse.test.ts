// Logger CSV import: good files of each documented format, each kind of bad row with its line
// number as in the file, and the unit conversions checked against values worked out by hand.
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { guessMapping, sniff } from "../../../../src/features/field-imports/parse/guess";
import type {
  ColumnMapping,
  TemperatureColumns,
} from "../../../../src/features/field-imports/parse/mapping";
import {
  parseLoggerText,
  type ParsedFile,
} from "../../../../src/features/field-imports/parse/parse-csv";
import { readFileText } from "../../../../src/features/field-imports/parse/read-file";
import {
  STANDARD_GRAVITY_M_S2,
  toCelsius,
  toG,
} from "../../../../src/features/field-imports/parse/units";

const fixture = (name: string) =>
  readFileSync(new URL(`../../../fixtures/loggers/${name}`, import.meta.url), "utf8");

/** Guess the mapping from the file itself, as the import screen does (device at UTC+02:00). */
async function importGuessed(text: string, kind: ColumnMapping["values"]["kind"], offset = 120) {
  const mapping = guessMapping(kind, sniff(text), offset);
  return { mapping, parsed: await parseLoggerText(text, mapping) };
}

const samplesOf = (p: ParsedFile) => (p.kind === "temperatures" ? p.samples : []);
const eventsOf = (p: ParsedFile) => (p.kind === "shock-log" ? p.events : []);

describe("unit conversions", () => {
  it("uses g0 = 9.80665 m/s², the conventional standard gravity (3rd CGPM, 1901 — published)", () => {
    expect(STANDARD_GRAVITY_M_S2).toBe(9.80665);
    expect(toG(9.80665, "m/s2")).toBe(1);
    expect(toG(98.0665, "m/s2")).toBeCloseTo(10, 12);
    expect(toG(12, "g")).toBe(12);
  });

  it("converts °F to °C (hand values: 32 °F freezing, 212 °F boiling, −40 equal, 98.6 °F = 37 °C)", () => {
    expect(toCelsius(32, "degF")).toBe(0);
    expect(toCelsius(212, "degF")).toBe(100);
    expect(toCelsius(-40, "degF")).toBe(-40);
    expect(toCelsius(98.6, "degF")).toBeCloseTo(37, 12);
    expect(toCelsius(21.5, "degC")).toBe(21.5);
  });
});

describe("good files", () => {
  it("reads ISO 8601 times with an offset, °C and optional humidity", async () => {
    const { mapping, parsed } = await importGuessed(
      fixture("temperatures-iso.csv"),
      "temperatures",
    );
    expect(mapping.time).toEqual({ column: "Timestamp", format: "iso", utcOffsetMinutes: 120 });
    expect(mapping.values).toEqual({
      kind: "temperatures",
      temperature: "Temperature (°C)",
      humidity: "RH (%)",
      temperatureUnit: "degC",
    });
    expect(parsed.errors).toEqual([]);
    expect(samplesOf(parsed)).toEqual([
      // 14:05+02:00 is 12:05 UTC.
      { at: "2026-06-03T12:05:00.000Z", celsius: 21.5, humidityPct: 45 },
      { at: "2026-06-03T12:10:00.000Z", celsius: 21.7, humidityPct: 44.8 },
      { at: "2026-06-03T12:15:00.000Z", celsius: 22, humidityPct: null },
    ]);
  });

  it("reads local times with a chosen UTC offset, ';' delimiter, decimal comma and CRLF", async () => {
    const { mapping, parsed } = await importGuessed(
      fixture("temperatures-local-comma.csv"),
      "temperatures",
      120,
    );
    expect(mapping.delimiter).toBe(";");
    expect(mapping.decimalSeparator).toBe(",");
    expect(mapping.time.format).toBe("local");
    expect(parsed.errors).toEqual([]);
    expect(samplesOf(parsed)).toEqual([
      { at: "2026-06-03T12:05:00.000Z", celsius: 21.5, humidityPct: 45 },
      { at: "2026-06-03T12:10:00.000Z", celsius: -3.25, humidityPct: 44.8 },
      { at: "2026-06-03T12:15:00.000Z", celsius: 22, humidityPct: 46 },
    ]);
    const west = await parseLoggerText(fixture("temperatures-local-comma.csv"), {
      ...mapping,
      time: { ...mapping.time, utcOffsetMinutes: -300 },
    });
    expect(samplesOf(west)[0]?.at).toBe("2026-06-03T19:05:00.000Z");
  });

  it("reads Unix seconds and converts °F (1780488300 s is 2026-06-03 12:05 UTC — computed with Python calendar.timegm)", async () => {
    const { mapping, parsed } = await importGuessed(
      fixture("temperatures-unix-fahrenheit.csv"),
      "temperatures",
    );
    expect(mapping.time.format).toBe("unix-s");
    expect(mapping.values).toMatchObject({ temperatureUnit: "degF", humidity: null });
    expect(parsed.errors).toEqual([]);
    expect(samplesOf(parsed).map((s) => [s.at, s.celsius])).toEqual([
      ["2026-06-03T12:05:00.000Z", 37],
      ["2026-06-03T12:10:00.000Z", 0],
      ["2026-06-03T12:15:00.000Z", -40],
      ["2026-06-03T12:20:00.000Z", 85],
    ]);
  });

  it("skips a preamble above the header and converts m/s² peaks to g", async () => {
    const { mapping, parsed } = await importGuessed(fixture("shock-ms2-preamble.csv"), "shock-log");
    expect(mapping.headerLine).toBe(4);
    expect(mapping.values).toEqual({
      kind: "shock-log",
      x: "Peak X (m/s²)",
      y: "Peak Y (m/s²)",
      z: "Peak Z (m/s²)",
      duration: "Duration (ms)",
      accelerationUnit: "m/s2",
    });
    expect(parsed.errors).toEqual([]);
    expect(eventsOf(parsed)).toEqual([
      { at: "2026-06-03T08:00:00.000Z", xG: 10, yG: 1, zG: null, durationMs: 11 },
      { at: "2026-06-03T09:30:00.000Z", xG: null, yG: null, zG: 20, durationMs: 6.5 },
    ]);
  });

  it("keeps shock events in the file's order (no order required) with g and Unix times", async () => {
    const { parsed } = await importGuessed(fixture("shock-g-unix.csv"), "shock-log");
    expect(parsed.errors).toEqual([]);
    expect(eventsOf(parsed)).toEqual([
      { at: "2026-06-03T12:05:00.000Z", xG: 12.5, yG: 3.1, zG: 0.4, durationMs: 11 },
      { at: "2026-06-03T12:00:00.000Z", xG: 2, yG: 0, zG: 1, durationMs: null },
    ]);
  });

  it("reads a File slice by slice and reports bytes read of the total", async () => {
    const text = fixture("temperatures-iso.csv").repeat(1);
    const seen: number[] = [];
    const read = await readFileText(new Blob([text]), (p) => seen.push(p.doneBytes / p.totalBytes));
    expect(read).toBe(text);
    expect(seen.at(-1)).toBe(1);
  });
});

describe("bad rows, each with its line number (header is line 1)", () => {
  const columns: TemperatureColumns = {
    kind: "temperatures",
    temperature: "temperature",
    humidity: "rh",
    temperatureUnit: "degC",
  };
  const base: ColumnMapping = {
    headerLine: 1,
    delimiter: ",",
    decimalSeparator: ".",
    time: { column: "time", format: "iso", utcOffsetMinutes: 0 },
    values: {
      kind: "temperatures",
      temperature: "temperature",
      humidity: "rh",
      temperatureUnit: "degC",
    },
  };

  it("names every problem and imports nothing", async () => {
    const parsed = await parseLoggerText(fixture("temperatures-bad.csv"), base);
    expect(parsed.errors.map((e) => e.text)).toEqual([
      'Line 3: temperature "abc" is not a number',
      "Line 4: time is empty",
      "Line 5: time 2026-06-03T12:04:00.000Z is not after the previous reading's (line 3)",
      "Line 6: temperature 90 °C is outside −50 … 85 °C",
      "Line 7: humidity 140 % is outside 0 … 100 %",
      "Line 8: expected 3 columns, found 2",
      "Line 9: expected 3 columns, found 4",
      'Line 10: time "2026-06-03 12:30:00" is not an ISO 8601 time with an offset',
      "Line 11: the last line is cut short (is the file complete?)",
    ]);
    expect(parsed.errorCount).toBe(9);
    expect(samplesOf(parsed)).toEqual([]);
  });

  it("reports bytes that are not UTF-8 on their line", async () => {
    const text = await readFileText(
      new Blob([
        readFileSync(new URL("../../../fixtures/loggers/temperatures-latin1.csv", import.meta.url)),
      ]),
    );
    const parsed = await parseLoggerText(text, {
      ...base,
      values: { ...columns, humidity: null },
    });
    expect(parsed.errors.map((e) => e.text)).toEqual(["Line 7: the file is not valid UTF-8 text"]);
  });

  it("names a mapped column missing from the header", async () => {
    const parsed = await parseLoggerText(fixture("temperatures-iso.csv"), base);
    expect(parsed.errors[0]?.text).toBe(
      'Line 1: the time column "time" is not in the header (columns: Timestamp, Temperature (°C), RH (%))',
    );
  });

  it("says so for an empty file and for a header without readings", async () => {
    expect((await parseLoggerText("", base)).errors[0]?.text).toBe("The file is empty");
    expect((await parseLoggerText("\uFEFF\n  \n", base)).errors[0]?.text).toBe("The file is empty");
    expect((await parseLoggerText("time,temperature,rh\n\n", base)).errors[0]?.text).toBe(
      "The file has a header but no readings",
    );
  });

  it("refuses peaks outside 0 … 1000 g after conversion, naming both units", async () => {
    const text = "t,x\n2026-06-03T12:00:00Z,9900\n2026-06-03T12:01:00Z,-5\n2026-06-03T12:02:00Z,\n";
    const parsed = await parseLoggerText(text, {
      ...base,
      time: { ...base.time, column: "t" },
      values: {
        kind: "shock-log",
        x: "x",
        y: null,
        z: null,
        duration: null,
        accelerationUnit: "m/s2",
      },
    });
    expect(parsed.errors.map((e) => e.text)).toEqual([
      // 9900 / 9.80665 = 1009.52 g.
      "Line 2: peak x 9900 m/s² (1009.52 g) is outside 0 … 1000 g",
      "Line 3: peak x -5 m/s² (-0.51 g) is outside 0 … 1000 g",
      "Line 4: no peak on any axis",
    ]);
  });

  it("refuses a mapping that cannot work, naming the field", async () => {
    const parsed = await parseLoggerText(fixture("temperatures-iso.csv"), {
      ...base,
      decimalSeparator: ",",
      values: { ...columns, temperature: "" },
    });
    expect(parsed.errors.map((e) => e.text)).toEqual([
      "Mapping: Choose a column",
      "Mapping: A decimal comma needs a delimiter other than the comma",
    ]);
  });

  it("refuses an unset logger clock and milliseconds read as seconds", async () => {
    const text = "time,temperature\n100,20\n1780488300000,20\n";
    const parsed = await parseLoggerText(text, {
      ...base,
      time: { ...base.time, format: "unix-s" },
      values: { ...columns, humidity: null },
    });
    expect(parsed.errors.map((e) => e.line)).toEqual([2, 3]);
    expect(parsed.errors[0]?.text).toContain("gives 1970-01-01, outside 1990–2099");
  });
});
