// The pure parts of photo and file handling on the tablet, and letting go of refused items.
import { describe, expect, it } from "vitest";
import { strFromU8, unzipSync } from "fflate";
import { addAttachmentLocally } from "../../../src/db/attachment-store";
import { exportOutbox, unsentFiles } from "../../../src/db/export";
import { listRefusedFiles } from "../../../src/db/queries";
import { dismissRecovery, eraseLocalData, forgetRefusedFile } from "../../../src/db/recovery-store";
import { IDBFactory, IDBKeyRange } from "fake-indexeddb";
import { fileKey, openDatabase } from "../../../src/db/database";
import { zipUnsent } from "../../../src/features/sync/zip-unsent";
import { claimedType, fitWithin } from "../../../src/lib/prepare-file";
import { newDb } from "../../helpers/fake-sync";

const campaignId = crypto.randomUUID();
const subject = { kind: "site" as const, id: crypto.randomUUID() };
const bytesOf = (text: string) => new TextEncoder().encode(text).buffer as ArrayBuffer;

describe("photo size on the tablet", () => {
  it("fits the longest side within the limit, keeps the aspect and never enlarges", () => {
    expect(fitWithin(4032, 3024, 2048)).toEqual({ width: 2048, height: 1536 });
    expect(fitWithin(3024, 4032, 2048)).toEqual({ width: 1536, height: 2048 });
    expect(fitWithin(800, 600, 2048)).toEqual({ width: 800, height: 600 });
    expect(fitWithin(10000, 1, 2048)).toEqual({ width: 2048, height: 1 });
  });

  it("takes the type from the browser, else from the extension, and refuses others", () => {
    expect(claimedType("image/png", "a.png")).toBe("image/png");
    expect(claimedType("", "LOG_0042.CSV")).toBe("text/csv");
    expect(claimedType("application/vnd.ms-excel", "export.csv")).toBe("text/csv");
    expect(claimedType("image/heic", "IMG_1.HEIC")).toBeNull();
    expect(claimedType("text/html", "page.html")).toBeNull();
  });
});

describe("the rescue copy of unsent work", () => {
  it("zips the changes as JSON with each waiting file's bytes named by hash", async () => {
    const db = newDb();
    await addAttachmentLocally(db, campaignId, {
      subject,
      bytes: bytesOf("label photo"),
      contentType: "image/jpeg",
      name: "label.jpg",
    });
    const files = await unsentFiles(db);
    const archive = zipUnsent(await exportOutbox(db), files);
    const entries = unzipSync(new Uint8Array(await archive.arrayBuffer()));
    const sha = files[0]?.sha256 ?? "";
    expect(Object.keys(entries).sort()).toEqual([`files/${sha}.jpg`, "unsent-changes.json"]);
    expect(strFromU8(entries[`files/${sha}.jpg`] ?? new Uint8Array())).toBe("label photo");
    const manifest = JSON.parse(strFromU8(entries["unsent-changes.json"] ?? new Uint8Array()));
    expect(manifest.entries.map((e: { name: string }) => e.name)).toEqual(["attachment.add"]);
    expect(manifest.files[0]).toMatchObject({ name: "label.jpg", sha256: sha, state: "waiting" });
  });
});

describe("letting go on this device", () => {
  it("removes a refused file but never one still waiting to be sent", async () => {
    const db = newDb();
    await addAttachmentLocally(db, campaignId, {
      subject,
      bytes: bytesOf("waiting"),
      contentType: "image/png",
      name: "w.png",
    });
    const [waiting] = await db.files.toArray();
    await forgetRefusedFile(db, campaignId, waiting?.sha256 ?? "");
    expect(await db.files.count()).toBe(1);
    await db.files.update(fileKey(campaignId, waiting?.sha256 ?? ""), {
      state: "refused",
      refusal: "wrong kind",
    });
    expect(await listRefusedFiles(db, campaignId)).toHaveLength(1);
    await forgetRefusedFile(db, campaignId, waiting?.sha256 ?? "");
    expect(await db.files.count()).toBe(0);
  });

  it("dismisses one recovery entry and leaves the others", async () => {
    const db = newDb();
    const entry = { campaignId, name: "site.create" as const, args: {}, reason: "r", at: "x" };
    const first = await db.recovery.add({ ...entry, mutationId: 1 });
    await db.recovery.add({ ...entry, mutationId: 2 });
    await dismissRecovery(db, first ?? 0);
    expect((await db.recovery.toArray()).map((r) => r.mutationId)).toEqual([2]);
  });

  it("erases the whole local database and keeps it closed", async () => {
    const factory = new IDBFactory();
    const db = openDatabase("shared-tablet", { indexedDB: factory, IDBKeyRange });
    await db.meta.put({ key: "clientId", value: "x" });
    await eraseLocalData(db);
    expect(db.isOpen()).toBe(false);
    await expect(db.meta.count()).rejects.toThrow();
    expect((await factory.databases()).map((d) => d.name)).not.toContain("shared-tablet");
  });
});
