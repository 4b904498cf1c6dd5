// An administrator edits the arrival checklist in the office: adds a number item with an allowed
// range, is told at the field when the range is upside down, saves, and the crew's tablets pull the
// new item. Offline, the editor says that templates are edited with a connection.
import { expect, test } from "vitest";
import { screenshot, viewports } from "../helpers/browser";
import { tabletForFile } from "../helpers/tablet";
import type { ChecklistTemplateView } from "../../shared/schemas/checklists";
import { apiCall, apiSignIn, openDemoSites, pullDemoCampaign, seriousViolations } from "./flows";

const tablet = tabletForFile(viewports.tabletLandscape);

test("an administrator edits templates online: a ranged number item, a stale save, offline, a new one deleted", async () => {
  const { page, server, profile } = tablet;
  await openDemoSites(page, server.baseUrl, "admin");
  await page
    .getByRole("navigation", { name: "Campaign" })
    .getByRole("link", { name: "Checklist templates" })
    .click();
  await page.getByRole("heading", { name: "Checklist templates", level: 1 }).waitFor();
  expect(await seriousViolations(page)).toEqual([]);

  await page.getByRole("link", { name: "Edit Arrival at the site" }).click();
  await page.getByRole("heading", { name: "Arrival at the site", level: 1 }).waitFor();
  const before = await page.getByRole("group", { name: /^Item \d+$/ }).count();
  await page.getByRole("button", { name: "Add item" }).click();
  const added = page.getByRole("group", { name: `Item ${before + 1}` });
  await added.getByLabel("Label", { exact: true }).fill("Dew-point margin at the crate");
  await added.getByLabel("Kind").selectOption({ label: "Number with unit" });
  await added.getByLabel("Unit").fill("K");
  await added.getByLabel("Lowest allowed").fill("3");
  await added.getByLabel("Highest allowed").fill("2");
  expect(await added.innerText()).toContain("dew-point-margin-at-the-crate");
  await page.getByRole("button", { name: "Save template" }).click();

  const highest = added.getByLabel("Highest allowed");
  const errorId = ((await highest.getAttribute("aria-describedby")) ?? "")
    .split(" ")
    .find((id) => id.endsWith("-error"));
  expect(errorId).toBeDefined();
  expect(await page.locator(`[id="${errorId}"]`).innerText()).toBe(
    "The lowest allowed value must not be above the highest",
  );
  expect(await seriousViolations(page)).toEqual([]);
  await screenshot(page, "checklist-template-range-error");

  await highest.fill("10,5");
  await page.getByRole("button", { name: "Save template" }).click();
  await page.getByText(/is saved as version 2/).waitFor();
  await screenshot(page, "checklist-template-saved");

  // What the crew's tablets pull now.
  const { changes } = await pullDemoCampaign(server.baseUrl, "field");
  const arrival = changes
    .filter((c) => c.entity === "checklistTemplate")
    .map((c) => c.data as ChecklistTemplateView)
    .find((t) => t.purpose === "arrival");
  expect(arrival?.version).toBe(2);
  expect(arrival?.items.at(-1)).toMatchObject({
    id: "dew-point-margin-at-the-crate",
    kind: "number",
    unit: "K",
    min: 3,
    max: 10.5,
  });
  expect(arrival?.items.map((i) => i.id)).toContain("weather");

  // Meanwhile another administrator saves version 3; this screen still holds version 2.
  const other = await apiSignIn(server.baseUrl, "admin");
  const path = `/campaigns/${arrival?.campaignId}/checklist-templates/${arrival?.id}`;
  const elsewhere = await apiCall(server.baseUrl, other.accessToken, "PUT", path, {
    baseVersion: 2,
    title: "Arrival at the site (revised)",
    purpose: "arrival",
    items: arrival?.items,
  });
  expect(elsewhere.status).toBe(200);
  await page.getByLabel("Title").fill("Arrival at the hut");
  await page.getByRole("button", { name: "Save template" }).click();
  const stale = page.getByRole("alert").filter({ hasText: "Changed by someone else" });
  expect(await stale.innerText()).toContain("now version 3");
  await stale.getByRole("button", { name: /Load the current version/ }).click();
  // The notice goes once the current version is in the form.
  await stale.waitFor({ state: "detached" });
  await page.getByText("Version 3.").waitFor();
  expect(await page.getByLabel("Title").inputValue()).toBe("Arrival at the site (revised)");

  await profile.context.setOffline(true);
  await page.getByText("Templates are edited with a connection.").first().waitFor();
  expect(await page.getByRole("button", { name: "Save template" }).isDisabled()).toBe(true);
  await screenshot(page, "checklist-template-offline");
  await profile.context.setOffline(false);

  // A new template, then deleted with a second tap.
  await page.getByRole("button", { name: "Back to the list" }).click();
  await page.getByRole("button", { name: "New template" }).click();
  await page.getByLabel("Title").fill("Generator refuelling");
  const first = page.getByRole("group", { name: "Item 1" });
  await first.getByLabel("Label", { exact: true }).fill("Engine stopped and cool");
  await first.getByLabel("This step can hurt someone").check();
  await first.getByLabel("Hazard").selectOption({ label: "Hot surfaces" });
  await first.getByLabel("Caution text").fill("Exhaust parts stay hot after stopping.");
  await page.getByRole("button", { name: "Add item" }).click();
  await page
    .getByRole("group", { name: "Item 2" })
    .getByLabel("Label", { exact: true })
    .fill("Fuel can earthed");
  await page.getByRole("button", { name: "Add item" }).click();
  await page.getByRole("button", { name: "Remove item 3" }).click();
  await page.getByRole("button", { name: "Move “Fuel can earthed” up" }).click();
  await page.getByRole("button", { name: "Save template" }).click();
  await page.getByText("“Generator refuelling” is saved as version 1.").waitFor();
  const saved = (await pullDemoCampaign(server.baseUrl, "field")).changes
    .filter((c) => c.entity === "checklistTemplate")
    .map((c) => c.data as ChecklistTemplateView)
    .find((t) => t.title === "Generator refuelling");
  expect(saved?.items.map((i) => [i.id, i.caution?.hazard ?? null])).toEqual([
    ["fuel-can-earthed", null],
    ["engine-stopped-and-cool", "hot-surface"],
  ]);
  await page.getByRole("button", { name: "Delete template" }).click();
  await page.getByRole("button", { name: "Tap again to delete" }).click();
  await page.getByText("“Generator refuelling” is deleted.").waitFor();
  expect(await page.getByRole("rowheader", { name: "Generator refuelling" }).count()).toBe(0);
  await page.getByRole("rowheader", { name: "Arrival at the site (revised)" }).waitFor();
}, 90_000);
