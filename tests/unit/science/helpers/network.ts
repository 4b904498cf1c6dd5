// Seeded levelling networks for the tests: points on a grid, each joined to its right and lower
// neighbour, observed from true heights with Gaussian errors of σ = sigmaPerSqrtKmM·√length.
import { seededGaussian } from "./random";

export interface Grid {
  readonly truth: Map<string, number>;
  readonly fixed: { point: string; heightM: number }[];
  readonly observations: {
    from: string;
    to: string;
    deltaM: number;
    sigmaM: number;
    lengthKm: number;
  }[];
}

/** noise = 0 gives error-free observations that keep their σ. */
export function gridNetwork(
  rows: number,
  cols: number,
  seed: number,
  noise = 1,
  sigmaPerSqrtKmM = 0.001,
): Grid {
  const g = seededGaussian(seed);
  const name = (r: number, c: number) => `P${r}-${c}`;
  const truth = new Map<string, number>();
  for (let r = 0; r < rows; r++)
    for (let c = 0; c < cols; c++) truth.set(name(r, c), 400 + 30 * g());
  const observations: Grid["observations"] = [];
  const link = (a: string, b: string) => {
    const lengthKm = 0.5 + ((observations.length * 7) % 10) / 5;
    const sigmaM = sigmaPerSqrtKmM * Math.sqrt(lengthKm);
    const deltaM = (truth.get(b) ?? 0) - (truth.get(a) ?? 0) + noise * sigmaM * g();
    observations.push({ from: a, to: b, deltaM, sigmaM, lengthKm });
  };
  for (let r = 0; r < rows; r++) {
    for (let c = 0; c < cols; c++) {
      if (c + 1 < cols) link(name(r, c), name(r, c + 1));
      if (r + 1 < rows) link(name(r, c), name(r + 1, c));
    }
  }
  const corners = [name(0, 0), name(rows - 1, cols - 1)];
  const fixed = corners.map((point) => ({ point, heightM: truth.get(point) ?? 0 }));
  return { truth, fixed, observations };
}
