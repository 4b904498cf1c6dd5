// Splitting an import into entries the shared schema accepts, and the mapping remembered per model.
import { describe, expect, it } from "vitest";
import { fieldEntryInput, type TemperatureSample } from "../../../../shared/schemas/field-entries";
import {
  recallMapping,
  rememberMapping,
  rememberedModels,
} from "../../../../src/features/field-imports/mapping-memory";
import type {
  ColumnMapping,
  TemperatureColumns,
} from "../../../../src/features/field-imports/parse/mapping";
import { splitIntoDrafts } from "../../../../src/features/field-imports/parse/split";

const siteId = "7a0c9a4e-3a43-4e8e-9d55-6a1f1f0b2a01";
const crateId = "0b6f5b7e-1d8c-4a55-8f3e-2a4c6d8e0f12";
const importId = "5f1e2d3c-4b5a-4697-8877-665544332211";
const startMs = Date.UTC(2026, 5, 3, 0, 0, 0);

const samples = (n: number): TemperatureSample[] =>
  Array.from({ length: n }, (_, i) => ({
    at: new Date(startMs + i * 60_000).toISOString(),
    celsius: 20 + (i % 10) / 10,
    humidityPct: null,
  }));

const target = { siteId, crateId, loggerModel: " TL-9 ", fileName: "crate-3.csv" };

describe("splitIntoDrafts", () => {
  it("splits 12,001 samples into 3 parts of 5000, 5000 and 2001 sharing one import id", () => {
    const drafts = splitIntoDrafts(
      { kind: "temperatures", samples: samples(12_001) },
      target,
      importId,
    );
    expect(drafts).toHaveLength(3);
    const sizes = drafts.map((d) => (d.data.kind === "temperatures" ? d.data.samples.length : 0));
    expect(sizes).toEqual([5000, 5000, 2001]);
    expect(sizes.reduce((a, b) => a + b)).toBe(12_001);
    drafts.forEach((draft, i) => {
      expect(draft.data).toMatchObject({
        kind: "temperatures",
        source: "logger",
        loggerModel: "TL-9",
        import: { importId, fileName: "crate-3.csv", part: i + 1, parts: 3 },
      });
      // observedAt is the first time of the part: 5000 one-minute steps per part.
      expect(draft.observedAt).toBe(new Date(startMs + i * 5000 * 60_000).toISOString());
      // Every part is an entry the shared schema accepts.
      const parsed = fieldEntryInput.safeParse({
        ...draft,
        id: crypto.randomUUID(),
        recordedAt: new Date().toISOString(),
      });
      expect(parsed.success, JSON.stringify(parsed.error?.issues)).toBe(true);
    });
  });

  it("splits shock events at 2000 and dates a part by its earliest event", () => {
    const events = Array.from({ length: 2001 }, (_, i) => ({
      at: new Date(startMs + (2001 - i) * 1000).toISOString(),
      xG: 3,
      yG: null,
      zG: null,
      durationMs: 11,
    }));
    const drafts = splitIntoDrafts({ kind: "shock-log", events }, target, importId);
    expect(drafts.map((d) => (d.data.kind === "shock-log" ? d.data.events.length : 0))).toEqual([
      2000, 1,
    ]);
    expect(drafts[0]?.observedAt).toBe(new Date(startMs + 2 * 1000).toISOString());
    expect(drafts[1]?.observedAt).toBe(new Date(startMs + 1000).toISOString());
    for (const draft of drafts)
      expect(
        fieldEntryInput.safeParse({
          ...draft,
          id: crypto.randomUUID(),
          recordedAt: draft.observedAt,
        }).success,
      ).toBe(true);
  });

  it("gives a fresh import id per import by default", () => {
    const a = splitIntoDrafts({ kind: "temperatures", samples: samples(2) }, target);
    const b = splitIntoDrafts({ kind: "temperatures", samples: samples(2) }, target);
    expect(a[0]?.data.kind === "temperatures" && a[0].data.import?.importId).not.toBe(
      b[0]?.data.kind === "temperatures" && b[0].data.import?.importId,
    );
  });
});

function memoryStorage() {
  const items = new Map<string, string>();
  return {
    getItem: (k: string) => items.get(k) ?? null,
    setItem: (k: string, v: string) => void items.set(k, v),
    items,
  };
}

const columns: TemperatureColumns = {
  kind: "temperatures",
  temperature: "T",
  humidity: null,
  temperatureUnit: "degC",
};
const mapping: ColumnMapping = {
  headerLine: 1,
  delimiter: ";",
  decimalSeparator: ",",
  time: { column: "Zeit", format: "local", utcOffsetMinutes: 60 },
  values: { kind: "temperatures", temperature: "T", humidity: null, temperatureUnit: "degC" },
};

describe("mapping memory", () => {
  it("remembers a mapping per kind and logger model (case and spaces aside)", () => {
    const storage = memoryStorage();
    rememberMapping("TL-9", mapping, storage);
    expect(recallMapping("temperatures", " tl-9 ", storage)).toEqual(mapping);
    expect(recallMapping("shock-log", "TL-9", storage)).toBeNull();
    expect(recallMapping("temperatures", "other", storage)).toBeNull();
    expect(rememberedModels("temperatures", storage)).toEqual(["TL-9"]);
  });

  it("ignores a stored value that does not pass the schema", () => {
    const storage = memoryStorage();
    storage.setItem(
      "equipot.loggerMappings.v1",
      JSON.stringify({ "temperatures:x": { loggerModel: "x", mapping: { headerLine: 0 } } }),
    );
    expect(recallMapping("temperatures", "x", storage)).toBeNull();
    storage.setItem("equipot.loggerMappings.v1", "{not json");
    expect(recallMapping("temperatures", "x", storage)).toBeNull();
  });
});

describe("a large file end to end", () => {
  it("parses 12,001 rows with progress in slices, then splits them into 3 parts", async () => {
    const { parseLoggerText } =
      await import("../../../../src/features/field-imports/parse/parse-csv");
    const rows = samples(12_001).map((s) => `${s.at},${s.celsius}`);
    const text = `time,temp\n${rows.join("\n")}\n`;
    const progress: number[] = [];
    const parsed = await parseLoggerText(
      text,
      {
        ...mapping,
        delimiter: ",",
        decimalSeparator: ".",
        time: { column: "time", format: "iso", utcOffsetMinutes: 0 },
        values: { ...columns, temperature: "temp" },
      },
      (p) => progress.push(p.doneChars / p.totalChars),
    );
    expect(parsed.errors).toEqual([]);
    expect(parsed.rows).toBe(12_001);
    expect(progress.length).toBeGreaterThanOrEqual(6);
    expect([...progress].sort((a, b) => a - b)).toEqual(progress);
    expect(progress.at(-1)).toBe(1);
    if (parsed.kind !== "temperatures") throw new Error("expected temperatures");
    expect(splitIntoDrafts(parsed, target, importId)).toHaveLength(3);
  });
});

describe("line numbers deep in a file", () => {
  it("still names the right line after the parser paused for the progress bar", async () => {
    const { parseLoggerText } =
      await import("../../../../src/features/field-imports/parse/parse-csv");
    const rows = samples(7000).map((s) => `${s.at},${s.celsius}`);
    rows[4500] = `${samples(4501)[4500]?.at ?? ""},warm`;
    const text = `time,temp\n\n${rows.join("\n")}\n`;
    const parsed = await parseLoggerText(text, {
      ...mapping,
      delimiter: ",",
      decimalSeparator: ".",
      time: { column: "time", format: "iso", utcOffsetMinutes: 0 },
      values: { ...columns, temperature: "temp" },
    });
    // Header on line 1, an empty line 2, row index 4500 on line 4503.
    expect(parsed.errors.map((e) => e.text)).toEqual([
      'Line 4503: temperature "warm" is not a number',
    ]);
  });
});
