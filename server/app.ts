// createApp(): middleware, routers, static PWA, and the error handler registered last.
import "./express-augment";
import cookieParser from "cookie-parser";
import express, { type Express, type RequestHandler } from "express";
import helmet from "helmet";
import { existsSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import type { Logger } from "pino";
import { pinoHttp } from "pino-http";
import { limits } from "../shared/schemas/limits";
import type { Config } from "./config";
import { publicUrl } from "./config";
import type { Db } from "./db/client";
import { authenticate } from "./middleware/authenticate";
import { apiNotFound, errorHandler } from "./middleware/error-handler";
import { authRouter, type AuthRouterDeps } from "./routes/auth/auth.router";
import { campaignsRouter } from "./routes/campaigns/campaigns.router";
import { healthRouter } from "./routes/health/health.router";
import { invitesRouter } from "./routes/invites/invites.router";
import { syncRouter } from "./routes/sync/sync.router";
import { createTokenService } from "./services/tokens";
import { createDiskStorage } from "./storage/disk";
import type { Storage } from "./storage/storage";
import { createSciencePool, type SciencePool } from "./workers/science-pool";

export interface AppDeps {
  config: Config;
  db: Db;
  log: Logger;
  onMailQueued?: () => void;
  /** Where links in e-mails point; known only after listen() when the port is chosen by the OS. */
  linkBase?: () => string;
  /** File storage, built by startServer from the configuration; by default a temp folder. */
  storage?: Storage;
  /** Worker threads for heavy analysis; by default a pool whose workers start on first use. */
  science?: SciencePool;
}

const contentSecurityPolicy = {
  useDefaults: true,
  directives: {
    "default-src": ["'self'"],
    "script-src": ["'self'"],
    "style-src": ["'self'", "'unsafe-inline'"],
    "img-src": ["'self'", "data:", "blob:"],
    "worker-src": ["'self'", "blob:"],
    "connect-src": ["'self'"],
    // Field tablets may reach a server by its LAN address over plain HTTP.
    "upgrade-insecure-requests": null,
  },
};

function staticPwa(dir: string): RequestHandler[] {
  const root = resolve(dir);
  // Only Vite's content-hashed files under assets/ may be cached for good; everything else
  // (index.html, sw.js, the manifest, icons) must be revalidated so an update reaches the tablet.
  const hashed = (path: string) => path.startsWith(join(root, "assets") + "/");
  const serve = express.static(root, {
    index: false,
    setHeaders: (res, path) => {
      res.setHeader(
        "Cache-Control",
        hashed(path) ? "public, max-age=31536000, immutable" : "no-cache",
      );
    },
  });
  const fallback: RequestHandler = (req, res, next) => {
    if (req.method !== "GET" || req.path.startsWith("/api/")) return next();
    res.setHeader("Cache-Control", "no-cache");
    // `root` keeps the dot-file check to the request path, so STATIC_DIR may sit under a dot folder.
    res.sendFile("index.html", { root });
  };
  return [serve, fallback];
}

export function createApp({
  config,
  db,
  log,
  onMailQueued = () => undefined,
  linkBase,
  storage = createDiskStorage(join(tmpdir(), `equipot-files-${process.pid}`)),
  science = createSciencePool(),
}: AppDeps): Express {
  const app = express();
  app.disable("x-powered-by");
  app.set("trust proxy", config.TRUST_PROXY === "true");
  app.use(helmet({ contentSecurityPolicy, crossOriginEmbedderPolicy: false }));
  app.use(
    pinoHttp({
      logger: log,
      autoLogging: { ignore: (req) => req.url === "/api/health" || !req.url?.startsWith("/api/") },
      // One short line per request: headers (tokens, cookies) never reach the log.
      serializers: {
        req: (req: { method?: string; url?: string }) => ({ method: req.method, url: req.url }),
        res: (res: { statusCode?: number }) => ({ status: res.statusCode }),
      },
    }),
  );

  const tokens = createTokenService(config.JWT_SECRET, config.ACCESS_TOKEN_TTL_S);
  const authDeps: AuthRouterDeps = {
    db,
    tokens,
    refreshTtlS: config.REFRESH_TOKEN_TTL_S,
    secureCookies: publicUrl(config).startsWith("https:"),
  };

  const api = express.Router();
  api.use(express.json({ limit: limits.jsonBodyBytes, strict: true }));
  api.use(cookieParser());
  api.use((_req, res, next) => {
    res.setHeader("Cache-Control", "no-store");
    next();
  });
  api.use("/health", healthRouter(db, config.DEMO === "true"));
  api.use("/auth", authRouter(authDeps));
  api.use("/invites", invitesRouter(authDeps));
  api.use(
    "/campaigns",
    authenticate(tokens),
    campaignsRouter({
      db,
      linkBase: linkBase ?? (() => publicUrl(config)),
      onMailQueued,
      storage,
      science,
      log,
    }),
  );
  api.use(
    "/sync",
    authenticate(tokens),
    syncRouter(db, linkBase ?? (() => publicUrl(config)), onMailQueued),
  );
  api.use(apiNotFound);
  app.use("/api", api);

  if (config.STATIC_DIR && existsSync(join(config.STATIC_DIR, "index.html")))
    app.use(staticPwa(config.STATIC_DIR));
  app.use(errorHandler);
  return app;
}
