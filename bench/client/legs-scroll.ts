// The logistics dashboard's legs table (TanStack Table with a virtual body) holding 10,000 legs,
// scrolled top to bottom with the mouse wheel while long tasks are recorded.
import { longTasks, readLongTasks, scroller, scrollerState, watchLongTasks } from "./page-scripts";
import type { DemoCampaign } from "./seed";
import type { Tablet } from "./tablet";

export interface ScrollResult {
  rate: number;
  legs: number;
  steps: number;
  scrollMs: number;
  longTasksMs: number[];
  /** Most rows in the DOM at once (virtualised: a few dozen, not thousands). */
  rowsInDom: number;
  reachedBottom: boolean;
}

const body = '[aria-label="Legs, scrollable"]';
// About 27 rows per step, a brisk scroll: the table moves ~5 viewports a step.
const stepPx = 1500;

export async function openLegs(tablet: Tablet, baseUrl: string, demo: DemoCampaign, n: number) {
  const { page } = tablet;
  const t0 = performance.now();
  await page.goto(`${baseUrl}/campaigns/${demo.campaignId}/logistics`);
  await page.getByText(new RegExp(`^${n} of ${n} legs$`)).waitFor({ timeout: 90_000 });
  return performance.now() - t0;
}

export async function scrollLegs(
  tablet: Tablet,
  legs: number,
  rate: number,
): Promise<ScrollResult> {
  const { page } = tablet;
  // The table sits below the fold: the wheel only reaches it under the pointer, on screen.
  await page.locator(body).scrollIntoViewIfNeeded();
  const box = await page.locator(body).boundingBox();
  if (box === null) throw new Error("the legs table is not on the page");
  await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
  await page.evaluate(watchLongTasks);
  await tablet.throttle(rate);
  const t0 = performance.now();
  let steps = 0;
  let rowsInDom = 0;
  let reachedBottom = false;
  try {
    // Bounded: twice the steps the height needs, in case some wheel events are coalesced.
    for (let limit = Math.ceil((legs * 56 * 2) / stepPx); steps < limit; steps++) {
      await page.mouse.wheel(0, stepPx);
      const state = scroller.parse(await page.evaluate(scrollerState(body)));
      if (state === null) throw new Error("the legs table went away while scrolling");
      rowsInDom = Math.max(rowsInDom, state.rows);
      if (state.top + state.view >= state.height - 1) {
        reachedBottom = true;
        break;
      }
    }
    // Let the last frames and their tasks finish before reading.
    await page.waitForTimeout(300);
  } finally {
    await tablet.throttle(1);
  }
  return {
    rate,
    legs,
    steps: steps + 1,
    scrollMs: performance.now() - t0,
    longTasksMs: longTasks.parse(await page.evaluate(readLongTasks)),
    rowsInDom,
    reachedBottom,
  };
}
