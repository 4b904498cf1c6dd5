// The network's pure helpers: the tie file reader, the field-book section as an observation, and
// which marks a benchmark reaches; the demo ties adjusted by the science core.
import { describe, expect, it } from "vitest";
import { adjustLevellingNetwork } from "../../../shared/science";
import {
  prepareNetwork,
  sectionObservation,
  tieObservation,
} from "../../../server/services/height-network/network";
import { readTieFile } from "../../../server/services/height-network/tie-file";
import { demoTies } from "../../../server/seed/demo-network";
import { demoBenchmarks } from "../../../server/seed/demo-scenario";

const tie = (id: string, fromMark: string, toMark: string, deltaM = 1) =>
  tieObservation({ id, fromMark, toMark, deltaM, lengthKm: 1, sigmaM: null, source: "t.csv" });
const bm = (code: string, heightM: number) => ({ id: code, code, heightM, heightSigmaM: 0.001 });

describe("readTieFile", () => {
  it("reads semicolons with decimal commas, any header case, σ in mm", () => {
    const read = readTieFile("FROM;To;DH_M;Length_km;sigma_mm\r\nA;B;-1,2345;0,5;1,5\r\n");
    expect(read).toEqual({
      ok: true,
      ties: [
        { line: 2, fromMark: "A", toMark: "B", deltaM: -1.2345, lengthKm: 0.5, sigmaM: 0.0015 },
      ],
    });
  });

  it("leaves σ empty as null and refuses a file with only its header", () => {
    const read = readTieFile("from,to,dh_m,length_km,sigma_mm\nA,B,1,2,\n");
    expect(read.ok && read.ties[0]?.sigmaM).toBeNull();
    expect(readTieFile("from,to,dh_m,length_km\n")).toMatchObject({
      ok: false,
      errors: [{ row: 1, field: "row" }],
    });
  });
});

describe("the network", () => {
  it("takes a closed section's mean of forward and negated backward runs", () => {
    const at = "2027-06-05T06:00:00.000Z";
    const s = (
      id: string,
      run: "forward" | "backward",
      number: number,
      bs: number,
      fs: number,
    ) => ({
      id,
      run,
      number,
      backsightM: bs,
      foresightM: fs,
      backsightDistanceM: 30,
      foresightDistanceM: 30,
      recordedAt: at,
    });
    const o = sectionObservation({
      id: "s1",
      fromMark: "P",
      toMark: "Q",
      classId: "fgcc-1984-second-order-class-i",
      setups: [s("a", "forward", 1, 1.8, 1.1), s("b", "backward", 1, 1.1, 1.8012)],
    });
    // By hand: forward +0.7000, backward −0.7012, mean +0.7006 m; forward 60 m = 0.06 km.
    expect(o).toMatchObject({ deltaM: 0.7006, lengthKm: 0.06, source: "field-book" });
  });

  it("sets aside marks no chain joins to a benchmark, and excluded observations", () => {
    const obs = [tie("1", "BM", "P"), tie("2", "P", "Q"), tie("3", "X", "Y"), tie("4", "Q", "Z")];
    const net = prepareNetwork(obs, [bm("BM", 10), bm("FAR", 20)], ["4"]);
    expect(net.used.map((o) => o.sourceId)).toEqual(["1", "2"]);
    expect(net.fixed.map((b) => b.code)).toEqual(["BM"]);
    expect(net.unconnected).toEqual(["X", "Y"]);
  });

  it("adjusts the demo ties into a loop that closes within a few mm", () => {
    const fixed = demoBenchmarks
      .filter((b) => b.code.startsWith("KR-"))
      .map((b) => ({ point: b.code, heightM: b.heightM }));
    const result = adjustLevellingNetwork(
      {
        fixed,
        observations: demoTies.map((t) => ({
          from: t.fromMark,
          to: t.toMark,
          deltaM: t.deltaM,
          lengthKm: t.lengthKm,
        })),
      },
      { sigmaPerSqrtKmM: 0.001 },
    );
    expect(result.dof).toBe(2);
    expect(result.globalTest?.passed).toBe(true);
    const crp = result.heights.find((h) => h.point === "KR-CRP")?.heightM ?? 0;
    // By hand: KR-BM-117 2869.412 m + 0.7741 m = 2870.1861 m; the loop moves it by under 2 mm.
    expect(Math.abs(crp - 2870.1861)).toBeLessThan(0.002);
    expect(result.residuals.every((r) => Math.abs(r.residualM) < 0.003)).toBe(true);
  });
});
