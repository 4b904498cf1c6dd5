// Allan variance from the running sum S of frequency (S = x/τ0): the term x[i+2m] − 2x[i+m] + x[i]
// is τ0·(S[i+2m] − 2S[i+m] + S[i]), so σ²_y(mτ0) = Σ (S[i+2m] − 2S[i+m] + S[i])² / (2m²·count).
// NIST SP 1065 (Riley 2008) §5.2.2 (non-overlapping, stride m) and §5.2.4 (overlapping, stride 1).
import { spansGap, type KernelResult } from "./kernel";
import type { PreparedSeries } from "./prepare";

function result(sum: number, count: number, dropped: number, m: number): KernelResult {
  return { variance: count > 0 ? sum / (2 * m * m * count) : 0, count, dropped };
}

function allanSums(p: PreparedSeries, m: number, stride: number): KernelResult {
  const s = p.sums;
  const gaps = p.gaps;
  const last = p.n - 2 * m;
  let sum = 0;
  let count = 0;
  let dropped = 0;
  for (let i = 0; i <= last; i += stride) {
    if (gaps !== null && spansGap(gaps, i, i + 2 * m)) {
      dropped++;
      continue;
    }
    const d = (s[i + 2 * m] ?? 0) - 2 * (s[i + m] ?? 0) + (s[i] ?? 0);
    sum += d * d;
    count++;
  }
  return result(sum, count, dropped, m);
}

/** Overlapping Allan variance at factor m: all n − 2m + 1 terms, stride τ0. */
export function overlappingAllanSums(p: PreparedSeries, m: number): KernelResult {
  return allanSums(p, m, 1);
}

/** Non-overlapping Allan variance at factor m: adjacent averages, stride τ. */
export function allanSumsNonOverlapping(p: PreparedSeries, m: number): KernelResult {
  return allanSums(p, m, m);
}

/** Σ d² for one factor over i = from … to, continuing a sum in the same order. */
function tail(s: Float64Array, m: number, from: number, to: number, start: number): number {
  let sum = start;
  for (let i = from; i <= to; i++) {
    const d = (s[i + 2 * m] ?? 0) - 2 * (s[i + m] ?? 0) + (s[i] ?? 0);
    sum += d * d;
  }
  return sum;
}

/**
 * Factors m, 2m and 4m in one pass: their terms share S[i], S[i+2m] and S[i+4m], so five loads
 * serve three factors instead of nine. Each factor's terms are still added in the order of i, so
 * the sums are the same, bit for bit, as three separate passes.
 */
function octaveTriple(p: PreparedSeries, m: number): KernelResult[] {
  const s = p.sums;
  const n = p.n;
  const last = n - 8 * m;
  let a = 0;
  let b = 0;
  let c = 0;
  let i = 0;
  for (; i <= last; i++) {
    const s0 = s[i] ?? 0;
    const s2 = s[i + 2 * m] ?? 0;
    const s4 = s[i + 4 * m] ?? 0;
    const d1 = s2 - 2 * (s[i + m] ?? 0) + s0;
    const d2 = s4 - 2 * s2 + s0;
    const d4 = (s[i + 8 * m] ?? 0) - 2 * s4 + s0;
    a += d1 * d1;
    b += d2 * d2;
    c += d4 * d4;
  }
  a = tail(s, m, i, n - 2 * m, a);
  b = tail(s, 2 * m, i, n - 4 * m, b);
  return [
    result(a, n - 2 * m + 1, 0, m),
    result(b, n - 4 * m + 1, 0, 2 * m),
    result(c, n - 8 * m + 1, 0, 4 * m),
  ];
}

/** Overlapping Allan variance at each of the ascending factors, octave triples in one pass. */
export function overlappingAllanMany(
  p: PreparedSeries,
  factors: readonly number[],
): KernelResult[] {
  const out: KernelResult[] = [];
  for (let k = 0; k < factors.length;) {
    const m = factors[k] ?? 1;
    if (p.gaps === null && factors[k + 1] === 2 * m && factors[k + 2] === 4 * m) {
      out.push(...octaveTriple(p, m));
      k += 3;
    } else {
      out.push(overlappingAllanSums(p, m));
      k++;
    }
  }
  return out;
}
