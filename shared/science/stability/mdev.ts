// Modified Allan variance (NIST SP 1065 (Riley 2008) §5.2.5):
// Mod σ²_y(mτ0) = Σ_j [Σ_{i=j}^{j+m−1} (x[i+2m] − 2x[i+m] + x[i])]² / (2m²τ²·count),
// which in the running sum S = x/τ0 is Σ_j inner_j² / (2m⁴·count). The inner sum is kept as a
// running sum: inner_{j+1} − inner_j is the term entering minus the term leaving,
// S[j+3m] − 3S[j+2m] + 3S[j+m] − S[j], so each factor costs O(N) with four loads per term.
// Without gaps the loops are in mdev-octaves.ts, which also shares one pass among octaves.
import { spansGap, type KernelResult } from "./kernel";
import { firstInner, octaveTriple, singleSum } from "./mdev-octaves";
import type { PreparedSeries } from "./prepare";

const step = (s: Float64Array, j: number, m: number) =>
  (s[j + 3 * m] ?? 0) - 3 * (s[j + 2 * m] ?? 0) + 3 * (s[j + m] ?? 0) - (s[j] ?? 0);

export function modifiedAllanSums(p: PreparedSeries, m: number): KernelResult {
  const s = p.sums;
  const gaps = p.gaps;
  // Term j spans y[j] … y[j + 3m − 2]; with N = n + 1 phase points there are N − 3m + 1 terms.
  const terms = p.n - 3 * m + 2;
  let sum = 0;
  let count = 0;
  let dropped = 0;
  if (gaps === null) {
    sum = singleSum(s, p.n, m);
    count = terms;
  } else {
    let inner = firstInner(s, m);
    for (let j = 0; j < terms; j++) {
      if (spansGap(gaps, j, j + 3 * m - 1)) dropped++;
      else {
        sum += inner * inner;
        count++;
      }
      if (j + 1 < terms) inner += step(s, j, m);
    }
  }
  const mm = m * m;
  return { variance: count > 0 ? sum / (2 * mm * mm * count) : 0, count, dropped };
}

/** Modified Allan variance at each of the ascending factors, octave triples in one pass. */
export function modifiedAllanMany(p: PreparedSeries, factors: readonly number[]): KernelResult[] {
  const out: KernelResult[] = [];
  for (let k = 0; k < factors.length;) {
    const m = factors[k] ?? 1;
    if (p.gaps === null && factors[k + 1] === 2 * m && factors[k + 2] === 4 * m) {
      out.push(...octaveTriple(p.sums, p.n, m));
      k += 3;
    } else {
      out.push(modifiedAllanSums(p, m));
      k++;
    }
  }
  return out;
}
