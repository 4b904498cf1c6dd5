import { describe, expect, test } from "vitest";
import { runStateOf } from "../../../src/features/comparison/lib/run-state";
import { heightResultView, type HeightResultView } from "../../../shared/schemas/comparison";

// A schema-valid result; each test changes only what it is about.
function result(
  over: Partial<HeightResultView["timeToTarget"]> = {},
  clock = true,
): HeightResultView {
  return heightResultView.parse({
    runId: "6f1c2a9e-3b4d-4e5f-8a6b-7c8d9e0f1a2b",
    dataRevision: 1,
    analysis: { state: "done", dataRevision: 1, error: null },
    clock: clock
      ? {
          meanFractional: 1e-16,
          geopotentialDifference: 8.98,
          heightDifferenceM: 0.916,
          sigmaM: 0.004,
        }
      : null,
    budget: [],
    combinedHeightUncertaintyM: 0.004,
    levelled: null,
    levelledMissing: "No remote mark",
    comparison: null,
    timeToTarget: {
      input: {
        targetHeightUncertaintyM: 0.005,
        instabilityAt1s: [{ name: "clock", value: 1e-15 }],
        systematic: [],
        heightTermsM: [],
        latitudeDeg: 47,
        heightM: 1000,
        accumulatedS: 20_000,
        uptime: 0.8,
        now: "2027-07-01T05:33:20.000Z",
      },
      instabilitySource: "data",
      reachable: true,
      neededS: 100_000,
      leftS: 80_000,
      wallClockLeftS: 100_000,
      eta: "2027-07-02T09:20:00.000Z",
      floorM: 0.001,
      dominant: "statistical",
      nowM: 0.008,
      reason: null,
      improve: null,
      ...over,
    },
    caution: "campaign results",
    computedAt: "2027-07-01T05:33:20.000Z",
  });
}

describe("runStateOf", () => {
  test("time left is the wall-clock time, with the uptime and the date", () => {
    // 100,000 s = 1 d 3 h 46 min 40 s → "1 d 4 h" (two units, rounded); 0.8 → 80 %.
    const s = runStateOf(result());
    expect(s.word).toBe("1 d 4 h left");
    expect(s.detail).toBe("at 80 % uptime");
    expect(s.eta).toBe("2027-07-02T09:20:00.000Z");
    expect(s.shape).toBe("disc");
  });
  test("not reachable carries the reason, an octagon and no date", () => {
    const s = runStateOf(
      result({
        reachable: false,
        neededS: null,
        leftS: null,
        wallClockLeftS: null,
        eta: null,
        reason: "Floor 6 mm above target",
      }),
    );
    expect(s).toMatchObject({
      word: "Not reachable",
      detail: "Floor 6 mm above target",
      eta: null,
      shape: "octagon",
    });
  });
  test("no data, analysing and reached are told apart", () => {
    expect(runStateOf(undefined).word).toBe("Not known yet");
    const none = result();
    expect(
      runStateOf({ ...none, analysis: { state: "none", dataRevision: null, error: null } }).word,
    ).toBe("No data yet");
    expect(runStateOf(result({}, false)).word).toBe("Analysing…");
    expect(runStateOf(result({ leftS: 0, wallClockLeftS: 0 })).word).toBe("Target reached");
  });
});
