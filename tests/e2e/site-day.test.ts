// A whole site day on a tablet, offline throughout: the crew arrives at the hut, works through the
// arrival checklist with one number out of range, logs a tripped shock indicator with a photo,
// tries a broken temperature-logger file (a clear error with its line, nothing imported) and then a
// good one, levels a section with one bad reading flagged, checks the dew point before unpacking —
// and when the network returns every entry is on the server. Each screen is checked with axe.
import { readFile } from "node:fs/promises";
import { expect, test } from "vitest";
import type { Page } from "playwright-core";
import { screenshot, viewports } from "../helpers/browser";
import { tabletForFile } from "../helpers/tablet";
import { pullDemoCampaign, readyForOffline, seriousViolations, waitForSyncStatus } from "./flows";

const tablet = tabletForFile(viewports.tabletPortrait);

const fixture = (name: string) => readFile(new URL(`../fixtures/loggers/${name}`, import.meta.url));
const png = Buffer.from(
  "iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==",
  "base64",
);

/** No serious or critical axe findings on the screen as it is now. */
async function accessible(page: Page, screen: string) {
  expect(await seriousViolations(page), screen).toEqual([]);
}

async function backToBoard(page: Page) {
  await page
    .getByRole("navigation", { name: "Campaign" })
    .getByRole("link", { name: "Site board" })
    .click();
  await page.getByRole("heading", { name: "Kestrel Ridge hut", level: 1 }).waitFor();
}

const item = (page: Page, label: string) =>
  page
    .getByRole("list", { name: "Items of Arrival at the site" })
    .getByRole("listitem")
    .filter({ has: page.getByRole("heading", { name: label }) });

async function arrivalChecklist(page: Page) {
  await page.getByRole("button", { name: "Arrival at the site" }).click();
  await page.getByRole("heading", { name: "Arrival at the site", level: 1 }).waitFor();
  const number = async (label: string, value: string) => {
    const at = item(page, label);
    await at.getByLabel("Value").fill(value);
    await at.getByRole("button", { name: "Save" }).click();
  };
  await number("Room temperature", "31,5");
  await item(page, "Room temperature")
    .getByText("outside the allowed range (between 18 and 26 °C)")
    .waitFor();
  for (const label of ["Access road", "Weather checked"])
    await item(page, label).getByRole("button", { name: "Done", exact: true }).click();
  await number("Room relative humidity", "45");
  await item(page, "Mains power").getByRole("button", { name: "Stable", exact: true }).click();
  await number("Crates delivered", "5");
  await item(page, "Photo of the crates")
    .locator('input[type="file"]')
    .setInputFiles({ name: "crates.png", mimeType: "image/png", buffer: png });
  await item(page, "Photo of the crates").getByText("Photo kept").waitFor();
  // Each result says who recorded it.
  expect(await item(page, "Access road").innerText()).toContain("Mira Castell");
  await accessible(page, "checklist run");
  await page.getByRole("button", { name: "Sign off" }).click();
  await page.getByText("Signed off", { exact: true }).waitFor();
}

async function trippedIndicator(page: Page) {
  await page.getByRole("link", { name: "Shock indicator" }).click();
  await page.getByRole("heading", { name: "Shock indicator", level: 1 }).waitFor();
  // Saved without answers: each problem at its field, nothing written.
  await page.getByRole("button", { name: "Save reading" }).click();
  await page.getByText("Choose the crate this entry is about").waitFor();
  await accessible(page, "shock indicator form");
  await page
    .getByLabel("Crate", { exact: true })
    .selectOption({ label: "KR-03 — Ultra-stable optical cavity" });
  await page.getByLabel("Rating").fill("25");
  await page.getByText("Tripped", { exact: true }).click();
  await page.getByRole("button", { name: "Save reading" }).click();
  await page
    .getByRole("status")
    .getByText("Limit exceeded: Indicator tripped (rated 25 g)")
    .waitFor();
  const camera = page.locator('input[type="file"][capture="environment"]');
  await camera.setInputFiles({ name: "indicator.png", mimeType: "image/png", buffer: png });
  await page.getByText("on this device now").waitFor();
  await accessible(page, "entry with photo");
  await screenshot(page, "site-day-indicator-800x1280");
}

async function temperatureFiles(page: Page) {
  await page.getByRole("link", { name: "Import temperature file" }).click();
  await page.getByRole("heading", { name: "Import temperatures" }).waitFor();
  await page.getByLabel("Crate", { exact: true }).selectOption({ label: "KR-03 (18 … 25 °C)" });
  await page.getByLabel("Logger model").fill("TL-9 (invented)");
  const file = page.getByLabel("Temperature logger file (CSV)");
  await file.setInputFiles({
    name: "crate-kr03-bad.csv",
    mimeType: "text/csv",
    buffer: await fixture("temperatures-bad.csv"),
  });
  await page.getByText("Nothing was imported").first().waitFor();
  await page.getByText('Line 3: temperature "abc" is not a number').waitFor();
  expect(await page.getByRole("button", { name: /^Import/ }).isDisabled()).toBe(true);
  await accessible(page, "import with errors");
  await screenshot(page, "site-day-import-errors-800x1280");

  await file.setInputFiles({
    name: "crate-kr03.csv",
    mimeType: "text/csv",
    buffer: await fixture("temperatures-iso.csv"),
  });
  const importButton = page.getByRole("button", { name: /^Import \d+ readings$/ });
  await importButton.waitFor();
  const count = Number((await importButton.innerText()).replace(/\D/g, ""));
  await accessible(page, "import preview");
  await importButton.click();
  await page.getByText("Saved on this device").waitFor();
  return count;
}

async function levelledSection(page: Page) {
  await page.getByRole("link", { name: "Levelling field books" }).click();
  await page.getByRole("heading", { name: "Levelling at Kestrel Ridge hut" }).waitFor();
  await page.getByLabel("From mark").fill("Clock reference");
  await page.getByLabel("To mark").fill("KR-BM-117");
  await page
    .getByLabel("Levelling class")
    .selectOption({ label: "Second-order, Class I (±6 mm·√K)" });
  await accessible(page, "levelling sections");
  await page.getByRole("button", { name: "Open section" }).click();
  await page.getByRole("heading", { name: "Clock reference → KR-BM-117", level: 1 }).waitFor();
  const setup = async (run: string, values: string[]) => {
    const form = page.getByRole("form", { name: `New setup, ${run}` });
    await form.getByLabel("BS (m)", { exact: true }).click();
    for (const value of values) {
      await page.keyboard.type(value);
      await page.keyboard.press("Enter");
    }
  };
  const forward = "Forward run, Clock reference → KR-BM-117";
  const backward = "Backward run, KR-BM-117 → Clock reference";
  await setup(forward, ["1.5234", "0.8123", "30", "30"]);
  await page.getByRole("region", { name: forward }).getByRole("rowheader", { name: "1" }).waitFor();
  // The backward foresight misread by 2 cm: flagged before the section is closed.
  await setup(backward, ["0.8130", "1.5441", "30", "30"]);
  const panel = page.getByRole("region", { name: "Misclosure" });
  await panel.getByText("Out of tolerance — re-level before closing").waitFor();
  await accessible(page, "field book out of tolerance");
  await screenshot(page, "site-day-levelling-800x1280");
  await page.getByRole("button", { name: "Close section" }).click();
  await page
    .getByLabel("Reason for closing out of tolerance")
    .fill("Staff sank in snow; re-level tomorrow");
  await page.getByRole("button", { name: "Close anyway" }).click();
  await page.getByText("Closed out of tolerance").waitFor();
}

async function unpacking(page: Page) {
  await page.getByRole("button", { name: "Unpacking the crates" }).click();
  await page.getByRole("heading", { name: "Unpacking the crates", level: 1 }).waitFor();
  const gate = page.getByRole("region", { name: "Dew-point check" });
  await gate.getByText("Check needed").waitFor();
  await gate.getByRole("link", { name: "Do the dew-point check" }).click();
  await page
    .getByLabel("Crate", { exact: true })
    .selectOption({ label: "KR-03 — Ultra-stable optical cavity" });
  await page.getByLabel("Room temperature").fill("21");
  await page.getByLabel("Room relative humidity").fill("50");
  await page.getByLabel("Crate surface temperature").fill("18,5");
  // Dew point of 21 °C at 50 % is 10.2 °C (Magnus); 18.5 °C is above it plus the 3 K margin.
  await page.getByText("May open", { exact: true }).waitFor();
  await accessible(page, "dew-point check");
  await page.getByRole("button", { name: "Save check" }).click();
  await page.getByText("Saved on this device").waitFor();
  await page.getByRole("link", { name: "Back to the checklist" }).click();
  await gate.getByText("Check done").waitFor();
}

test("a whole site day offline on a tablet reaches the server when the network returns", async () => {
  const { page, server, profile } = tablet;
  await readyForOffline(page, server.baseUrl, "field");
  await profile.context.setOffline(true);

  // The crew's home: choose the site once; the board opens there from now on.
  await page
    .getByRole("navigation", { name: "Campaign" })
    .getByRole("link", { name: "Site board" })
    .click();
  await page.getByRole("heading", { name: "Which site are you at?" }).waitFor();
  await accessible(page, "site choice");
  await page.getByRole("link", { name: "Kestrel Ridge hut" }).click();
  await page.getByText("This tablet's site").waitFor();
  await accessible(page, "site board");

  await arrivalChecklist(page);
  await backToBoard(page);
  await trippedIndicator(page);
  await backToBoard(page);
  const readings = await temperatureFiles(page);
  await backToBoard(page);
  await page.getByRole("link", { name: "Temperatures", exact: true }).click();
  await page.getByLabel("Crate", { exact: true }).selectOption({ label: "KR-03 (18 … 25 °C)" });
  await page.getByText("Mean kinetic temperature").waitFor();
  await accessible(page, "temperatures");
  await backToBoard(page);
  await levelledSection(page);
  await backToBoard(page);
  await unpacking(page);
  await backToBoard(page);

  // The board now shows the tripped indicator as an alert and the crate as here.
  await page
    .getByRole("region", { name: "Limit alerts" })
    .getByText("1 entry beyond limits")
    .waitFor();
  await page.getByRole("list", { name: "Crates at this site" }).getByText("KR-03").waitFor();
  await accessible(page, "site board after the day");
  await screenshot(page, "site-day-board-800x1280");

  await profile.context.setOffline(false);
  await waitForSyncStatus(page, "All changes sent", 60_000);

  const { changes } = await pullDemoCampaign(server.baseUrl, "reviewer");
  const of = <E extends (typeof changes)[number]["entity"]>(entity: E) =>
    changes.flatMap((c) =>
      c.entity === entity ? [c.data as Extract<typeof c, { entity: E }>["data"]] : [],
    );
  const runs = of("checklistRun");
  expect(runs.map((r) => [r.title, r.signedOffAt !== null])).toEqual(
    expect.arrayContaining([
      ["Arrival at the site", true],
      ["Unpacking the crates", false],
    ]),
  );
  expect(
    of("checklistResult")
      .filter((r) => r.outOfRange)
      .map((r) => r.value),
  ).toEqual([31.5]);
  const entries = of("fieldEntry");
  const indicator = entries.find((e) => e.kind === "shock-indicator");
  expect(indicator?.flags).toEqual({ exceeded: true, summary: "Indicator tripped (rated 25 g)" });
  expect(indicator?.recordedByName).toBe("Mira Castell");
  const samples = entries.flatMap((e) => (e.data.kind === "temperatures" ? e.data.samples : []));
  expect(samples).toHaveLength(readings);
  expect(entries.find((e) => e.kind === "dew-point")?.flags.exceeded).toBe(false);
  const links = of("attachment");
  expect(links.map((l) => l.subject.kind).sort()).toEqual(["checklistRun", "fieldEntry"]);
  expect(links.find((l) => l.subject.kind === "fieldEntry")?.subject.id).toBe(indicator?.id);
  const section = of("levellingSection").find((s) => s.toMark === "KR-BM-117");
  expect(section?.closure?.withinTolerance).toBe(false);
  expect(section?.closeNote).toBe("Staff sank in snow; re-level tomorrow");
  expect(of("levellingSetup").filter((s) => s.sectionId === section?.id)).toHaveLength(2);
});
