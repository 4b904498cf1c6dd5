// Science-core benchmark (not a test): `node --import tsx bench/science.ts`.
// Times overlapping ADEV and MDEV at all octave factors on 10⁶ points against a plain C loop doing
// the same sums (cc -O2, same run), a 500-point levelling adjustment, and memory per sample.
// Prints a table and writes bench/.build/science.json; runScienceBench() returns the rows.
import { writeFileSync } from "node:fs";
import { join } from "node:path";
import { pathToFileURL } from "node:url";
import {
  adjustLevellingNetwork,
  modifiedAllanDeviation,
  overlappingAllanDeviation,
} from "../shared/science";
import { overlappingAllanMany } from "../shared/science/stability/adev";
import { maxFactor } from "../shared/science/stability/factors";
import { modifiedAllanMany } from "../shared/science/stability/mdev";
import { prepareSeries } from "../shared/science/stability/prepare";
import { gridNetwork, whiteFrequency } from "./science/data";
import {
  BUILD_DIR,
  compileC,
  median,
  removeSamples,
  runC,
  time,
  type CResult,
} from "./science/timing";

export interface Row {
  readonly name: string;
  readonly n: number;
  /** Median wall time, ms (null for the memory row). */
  readonly medianMs: number | null;
  /** The C reference doing the same sums, when a compiler is available. */
  readonly cMedianMs: number | null;
  readonly ratioToC: number | null;
  /** The target: a time limit in ms, or a ratio limit to C. */
  readonly limit: string;
  readonly pass: boolean | null;
  readonly note: string;
}

const N = 1_000_000;
const ROUNDS = 5;

/** The sums alone, as the C program does them: prepare once, then every octave factor. */
function octaveSums(y: Float64Array, statistic: "oadev" | "mdev"): number[] {
  const p = prepareSeries(y, 1);
  const factors: number[] = [];
  for (let m = 1; m <= maxFactor(statistic, p.n); m *= 2) factors.push(m);
  const sums =
    statistic === "oadev" ? overlappingAllanMany(p, factors) : modifiedAllanMany(p, factors);
  return sums.map((k) => Math.sqrt(k.variance));
}

function agreement(ts: number[], c: CResult | null): string {
  if (c === null) return "no C compiler: ratio not measured";
  const worst = ts.reduce((w, v, i) => Math.max(w, Math.abs(v - (c.deviations[i] ?? NaN)) / v), 0);
  return Number.isFinite(worst) && c.deviations.length === ts.length
    ? `TS and C agree to ${worst.toExponential(1)} relative`
    : "TS and C values DIFFER";
}

interface Timings {
  readonly sums: number;
  readonly full: number;
  readonly c: CResult | null;
  readonly cGrouped: number | null;
}

/** TS and C timed in alternating rounds, so a busy machine slows both alike; medians kept. */
function timeStatistic(exe: string | null, y: Float64Array, statistic: "oadev" | "mdev"): Timings {
  const api = statistic === "oadev" ? overlappingAllanDeviation : modifiedAllanDeviation;
  const sums: number[] = [];
  const full: number[] = [];
  const c: CResult[] = [];
  const grouped: number[] = [];
  for (let r = 0; r < ROUNDS; r++) {
    if (exe !== null) c.push(runC(exe, y, statistic, 3));
    if (exe !== null) grouped.push(runC(exe, y, `${statistic}-grouped`, 3).medianMs);
    sums.push(time(() => octaveSums(y, statistic), 3, r === 0 ? 2 : 0));
    full.push(time(() => api(y, 1), 3, r === 0 ? 2 : 0));
  }
  const cMedian = median(c.map((x) => x.medianMs));
  const first = c[0];
  return {
    sums: median(sums),
    full: median(full),
    c: first === undefined ? null : { medianMs: cMedian, deviations: first.deviations },
    cGrouped: grouped.length > 0 ? median(grouped) : null,
  };
}

function stabilityRows(exe: string | null): Row[] {
  const y = whiteFrequency(N, 1e-15, 1);
  const rows: Row[] = [];
  for (const statistic of ["oadev", "mdev"] as const) {
    const label = statistic === "oadev" ? "overlapping ADEV" : "MDEV";
    const t = timeStatistic(exe, y, statistic);
    const ratio = (ms: number) => (t.c === null ? null : ms / t.c.medianMs);
    const sumsRatio = ratio(t.sums);
    const grouped =
      t.cGrouped === null
        ? ""
        : `; C with the same shared-load passes: ${t.cGrouped.toFixed(1)} ms`;
    rows.push({
      name: `${label}, octave factors, sums only`,
      n: N,
      medianMs: t.sums,
      cMedianMs: t.c?.medianMs ?? null,
      ratioToC: sumsRatio,
      limit: "≤ 2 × C",
      pass: sumsRatio === null ? null : sumsRatio <= 2,
      note: agreement(octaveSums(y, statistic), t.c) + grouped,
    });
    rows.push({
      name: `${label}, octave factors, full API (noise id, edf, 68 % CI)`,
      n: N,
      medianMs: t.full,
      cMedianMs: t.c?.medianMs ?? null,
      ratioToC: ratio(t.full),
      limit: statistic === "oadev" ? "< 100 ms" : "O(N) per factor",
      pass: statistic === "oadev" ? t.full < 100 : null,
      note: "",
    });
  }
  return rows;
}

function scalingRow(): Row {
  const small = whiteFrequency(N, 1e-15, 2);
  const large = whiteFrequency(2 * N, 1e-15, 3);
  const a = time(() => overlappingAllanDeviation(small, 1), 5);
  const b = time(() => overlappingAllanDeviation(large, 1), 5);
  return {
    name: "overlapping ADEV full API, 2·10⁶ points",
    n: 2 * N,
    medianMs: b,
    cMedianMs: null,
    ratioToC: null,
    limit: "≈ 2.1 × the 10⁶ time (N log N)",
    pass: b / a < 2.6,
    note: `${(b / a).toFixed(2)} × the 10⁶-point time`,
  };
}

/** Typed-array bytes held by the prepared series per sample, at two lengths (linear in N). */
function memoryRow(): Row {
  const perSample = [N, 2 * N].map((n) => {
    const y = whiteFrequency(n, 1e-15, 4);
    const before = process.memoryUsage().arrayBuffers;
    const p = prepareSeries(y, 1);
    const bytes = process.memoryUsage().arrayBuffers - before;
    return bytes / p.n;
  });
  const [a = NaN, b = NaN] = perSample;
  return {
    name: "memory: typed-array bytes per sample while analysing",
    n: 2 * N,
    medianMs: null,
    cMedianMs: null,
    ratioToC: null,
    limit: "linear in N",
    pass: Math.abs(a - b) / a < 0.1,
    note: `${a.toFixed(1)} B/sample at 10⁶, ${b.toFixed(1)} B/sample at 2·10⁶ (the running sum; a Float64Array input is read in place)`,
  };
}

function levellingRow(): Row {
  const net = gridNetwork(20, 25, 5);
  const ms = time(() => adjustLevellingNetwork(net), 3, 1);
  return {
    name: `levelling adjustment, 500 points, ${net.observations.length} observations`,
    n: 500,
    medianMs: ms,
    cMedianMs: null,
    ratioToC: null,
    limit: "< 1000 ms",
    pass: ms < 1000,
    note: "dense normal equations, ml-matrix Cholesky",
  };
}

export async function runScienceBench(): Promise<Row[]> {
  const exe = compileC();
  const rows = [...stabilityRows(exe), scalingRow(), memoryRow(), levellingRow()];
  removeSamples();
  writeFileSync(join(BUILD_DIR, "science.json"), JSON.stringify(rows, null, 2) + "\n");
  return rows;
}

export function printScienceRows(rows: readonly Row[]): void {
  const fmt = (v: number | null, digits = 1) => (v === null ? "—" : v.toFixed(digits));
  const table = rows.map((r) => ({
    benchmark: r.name,
    n: r.n,
    "TS ms": fmt(r.medianMs),
    "C ms": fmt(r.cMedianMs),
    "TS/C": fmt(r.ratioToC, 2),
    target: r.limit,
    pass: r.pass === null ? "—" : r.pass ? "yes" : "NO",
    note: r.note,
  }));
  console.table(table);
}

if (process.argv[1] !== undefined && import.meta.url === pathToFileURL(process.argv[1]).href) {
  printScienceRows(await runScienceBench());
}
