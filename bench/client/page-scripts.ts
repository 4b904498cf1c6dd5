// Code run inside the page, kept as plain strings: functions compiled by tsx would carry helper
// calls (`__name`) that do not exist in the page.
import { z } from "zod";

/** The last largest-contentful-paint entry, once none has come for 1.5 s. */
export const readLcp = `new Promise((resolve) => {
  let last = null;
  let timer = 0;
  const observer = new PerformanceObserver((list) => {
    const entries = list.getEntries();
    const e = entries[entries.length - 1];
    const el = e.element;
    last = {
      ms: e.startTime,
      size: e.size,
      element: el ? el.tagName.toLowerCase() + ": " + (el.textContent || "").trim().slice(0, 40) : e.url,
    };
    clearTimeout(timer);
    timer = setTimeout(() => { observer.disconnect(); resolve(last); }, 1500);
  });
  observer.observe({ type: "largest-contentful-paint", buffered: true });
  timer = setTimeout(() => { observer.disconnect(); resolve(last); }, 3000);
})`;

export const lcpEntry = z
  .object({ ms: z.number(), size: z.number(), element: z.string() })
  .nullable();

/**
 * Clicks the board's "Temperatures" link (a client-side navigation) and times until the chart's
 * canvas is in the page and two frames have passed, i.e. the drawn chart has been painted.
 */
export const timeChart = `new Promise((resolve, reject) => {
  const link = [...document.querySelectorAll("a")].find((a) => a.textContent.trim() === "Temperatures");
  if (!link) { reject(new Error("no Temperatures link on the board")); return; }
  const t0 = performance.now();
  let canvasMs = null;
  let dataMs = null;
  const done = () => {
    const text = document.body.innerText.match(/([\\d,]+) readings from (\\d+) entr/);
    resolve({ dataMs, canvasMs, drawnMs: performance.now() - t0, readings: text ? Number(text[1].replace(/,/g, "")) : 0 });
  };
  const observer = new MutationObserver(() => {
    // The count above the chart shows once the samples are read and merged.
    if (dataMs === null && document.body.textContent.includes(" readings from ")) dataMs = performance.now() - t0;
    if (canvasMs !== null || !document.querySelector('[data-testid="temperature-chart"] canvas')) return;
    canvasMs = performance.now() - t0;
    observer.disconnect();
    requestAnimationFrame(() => requestAnimationFrame(done));
  });
  observer.observe(document.body, { childList: true, subtree: true });
  setTimeout(() => reject(new Error("no chart within 30 s")), 30000);
  link.click();
})`;

export const chartTiming = z.object({
  dataMs: z.number(),
  canvasMs: z.number(),
  drawnMs: z.number(),
  readings: z.number(),
});

export const watchLongTasks = `(() => {
  globalThis.benchLongTasks = [];
  new PerformanceObserver((list) => {
    for (const e of list.getEntries()) globalThis.benchLongTasks.push(e.duration);
  }).observe({ type: "longtask" });
  return true;
})()`;

export const readLongTasks = "globalThis.benchLongTasks";
export const longTasks = z.array(z.number());

/** The scroller's position after the next frame (one round trip per wheel step). */
export const scrollerState = (
  selector: string,
) => `new Promise((resolve) => requestAnimationFrame(() => {
  const el = document.querySelector(${JSON.stringify(selector)});
  resolve(el ? { top: el.scrollTop, height: el.scrollHeight, view: el.clientHeight,
    rows: el.querySelectorAll('[role="row"]').length } : null);
}))`;

export const scroller = z
  .object({ top: z.number(), height: z.number(), view: z.number(), rows: z.number() })
  .nullable();
