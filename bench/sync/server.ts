// The Equipot server under benchmark, in its own process so that its memory is measured apart
// from the client's: createApp() on DATABASE_URL, loopback, a port chosen by the OS. The parent
// asks for memory figures over the IPC channel.
import { createServer } from "node:http";
import { pino } from "pino";
import { createApp } from "../../server/app";
import { parseConfig } from "../../server/config";
import { connect } from "../../server/db/client";
import { liveHeap, samplePeak, type Peak } from "./memory";

export type ServerMessage = { type: "memory-start" } | { type: "memory-stop" };

export interface ServerMemory {
  /** Live heap before and after, peak heap and RSS in between, bytes. */
  before: number;
  after: number;
  peak: Peak;
  rssBefore: number;
}

const config = parseConfig({
  NODE_ENV: "test",
  DATABASE_URL: process.env.DATABASE_URL,
  JWT_SECRET: "bench-secret-that-is-long-enough-for-hs256-0123456789",
  LOG_LEVEL: "silent",
  HOST: "127.0.0.1",
  PORT: "0",
  ACCESS_TOKEN_TTL_S: "3600",
});
const database = connect(config.DATABASE_URL);
const app = createApp({ config, db: database.db, log: pino({ level: "silent" }) });
const server = createServer(app).listen(0, "127.0.0.1", () => {
  const address = server.address();
  process.send?.({ type: "listening", port: typeof address === "object" ? address?.port : 0 });
});

let stop: (() => Peak) | undefined;
let before = 0;
let rssBefore = 0;
process.on("message", (message: ServerMessage) => {
  if (message.type === "memory-start") {
    before = liveHeap();
    rssBefore = process.memoryUsage().rss;
    stop = samplePeak();
    process.send?.({ type: "memory-started" });
  } else {
    const peak = stop?.() ?? { heapUsed: 0, rss: 0 };
    const memory: ServerMemory = { before, after: liveHeap(), peak, rssBefore };
    process.send?.({ type: "memory", memory });
  }
});
process.on("disconnect", () => {
  server.close();
  void database.close().then(() => process.exit(0));
});
