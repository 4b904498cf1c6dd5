import { describe, expect, it } from "vitest";
import { modifiedAllanDeviation } from "../../../shared/science";
import { modifiedAllanMany, modifiedAllanSums } from "../../../shared/science/stability/mdev";
import { prepareSeries } from "../../../shared/science/stability/prepare";
import { cumulativeSum, whiteNoise } from "./helpers/random";
import { relative } from "./helpers/runs";

// The MDEV kernel (running inner sums, octaves m, 2m, 4m sharing one pass, the m = 1 pass keeping
// phase values in locals, passes run in blocks of terms) against the definition of the modified
// Allan variance written plainly: NIST SP 1065 (Riley 2008) §5.2.5 and IEEE Std 1139-2008,
// Mod σ²_y(τ) = Σ_j [Σ_{i=j}^{j+m−1} (x[i+2m] − 2x[i+m] + x[i])]² / (2m²τ²(N − 3m + 1)),
// N phase points, τ = mτ0 (REFERENCES.md §1.3; O(N·m) per factor, computed).

function phase(y: Float64Array, tau0: number): Float64Array {
  let mean = 0;
  for (const v of y) mean += v / y.length;
  const x = new Float64Array(y.length + 1);
  for (let i = 0; i < y.length; i++) x[i + 1] = (x[i] ?? 0) + ((y[i] ?? 0) - mean) * tau0;
  return x;
}

function mdevByDefinition(y: Float64Array, tau0: number, m: number): number {
  const x = phase(y, tau0);
  const tau = m * tau0;
  let sum = 0;
  let terms = 0;
  for (let j = 0; j + 3 * m <= x.length; j++) {
    let inner = 0;
    for (let i = j; i < j + m; i++) {
      inner += (x[i + 2 * m] ?? 0) - 2 * (x[i + m] ?? 0) + (x[i] ?? 0);
    }
    sum += inner * inner;
    terms++;
  }
  expect(terms).toBe(x.length - 3 * m + 1);
  return Math.sqrt(sum / (2 * m * m * tau * tau * terms));
}

function octaves(n: number): number[] {
  const out: number[] = [];
  for (let m = 1; 3 * m <= n + 1; m *= 2) out.push(m);
  return out;
}

function offsetWhite(n: number, seed: number): Float64Array {
  const y = whiteNoise(n, 1e-15, seed);
  return y.map((v) => v + 4e-13);
}

describe("MDEV at octave factors equals the definition (NIST SP 1065 §5.2.5)", () => {
  // Lengths at the edges of the shared passes (a triple needs n ≥ 12m − 1) and across blocks.
  it.each([11, 12, 13, 22, 23, 24, 47, 95, 1000, 9001])("white FM, %i samples", (n) => {
    const y = offsetWhite(n, n);
    const curve = modifiedAllanDeviation(y, 1);
    expect(curve.map((p) => p.factor)).toEqual(octaves(n));
    for (const p of curve) {
      expect(relative(p.deviation, mdevByDefinition(y, 1, p.factor))).toBeLessThan(1e-9);
      expect(p.count).toBe(n - 3 * p.factor + 2);
    }
  });

  it("random-walk FM over 8192 samples, τ0 = 0.5 s", () => {
    const y = cumulativeSum(whiteNoise(8192, 1e-16, 5)).map((v) => v + 1e-12);
    for (const p of modifiedAllanDeviation(y, 0.5)) {
      expect(relative(p.deviation, mdevByDefinition(y, 0.5, p.factor))).toBeLessThan(1e-9);
    }
  });
});

describe("the shared passes give the same sums as one pass per factor", () => {
  it.each([13, 100, 20_000])("%i samples, bit for bit", (n) => {
    const p = prepareSeries(offsetWhite(n, 7 * n), 1);
    const factors = octaves(n);
    const shared = modifiedAllanMany(p, factors);
    const separate = factors.map((m) => modifiedAllanSums(p, m));
    expect(shared.map((k) => k.variance)).toEqual(separate.map((k) => k.variance));
    expect(shared.map((k) => k.count)).toEqual(separate.map((k) => k.count));
  });
});
