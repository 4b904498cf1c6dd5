// A minimal SMTP server on loopback whose reply to a message's data can be held back: it takes the
// whole message, keeps it, runs an optional hook, then either answers 250 or hangs up without a
// reply. That is the window the outbox cannot close (the mail server has the message, the sender
// does not know it), so tests can see what a resend looks like.
import { createServer, type Socket } from "node:net";
import type { AddressInfo } from "node:net";

export interface HeldMessage {
  messageId: string | undefined;
  to: string[];
  subject: string | undefined;
  raw: string;
}

export interface HangupSmtp {
  url: string;
  /** Every message whose data arrived in full, replied to or not. */
  received: HeldMessage[];
  /** Errors thrown by the hook: a test should expect none. */
  hookErrors: unknown[];
  close: () => Promise<void>;
}

export interface HangupOptions {
  /** Decides, after the data arrived and the hook ran, whether to hang up instead of replying. */
  hangUp: (message: HeldMessage, index: number) => boolean;
  /** Runs after the data arrived and before the reply (or the hang-up). */
  beforeReply?: (message: HeldMessage) => Promise<void>;
}

const header = (raw: string, name: string) =>
  new RegExp(`^${name}:\\s*(.+)$`, "im").exec(raw.split("\r\n\r\n")[0] ?? "")?.[1]?.trim();

export async function startHangupSmtp(options: HangupOptions): Promise<HangupSmtp> {
  const received: HeldMessage[] = [];
  const hookErrors: unknown[] = [];
  const sockets = new Set<Socket>();

  const server = createServer((socket) => {
    sockets.add(socket);
    socket.on("close", () => sockets.delete(socket));
    socket.on("error", () => undefined);
    socket.setEncoding("utf8");
    let buffer = "";
    let inData = false;
    let to: string[] = [];
    const reply = (line: string) => {
      if (!socket.destroyed) socket.write(`${line}\r\n`);
    };

    const finishData = async (data: string) => {
      // Undo the dot-stuffing of lines that began with a dot.
      const raw = data.replace(/\r\n\.\./g, "\r\n.");
      const message: HeldMessage = {
        messageId: header(raw, "Message-ID"),
        to,
        subject: header(raw, "Subject"),
        raw,
      };
      const index = received.push(message) - 1;
      try {
        await options.beforeReply?.(message);
      } catch (error) {
        hookErrors.push(error);
      }
      if (options.hangUp(message, index)) socket.destroy();
      else reply("250 2.0.0 kept");
    };

    const onCommand = (line: string) => {
      const verb = line.slice(0, 4).toUpperCase();
      if (verb === "EHLO" || verb === "HELO") reply("250 hangup.test");
      else if (verb === "MAIL") {
        to = [];
        reply("250 2.1.0 ok");
      } else if (verb === "RCPT") {
        to.push(/<([^>]*)>/.exec(line)?.[1] ?? "");
        reply("250 2.1.5 ok");
      } else if (verb === "DATA") {
        inData = true;
        reply("354 end with <CRLF>.<CRLF>");
      } else if (verb === "RSET" || verb === "NOOP") reply("250 2.0.0 ok");
      else if (verb === "QUIT") {
        reply("221 2.0.0 bye");
        socket.end();
      } else reply("502 5.5.1 not implemented");
    };

    // Bounded by the input: each pass consumes a command line or a message's data; while a
    // message's reply is pending, what follows waits in the buffer.
    let busy = false;
    const pump = () => {
      while (!busy && !socket.destroyed) {
        if (inData) {
          const end = buffer.indexOf("\r\n.\r\n");
          if (end < 0) return;
          const data = buffer.slice(0, end);
          buffer = buffer.slice(end + 5);
          inData = false;
          busy = true;
          void finishData(data).finally(() => {
            busy = false;
            pump();
          });
          return;
        }
        const eol = buffer.indexOf("\r\n");
        if (eol < 0) return;
        const line = buffer.slice(0, eol);
        buffer = buffer.slice(eol + 2);
        onCommand(line);
      }
    };
    socket.on("data", (chunk: string) => {
      buffer += chunk;
      pump();
    });
    reply("220 hangup.test ESMTP");
  });

  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(0, "127.0.0.1", () => resolve());
  });
  const { port } = server.address() as AddressInfo;
  return {
    url: `smtp://127.0.0.1:${port}`,
    received,
    hookErrors,
    close: () =>
      new Promise<void>((resolve) => {
        for (const s of sockets) s.destroy();
        server.close(() => resolve());
      }),
  };
}
