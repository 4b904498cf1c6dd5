// Builds the client once into bench/.build/client-dist (or reuses EQUIPOT_BENCH_CLIENT_DIST), and
// sizes its JavaScript files as they would travel: gzip level 9 of the bytes on disk.
import { execFileSync } from "node:child_process";
import { existsSync, readFileSync } from "node:fs";
import { join, resolve } from "node:path";
import { gzipSync } from "node:zlib";
import { BUILD_DIR } from "../science/timing";

export interface ClientBuild {
  dir: string;
  /** null when an existing build was reused. */
  buildMs: number | null;
}

export function buildClient(): ClientBuild {
  const given = process.env.EQUIPOT_BENCH_CLIENT_DIST;
  if (given !== undefined && given !== "") {
    const dir = resolve(given);
    if (!existsSync(join(dir, "index.html"))) throw new Error(`${dir} holds no built client`);
    return { dir, buildMs: null };
  }
  const dir = join(BUILD_DIR, "client-dist");
  const t0 = performance.now();
  execFileSync("npx", ["vite", "build", "--outDir", dir, "--emptyOutDir", "--logLevel", "warn"], {
    stdio: ["ignore", "ignore", "inherit"],
  });
  return { dir, buildMs: performance.now() - t0 };
}

export interface SizedFile {
  path: string;
  bytes: number;
  gzipBytes: number;
}

/** Sizes of the files behind these same-origin URL paths (e.g. /assets/index-abc.js). */
export function sizeFiles(dir: string, urlPaths: Iterable<string>): SizedFile[] {
  return [...new Set(urlPaths)].map((path) => {
    const bytes = readFileSync(join(dir, decodeURIComponent(path)));
    return { path, bytes: bytes.length, gzipBytes: gzipSync(bytes, { level: 9 }).length };
  });
}
