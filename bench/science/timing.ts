// Timing helpers for the science benchmark: medians of repeated runs, and the C reference
// compiled with the system `cc -O2` into bench/.build/.
import { execFileSync } from "node:child_process";
import { mkdirSync, rmSync, writeFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";

export const BENCH_DIR = dirname(dirname(fileURLToPath(import.meta.url)));
export const BUILD_DIR = join(BENCH_DIR, ".build");

export function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)] ?? NaN;
}

/** Median wall time (ms) of `repeats` runs after `warmup` unmeasured ones. */
export function time(run: () => unknown, repeats = 7, warmup = 2): number {
  for (let i = 0; i < warmup; i++) run();
  const times: number[] = [];
  for (let i = 0; i < repeats; i++) {
    const t0 = performance.now();
    run();
    times.push(performance.now() - t0);
  }
  return median(times);
}

export interface CResult {
  readonly medianMs: number;
  readonly deviations: number[];
}

/** Compiles the C reference once; null when no C compiler is available. */
export function compileC(): string | null {
  mkdirSync(BUILD_DIR, { recursive: true });
  const exe = join(BUILD_DIR, "science-kernels");
  try {
    execFileSync("cc", ["-O2", "-o", exe, join(BENCH_DIR, "science", "kernels.c"), "-lm"], {
      stdio: "pipe",
    });
    return exe;
  } catch {
    return null;
  }
}

export type CMode = "oadev" | "oadev-grouped" | "mdev" | "mdev-grouped";

const SAMPLES_FILE = join(BUILD_DIR, "science-samples.bin");

/** Deletes the sample file handed to the C program. */
export function removeSamples(): void {
  rmSync(SAMPLES_FILE, { force: true });
}

export function runC(exe: string, y: Float64Array, mode: CMode, repeats = 7): CResult {
  const file = SAMPLES_FILE;
  writeFileSync(file, new Uint8Array(y.buffer, y.byteOffset, y.byteLength));
  const out = execFileSync(exe, [file, mode, String(repeats)], { encoding: "utf8" })
    .trim()
    .split(/\s+/);
  return { medianMs: Number(out[0]), deviations: out.slice(1).map(Number) };
}
