// Modified Allan variance (NIST SP 1065 (Riley 2008) §5.2.5):
// Mod σ²_y(mτ0) = Σ_j [Σ_{i=j}^{j+m−1} (x[i+2m] − 2x[i+m] + x[i])]² / (2m²τ²·count),
// which in the running sum S = x/τ0 is Σ_j inner_j² / (2m⁴·count). The inner sum is kept as a
// running sum: inner_{j+1} − inner_j is the term entering minus the term leaving,
// S[j+3m] − 3S[j+2m] + 3S[j+m] − S[j], so each factor costs O(N) with four loads per term.
import { spansGap, type KernelResult } from "./kernel";
import type { PreparedSeries } from "./prepare";

function firstInner(s: Float64Array, m: number): number {
  let inner = 0;
  for (let i = 0; i < m; i++) inner += (s[i + 2 * m] ?? 0) - 2 * (s[i + m] ?? 0) + (s[i] ?? 0);
  return inner;
}

const step = (s: Float64Array, j: number, m: number) =>
  (s[j + 3 * m] ?? 0) - 3 * (s[j + 2 * m] ?? 0) + 3 * (s[j + m] ?? 0) - (s[j] ?? 0);

export function modifiedAllanSums(p: PreparedSeries, m: number): KernelResult {
  const s = p.sums;
  const gaps = p.gaps;
  // Term j spans y[j] … y[j + 3m − 2]; with N = n + 1 phase points there are N − 3m + 1 terms.
  const terms = p.n - 3 * m + 2;
  let inner = firstInner(s, m);
  let sum = 0;
  let count = 0;
  let dropped = 0;
  if (gaps === null) {
    // The same update as step(), written out: this loop is the whole cost of MDEV.
    const m2 = 2 * m;
    const m3 = 3 * m;
    sum = inner * inner;
    for (let j = 0; j + 1 < terms; j++) {
      inner += (s[j + m3] ?? 0) - 3 * (s[j + m2] ?? 0) + 3 * (s[j + m] ?? 0) - (s[j] ?? 0);
      sum += inner * inner;
    }
    count = terms;
  } else {
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

/** Continues a factor's running sum from term j0 (inner is inner_{j0}) to its last term. */
function carry(s: Float64Array, m: number, j0: number, terms: number, inner: number, sum: number) {
  let total = sum;
  let value = inner;
  for (let j = j0; j + 1 < terms; j++) {
    value += (s[j + 3 * m] ?? 0) - 3 * (s[j + 2 * m] ?? 0) + 3 * (s[j + m] ?? 0) - (s[j] ?? 0);
    total += value * value;
  }
  return total;
}

function variance(sum: number, m: number, count: number): KernelResult {
  const mm = m * m;
  return { variance: sum / (2 * mm * mm * count), count, dropped: 0 };
}

/**
 * Factors m, 2m and 4m in one pass (no gaps): their updates share S[j], S[j+2m] and S[j+4m],
 * so eight loads serve three factors instead of twelve. Terms are added in the order of j for
 * each factor, so the sums equal three separate passes bit for bit.
 */
function octaveTriple(p: PreparedSeries, m: number): KernelResult[] {
  const s = p.sums;
  const n = p.n;
  const [t1, t2, t4] = [n - 3 * m + 2, n - 6 * m + 2, n - 12 * m + 2];
  let [i1, i2, i4] = [firstInner(s, m), firstInner(s, 2 * m), firstInner(s, 4 * m)];
  let [a, b, c] = [i1 * i1, i2 * i2, i4 * i4];
  let j = 0;
  for (; j + 1 < t4; j++) {
    const s0 = s[j] ?? 0;
    const s2 = s[j + 2 * m] ?? 0;
    const s4 = s[j + 4 * m] ?? 0;
    i1 += (s[j + 3 * m] ?? 0) - 3 * s2 + 3 * (s[j + m] ?? 0) - s0;
    i2 += (s[j + 6 * m] ?? 0) - 3 * s4 + 3 * s2 - s0;
    i4 += (s[j + 12 * m] ?? 0) - 3 * (s[j + 8 * m] ?? 0) + 3 * s4 - s0;
    a += i1 * i1;
    b += i2 * i2;
    c += i4 * i4;
  }
  a = carry(s, m, j, t1, i1, a);
  b = carry(s, 2 * m, j, t2, i2, b);
  return [variance(a, m, t1), variance(b, 2 * m, t2), variance(c, 4 * m, t4)];
}

/** Modified Allan variance at each of the ascending factors, octave triples in one pass. */
export function modifiedAllanMany(p: PreparedSeries, factors: readonly number[]): KernelResult[] {
  const out: KernelResult[] = [];
  for (let k = 0; k < factors.length;) {
    const m = factors[k] ?? 1;
    if (p.gaps === null && factors[k + 1] === 2 * m && factors[k + 2] === 4 * m) {
      out.push(...octaveTriple(p, m));
      k += 3;
    } else {
      out.push(modifiedAllanSums(p, m));
      k++;
    }
  }
  return out;
}
