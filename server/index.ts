// Runs the API (and the built PWA when STATIC_DIR is set) as one process.
import type { Server } from "node:http";
import { pathToFileURL } from "node:url";
import { createApp } from "./app";
import { parseConfig, publicUrl, type Config } from "./config";
import { privilegedRoleProblem } from "./db/app-role";
import { connect } from "./db/client";
import { createLogger } from "./logger";
import { createMailWorker, type MailWorker } from "./mail/mail-worker";
import { queueWeeklySummaries } from "./services/review-summary.service";
import { createStorage } from "./storage/create-storage";
import { createSciencePool } from "./workers/science-pool";

export interface RunningServer {
  url: string;
  mail?: MailWorker;
  close: () => Promise<void>;
}

export async function startServer(config: Config): Promise<RunningServer> {
  const log = createLogger(config);
  const storage = await createStorage(config);
  log.info({ driver: config.STORAGE_DRIVER }, "file storage ready");
  const database = connect(config.DATABASE_URL);
  const problem = await privilegedRoleProblem(database.pool);
  if (problem) {
    await database.close();
    throw new Error(problem);
  }
  const mail = config.SMTP_URL
    ? createMailWorker(database.db, config.SMTP_URL, config.MAIL_FROM, log)
    : undefined;
  if (!mail) log.warn("SMTP_URL is not set: e-mail stays in the outbox until it is");
  let url = publicUrl(config);
  const linkBase = () => url;
  const science = createSciencePool();
  const app = createApp({
    config,
    db: database.db,
    log,
    onMailQueued: () => mail?.kick(),
    linkBase,
    storage,
    science,
  });
  const server = await new Promise<Server>((resolve, reject) => {
    const s = app.listen(config.PORT, config.HOST, () => resolve(s)).on("error", reject);
  });
  const address = server.address();
  const port = typeof address === "object" && address ? address.port : config.PORT;
  url = config.PUBLIC_URL ?? `http://${config.HOST}:${port}`;
  // Hourly: a summary is queued once per ISO week, so any instance may run the check.
  const summaries = setInterval(() => {
    queueWeeklySummaries(database.db, new Date(), url)
      .then((queued) => queued > 0 && mail?.kick())
      .catch((error: unknown) => log.error({ err: error }, "weekly review summaries failed"));
  }, 3_600_000);
  summaries.unref();
  return {
    url,
    mail,
    close: async () => {
      clearInterval(summaries);
      const closed = new Promise<void>((resolve) => server.close(() => resolve()));
      server.closeAllConnections();
      await closed;
      await mail?.stop();
      await science.close();
      await database.close();
    },
  };
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? "").href) {
  const config = parseConfig();
  const running = await startServer(config);
  console.log(`Equipot API listening on ${running.url} (public URL ${publicUrl(config)})`);
  const stop = () => void running.close().then(() => process.exit(0));
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
}
