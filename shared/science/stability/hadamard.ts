// Overlapping Hadamard variance (NIST SP 1065 (Riley 2008) §5.2.8):
// Hσ²_y(mτ0) = Σ (x[i+3m] − 3x[i+2m] + 3x[i+m] − x[i])² / (6τ²·count), i = 0 … N − 3m − 1,
// in the running sum S = x/τ0: Σ (S[i+3m] − 3S[i+2m] + 3S[i+m] − S[i])² / (6m²·count).
import { spansGap, type KernelResult } from "./kernel";
import type { PreparedSeries } from "./prepare";

export function overlappingHadamardSums(p: PreparedSeries, m: number): KernelResult {
  const s = p.sums;
  const gaps = p.gaps;
  const last = p.n - 3 * m;
  let sum = 0;
  let count = 0;
  let dropped = 0;
  for (let i = 0; i <= last; i++) {
    if (gaps !== null && spansGap(gaps, i, i + 3 * m)) {
      dropped++;
      continue;
    }
    const d = (s[i + 3 * m] ?? 0) - 3 * (s[i + 2 * m] ?? 0) + 3 * (s[i + m] ?? 0) - (s[i] ?? 0);
    sum += d * d;
    count++;
  }
  return { variance: count > 0 ? sum / (6 * m * m * count) : 0, count, dropped };
}
