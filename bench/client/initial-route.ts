// The initial route's JavaScript (what the sign-in page and the site board request, gzipped) and
// the site board's largest contentful paint, served by the service worker, with the CPU slowed 4×.
import type { Page, Response } from "playwright-core";
import { waitForSyncStatus } from "../../tests/e2e/flows";
import { median } from "../science/timing";
import { sizeFiles, type SizedFile } from "./build";
import { lcpEntry, readLcp } from "./page-scripts";
import type { DemoCampaign } from "./seed";
import { boardUrl, signInAs, waitForBoard, waitForServiceWorker, type Tablet } from "./tablet";

export interface InitialJs {
  files: SizedFile[];
  gzipBytes: number;
  /** Chunks that must stay lazy and were requested anyway. */
  lazyLoaded: string[];
}

const isScript = (path: string) => /\.m?js$/.test(path);
// Chunks the sign-in page and the board must never request: the map, the charts and their
// libraries, and the ZIP library (unsent changes only), which load inside the pages or actions
// that need them. Route chunks and the libraries of single pages are fetched once on a first
// visit, before the service worker controls the tab (router.tsx, warmPagesWithoutWorker), and
// are counted in the total like every other script the two pages request.
const lazyChunk = /\/(maplibre|uplot|campaign-map|report-map|preview\.worker|zip)[^/]*\.m?js$/;

// Nor, once the service worker controls the tablet, other pages or their libraries (forms, QR,
// statistics, CSV, the legs table): the board is in the initial bundle.
const otherPageChunk = /\/(forms|qr|stats|csv|table|[\w-]+-route)-[^/]*\.m?js$/;

/** Collects the paths of this origin's scripts the page requests until stop() is called. */
function recordScripts(page: Page, origin: string): { paths: Set<string>; stop: () => void } {
  const paths = new Set<string>();
  const onRequest = (request: { url: () => string }) => {
    const url = new URL(request.url());
    if (url.origin === origin && isScript(url.pathname)) paths.add(url.pathname);
  };
  page.on("request", onRequest);
  return { paths, stop: () => page.off("request", onRequest) };
}

/** The requested scripts gzipped, largest first, and those the pattern says must stay lazy. */
function sized(buildDir: string, paths: Set<string>, mustStayLazy: (path: string) => boolean) {
  const files = sizeFiles(buildDir, paths).sort((a, b) => b.gzipBytes - a.gzipBytes);
  return {
    files,
    gzipBytes: files.reduce((sum, f) => sum + f.gzipBytes, 0),
    lazyLoaded: files.map((f) => f.path).filter(mustStayLazy),
  };
}

/** Signs in through the page, opens the site board, and leaves the tablet synced and SW-controlled. */
export async function measureInitialJs(
  tablet: Tablet,
  baseUrl: string,
  buildDir: string,
  demo: DemoCampaign,
): Promise<InitialJs> {
  const { page } = tablet;
  const scripts = recordScripts(page, new URL(baseUrl).origin);
  try {
    await signInAs(page, baseUrl, "field");
    await page.goto(boardUrl(baseUrl, demo.campaignId, demo.siteId));
    await waitForBoard(page, demo.siteName);
    await waitForSyncStatus(page, "All changes sent", 30_000);
    await page.waitForLoadState("networkidle");
  } finally {
    scripts.stop();
  }
  await waitForServiceWorker(page);
  return sized(buildDir, scripts.paths, (p) => lazyChunk.test(p));
}

/**
 * The scripts a start of the board requests once the service worker controls the tablet (every
 * start after the first visit): a new document on the board, until the network is idle.
 */
export async function measureBoardStartJs(
  tablet: Tablet,
  baseUrl: string,
  buildDir: string,
  demo: DemoCampaign,
): Promise<InitialJs> {
  const { page } = tablet;
  await waitForServiceWorker(page);
  const scripts = recordScripts(page, new URL(baseUrl).origin);
  try {
    await page.goto(boardUrl(baseUrl, demo.campaignId, demo.siteId));
    await waitForBoard(page, demo.siteName);
    await page.waitForLoadState("networkidle");
  } finally {
    scripts.stop();
  }
  return sized(buildDir, scripts.paths, (p) => lazyChunk.test(p) || otherPageChunk.test(p));
}

export interface BoardLcp {
  runsMs: number[];
  medianMs: number;
  element: string;
  /** Document and script responses of the measured reloads, and how many the worker answered. */
  responses: number;
  fromWorker: number;
}

export async function measureBoardLcp(
  tablet: Tablet,
  baseUrl: string,
  demo: DemoCampaign,
  reloads: number,
): Promise<BoardLcp> {
  const { page } = tablet;
  const shell: Response[] = [];
  const onResponse = (r: Response) => {
    const type = r.request().resourceType();
    if (type === "document" || type === "script") shell.push(r);
  };
  const url = boardUrl(baseUrl, demo.campaignId, demo.siteId);
  if (page.url() !== url) await page.goto(url);
  await waitForBoard(page, demo.siteName);
  page.on("response", onResponse);
  await tablet.throttle(4);
  const runsMs: number[] = [];
  let element = "";
  try {
    for (let i = 0; i < reloads; i++) {
      await page.reload();
      await waitForBoard(page, demo.siteName);
      const entry = lcpEntry.parse(await page.evaluate(readLcp));
      if (entry === null) throw new Error("no largest-contentful-paint entry on the board");
      runsMs.push(entry.ms);
      element = entry.element;
    }
  } finally {
    await tablet.throttle(1);
    page.off("response", onResponse);
  }
  return {
    runsMs,
    medianMs: median(runsMs),
    element,
    responses: shell.length,
    fromWorker: shell.filter((r) => r.fromServiceWorker()).length,
  };
}
