// Client benchmark (not a test): `node --import tsx bench/client.ts`.
// In Debian's Chromium on loopback, against the real server and a fresh demo database:
// the initial route's JavaScript (gzip -9), the site board's largest contentful paint served by the
// service worker with the CPU slowed 4×, a 100,000-sample temperature chart from click to paint,
// and long tasks while the 10,000-leg logistics table is scrolled. EQUIPOT_BENCH_CLIENT_DIST
// reuses a build. Prints a table and writes bench/.build/client.json; runClientBench() returns rows.
import { mkdirSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { pathToFileURL } from "node:url";
import { startClientServer, type ClientServer } from "./client/app-server";
import { buildClient } from "./client/build";
import { measureChart, waitForSamples, type ChartRuns } from "./client/chart";
import {
  measureBoardLcp,
  measureBoardStartJs,
  measureInitialJs,
  type BoardLcp,
  type InitialJs,
} from "./client/initial-route";
import { openLegs, scrollLegs, type ScrollResult } from "./client/legs-scroll";
import { insertLegs, pushTemperatures, readDemoCampaign, type DemoCampaign } from "./client/seed";
import { openTablet, signInAs, type Tablet } from "./client/tablet";
import { BUILD_DIR } from "./science/timing";

export interface ClientRow {
  readonly name: string;
  readonly n: number;
  /** The measured figure in `unit` (a median where there are repeats). */
  readonly figure: number | null;
  readonly unit: "KiB" | "ms" | "long tasks";
  readonly baseline: number | null;
  readonly ratio: number | null;
  readonly limit: string;
  readonly pass: boolean | null;
  readonly note: string;
}

const SAMPLES = 100_000;
const LEGS = 10_000;
const LCP_RELOADS = 5;
const CHART_REPEATS = 3;
const DEADLINE_MS = 170_000;
const KiB = 1024;

const started = performance.now();
/** Progress on stderr, so a slow step shows where the time goes. */
const step = (what: string) =>
  console.error(`[client bench ${((performance.now() - started) / 1000).toFixed(1)} s] ${what}`);

const ms = (values: readonly number[]) => values.map((v) => v.toFixed(0)).join(", ");

function initialJsRow(js: InitialJs, name: string): ClientRow {
  const kib = js.gzipBytes / KiB;
  const largest = js.files
    .slice(0, 5)
    .map((f) => `${f.path.replace("/assets/", "")} ${(f.gzipBytes / KiB).toFixed(1)}`)
    .join(", ");
  return {
    name,
    n: js.files.length,
    figure: kib,
    unit: "KiB",
    baseline: null,
    ratio: null,
    limit: "≤ 170 KiB",
    pass: kib <= 170 && js.lazyLoaded.length === 0,
    note:
      `${js.files.length} JS files requested; largest (KiB gzip): ${largest}; ` +
      (js.lazyLoaded.length === 0
        ? "maplibre, uPlot and the map chunks not requested"
        : `lazy chunks requested: ${js.lazyLoaded.join(", ")}`),
  };
}

function lcpRow(lcp: BoardLcp): ClientRow {
  return {
    name: "site board LCP, CPU 4×, reload served by the service worker",
    n: lcp.runsMs.length,
    figure: lcp.medianMs,
    unit: "ms",
    baseline: null,
    ratio: null,
    limit: "≤ 1500 ms",
    pass: lcp.medianMs <= 1500 && lcp.fromWorker === lcp.responses,
    note:
      `reloads: ${ms(lcp.runsMs)} ms; LCP element ${lcp.element}; ` +
      `${lcp.fromWorker} of ${lcp.responses} document and script responses from the service worker`,
  };
}

function chartRow(chart: ChartRuns, seedNote: string): ClientRow {
  const goal = chart.rate === 1;
  return {
    name: `temperature chart, ${SAMPLES.toLocaleString("en-GB")} samples, click → painted, CPU ${chart.rate}×${goal ? " (no throttling)" : ""}`,
    n: chart.readings,
    figure: chart.medianMs,
    unit: "ms",
    baseline: null,
    ratio: null,
    limit: goal ? "≤ 500 ms" : "— (≤ 500 ms is the 1× goal)",
    pass: goal ? chart.medianMs <= 500 && chart.readings === SAMPLES : null,
    note:
      `runs: ${ms(chart.runsMs)} ms; medians: samples read and merged (count shown) at ${chart.dataMedianMs.toFixed(0)} ms, ` +
      `uPlot canvas in the page at ${chart.canvasMedianMs.toFixed(0)} ms; ${seedNote}`,
  };
}

function scrollRow(scroll: ScrollResult, seedNote: string): ClientRow {
  const over = scroll.longTasksMs.filter((d) => d > 50);
  const longest = scroll.longTasksMs.length === 0 ? 0 : Math.max(...scroll.longTasksMs);
  const goal = scroll.rate === 1;
  return {
    name: `legs table, ${scroll.legs.toLocaleString("en-GB")} rows, wheel-scrolled top to bottom, CPU ${scroll.rate}×`,
    n: scroll.legs,
    figure: over.length,
    unit: "long tasks",
    baseline: null,
    ratio: null,
    limit: goal ? "0 long tasks > 50 ms" : "— (the goal is at 1×)",
    pass: goal ? over.length === 0 && scroll.reachedBottom : null,
    note:
      `longest task ${longest.toFixed(0)} ms (all: ${ms(scroll.longTasksMs) || "none"}); ${scroll.steps} wheel steps in ${(scroll.scrollMs / 1000).toFixed(1)} s` +
      `${scroll.reachedBottom ? "" : " (bottom NOT reached)"}; at most ${scroll.rowsInDom} rows in the DOM; ${seedNote}`,
  };
}

/** The logistics account's tablet, signed in and showing all legs once they have been pulled. */
async function openCoordinator(server: ClientServer, demo: DemoCampaign, tablets: Tablet[]) {
  const coordinator = await openTablet();
  tablets.push(coordinator);
  await signInAs(coordinator.page, server.baseUrl, "logistics");
  const openMs = await openLegs(coordinator, server.baseUrl, demo, LEGS + demo.legs);
  return { coordinator, openMs };
}

async function runAll(server: ClientServer, buildDir: string, tablets: Tablet[]) {
  const demo = await readDemoCampaign(server.baseUrl, "field@demo.equipot.test");
  const field = await openTablet();
  tablets.push(field);
  step("signing in and opening the site board");
  const js = await measureInitialJs(field, server.baseUrl, buildDir, demo);
  step("site board start served by the service worker");
  const start = await measureBoardStartJs(field, server.baseUrl, buildDir, demo);
  step("site board LCP, 4× CPU");
  const lcp = await measureBoardLcp(field, server.baseUrl, demo, LCP_RELOADS);

  // Seeded after the board was measured, so its figure is for the demo campaign as shipped.
  step("seeding temperatures and legs");
  const t0 = performance.now();
  await pushTemperatures(server.baseUrl, demo, SAMPLES);
  const pushMs = performance.now() - t0;
  const t1 = performance.now();
  await insertLegs(server.databaseUrl, demo, LEGS);
  const legsMs = performance.now() - t1;
  // Both tablets pull at once (not timed), then each is measured while the other is idle.
  step("both tablets pulling the seeded data");
  const samples = waitForSamples(field, server.baseUrl, demo, SAMPLES);
  const legs = openCoordinator(server, demo, tablets);
  const [pulledMs, { coordinator, openMs }] = await Promise.all([samples, legs]);
  step("temperature chart, 1× and 4×");
  const tempNote =
    `seeded by ${SAMPLES / 5000} pushes of one 5,000-sample entry (${(pushMs / 1000).toFixed(1)} s), ` +
    `pulled onto the tablet in ${(pulledMs / 1000).toFixed(1)} s (not timed)`;
  const charts = [
    await measureChart(field, server.baseUrl, demo, 1, CHART_REPEATS),
    await measureChart(field, server.baseUrl, demo, 4, CHART_REPEATS),
  ];
  await field.page.goto("about:blank");

  step("scrolling the legs table");
  const legsNote =
    `${LEGS.toLocaleString("en-GB")} legs inserted in PostgreSQL (${(legsMs / 1000).toFixed(1)} s), ` +
    `pulled and listed in ${(openMs / 1000).toFixed(1)} s (not timed)`;
  const scrolls = [await scrollLegs(coordinator, LEGS + demo.legs, 1)];
  return [
    initialJsRow(
      js,
      "initial route JS, fresh device (sign-in + site board, and the one-time fetch of every page before the service worker controls the tab), gzip -9",
    ),
    initialJsRow(start, "initial route JS, site board start served by the service worker, gzip -9"),
    lcpRow(lcp),
    ...charts.map((c) => chartRow(c, tempNote)),
    ...scrolls.map((s) => scrollRow(s, legsNote)),
  ];
}

export async function runClientBench(): Promise<ClientRow[]> {
  step("building the client");
  const build = buildClient();
  step("starting PostgreSQL and the server");
  const server = await startClientServer(build.dir);
  const tablets: Tablet[] = [];
  let timer: NodeJS.Timeout | undefined;
  const deadline = new Promise<never>((_, reject) => {
    timer = setTimeout(
      () => reject(new Error(`the client benchmark passed ${DEADLINE_MS / 1000} s`)),
      DEADLINE_MS,
    );
  });
  try {
    const rows = await Promise.race([runAll(server, build.dir, tablets), deadline]);
    mkdirSync(BUILD_DIR, { recursive: true });
    writeFileSync(join(BUILD_DIR, "client.json"), JSON.stringify(rows, null, 2) + "\n");
    return rows;
  } finally {
    clearTimeout(timer);
    for (const tablet of tablets) await tablet.profile.close().catch(() => undefined);
    await server.stop();
  }
}

export function printClientRows(rows: readonly ClientRow[]): void {
  const fmt = (v: number | null, digits = 0) => (v === null ? "—" : v.toFixed(digits));
  console.table(
    rows.map((r) => ({
      benchmark: r.name,
      n: r.n,
      figure: `${fmt(r.figure, r.unit === "KiB" ? 1 : 0)} ${r.unit}`,
      baseline: fmt(r.baseline),
      ratio: fmt(r.ratio, 2),
      target: r.limit,
      pass: r.pass === null ? "—" : r.pass ? "yes" : "NO",
      note: r.note,
    })),
  );
}

if (process.argv[1] !== undefined && import.meta.url === pathToFileURL(process.argv[1]).href) {
  printClientRows(await runClientBench());
}
