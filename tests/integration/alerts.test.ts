// Alerts for entries beyond a crate's limits, on the real server, PostgreSQL and the local SMTP
// catcher: an exceeded entry raises one alert (pulled by tablets) and one e-mail per logistics
// member through the outbox; a mail server that is down delays the e-mail without losing it or
// sending it twice; duplicates never queue a second alert or e-mail; acknowledging is logistics'.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { pino } from "pino";
import { mkdtempSync, readdirSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { createTestContext, signInAs, type TestContext } from "../helpers/app";
import { pullAll, pushAs, syncClient, type TestSyncClient } from "../helpers/sync";
import { startMailCatcher, type MailCatcher } from "../../scripts/lib/mail-catcher";
import { createMailWorker, type MailWorker } from "../../server/mail/mail-worker";
import { enqueueEmailOnce } from "../../server/db/repositories/outbox";
import { memberships, users } from "../../server/db/schema";
import { alertEmail, raiseAlertForEntry } from "../../server/services/alerts.service";
import type { CrateView } from "../../shared/schemas/crates";
import type { AlertView } from "../../shared/schemas/logistics";
import { changeRecord } from "../../shared/sync/protocol";

let ctx: TestContext;
let catcher: MailCatcher;
let worker: MailWorker;
let mailFolder: string;
let campaignId: string;
let fieldToken: string;
let logisticsToken: string;
let logisticsId: string;
let siteId: string;
let siteName: string;
let kr03: CrateView;
/** Every account that should get an alert e-mail, found by the test's own query below. */
let expectedRecipients: { id: string; email: string }[];

const at = "2027-06-04T08:00:00.000Z";
const silent = pino({ level: "silent" });

beforeAll(async () => {
  ctx = await createTestContext({ PUBLIC_URL: "http://equipot.test:8080" });
  mailFolder = mkdtempSync(join(tmpdir(), "equipot-alert-mail-"));
  catcher = await startMailCatcher({ folder: mailFolder });
  worker = createMailWorker(
    ctx.appDb,
    catcher.url,
    "Equipot <no-reply@equipot.test>",
    silent,
    60_000,
  );
  const field = await signInAs(ctx.app, "field");
  fieldToken = field.token;
  campaignId = field.memberships[0]?.campaignId ?? "";
  const logistics = await signInAs(ctx.app, "logistics");
  logisticsToken = logistics.token;
  logisticsId = (logistics.body as { user: { id: string } }).user.id;

  // A second logistics member, a disabled one and a geodesist: only the first two roles count,
  // and only accounts that are not disabled.
  const db = ctx.database.db;
  const extra = await db
    .insert(users)
    .values([
      { email: "second.logistics@example.test", name: "Second Logistics" },
      { email: "gone.logistics@example.test", name: "Gone Logistics", disabledAt: new Date(at) },
      { email: "levels@example.test", name: "Levels Person" },
    ])
    .returning();
  await db.insert(memberships).values(
    extra.map((u, i) => ({
      campaignId,
      userId: u.id,
      role: (["logistics", "logistics", "geodesist"] as const)[i] ?? "geodesist",
    })),
  );
  const recipients = await ctx.database.pool.query<{ id: string; email: string }>(
    `select u.id, u.email from memberships m join users u on u.id = m.user_id
      where m.campaign_id = $1 and m.role = 'logistics' and u.disabled_at is null`,
    [campaignId],
  );
  expectedRecipients = recipients.rows;

  const { changes } = await pullAll(ctx.app, fieldToken, campaignId);
  const site = changes.find((c) => c.entity === "site");
  if (site?.entity !== "site") throw new Error("no demo site pulled");
  siteId = site.id;
  siteName = site.data.name;
  const crate = changes.find((c) => c.entity === "crate" && c.data.label === "KR-03");
  if (crate?.entity !== "crate") throw new Error("demo crate KR-03 was not pulled");
  kr03 = crate.data;
});
afterAll(async () => {
  await worker.stop();
  await catcher.close();
  await ctx.close();
  rmSync(mailFolder, { recursive: true, force: true });
});

const entry = (data: Record<string, unknown>) => ({
  id: crypto.randomUUID(),
  siteId,
  crateId: kr03.id,
  observedAt: at,
  recordedAt: at,
  data,
});
const tripped = () => entry({ kind: "shock-indicator", ratingG: 10, tripped: true });

type Mutation = ReturnType<TestSyncClient["mutation"]>;
const pushField = (client: TestSyncClient, mutations: Mutation[]) =>
  pushAs(ctx.app, fieldToken, { clientId: client.clientId, campaignId, mutations });

async function addEntry(args: ReturnType<typeof entry>) {
  const client = syncClient();
  const res = await pushField(client, [client.mutation("entry.add", args)]);
  expect(res.body.results.map((r) => [r.status, r.message])).toEqual([["applied", undefined]]);
  return client;
}

async function pulledAlerts(token: string): Promise<AlertView[]> {
  const { changes } = await pullAll(ctx.app, token, campaignId);
  return changes.flatMap((c) => {
    const parsed = changeRecord.parse(c); // the wire schema a tablet applies
    return parsed.entity === "alert" ? [parsed.data] : [];
  });
}

const sql = <T extends Record<string, unknown>>(text: string, values: unknown[] = []) =>
  ctx.database.pool.query<T>(text, values).then((r) => r.rows);

const alertsOfEntry = (entryId: string) =>
  sql<{ id: string }>("select id from alerts where entry_id = $1", [entryId]);
const outboxOfAlert = (alertId: string) =>
  sql<{
    id: string;
    to_address: string;
    message_key: string;
    attempts: number;
    sent_at: Date | null;
    last_error: string | null;
    due_later: boolean;
  }>(
    `select id, to_address, message_key, attempts, sent_at, last_error,
            next_attempt_at > now() as due_later
       from email_outbox where message_key like $1 order by id`,
    [`alert:${alertId}:%`],
  );

/** Message-IDs of the raw messages the catcher kept on disk. */
const caughtMessageIds = () =>
  readdirSync(mailFolder).flatMap((f) => {
    const id = /^Message-ID:\s*(<[^>]+>)/im.exec(readFileSync(join(mailFolder, f), "utf8"));
    return id?.[1] ? [id[1]] : [];
  });

describe("alerts for entries beyond a crate's limits", () => {
  it("raises one alert and one e-mail per logistics member for a tripped indicator on KR-03", async () => {
    expect(expectedRecipients.map((r) => r.email).sort()).toEqual([
      "logistics@demo.equipot.test",
      "second.logistics@example.test",
    ]);
    const args = tripped();
    await addEntry(args);

    const alert = (await pulledAlerts(fieldToken)).find((a) => a.entryId === args.id);
    expect(alert).toMatchObject({
      campaignId,
      crateId: kr03.id,
      siteId,
      kind: "shock-indicator",
      summary: "Indicator tripped (rated 10 g)",
      acknowledgedAt: null,
      acknowledgedBy: null,
    });
    if (!alert) throw new Error("unreachable");

    const rows = await outboxOfAlert(alert.id);
    expect(rows.map((r) => [r.to_address, r.message_key]).sort()).toEqual(
      expectedRecipients
        .map((r) => [r.email, `alert:${alert.id}:${r.id}`])
        .sort((a, b) => String(a[0]).localeCompare(String(b[0]))),
    );

    expect(await worker.drain()).toBe(2);
    const mail = await catcher.waitFor((m) => m.to.includes("logistics@demo.equipot.test"));
    expect(mail.subject).toContain("KR-03");
    expect(mail.subject).toContain("Indicator tripped (rated 10 g)");
    expect(mail.subject).toContain("Kestrel Ridge");
    expect(mail.text).toContain(siteName);
    expect(mail.text).toContain("Crate:       KR-03");
    expect(mail.text).toContain("Observed:    2027-06-04 08:00 UTC");
    expect(mail.text).toContain("Recorded by: Mira Castell");
    expect(mail.text).toContain(`/campaigns/${campaignId}/alerts`);
    expect(mail.text).toContain(
      "Equipot alerts do not replace the carrier's or the site's own procedures",
    );
    await catcher.waitFor((m) => m.to.includes("second.logistics@example.test"));
    expect(catcher.messages.filter((m) => m.to.includes("gone.logistics@example.test"))).toEqual(
      [],
    );
    // Each message carries the stable Message-ID of its outbox row.
    expect(caughtMessageIds().sort()).toEqual(rows.map((r) => `<outbox-${r.id}@equipot>`).sort());
    expect(await worker.drain()).toBe(0);
  });

  it("raises neither an alert nor an e-mail for an entry within the limits", async () => {
    const [before] = await sql<{ n: string }>("select count(*) as n from email_outbox");
    const args = entry({ kind: "shock-indicator", ratingG: 25, tripped: false });
    await addEntry(args);
    expect(await alertsOfEntry(args.id)).toEqual([]);
    expect((await pulledAlerts(fieldToken)).some((a) => a.entryId === args.id)).toBe(false);
    const [after] = await sql<{ n: string }>("select count(*) as n from email_outbox");
    expect(after?.n).toBe(before?.n);
  });

  it("links to the campaign's alerts under the public address", () => {
    const mail = alertEmail({
      campaignId,
      campaignName: "Kestrel Ridge",
      siteName: "Upper hut",
      crateLabel: "KR-03",
      kind: "shock-indicator",
      summary: "Indicator tripped (rated 10 g)",
      observedAt: new Date("2027-06-04T08:00:59.900Z"),
      recordedByName: "Mira Castell",
      linkBase: "http://equipot.test:8080/",
    });
    expect(mail.textBody).toContain(`\nhttp://equipot.test:8080/campaigns/${campaignId}/alerts\n`);
    // Cut to the minute, never rounded up into the next one.
    expect(mail.textBody).toContain("Observed:    2027-06-04 08:00 UTC");
  });

  it("keeps the e-mail while the mail server is down and sends it once when it is back", async () => {
    const folder = mkdtempSync(join(tmpdir(), "equipot-alert-down-"));
    let down = await startMailCatcher({ folder });
    const { port } = down;
    const flaky = createMailWorker(ctx.appDb, down.url, "x@equipot.test", silent, 60_000);
    try {
      await down.close();
      const args = tripped();
      await addEntry(args);
      const [alert] = await alertsOfEntry(args.id);
      if (!alert) throw new Error("no alert raised");

      expect(await flaky.drain()).toBe(0);
      const waiting = await outboxOfAlert(alert.id);
      expect(waiting).toHaveLength(expectedRecipients.length);
      for (const row of waiting) {
        expect(row).toMatchObject({ attempts: 1, sent_at: null, due_later: true });
        expect(row.last_error).toBeTruthy();
      }
      // Not due yet: another drain leaves it waiting, attempts unchanged.
      expect(await flaky.drain()).toBe(0);
      expect((await outboxOfAlert(alert.id)).map((r) => r.attempts)).toEqual(waiting.map(() => 1));

      down = await startMailCatcher({ port, folder });
      await sql("update email_outbox set next_attempt_at = now() where message_key like $1", [
        `alert:${alert.id}:%`,
      ]);
      expect(await flaky.drain()).toBe(expectedRecipients.length);
      expect(await flaky.drain()).toBe(0);
      const sent = await outboxOfAlert(alert.id);
      expect(sent.every((r) => r.sent_at !== null && r.last_error === null)).toBe(true);
      expect(
        down.messages
          .map((m) => m.to)
          .flat()
          .sort(),
      ).toEqual(expectedRecipients.map((r) => r.email).sort());
      const ids = readdirSync(folder).map(
        (f) => /^Message-ID:\s*(<[^>]+>)/im.exec(readFileSync(join(folder, f), "utf8"))?.[1],
      );
      expect(ids.sort()).toEqual(sent.map((r) => `<outbox-${r.id}@equipot>`).sort());
    } finally {
      await flaky.stop();
      await down.close();
      rmSync(folder, { recursive: true, force: true });
    }
  });

  it("never queues a second alert or e-mail for a duplicate push or a second raise", async () => {
    const args = tripped();
    const client = syncClient();
    const mutation = client.mutation("entry.add", args);
    expect((await pushField(client, [mutation])).body.results[0]?.status).toBe("applied");
    // The same mutation again (a lost answer), then the same entry under a new mutation id.
    expect((await pushField(client, [mutation])).body.results[0]?.status).toBe("duplicate");
    const again = await pushField(client, [client.mutation("entry.add", args)]);
    expect(again.body.results[0]?.status).toBe("rejected");

    const alerts = await alertsOfEntry(args.id);
    expect(alerts).toHaveLength(1);
    const alertId = alerts[0]?.id ?? "";
    expect(await outboxOfAlert(alertId)).toHaveLength(expectedRecipients.length);

    const raised = await ctx.database.db.transaction(async (tx) =>
      raiseAlertForEntry(tx, {
        entry: {
          id: args.id,
          campaignId,
          siteId,
          crateId: kr03.id,
          kind: "shock-indicator",
          observedAt: new Date(at),
          summary: "Indicator tripped (rated 10 g)",
        },
        crateLabel: "KR-03",
        recordedByName: null,
        linkBase: undefined,
      }),
    );
    expect(raised).toMatchObject({ created: false, queued: 0 });
    expect(raised.alert.id).toBe(alertId);
    const recipient = expectedRecipients[0];
    if (!recipient) throw new Error("no recipient");
    expect(
      await enqueueEmailOnce(ctx.database.db, {
        toAddress: recipient.email,
        subject: "again",
        textBody: "again",
        messageKey: `alert:${alertId}:${recipient.id}`,
      }),
    ).toBe(false);
    expect(await alertsOfEntry(args.id)).toHaveLength(1);
    expect(await outboxOfAlert(alertId)).toHaveLength(expectedRecipients.length);
  });

  it("lets logistics acknowledge an alert once, pulled by tablets, and refuses a field user", async () => {
    const args = tripped();
    await addEntry(args);
    const [alert] = await alertsOfEntry(args.id);
    if (!alert) throw new Error("no alert raised");

    const crew = syncClient();
    const refused = await pushField(crew, [
      crew.mutation("alert.acknowledge", { id: alert.id, at, note: "Seen" }),
    ]);
    expect(refused.body.results[0]).toMatchObject({
      status: "rejected",
      message: expect.stringContaining("role"),
    });

    const desk = syncClient();
    const ackAt = "2027-06-04T09:15:00.000Z";
    const ack = (note: string) =>
      pushAs(ctx.app, logisticsToken, {
        clientId: desk.clientId,
        campaignId,
        mutations: [desk.mutation("alert.acknowledge", { id: alert.id, at: ackAt, note })],
      });
    expect((await ack("  Crate held for inspection  ")).body.results[0]).toEqual({
      mutationId: 1,
      status: "applied",
    });
    const pulled = (await pulledAlerts(fieldToken)).find((a) => a.id === alert.id);
    expect(pulled).toMatchObject({
      acknowledgedAt: ackAt,
      acknowledgedBy: logisticsId,
      acknowledgeNote: "Crate held for inspection",
    });
    const [seqBefore] = await sql<{ change_seq: string }>(
      "select change_seq from alerts where id = $1",
      [alert.id],
    );

    expect((await ack("Second look")).body.results[0]).toMatchObject({
      status: "applied",
      message: "Already acknowledged",
    });
    const [row] = await sql<{ change_seq: string; acknowledge_note: string }>(
      "select change_seq, acknowledge_note from alerts where id = $1",
      [alert.id],
    );
    expect(row).toEqual({
      change_seq: seqBefore?.change_seq,
      acknowledge_note: "Crate held for inspection",
    });
    const audit = await sql<{ n: string }>(
      "select count(*) as n from audit_events where entity = 'alert' and entity_id = $1 and action = 'acknowledge'",
      [alert.id],
    );
    expect(audit[0]?.n).toBe("1");
  });
});
