import { pino, type Logger } from "pino";
import type { Config } from "./config";

export const createLogger = (config: Pick<Config, "LOG_LEVEL">): Logger =>
  pino({
    level: config.LOG_LEVEL,
    redact: ["req.headers.authorization", "req.headers.cookie", 'res.headers["set-cookie"]'],
  });
