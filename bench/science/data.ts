// Deterministic inputs for the science benchmark: Gaussian white FM from a seeded generator
// (Box–Muller over a 32-bit multiply–xorshift generator) and a grid-shaped levelling network.

function uniform(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = Math.imul(state ^ (state >>> 15), state | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function whiteFrequency(n: number, sigma: number, seed: number): Float64Array {
  const u = uniform(seed);
  const y = new Float64Array(n);
  for (let i = 0; i < n; i += 2) {
    const r = sigma * Math.sqrt(-2 * Math.log(1 - u()));
    const phi = 2 * Math.PI * u();
    y[i] = r * Math.cos(phi);
    if (i + 1 < n) y[i + 1] = r * Math.sin(phi);
  }
  return y;
}

export interface BenchNetwork {
  readonly fixed: { point: string; heightM: number }[];
  readonly observations: { from: string; to: string; deltaM: number; lengthKm: number }[];
}

/** rows × cols points, each tied to its right and lower neighbour; two fixed corners. */
export function gridNetwork(rows: number, cols: number, seed: number): BenchNetwork {
  const noise = whiteFrequency(2 * rows * cols + rows * cols, 1, seed);
  const name = (r: number, c: number) => `BM${r}.${c}`;
  const height = (r: number, c: number) => 500 + 50 * (noise[r * cols + c] ?? 0);
  const observations: BenchNetwork["observations"] = [];
  let k = rows * cols;
  const link = (r1: number, c1: number, r2: number, c2: number) => {
    const lengthKm = 1 + (k % 5) * 0.3;
    const errorM = 0.001 * Math.sqrt(lengthKm) * (noise[k++] ?? 0);
    observations.push({
      from: name(r1, c1),
      to: name(r2, c2),
      deltaM: height(r2, c2) - height(r1, c1) + errorM,
      lengthKm,
    });
  };
  for (let r = 0; r < rows; r++) {
    for (let c = 0; c < cols; c++) {
      if (c + 1 < cols) link(r, c, r, c + 1);
      if (r + 1 < rows) link(r, c, r + 1, c);
    }
  }
  const fixed = [
    { point: name(0, 0), heightM: height(0, 0) },
    { point: name(rows - 1, cols - 1), heightM: height(rows - 1, cols - 1) },
  ];
  return { fixed, observations };
}
