import { afterAll, describe, expect, it } from "vitest";
import { adjustLevellingNetwork, ScienceInputError } from "../../shared/science";
import { createSciencePool } from "../../server/workers/science-pool";

// Ghilani & Wolf, "Adjustment Computations", 4th ed., Example 12.1 (REFERENCES.md §4).
const network = {
  fixed: [{ point: "A", heightM: 437.596 }],
  observations: [
    { from: "A", to: "B", deltaM: 10.509, sigmaM: 0.006 },
    { from: "B", to: "C", deltaM: 5.36, sigmaM: 0.004 },
    { from: "C", to: "D", deltaM: -8.523, sigmaM: 0.005 },
    { from: "D", to: "A", deltaM: -7.348, sigmaM: 0.003 },
    { from: "B", to: "D", deltaM: -3.167, sigmaM: 0.004 },
    { from: "A", to: "C", deltaM: 15.881, sigmaM: 0.012 },
  ],
};

describe("science pool (worker threads)", () => {
  const pool = createSciencePool(2);
  afterAll(() => pool.close());

  it("runs the adjustment in a worker and returns what the core returns in-process", async () => {
    const result = await pool.run("adjust", { network, options: {} });
    const heights = Object.fromEntries(result.heights.map((h) => [h.point, h.heightM]));
    // Published adjusted heights (Ghilani & Wolf Example 12.1).
    expect(heights.B).toBeCloseTo(448.1087, 4);
    expect(heights.C).toBeCloseTo(453.4685, 4);
    expect(heights.D).toBeCloseTo(444.9436, 4);
    expect(result).toEqual(adjustLevellingNetwork(network));
  });

  it("carries the field of a science input error across the thread", async () => {
    const bad = { network: { fixed: [], observations: network.observations }, options: {} };
    const error = await pool.run("adjust", bad).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ScienceInputError);
    expect((error as ScienceInputError).field).toBe("fixed");
  });

  it("queues more tasks than workers and answers each", async () => {
    const results = await Promise.all(
      Array.from({ length: 5 }, () => pool.run("adjust", { network, options: {} })),
    );
    expect(results.map((r) => r.dof)).toEqual([3, 3, 3, 3, 3]);
  });
});
