// Photos and files on the tablet: kept with their hash, linked through the outbox, uploaded by the
// engine before the push, skipped when the server has them, kept when the server refuses them.
import { createHash } from "node:crypto";
import { describe, expect, it } from "vitest";
import {
  addAttachmentLocally,
  removeAttachmentLocally,
  sha256Of,
} from "../../../src/db/attachment-store";
import { fileKey } from "../../../src/db/database";
import { findFile, listAttachments, listRefusedFiles } from "../../../src/db/queries";
import { createSiteLocally } from "../../../src/db/site-store";
import { engineFor, fakeServer, newDb } from "../../helpers/fake-sync";

const campaignId = crypto.randomUUID();
const site = {
  name: "Saddle hut",
  kind: "mountain" as const,
  latitudeDeg: 46.5,
  longitudeDeg: 9.9,
  approxHeightM: 2500,
  notes: "",
};

const bytesOf = (text: string) => new TextEncoder().encode(text).buffer as ArrayBuffer;

async function setUp() {
  const db = newDb();
  const server = fakeServer(campaignId);
  const engine = engineFor(db, server, campaignId);
  const siteId = await createSiteLocally(db, campaignId, site);
  const attach = (text: string, caption = "") =>
    addAttachmentLocally(db, campaignId, {
      subject: { kind: "site", id: siteId },
      bytes: bytesOf(text),
      contentType: "image/jpeg",
      name: "door.jpg",
      caption,
    });
  return { db, server, engine, siteId, attach };
}

describe("attachments on the tablet", () => {
  it("hashes with SHA-256 as Node's crypto does", async () => {
    // Independent check: Node's own crypto module (OpenSSL).
    const text = "crate 3 arrived, door label torn";
    expect(await sha256Of(bytesOf(text))).toBe(createHash("sha256").update(text).digest("hex"));
  });

  it("keeps the bytes, the link and the outbox entry together, and one copy of equal bytes", async () => {
    const { db, siteId, attach } = await setUp();
    const first = await attach("same bytes", "North door");
    await attach("same bytes", "Again");
    const links = await listAttachments(db, campaignId, siteId);
    expect(links.map((l) => [l.id === first, l.caption, l.pending])).toEqual([
      [true, "North door", true],
      [false, "Again", true],
    ]);
    expect(await db.files.count()).toBe(1);
    const sha = links[0]?.sha256 ?? "";
    expect(await findFile(db, campaignId, sha)).toMatchObject({ state: "waiting", sizeBytes: 10 });
    expect((await db.outbox.toArray()).map((e) => e.name)).toEqual([
      "site.create",
      "attachment.add",
      "attachment.add",
    ]);
  });

  it("refuses a file of a type the server does not take, before anything is written", async () => {
    const { db, siteId } = await setUp();
    await expect(
      addAttachmentLocally(db, campaignId, {
        subject: { kind: "site", id: siteId },
        bytes: bytesOf("<svg/>"),
        contentType: "image/svg+xml" as "image/png",
        name: "x.svg",
      }),
    ).rejects.toThrow();
    expect(await db.files.count()).toBe(0);
    expect(await db.outbox.count()).toBe(1);
  });

  it("uploads waiting files before the push, then confirms links by pull", async () => {
    const { db, server, engine, siteId, attach } = await setUp();
    await attach("photo one");
    const seen: string[] = [];
    engine.subscribe((e) => {
      if (e.type === "status" && e.status.progress?.phase === "files")
        seen.push(`${e.status.progress.done}/${e.status.progress.total}`);
    });
    expect((await engine.refreshCounts(), engine.getStatus().pendingFiles)).toBe(1);
    await engine.sync();
    expect(server.uploads).toHaveLength(1);
    expect(server.links.size).toBe(1);
    expect(seen.at(-1)).toBe("9/9");
    const [link] = await listAttachments(db, campaignId, siteId);
    expect(link?.pending).toBe(false);
    expect(await findFile(db, campaignId, link?.sha256 ?? "")).toMatchObject({ state: "sent" });
    expect(engine.getStatus()).toMatchObject({ pending: 0, pendingFiles: 0, upload: null });
  });

  it("skips the upload when the server already has the bytes", async () => {
    const { db, server, engine, attach } = await setUp();
    await attach("already there");
    const sha = createHash("sha256").update("already there").digest("hex");
    server.files.set(sha, Buffer.from("already there"));
    await engine.sync();
    expect(server.uploads).toEqual([]);
    expect((await db.files.get(fileKey(campaignId, sha)))?.state).toBe("sent");
  });

  it("keeps waiting files when offline, and sends them once the network is back", async () => {
    const { server, engine, attach } = await setUp();
    await attach("offline photo");
    server.controls.offline = true;
    await expect(engine.sync()).rejects.toThrow();
    expect(engine.getStatus()).toMatchObject({ pendingFiles: 1, error: { kind: "offline" } });
    server.controls.offline = false;
    await engine.sync();
    expect(server.uploads).toHaveLength(1);
    expect(engine.getStatus().pendingFiles).toBe(0);
  });

  it("keeps a file the server refuses for good, with the reason, and goes on", async () => {
    const { db, server, engine, attach } = await setUp();
    await attach("not an image really");
    server.controls.refuseFiles = "The file's content is not an accepted type";
    await engine.sync();
    const [refused] = await listRefusedFiles(db, campaignId);
    expect(refused).toMatchObject({
      state: "refused",
      refusal: "The file's content is not an accepted type",
    });
    expect(new TextDecoder().decode(refused?.bytes)).toBe("not an image really");
    expect(await db.outbox.count()).toBe(0);
  });

  it("removes a link as a tombstone that survives the next pull", async () => {
    const { db, server, engine, siteId, attach } = await setUp();
    const id = await attach("to remove");
    await engine.sync();
    await removeAttachmentLocally(db, campaignId, id);
    expect(await listAttachments(db, campaignId, siteId)).toEqual([]);
    await engine.sync();
    expect(server.links.get(id)?.removedAt).toEqual(expect.any(String));
    expect(await listAttachments(db, campaignId, siteId)).toEqual([]);
  });
});

describe("refusals the push answer did not bring", () => {
  it("reach the recovery list through the pull", async () => {
    const { db, server, engine } = await setUp();
    await createSiteLocally(db, campaignId, { ...site, name: "Refused later" });
    server.rejectMutation(2, "Your role does not allow this change");
    server.controls.loseNextResponse = true;
    await expect(engine.sync()).rejects.toThrow();
    // The outbox entry has no push answer; only the server's record says it was refused.
    expect((await db.outbox.get(2))?.result).toBeUndefined();
    await engine.sync();
    const recovery = await db.recovery.toArray();
    expect(recovery.map((r) => [r.mutationId, r.reason])).toEqual([
      [2, "Your role does not allow this change"],
    ]);
    expect(await db.outbox.count()).toBe(0);
  });
});
