// The temperature chart of one crate with 100,000 samples: from the click on the board's
// "Temperatures" link to the chart painted. That includes reading the site's entries from
// IndexedDB, merging the parts, the statistics and uPlot's drawing.
import { median } from "../science/timing";
import { chartTiming, timeChart } from "./page-scripts";
import type { DemoCampaign } from "./seed";
import { boardUrl, waitForBoard, type Tablet } from "./tablet";

export interface ChartRuns {
  rate: number;
  runsMs: number[];
  medianMs: number;
  /** Until the merged series' count shows, and until uPlot's canvas is in the page. */
  dataMedianMs: number;
  canvasMedianMs: number;
  readings: number;
}

/** Reloads until the sync has brought the samples onto the tablet, and warms the uPlot chunk. */
export async function waitForSamples(
  tablet: Tablet,
  baseUrl: string,
  demo: DemoCampaign,
  samples: number,
): Promise<number> {
  const { page } = tablet;
  const t0 = performance.now();
  const url = `${boardUrl(baseUrl, demo.campaignId, demo.siteId)}/temperatures`;
  await page.goto(url);
  const shown = `${samples.toLocaleString("en-GB")} readings`;
  await page.getByText(shown).waitFor({ timeout: 90_000 });
  await page.locator('[data-testid="temperature-chart"] canvas').first().waitFor();
  return performance.now() - t0;
}

export async function measureChart(
  tablet: Tablet,
  baseUrl: string,
  demo: DemoCampaign,
  rate: number,
  repeats: number,
): Promise<ChartRuns> {
  const { page } = tablet;
  const drawn: number[] = [];
  const canvas: number[] = [];
  const data: number[] = [];
  let readings = 0;
  for (let i = 0; i < repeats; i++) {
    await page.goto(boardUrl(baseUrl, demo.campaignId, demo.siteId));
    await waitForBoard(page, demo.siteName);
    await page.waitForLoadState("networkidle");
    await tablet.throttle(rate);
    try {
      const timing = chartTiming.parse(await page.evaluate(timeChart));
      drawn.push(timing.drawnMs);
      canvas.push(timing.canvasMs);
      data.push(timing.dataMs);
      readings = timing.readings;
    } finally {
      await tablet.throttle(1);
    }
  }
  return {
    rate,
    runsMs: drawn,
    medianMs: median(drawn),
    dataMedianMs: median(data),
    canvasMedianMs: median(canvas),
    readings,
  };
}
