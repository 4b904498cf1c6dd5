// The benchmark form's draft ↔ stored fields, the file format by name, row problems in words and
// the list's number formats.
import { describe, expect, test } from "vitest";
import { benchmarkFields, type BenchmarkView } from "../../../shared/schemas/benchmarks";
import {
  draftFromBenchmark,
  fieldsFromDraft,
} from "../../../src/features/benchmarks/lib/benchmark-draft";
import {
  describeRowProblem,
  formatOfFileName,
} from "../../../src/features/benchmarks/lib/benchmark-file";
import { formatPublishedHeightM, formatSigmaMm } from "../../../src/features/benchmarks/lib/format";

const stored: BenchmarkView = {
  id: "7f1c2a4e-0d55-4a4e-9f0e-2d3b6f1a9c01",
  campaignId: "1b0f3f7e-5a7e-4c1d-8f4a-0e9d2c3b4a51",
  code: "KR-BM-117",
  description: "Bolt in the hut's north foundation wall",
  latitudeDeg: 47.08447,
  longitudeDeg: 11.22691,
  heightM: 2869.412,
  heightSigmaM: 0.0003,
  heightSystem: "Normal heights",
  datum: "Demo datum 2016",
  source: "Invented",
  version: 3,
  updatedAt: "2027-06-01T08:00:00.000Z",
};

describe("benchmark draft", () => {
  test("σ is typed in mm and stored in m without binary noise", () => {
    const draft = draftFromBenchmark(stored);
    expect(draft.heightSigmaM).toBe("0.3");
    expect(fieldsFromDraft(draft).heightSigmaM).toBe(0.0003);
  });

  test("a decimal comma is read", () => {
    const fields = fieldsFromDraft({
      ...draftFromBenchmark(null),
      code: "KR-BM-201",
      latitudeDeg: "47,08512",
      longitudeDeg: "11,22304",
      heightM: "2874,118",
      heightSigmaM: "2,5",
      heightSystem: "Normal heights",
    });
    expect(fields).toMatchObject({
      latitudeDeg: 47.08512,
      longitudeDeg: 11.22304,
      heightM: 2874.118,
      heightSigmaM: 0.0025,
    });
    expect(benchmarkFields.safeParse(fields).success).toBe(true);
  });

  test("unreadable numbers reach the schema, which names the field", () => {
    const fields = fieldsFromDraft({ ...draftFromBenchmark(stored), heightM: "about 2869" });
    const parsed = benchmarkFields.safeParse(fields);
    expect(parsed.success).toBe(false);
    expect(parsed.error?.issues.map((i) => [i.path.join("."), i.message])).toEqual([
      ["heightM", "Height must be a number"],
    ]);
  });

  test("a new benchmark takes the height system and datum it is given", () => {
    const draft = draftFromBenchmark(null, { heightSystem: "Normal heights", datum: "D16" });
    expect(draft).toMatchObject({ code: "", heightM: "", heightSystem: "Normal heights" });
    expect(draft.datum).toBe("D16");
  });
});

describe("benchmark files", () => {
  test.each([
    ["marks.csv", "csv"],
    ["MARKS.CSV", "csv"],
    ["marks.txt", "csv"],
    ["marks.geojson", "geojson"],
    ["marks.json", "geojson"],
    ["marks.xlsx", null],
    ["marks", null],
  ])("%s reads as %s", (name, format) => expect(formatOfFileName(name)).toBe(format));

  test("problems name the line, the feature or the file", () => {
    const row = { row: 3, field: "latitude_deg", message: "Latitude must be between -90 and 90 °" };
    expect(describeRowProblem("csv", row)).toBe(
      "Line 3, latitude_deg: Latitude must be between -90 and 90 °",
    );
    expect(describeRowProblem("geojson", { ...row, row: 2, field: "geometry" })).toBe(
      "Feature 2, geometry: Latitude must be between -90 and 90 °",
    );
    expect(
      describeRowProblem("geojson", {
        row: 0,
        field: "file",
        message: "The file is not valid JSON",
      }),
    ).toBe("The file: The file is not valid JSON");
  });
});

describe("benchmark numbers", () => {
  test("heights to the millimetre, a fourth decimal when given", () => {
    expect(formatPublishedHeightM(2869.412)).toBe("2869.412 m");
    expect(formatPublishedHeightM(2862.0735)).toBe("2862.0735 m");
    expect(formatPublishedHeightM(-3.5)).toBe("−3.500 m");
  });
  test("σ in mm", () => {
    expect(formatSigmaMm(0.004)).toBe("4.0 mm");
    expect(formatSigmaMm(0.0025)).toBe("2.5 mm");
    expect(formatSigmaMm(0.00025)).toBe("0.25 mm");
  });
});
