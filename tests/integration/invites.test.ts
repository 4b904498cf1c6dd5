import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { pino } from "pino";
import { createTestContext, signInAs, withHeader, type TestContext } from "../helpers/app";
import { startMailCatcher, type MailCatcher } from "../../scripts/lib/mail-catcher";
import { createMailWorker, type MailWorker } from "../../server/mail/mail-worker";

let ctx: TestContext;
let catcher: MailCatcher;
let worker: MailWorker;
let campaignId: string;

beforeAll(async () => {
  ctx = await createTestContext({ PUBLIC_URL: "http://equipot.test:8080" });
  catcher = await startMailCatcher();
  worker = createMailWorker(
    ctx.database.db,
    catcher.url,
    "Equipot <no-reply@equipot.test>",
    pino({ level: "silent" }),
    60_000,
  );
  const admin = await signInAs(ctx.app, "admin");
  campaignId =
    admin.memberships.find((m) => m.campaignName.startsWith("Kestrel"))?.campaignId ?? "";
});
afterAll(async () => {
  await worker.stop();
  await catcher.close();
  await ctx.close();
});

describe("invites", () => {
  it("e-mails a link through the outbox that lets the invitee set a password and sign in", async () => {
    const { token } = await signInAs(ctx.app, "admin");
    const res = await request(ctx.app)
      .post(`/api/campaigns/${campaignId}/invites`)
      .set("Authorization", `Bearer ${token}`)
      .send({ email: "New.Crew@Example.test", role: "field" });
    expect(res.status).toBe(201);
    expect(res.body.invite).toMatchObject({ email: "new.crew@example.test", role: "field" });
    expect(ctx.mailQueued.count).toBe(1);

    expect(await worker.drain()).toBe(1);
    const mail = await catcher.waitFor((m) => m.to.includes("new.crew@example.test"));
    expect(mail.subject).toContain("Kestrel Ridge");
    const link = /http:\/\/equipot\.test:8080\/invite\/([A-Za-z0-9_-]+)/.exec(mail.text);
    expect(link?.[1]).toBeDefined();

    const accepted = await withHeader(request(ctx.app).post("/api/invites/accept")).send({
      token: link?.[1],
      name: "New Crew",
      password: "a-strong-password",
    });
    expect(accepted.status).toBe(200);
    expect(accepted.body.memberships).toContainEqual(
      expect.objectContaining({ campaignId, role: "field" }),
    );

    const again = await withHeader(request(ctx.app).post("/api/invites/accept")).send({
      token: link?.[1],
      name: "Someone Else",
      password: "another-strong-password",
    });
    expect(again.status).toBe(404);

    const signIn = await withHeader(request(ctx.app).post("/api/auth/sign-in")).send({
      email: "new.crew@example.test",
      password: "a-strong-password",
    });
    expect(signIn.status).toBe(200);
    // Sent once: a second drain finds nothing due.
    expect(await worker.drain()).toBe(0);
    expect(catcher.messages).toHaveLength(1);
  });

  it("keeps the message when the mail server is down and sends it once it is back", async () => {
    const { token } = await signInAs(ctx.app, "admin");
    const deadWorker = createMailWorker(
      ctx.database.db,
      "smtp://127.0.0.1:1",
      "x@equipot.test",
      pino({ level: "silent" }),
      60_000,
    );
    await request(ctx.app)
      .post(`/api/campaigns/${campaignId}/invites`)
      .set("Authorization", `Bearer ${token}`)
      .send({ email: "later@example.test", role: "reviewer" });
    expect(await deadWorker.drain()).toBe(0);
    await deadWorker.stop();
    const rows = await ctx.database.pool.query(
      "select attempts, sent_at, last_error from email_outbox where to_address = $1",
      ["later@example.test"],
    );
    expect(rows.rows[0]).toMatchObject({ attempts: 1, sent_at: null });
    await ctx.database.pool.query(
      "update email_outbox set next_attempt_at = now() where to_address = $1",
      ["later@example.test"],
    );
    expect(await worker.drain()).toBe(1);
    await catcher.waitFor((m) => m.to.includes("later@example.test"));
  });

  it("refuses an invite from a non-admin and a bad role", async () => {
    const logistics = await signInAs(ctx.app, "logistics");
    const denied = await request(ctx.app)
      .post(`/api/campaigns/${campaignId}/invites`)
      .set("Authorization", `Bearer ${logistics.token}`)
      .send({ email: "x@example.test", role: "field" });
    expect(denied.status).toBe(403);
    const admin = await signInAs(ctx.app, "admin");
    const bad = await request(ctx.app)
      .post(`/api/campaigns/${campaignId}/invites`)
      .set("Authorization", `Bearer ${admin.token}`)
      .send({ email: "x@example.test", role: "owner" });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details[0].path).toBe("role");
  });
});
