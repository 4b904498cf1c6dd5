// Sends the e-mail outbox, one message per transaction: claim it (SKIP LOCKED), send it, mark it
// sent, commit. A crash between the SMTP hand-over and the commit sends it again (at least once),
// under the same Message-ID so the resend is recognisable; SMTP failures retry with backoff. One
// message per transaction keeps a database failure from re-sending a whole batch.
import nodemailer, { type Transporter } from "nodemailer";
import type { Logger } from "pino";
import type { Db } from "../db/client";
import {
  claimDueEmails,
  markEmailFailed,
  markEmailSent,
  outboxMessageId,
} from "../db/repositories/outbox";

export interface MailWorker {
  /** Sends what is due now; resolves with how many were sent. */
  drain: () => Promise<number>;
  kick: () => void;
  stop: () => Promise<void>;
}

export interface MailWorkerOptions {
  /**
   * The clock due times are read from and written with; without it the database's now() is used,
   * as in production. Tests pass a simulated clock to step through hours in seconds.
   */
  now?: () => Date;
}

const batchSize = 20;
/** Seconds until the next attempt after `attempts` failed ones: doubling from 10 s, at most 1 h. */
export const retryDelayS = (attempts: number) => Math.min(3600, 5 * 2 ** Math.min(attempts, 10));

export function createMailWorker(
  db: Db,
  smtpUrl: string,
  from: string,
  log: Logger,
  intervalMs = 5000,
  options: MailWorkerOptions = {},
): MailWorker {
  const transport: Transporter = nodemailer.createTransport(smtpUrl);
  let running: Promise<number> | undefined;
  let stopped = false;

  type Outcome = "none" | "sent" | "failed";
  const sendOne = (): Promise<Outcome> =>
    db.transaction(async (tx) => {
      // One reading per message: the claim and its outcome are stamped with the same instant.
      const at = options.now?.();
      const [email] = await claimDueEmails(tx, 1, at);
      if (!email) return "none";
      try {
        await transport.sendMail({
          from,
          to: email.toAddress,
          subject: email.subject,
          text: email.textBody,
          messageId: outboxMessageId(email.id),
        });
      } catch (error) {
        const attempts = email.attempts + 1;
        log.warn({ emailId: email.id, attempts, err: error }, "e-mail not sent, will retry");
        await markEmailFailed(tx, email.id, attempts, String(error), retryDelayS(attempts), at);
        return "failed";
      }
      await markEmailSent(tx, email.id, at);
      return "sent";
    });

  // A failed message is due again only after its backoff, so it is not claimed twice in one drain.
  const drainOnce = async (): Promise<number> => {
    let sent = 0;
    for (let i = 0; i < batchSize; i += 1) {
      const outcome = await sendOne();
      if (outcome === "none") break;
      if (outcome === "sent") sent += 1;
    }
    return sent;
  };

  const drain = async () => {
    running ??= drainOnce().finally(() => (running = undefined));
    return running;
  };
  const tick = () => {
    if (!stopped)
      drain().catch((error: unknown) => log.error({ err: error }, "mail worker failed"));
  };
  const timer = setInterval(tick, intervalMs);
  timer.unref();

  return {
    drain,
    kick: () => setImmediate(tick),
    stop: async () => {
      stopped = true;
      clearInterval(timer);
      await running?.catch(() => undefined);
      transport.close();
    },
  };
}
