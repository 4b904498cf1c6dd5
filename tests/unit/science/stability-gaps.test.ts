import { describe, expect, it } from "vitest";
import {
  allanDeviation,
  analyzeStability,
  GAP_POLICY,
  modifiedAllanDeviation,
  overlappingAllanDeviation,
  overlappingHadamardDeviation,
} from "../../../shared/science";
import { whiteNoise } from "./helpers/random";
import { relative } from "./helpers/runs";

// Direct evaluation of the phase formulas of REFERENCES.md §1.3 / NIST SP 1065 §5.2, written
// independently of the library (O(N·m) loops), keeping only terms whose phase points are all
// known: the reference for the fast running-sum code and for the gap policy (computed).
/** x_i = Σ_{k<i} y_k with a missing y counted as 0: only used inside spans without gaps. */
function phaseWithGaps(y: ArrayLike<number>): number[] {
  const x = [0];
  for (let i = 0; i < y.length; i++)
    x.push((x[i] ?? 0) + (Number.isNaN(y[i] ?? 0) ? 0 : (y[i] ?? 0)));
  return x;
}

function spanKnown(y: ArrayLike<number>, from: number, to: number): boolean {
  for (let i = from; i < to; i++) if (Number.isNaN(y[i] ?? 0)) return false;
  return true;
}

type Direct = { deviation: number; count: number; dropped: number };

function directOadev(y: ArrayLike<number>, m: number, stride = 1): Direct {
  const x = phaseWithGaps(y);
  let sum = 0;
  let count = 0;
  let dropped = 0;
  for (let i = 0; i + 2 * m < x.length; i += stride) {
    if (!spanKnown(y, i, i + 2 * m)) {
      dropped++;
      continue;
    }
    sum += ((x[i + 2 * m] ?? 0) - 2 * (x[i + m] ?? 0) + (x[i] ?? 0)) ** 2;
    count++;
  }
  return { deviation: Math.sqrt(sum / (2 * m * m * count)), count, dropped };
}

function directMdev(y: ArrayLike<number>, m: number): Direct {
  const x = phaseWithGaps(y);
  let sum = 0;
  let count = 0;
  let dropped = 0;
  for (let j = 0; j + 3 * m <= x.length; j++) {
    if (!spanKnown(y, j, j + 3 * m - 1)) {
      dropped++;
      continue;
    }
    let inner = 0;
    for (let i = j; i < j + m; i++)
      inner += (x[i + 2 * m] ?? 0) - 2 * (x[i + m] ?? 0) + (x[i] ?? 0);
    sum += inner * inner;
    count++;
  }
  return { deviation: Math.sqrt(sum / (2 * m ** 4 * count)), count, dropped };
}

function directHdev(y: ArrayLike<number>, m: number): Direct {
  const x = phaseWithGaps(y);
  let sum = 0;
  let count = 0;
  let dropped = 0;
  for (let i = 0; i + 3 * m < x.length; i++) {
    if (!spanKnown(y, i, i + 3 * m)) {
      dropped++;
      continue;
    }
    sum += ((x[i + 3 * m] ?? 0) - 3 * (x[i + 2 * m] ?? 0) + 3 * (x[i + m] ?? 0) - (x[i] ?? 0)) ** 2;
    count++;
  }
  return { deviation: Math.sqrt(sum / (6 * m * m * count)), count, dropped };
}

function withGaps(n: number, holes: number[], seed: number): Float64Array {
  const y = whiteNoise(n, 1e-15, seed);
  for (let i = 0; i < y.length; i++) y[i] = (y[i] ?? 0) + 3e-13; // a frequency offset
  for (const h of holes) y[h] = NaN;
  return y;
}

const CASES = [
  { name: "no gap", holes: [] as number[] },
  { name: "one gap", holes: [100] },
  { name: "a run and scattered gaps", holes: [5, 6, 7, 8, 250, 251, 399] },
];

describe.each(CASES)("running-sum statistics against direct sums: $name", ({ holes }) => {
  const y = withGaps(420, holes, 11);
  const factors = [1, 2, 3, 7, 16, 40];

  it.each([
    ["overlapping ADEV", overlappingAllanDeviation, (m: number) => directOadev(y, m)],
    ["ADEV", allanDeviation, (m: number) => directOadev(y, m, m)],
    ["MDEV", modifiedAllanDeviation, (m: number) => directMdev(y, m)],
    ["overlapping HDEV", overlappingHadamardDeviation, (m: number) => directHdev(y, m)],
  ] as const)("%s", (_name, fn, direct) => {
    const curve = fn(y, 1, factors);
    expect(curve.map((p) => p.factor)).toEqual(factors);
    for (const p of curve) {
      const d = direct(p.factor);
      expect(relative(p.deviation, d.deviation)).toBeLessThan(1e-9);
      expect(p.count).toBe(d.count);
      expect(p.dropped).toBe(d.dropped);
    }
    expect(curve.missing).toBe(holes.length);
    expect(curve.treatment).toBe(holes.length > 0 ? "terms-touching-a-gap-dropped" : "none");
  });
});

describe("octave factors share passes (m, 2m, 4m) and still equal the direct sums", () => {
  const y = withGaps(3000, [], 12);

  it.each([
    ["overlapping ADEV", overlappingAllanDeviation, (m: number) => directOadev(y, m)],
    ["MDEV", modifiedAllanDeviation, (m: number) => directMdev(y, m)],
  ] as const)("%s", (_name, fn, direct) => {
    const curve = fn(y, 1);
    // Octaves up to 1024 (ADEV, 3000/2) or 512 (MDEV, 3001/3): at least three shared triples.
    expect(curve.length).toBeGreaterThanOrEqual(10);
    for (const p of curve) {
      const d = direct(p.factor);
      expect(relative(p.deviation, d.deviation)).toBeLessThan(1e-9);
      expect(p.count).toBe(d.count);
    }
  });

  it("a constant series has zero deviation and finite intervals", () => {
    const curve = overlappingAllanDeviation(new Float64Array(500).fill(3e-14), 1);
    expect(curve.every((p) => p.deviation === 0 && p.low68 === 0 && p.high68 === 0)).toBe(true);
    expect(curve.every((p) => Number.isFinite(p.edf) && p.noise === "white-fm")).toBe(true);
  });
});

describe("gap policy", () => {
  it("is written down", () => {
    expect(GAP_POLICY).toMatch(/never interpolated/);
  });

  it("a missing phase point removes the two frequency samples beside it", () => {
    const x = Array.from({ length: 64 }, (_, i) => Math.sin(i) * 1e-12);
    const holed = [...x];
    holed[20] = NaN;
    const a = analyzeStability("oadev", holed, 1, [1], { fromPhase: true });
    expect(a.missing).toBe(1);
    expect(a.input).toBe("phase");
    // Frequency samples 19 and 20 are missing: terms starting at 18, 19, 20 span them.
    expect(a.points[0]?.dropped).toBe(3);
    // 63 frequency samples give 63 − 2 + 1 terms at m = 1.
    expect(a.points[0]?.count).toBe(63 - 2 + 1 - 3);
  });

  it("a factor with no usable term is skipped and listed, not invented", () => {
    const y = new Float64Array(12).fill(1e-15);
    y[3] = NaN;
    y[8] = NaN;
    const curve = overlappingAllanDeviation(y, 1, [1, 4]);
    expect(curve.map((p) => p.factor)).toEqual([1]);
    expect(curve.skippedFactors).toEqual([4]);
  });
});
