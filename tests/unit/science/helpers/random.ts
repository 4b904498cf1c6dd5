// Deterministic noise for the tests: a small seeded generator (mulberry32, 32-bit state) and the
// Box–Muller transform; power-law noise by the fractional-difference filter of N. J. Kasdin and
// T. Walter, "Discrete simulation of power law noise", Proc. IEEE FCS 1992: h0 = 1,
// h_k = h_{k−1}·(k − 1 + β/2)/k for a 1/f^β spectrum.

export function seededUniform(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function seededGaussian(seed: number): () => number {
  const u = seededUniform(seed);
  let spare: number | null = null;
  return () => {
    if (spare !== null) {
      const s = spare;
      spare = null;
      return s;
    }
    const r = Math.sqrt(-2 * Math.log(1 - u()));
    const phi = 2 * Math.PI * u();
    spare = r * Math.sin(phi);
    return r * Math.cos(phi);
  };
}

export function whiteNoise(n: number, sigma: number, seed: number): Float64Array {
  const g = seededGaussian(seed);
  return Float64Array.from({ length: n }, () => sigma * g());
}

/** 1/f^β noise of n samples by direct convolution (O(n²): keep n small). */
export function powerLawNoise(n: number, beta: number, seed: number): Float64Array {
  const w = whiteNoise(n, 1, seed);
  const h = new Float64Array(n);
  h[0] = 1;
  for (let k = 1; k < n; k++) h[k] = ((h[k - 1] ?? 0) * (k - 1 + beta / 2)) / k;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let k = 0; k <= i; k++) s += (h[k] ?? 0) * (w[i - k] ?? 0);
    out[i] = s;
  }
  return out;
}

export function cumulativeSum(v: ArrayLike<number>): Float64Array {
  const out = new Float64Array(v.length);
  let s = 0;
  for (let i = 0; i < v.length; i++) {
    s += v[i] ?? 0;
    out[i] = s;
  }
  return out;
}

export function differences(v: ArrayLike<number>): Float64Array {
  const out = new Float64Array(Math.max(v.length - 1, 0));
  for (let i = 0; i < out.length; i++) out[i] = (v[i + 1] ?? 0) - (v[i] ?? 0);
  return out;
}

/** Fractional-frequency series of each noise type, unit level, n samples. */
export function noiseSeries(type: string, n: number, seed: number): Float64Array {
  switch (type) {
    case "white-pm":
      return differences(whiteNoise(n + 1, 1, seed));
    case "flicker-pm":
      return differences(powerLawNoise(n + 1, 1, seed));
    case "white-fm":
      return whiteNoise(n, 1, seed);
    case "flicker-fm":
      return powerLawNoise(n, 1, seed);
    default:
      return cumulativeSum(whiteNoise(n, 1, seed));
  }
}
