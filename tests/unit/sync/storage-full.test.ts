// The tablet's storage is full: the browser refuses IndexedDB writes with a QuotaExceededError
// DOMException (simulated here on fake-indexeddb's object stores, the browser's part). Saving an
// entry then fails whole: no outbox entry, no working copy, no mutation id used up; the message a
// person sees says the storage is full and that nothing was saved; with space back the same
// draft saves as the first mutation.
import { IDBObjectStore } from "fake-indexeddb";
import { afterEach, describe, expect, it } from "vitest";
import { listSiteEntries } from "../../../src/db/field-entry-queries";
import { addFieldEntryLocally } from "../../../src/db/field-entry-store";
import { authorNameKey } from "../../../src/db/outbox";
import { writeMeta } from "../../../src/db/meta";
import { isStorageFull, messageOf, storageFullMessage } from "../../../src/lib/api-error";
import { localSiteAndCrate, newDb } from "../../helpers/fake-sync";

const campaignId = crypto.randomUUID();
const siteId = crypto.randomUUID();
const { site, crate } = localSiteAndCrate(campaignId, siteId, crypto.randomUUID());

const store = IDBObjectStore.prototype as unknown as Record<
  "add" | "put",
  (...a: unknown[]) => unknown
>;
const original = { add: store.add, put: store.put };
function fillStorage() {
  const refuse = () => {
    throw new DOMException("The quota has been exceeded.", "QuotaExceededError");
  };
  store.add = refuse;
  store.put = refuse;
}
afterEach(() => Object.assign(store, original));

const draft = {
  siteId,
  crateId: null,
  observedAt: "2027-06-02T08:01:00.000Z",
  data: { kind: "observation" as const, text: "Drift across the col" },
};

describe("a full storage on the tablet", () => {
  it("saves nothing of the entry, says why, and saves it whole once space is back", async () => {
    const db = newDb();
    await db.sites.put(site);
    await db.crates.put(crate);
    await writeMeta(db, authorNameKey, "Ada Field");

    fillStorage();
    const failure = await addFieldEntryLocally(db, campaignId, draft).then(
      () => null,
      (e: unknown) => e,
    );
    Object.assign(store, original);
    expect(failure).not.toBeNull();
    expect(isStorageFull(failure)).toBe(true);
    expect(messageOf(failure)).toBe(storageFullMessage);
    expect(await db.outbox.count()).toBe(0);
    expect(await listSiteEntries(db, campaignId, siteId)).toEqual([]);

    const { id } = await addFieldEntryLocally(db, campaignId, draft);
    const [queued] = await db.outbox.toArray();
    expect(queued).toMatchObject({ mutationId: 1, name: "entry.add" });
    const [entry] = await listSiteEntries(db, campaignId, siteId);
    expect(entry).toMatchObject({ id, pending: true });
  });

  it("tells other errors apart: a full storage is named only when the browser says so", () => {
    expect(isStorageFull(new DOMException("gone", "AbortError"))).toBe(false);
    expect(isStorageFull(new Error("QuotaExceededError in the text only"))).toBe(false);
    expect(isStorageFull({ name: "AbortError", inner: { name: "QuotaExceededError" } })).toBe(true);
  });
});
