// Modified Allan sums at octave factors m, 2m, 4m in one pass (no gaps). The running update of
// mdev.ts, inner_{j+1} = inner_j + S[j+3m] − 3S[j+2m] + 3S[j+m] − S[j], is done for the three
// factors side by side: they share S[j], S[j+2m] and S[j+4m]. Every factor's terms are added in
// the order of j with the same operations as a pass of its own, so the sums are the same bit for
// bit (the benchmark's C reference does one plain pass per factor and agrees exactly).
// The pass runs in blocks of terms with its state in a Float64Array: the loop function is then
// called often, touches only numbers and typed arrays, and V8 compiles all of it with full type
// feedback. (One long call per pass ran in on-stack-replaced code that deoptimised at its end on
// every call, and the m = 1 pass ran at half speed there.)
import type { KernelResult } from "./kernel";

const BLOCK = 4096;

/** inner_0 = Σ_{i<m} (S[i+2m] − 2S[i+m] + S[i]). */
export function firstInner(s: Float64Array, m: number): number {
  let inner = 0;
  for (let i = 0; i < m; i++) inner += (s[i + 2 * m] ?? 0) - 2 * (s[i + m] ?? 0) + (s[i] ?? 0);
  return inner;
}

// State of a pass: inner_j and the sum so far for m, 2m, 4m.
const [I1, A, I2, B, I4, C] = [0, 1, 2, 3, 4, 5];

/** Terms j0 … j1 − 1 of factors m, 2m, 4m: eight loads serve three factors instead of twelve. */
function tripleBlock(s: Float64Array, m: number, j0: number, j1: number, st: Float64Array) {
  let i1 = st[I1] ?? 0;
  let a = st[A] ?? 0;
  let i2 = st[I2] ?? 0;
  let b = st[B] ?? 0;
  let i4 = st[I4] ?? 0;
  let c = st[C] ?? 0;
  for (let j = j0; j < j1; j++) {
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
  st[I1] = i1;
  st[A] = a;
  st[I2] = i2;
  st[B] = b;
  st[I4] = i4;
  st[C] = c;
}

/**
 * tripleBlock for m = 1: S[j] … S[j+6] move through locals from one term to the next, so a term
 * loads three values (S[j+6], S[j+8], S[j+12]) instead of eight.
 */
function tripleBlockFromOne(s: Float64Array, j0: number, j1: number, st: Float64Array) {
  let i1 = st[I1] ?? 0;
  let a = st[A] ?? 0;
  let i2 = st[I2] ?? 0;
  let b = st[B] ?? 0;
  let i4 = st[I4] ?? 0;
  let c = st[C] ?? 0;
  // Plain lets: values taken from an array destructuring stay boxed through the loop in V8.
  let x0 = s[j0] ?? 0;
  let x1 = s[j0 + 1] ?? 0;
  let x2 = s[j0 + 2] ?? 0;
  let x3 = s[j0 + 3] ?? 0;
  let x4 = s[j0 + 4] ?? 0;
  let x5 = s[j0 + 5] ?? 0;
  for (let j = j0; j < j1; j++) {
    const x6 = s[j + 6] ?? 0;
    i1 += x3 - 3 * x2 + 3 * x1 - x0;
    i2 += x6 - 3 * x4 + 3 * x2 - x0;
    i4 += (s[j + 12] ?? 0) - 3 * (s[j + 8] ?? 0) + 3 * x4 - x0;
    a += i1 * i1;
    b += i2 * i2;
    c += i4 * i4;
    x0 = x1;
    x1 = x2;
    x2 = x3;
    x3 = x4;
    x4 = x5;
    x5 = x6;
  }
  st[I1] = i1;
  st[A] = a;
  st[I2] = i2;
  st[B] = b;
  st[I4] = i4;
  st[C] = c;
}

/** Terms j0 … j1 − 1 of factors m and 2m (they share S[j] and S[j+2m]). */
function pairBlock(s: Float64Array, m: number, j0: number, j1: number, st: Float64Array) {
  let x = st[I1] ?? 0;
  let a = st[A] ?? 0;
  let z = st[I2] ?? 0;
  let b = st[B] ?? 0;
  for (let j = j0; j < j1; j++) {
    const s0 = s[j] ?? 0;
    const s2 = s[j + 2 * m] ?? 0;
    x += (s[j + 3 * m] ?? 0) - 3 * s2 + 3 * (s[j + m] ?? 0) - s0;
    z += (s[j + 6 * m] ?? 0) - 3 * (s[j + 4 * m] ?? 0) + 3 * s2 - s0;
    a += x * x;
    b += z * z;
  }
  st[I1] = x;
  st[A] = a;
  st[I2] = z;
  st[B] = b;
}

/** Terms j0 … j1 − 1 of factor m alone. */
function singleBlock(s: Float64Array, m: number, j0: number, j1: number, st: Float64Array) {
  let x = st[I1] ?? 0;
  let a = st[A] ?? 0;
  for (let j = j0; j < j1; j++) {
    x += (s[j + 3 * m] ?? 0) - 3 * (s[j + 2 * m] ?? 0) + 3 * (s[j + m] ?? 0) - (s[j] ?? 0);
    a += x * x;
  }
  st[I1] = x;
  st[A] = a;
}

/** Σ inner_j² of factor m alone, no gaps. */
export function singleSum(s: Float64Array, n: number, m: number): number {
  const t1 = n - 3 * m + 2;
  const inner = firstInner(s, m);
  const st = Float64Array.of(inner, inner * inner);
  for (let j = 0; j < t1 - 1; j += BLOCK) singleBlock(s, m, j, Math.min(j + BLOCK, t1 - 1), st);
  return st[A] ?? 0;
}

function variance(sum: number, m: number, count: number): KernelResult {
  const mm = m * m;
  return { variance: sum / (2 * mm * mm * count), count, dropped: 0 };
}

/** Modified Allan variance at factors m, 2m and 4m, no gaps, in one shared pass. */
export function octaveTriple(s: Float64Array, n: number, m: number): KernelResult[] {
  const [t1, t2, t4] = [n - 3 * m + 2, n - 6 * m + 2, n - 12 * m + 2];
  const [i1, i2, i4] = [firstInner(s, m), firstInner(s, 2 * m), firstInner(s, 4 * m)];
  const st = Float64Array.of(i1, i1 * i1, i2, i2 * i2, i4, i4 * i4);
  // Term j's update gives inner_{j+1}, so a factor with t terms runs updates j = 0 … t − 2.
  let j = 0;
  for (; j < t4 - 1; j += BLOCK) {
    const end = Math.min(j + BLOCK, t4 - 1);
    if (m === 1) tripleBlockFromOne(s, j, end, st);
    else tripleBlock(s, m, j, end, st);
  }
  for (j = Math.max(t4 - 1, 0); j < t2 - 1; j += BLOCK)
    pairBlock(s, m, j, Math.min(j + BLOCK, t2 - 1), st);
  for (j = Math.max(t2 - 1, 0); j < t1 - 1; j += BLOCK)
    singleBlock(s, m, j, Math.min(j + BLOCK, t1 - 1), st);
  return [
    variance(st[A] ?? 0, m, t1),
    variance(st[B] ?? 0, 2 * m, t2),
    variance(st[C] ?? 0, 4 * m, t4),
  ];
}
