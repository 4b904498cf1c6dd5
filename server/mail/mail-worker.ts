// Sends the e-mail outbox. A message is marked sent in the same transaction that claimed it, so a
// crash before the commit means it is sent again (at least once); SMTP failures retry with backoff.
import nodemailer, { type Transporter } from "nodemailer";
import type { Logger } from "pino";
import type { Db } from "../db/client";
import { claimDueEmails, markEmailFailed, markEmailSent } from "../db/repositories/outbox";

export interface MailWorker {
  /** Sends what is due now; resolves with how many were sent. */
  drain: () => Promise<number>;
  kick: () => void;
  stop: () => Promise<void>;
}

const retryDelayS = (attempts: number) => Math.min(3600, 5 * 2 ** Math.min(attempts, 10));

export function createMailWorker(
  db: Db,
  smtpUrl: string,
  from: string,
  log: Logger,
  intervalMs = 5000,
): MailWorker {
  const transport: Transporter = nodemailer.createTransport(smtpUrl);
  let running: Promise<number> | undefined;
  let stopped = false;

  const drainOnce = async (): Promise<number> =>
    db.transaction(async (tx) => {
      let sent = 0;
      for (const email of await claimDueEmails(tx, 20)) {
        try {
          await transport.sendMail({
            from,
            to: email.toAddress,
            subject: email.subject,
            text: email.textBody,
          });
          await markEmailSent(tx, email.id);
          sent += 1;
        } catch (error) {
          const attempts = email.attempts + 1;
          log.warn({ emailId: email.id, attempts, err: error }, "e-mail not sent, will retry");
          await markEmailFailed(tx, email.id, attempts, String(error), retryDelayS(attempts));
        }
      }
      return sent;
    });

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
