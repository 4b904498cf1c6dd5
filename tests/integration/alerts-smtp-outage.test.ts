// The mail server down for an hour of simulated time while alerts are raised through the sync
// route: the outbox keeps every e-mail unsent, the worker retries no faster than its backoff, and
// once the server is back each alert e-mail arrives exactly once, within the backoff's cap. The
// worker runs on a simulated clock (its `now` option) so the hour passes in seconds.
//
// What "exactly once" can and cannot mean here: the worker hands a message over and then commits
// "sent", so a hang-up before the server's reply, or a lost commit, sends it again (at least
// once) under the same Message-ID. The last two cases show that: one distinct Message-ID per
// alert and recipient, a resend recognisable by it. Only the plain outage is duplicate-free.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { pino } from "pino";
import { mkdtempSync, readdirSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { createTestContext, signInAs, type TestContext } from "../helpers/app";
import { pullAll, pushAs, syncClient } from "../helpers/sync";
import { startHangupSmtp } from "../helpers/smtp-hangup";
import { startMailCatcher } from "../../scripts/lib/mail-catcher";
import { createMailWorker, retryDelayS } from "../../server/mail/mail-worker";
import { outboxMessageId } from "../../server/db/repositories/outbox";
import { connect } from "../../server/db/client";
import { memberships, users } from "../../server/db/schema";

const silent = pino({ level: "silent" });
const from = "Equipot <no-reply@equipot.test>";
/** Simulated seconds between drains: the worker's production interval (5000 ms). */
const STEP_S = 5;
const OUTAGE_S = 3600;
/** The longest wait between two attempts, however many failed. */
const CAP_S = retryDelayS(1_000);
/** Far beyond any test here: the worker's own timer never ticks, the test drains. */
const noTimerMs = 3_600_000;

let ctx: TestContext;
let campaignId: string;
let fieldToken: string;
let siteId: string;
let crateId: string;
let recipients: string[];

beforeAll(async () => {
  ctx = await createTestContext();
  const field = await signInAs(ctx.app, "field");
  fieldToken = field.token;
  campaignId = field.memberships[0]?.campaignId ?? "";
  // A second logistics member: two e-mails per alert.
  const [second] = await ctx.database.db
    .insert(users)
    .values({ email: "second.logistics@example.test", name: "Second Logistics" })
    .returning();
  if (!second) throw new Error("second logistics member not created");
  await ctx.database.db
    .insert(memberships)
    .values({ campaignId, userId: second.id, role: "logistics" });
  const rows = await sql<{ email: string }>(
    `select u.email from memberships m join users u on u.id = m.user_id
      where m.campaign_id = $1 and m.role = 'logistics' and u.disabled_at is null order by 1`,
    [campaignId],
  );
  recipients = rows.map((r) => r.email);

  const { changes } = await pullAll(ctx.app, fieldToken, campaignId);
  const site = changes.find((c) => c.entity === "site");
  const crate = changes.find((c) => c.entity === "crate" && c.data.label === "KR-03");
  if (site?.entity !== "site" || crate?.entity !== "crate") throw new Error("demo data missing");
  siteId = site.id;
  crateId = crate.id;
});
afterAll(async () => {
  await ctx.close();
});

const sql = <T extends Record<string, unknown>>(text: string, values: unknown[] = []) =>
  ctx.database.pool.query<T>(text, values).then((r) => r.rows);

/** Raises an alert through the sync route: a tripped indicator; its rating makes the subject unique. */
async function raiseAlert(ratingG: number): Promise<string> {
  const client = syncClient();
  const entryId = crypto.randomUUID();
  const at = "2027-06-04T08:00:00.000Z";
  const res = await pushAs(ctx.app, fieldToken, {
    clientId: client.clientId,
    campaignId,
    mutations: [
      client.mutation("entry.add", {
        id: entryId,
        siteId,
        crateId,
        observedAt: at,
        recordedAt: at,
        data: { kind: "shock-indicator", ratingG, tripped: true },
      }),
    ],
  });
  expect(res.body.results.map((r) => r.status)).toEqual(["applied"]);
  const [alert] = await sql<{ id: string }>("select id from alerts where entry_id = $1", [entryId]);
  if (!alert) throw new Error("no alert raised");
  return alert.id;
}

interface OutboxRow extends Record<string, unknown> {
  id: number;
  to_address: string;
  subject: string;
  attempts: number;
  sent_at: Date | null;
  next_attempt_at: Date;
  last_error: string | null;
}
const outboxOf = (alertIds: string[]) =>
  sql<OutboxRow>(
    `select id::int as id, to_address, subject, attempts, sent_at, next_attempt_at, last_error
       from email_outbox where split_part(message_key, ':', 2) = any($1::text[]) order by id`,
    [alertIds],
  );

/**
 * A clock for the worker that only moves when told. It starts a minute ahead of the real one, so
 * rows queued by the app (due at the database's real now()) are due at once, and it stays ahead
 * because a test runs for less than that minute.
 */
function simulatedClock() {
  const startMs = Date.now() + 60_000;
  let ms = startMs;
  return {
    now: () => new Date(ms),
    advance: (seconds: number) => (ms += seconds * 1000),
    /** Simulated seconds since the start, of now or of a stored instant. */
    elapsedS: (at: Date = new Date(ms)) => (at.getTime() - startMs) / 1000,
  };
}

const messageIdOf = (raw: string) => /^Message-ID:\s*(<[^>]+>)/im.exec(raw)?.[1];
const countBy = (values: string[]) => {
  const counts = new Map<string, number>();
  for (const v of values) counts.set(v, (counts.get(v) ?? 0) + 1);
  return counts;
};

describe("alert e-mails and an SMTP server that is down or hangs up", () => {
  it("keeps every alert e-mail through an hour down and delivers each once afterwards", async () => {
    const folder = mkdtempSync(join(tmpdir(), "equipot-smtp-outage-"));
    let catcher = await startMailCatcher({ folder });
    const { port, url } = catcher;
    await catcher.close(); // connection refused from now on
    const clock = simulatedClock();
    const worker = createMailWorker(ctx.appDb, url, from, silent, noTimerMs, {
      now: clock.now,
    });
    try {
      // Simulated second of the outage at which each alert is raised, with its rating.
      const raises = new Map([
        [0, [10, 12]],
        [1200, [14]],
        [3300, [16]],
      ]);
      const alertIds: string[] = [];
      /** Simulated seconds of each failed attempt, per outbox row. */
      const failedAt = new Map<number, number[]>();

      // The outage: a drain every STEP_S simulated seconds for an hour.
      for (let t = 0; t < OUTAGE_S; t += STEP_S) {
        expect(clock.elapsedS()).toBe(t);
        for (const rating of raises.get(t) ?? []) alertIds.push(await raiseAlert(rating));
        expect(await worker.drain()).toBe(0);
        const rows = await outboxOf(alertIds);
        expect(rows).toHaveLength(alertIds.length * recipients.length); // none lost
        for (const row of rows) {
          expect(row.sent_at).toBeNull();
          const times = failedAt.get(row.id) ?? [];
          // At most one attempt per drain: a failed row is due again only after its backoff.
          expect(row.attempts - times.length).toBeGreaterThanOrEqual(0);
          expect(row.attempts - times.length).toBeLessThanOrEqual(1);
          if (row.attempts > times.length) {
            times.push(t);
            failedAt.set(row.id, times);
            expect(row.last_error).toMatch(/ECONNREFUSED/);
            // Due again exactly its backoff after this attempt, on the worker's clock.
            expect(clock.elapsedS(row.next_attempt_at) - t).toBe(retryDelayS(row.attempts));
          }
        }
        clock.advance(STEP_S);
      }

      // Never faster than the backoff, never later than one drain after it was due; and the
      // backoff itself as designed: 10 s after the first failure, doubling, at most an hour.
      expect(CAP_S).toBe(3600);
      for (const times of failedAt.values()) {
        expect(times.length).toBeGreaterThan(1);
        for (let k = 1; k < times.length; k += 1) {
          const gap = (times[k] ?? 0) - (times[k - 1] ?? 0);
          expect(gap).toBeGreaterThanOrEqual(retryDelayS(k));
          expect(gap).toBeLessThan(retryDelayS(k) + STEP_S);
          expect(retryDelayS(k)).toBe(Math.min(CAP_S, 10 * 2 ** (k - 1)));
        }
      }

      // The server is back, on the same port, an hour after it went.
      const recoveryS = clock.elapsedS();
      expect(recoveryS).toBe(OUTAGE_S);
      catcher = await startMailCatcher({ port, folder });
      const waiting = await outboxOf(alertIds);
      const dueAfterRecoveryS = new Map(
        waiting.map((r) => [r.id, clock.elapsedS(r.next_attempt_at) - recoveryS]),
      );
      for (const wait of dueAfterRecoveryS.values()) expect(wait).toBeLessThanOrEqual(CAP_S);

      let delivered = 0;
      for (let t = recoveryS; t <= recoveryS + CAP_S + STEP_S; t += STEP_S) {
        delivered += await worker.drain();
        if (delivered === waiting.length) break;
        clock.advance(STEP_S);
      }
      expect(delivered).toBe(waiting.length);
      const sent = await outboxOf(alertIds);
      const deliveredAfterS = new Map<number, number>();
      for (const row of sent) {
        expect(row.sent_at).not.toBeNull();
        expect(row.last_error).toBeNull();
        // No attempt in between: the attempts stayed those of the outage.
        expect(row.attempts).toBe(failedAt.get(row.id)?.length);
        const after = clock.elapsedS(row.sent_at ?? new Date(0)) - recoveryS;
        const due = dueAfterRecoveryS.get(row.id) ?? Number.NaN;
        // Sent at the first drain once due, and within the backoff's cap of the recovery.
        expect(after).toBeGreaterThanOrEqual(due);
        expect(after).toBeLessThan(Math.max(due, 0) + STEP_S);
        expect(after).toBeLessThanOrEqual(CAP_S);
        deliveredAfterS.set(row.id, after);
      }

      // Another two hours of drains send nothing more.
      for (let i = 0; i < 120; i += 1) {
        clock.advance(60);
        expect(await worker.drain()).toBe(0);
      }

      // Exactly once: by Message-ID, and by recipient and subject.
      const files = readdirSync(folder).map((f) => readFileSync(join(folder, f), "utf8"));
      expect(files.map(messageIdOf).sort()).toEqual(sent.map((r) => outboxMessageId(r.id)).sort());
      expect(catcher.messages).toHaveLength(sent.length);
      const caught = catcher.messages.map((m) => `${m.to.join(",")} | ${m.subject}`).sort();
      expect(caught).toEqual(sent.map((r) => `${r.to_address} | ${r.subject}`).sort());
      expect([...countBy(caught).values()].every((n) => n === 1)).toBe(true);
      expect(new Set(sent.map((r) => r.to_address))).toEqual(new Set(recipients));
      // Each e-mail was first tried at the drain right after its alert was raised.
      expect(new Set(sent.map((r) => failedAt.get(r.id)?.[0]))).toEqual(new Set(raises.keys()));

      // The figures for README: attempts per message (failures plus the one that went through),
      // and simulated seconds from the server's return to the delivery.
      console.info(
        "smtp outage figures:",
        JSON.stringify(
          sent.map((r) => ({
            raisedAtS: failedAt.get(r.id)?.[0],
            attempts: r.attempts + 1,
            deliveredAfterRecoveryS: deliveredAfterS.get(r.id),
          })),
        ),
      );
    } finally {
      await worker.stop();
      await catcher.close();
      rmSync(folder, { recursive: true, force: true });
    }
  }, 60_000); // about 1,500 drains: seconds, but the machine may be shared

  it("sends again under the same Message-ID when the server hangs up before its reply", async () => {
    // The server keeps each message's first delivery but hangs up instead of answering.
    const firstCopies = new Set<string>();
    const smtp = await startHangupSmtp({
      hangUp: (m) => {
        const id = m.messageId ?? "";
        const first = !firstCopies.has(id);
        firstCopies.add(id);
        return first;
      },
    });
    const clock = simulatedClock();
    const worker = createMailWorker(ctx.appDb, smtp.url, from, silent, noTimerMs, {
      now: clock.now,
    });
    try {
      const alertId = await raiseAlert(18);
      expect(await worker.drain()).toBe(0);
      const failed = await outboxOf([alertId]);
      expect(failed).toHaveLength(recipients.length);
      for (const row of failed) {
        expect(row).toMatchObject({ attempts: 1, sent_at: null });
        expect(clock.elapsedS(row.next_attempt_at)).toBe(retryDelayS(1));
      }
      expect(smtp.received).toHaveLength(recipients.length);

      clock.advance(retryDelayS(1) - 1);
      expect(await worker.drain()).toBe(0); // not due yet
      expect(smtp.received).toHaveLength(recipients.length);
      clock.advance(1);
      expect(await worker.drain()).toBe(recipients.length);
      clock.advance(CAP_S);
      expect(await worker.drain()).toBe(0);

      const sent = await outboxOf([alertId]);
      expect(sent.every((r) => r.sent_at !== null && r.attempts === 1)).toBe(true);
      // At least once: every message reached the server twice, both copies under its one ID.
      const ids = countBy(smtp.received.map((m) => m.messageId ?? ""));
      expect([...ids.keys()].sort()).toEqual(sent.map((r) => outboxMessageId(r.id)).sort());
      expect([...ids.values()]).toEqual(sent.map(() => 2));
      for (const row of sent) {
        const copies = smtp.received.filter((m) => m.messageId === outboxMessageId(row.id));
        expect(copies.map((m) => m.to)).toEqual([[row.to_address], [row.to_address]]);
      }
      expect(smtp.hookErrors).toEqual([]);
    } finally {
      await worker.stop();
      await smtp.close();
    }
  });

  it("sends again under the same Message-ID when the commit after the hand-over is lost", async () => {
    // The worker on its own connection, named so that the test can end exactly that session.
    const appName = `equipot-mail-crash-${process.pid}`;
    const ownUrl = new URL(ctx.database.url);
    ownUrl.searchParams.set("application_name", appName);
    const own = connect(ownUrl.toString(), 2);
    let cut = false;
    const smtp = await startHangupSmtp({
      hangUp: () => false,
      // The server has the first message; before it answers, the worker's session is ended,
      // so the "sent" it writes next never commits.
      beforeReply: async () => {
        if (cut) return;
        cut = true;
        const ended = await sql<{ ok: boolean }>(
          `select pg_terminate_backend(pid) as ok from pg_stat_activity
            where application_name = $1 and state = 'idle in transaction'`,
          [appName],
        );
        expect(ended).toEqual([{ ok: true }]);
        for (let i = 0; i < 100; i += 1) {
          const left = await sql("select 1 from pg_stat_activity where application_name = $1", [
            appName,
          ]);
          if (left.length === 0) return;
          await new Promise((r) => setTimeout(r, 20));
        }
        throw new Error("the worker's session did not end within 2 s");
      },
    });
    const clock = simulatedClock();
    const worker = createMailWorker(own.db, smtp.url, from, silent, noTimerMs, { now: clock.now });
    try {
      const alertId = await raiseAlert(20);
      await expect(worker.drain()).rejects.toThrow();
      expect(smtp.received).toHaveLength(1);
      // Nothing written for the message the server has: still due, no attempt counted.
      const rolledBack = await outboxOf([alertId]);
      expect(rolledBack).toHaveLength(recipients.length);
      for (const row of rolledBack) expect(row).toMatchObject({ attempts: 0, sent_at: null });

      expect(await worker.drain()).toBe(recipients.length);
      clock.advance(CAP_S);
      expect(await worker.drain()).toBe(0);

      const sent = await outboxOf([alertId]);
      expect(sent.every((r) => r.sent_at !== null)).toBe(true);
      const ids = countBy(smtp.received.map((m) => m.messageId ?? ""));
      expect([...ids.keys()].sort()).toEqual(sent.map((r) => outboxMessageId(r.id)).sort());
      // The first message twice (once before the lost commit), the others once.
      expect(sent.map((r) => ids.get(outboxMessageId(r.id)))).toEqual(
        sent.map((_r, i) => (i === 0 ? 2 : 1)),
      );
      expect(smtp.hookErrors).toEqual([]);
    } finally {
      await worker.stop();
      await smtp.close();
      await own.close();
    }
  });
});
