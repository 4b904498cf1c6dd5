// A local SMTP catcher for development and tests: it accepts every message on loopback and keeps
// it (in memory, and as .eml files when a folder is given) so that it can be read back.
import { simpleParser } from "mailparser";
import { mkdirSync, writeFileSync } from "node:fs";
import type { AddressInfo } from "node:net";
import { join } from "node:path";
import { SMTPServer } from "smtp-server";

export interface CaughtMail {
  to: string[];
  from: string;
  subject: string;
  text: string;
  receivedAt: string;
}

export interface MailCatcher {
  port: number;
  url: string;
  messages: CaughtMail[];
  waitFor: (match: (m: CaughtMail) => boolean, timeoutMs?: number) => Promise<CaughtMail>;
  close: () => Promise<void>;
}

function addressesOf(value: unknown): string[] {
  const list = Array.isArray(value) ? value : value ? [value] : [];
  return list
    .flatMap((v: { value?: { address?: string }[] }) => (v.value ?? []).map((a) => a.address ?? ""))
    .filter(Boolean);
}

export async function startMailCatcher(
  options: { port?: number; folder?: string } = {},
): Promise<MailCatcher> {
  const messages: CaughtMail[] = [];
  const waiters = new Set<() => void>();
  if (options.folder) mkdirSync(options.folder, { recursive: true });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    logger: false,
    onData(stream, _session, callback) {
      const chunks: Buffer[] = [];
      stream.on("data", (c: Buffer) => chunks.push(c));
      stream.on("end", () => {
        const raw = Buffer.concat(chunks);
        simpleParser(raw)
          .then((parsed) => {
            const mail: CaughtMail = {
              to: addressesOf(parsed.to),
              from: addressesOf(parsed.from)[0] ?? "",
              subject: parsed.subject ?? "",
              text: parsed.text ?? "",
              receivedAt: new Date().toISOString(),
            };
            messages.push(mail);
            if (options.folder)
              writeFileSync(join(options.folder, `${Date.now()}-${messages.length}.eml`), raw);
            for (const wake of waiters) wake();
            callback();
          })
          .catch((error: Error) => callback(error));
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(options.port ?? 0, "127.0.0.1", () => resolve());
  });
  const port = (server.server.address() as AddressInfo).port;

  const waitFor = (match: (m: CaughtMail) => boolean, timeoutMs = 10_000) =>
    new Promise<CaughtMail>((resolve, reject) => {
      const check = () => {
        const found = messages.find(match);
        if (!found) return;
        waiters.delete(check);
        clearTimeout(timer);
        resolve(found);
      };
      const timer = setTimeout(() => {
        waiters.delete(check);
        reject(new Error(`no matching e-mail within ${timeoutMs} ms (${messages.length} caught)`));
      }, timeoutMs);
      waiters.add(check);
      check();
    });

  return {
    port,
    url: `smtp://127.0.0.1:${port}`,
    messages,
    waitFor,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
