// Exact moments of a stability estimator for Gaussian noise, from first principles: each term is
// a linear form z_t = w_t·e in independent unit innovations e, so Q = Σ z_t² has
// E[Q] = Σ|w_t|² and Var[Q] = 2 Σ_{t,s} (w_t·w_s)², and edf = 2E²/Var (the definition of edf,
// NIST SP 1065 §5.3). Independent of the code under test.

export type Innovation = "white-fm" | "white-pm" | "random-walk-fm";
export type Estimator = "adev" | "oadev" | "mdev" | "ohdev";

/** Coefficients of the term in the running sum S (S_j = Σ_{l<j} y_l) at offsets k·m. */
function second(start: number, m: number, d: number): [number, number][] {
  const c = d === 2 ? [1, -2, 1] : [-1, 3, -3, 1];
  return c.map((v, k): [number, number] => [start + k * m, v]);
}

/** Weight vector over y (length n) of one term. */
function termOverY(estimator: Estimator, start: number, m: number, n: number): Float64Array {
  const w = new Float64Array(n);
  const inner = estimator === "mdev" ? m : 1;
  for (let j = 0; j < inner; j++) {
    for (const [at, c] of second(start + j, m, estimator === "ohdev" ? 3 : 2)) {
      for (let l = 0; l < at; l++) w[l] = (w[l] ?? 0) + c;
    }
  }
  return w;
}

function termStarts(estimator: Estimator, m: number, n: number): number[] {
  const out: number[] = [];
  const stride = estimator === "adev" ? m : 1;
  const span =
    estimator === "adev" || estimator === "oadev"
      ? 2 * m
      : estimator === "mdev"
        ? 3 * m - 1
        : 3 * m;
  for (let i = 0; i + span <= n; i += stride) out.push(i);
  return out;
}

/** Maps a weight over y to a weight over the innovations of the noise model. */
function toInnovations(w: Float64Array, noise: Innovation): Float64Array {
  if (noise === "white-fm") return w;
  if (noise === "white-pm") {
    // y_l = e_{l+1} − e_l.
    const out = new Float64Array(w.length + 1);
    for (let l = 0; l < w.length; l++) {
      out[l + 1] = (out[l + 1] ?? 0) + (w[l] ?? 0);
      out[l] = (out[l] ?? 0) - (w[l] ?? 0);
    }
    return out;
  }
  // y_l = Σ_{q≤l} e_q.
  const out = new Float64Array(w.length);
  let s = 0;
  for (let q = w.length - 1; q >= 0; q--) {
    s += w[q] ?? 0;
    out[q] = s;
  }
  return out;
}

function dot(a: Float64Array, b: Float64Array): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += (a[i] ?? 0) * (b[i] ?? 0);
  return s;
}

export interface ExactMoments {
  readonly terms: number;
  /** E[Σ z_t²]/terms for unit innovations. */
  readonly meanTerm: number;
  readonly edf: number;
}

export function exactMoments(
  estimator: Estimator,
  noise: Innovation,
  m: number,
  n: number,
): ExactMoments {
  const rows = termStarts(estimator, m, n).map((i) =>
    toInnovations(termOverY(estimator, i, m, n), noise),
  );
  let mean = 0;
  let variance = 0;
  rows.forEach((a, i) => {
    const aa = dot(a, a);
    mean += aa;
    variance += 2 * aa * aa;
    for (let j = i + 1; j < rows.length; j++) variance += 4 * dot(a, rows[j] ?? a) ** 2;
  });
  return { terms: rows.length, meanTerm: mean / rows.length, edf: (2 * mean * mean) / variance };
}
