import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { resultCsv } from "../../../src/features/comparison/lib/result-export";
import {
  heightResultView,
  officialHeightsCaution,
  type HeightResultView,
} from "../../../shared/schemas/comparison";

// A result shaped as the server sends it (validated by the shared schema, so the test cannot
// drift from the contract); the figures are invented.
const result: HeightResultView = heightResultView.parse({
  runId: "6f0c8a36-0c59-4c39-9d1e-8d7d1c8b1e11",
  dataRevision: 2,
  analysis: { state: "done", dataRevision: 2, error: null },
  clock: {
    meanFractional: 2.9e-13,
    geopotentialDifference: 26054.25,
    heightDifferenceM: 2657.694,
    sigmaM: 0.0405,
  },
  budget: [
    { term: "statistical", kind: "statistical", fractional: 3.72e-18, heightM: 0.03414 },
    { term: "EQ-T1 systematic", kind: "systematic", fractional: 1.87e-18, heightM: 0.01716 },
  ],
  combinedHeightUncertaintyM: 0.0382,
  levelled: null,
  levelledMissing: "No levelling adjustment has been computed for this campaign yet.",
  comparison: null,
  timeToTarget: {
    input: {
      targetHeightUncertaintyM: 0.03,
      instabilityAt1s: [{ name: "fit", value: 1.5e-15 }],
      systematic: [],
      heightTermsM: [],
      latitudeDeg: 47.08,
      heightM: 2871,
      accumulatedS: 162_000,
      uptime: 0.94,
      now: "2027-07-13T23:59:50.000Z",
    },
    instabilitySource: "data",
    reachable: true,
    neededS: 450_000,
    leftS: 288_000,
    wallClockLeftS: 306_383,
    eta: "2027-07-17T12:56:13.000Z",
    floorM: 0.0218,
    dominant: "statistical",
    nowM: 0.0405,
    reason: null,
    improve: null,
  },
  caution: officialHeightsCaution,
  computedAt: "2027-07-14T00:00:00.000Z",
});

describe("result CSV", () => {
  it("starts with the caution and carries the figures and the budget, read back by papaparse", () => {
    const csv = resultCsv("Kestrel Ridge hut against Brennmoor", result);
    expect(csv.split("\n")[0]).toBe(`# ${officialHeightsCaution}`);
    const rows = Papa.parse<string[]>(csv.trim(), { skipEmptyLines: true, comments: "#" }).data;
    const value = (name: string) => rows.find((r) => r[0] === name)?.[1];
    expect(Number(value("height difference (clocks)"))).toBe(2657.694);
    expect(value("expected date")).toBe("2027-07-17T12:56:13.000Z");
    expect(rows.find((r) => r[0] === "EQ-T1 systematic")).toEqual([
      "EQ-T1 systematic",
      "systematic",
      "1.87e-18",
      "0.01716",
    ]);
    expect(rows.at(-1)).toEqual(["combined", "", "", "0.0382"]);
  });
});
