// A real server for end-to-end tests: a fresh database seeded with the demo campaign, the built
// PWA from dist/, and a local SMTP catcher, on a random loopback port.
import { cpSync, existsSync, mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { startMailCatcher, type MailCatcher } from "../../scripts/lib/mail-catcher";
import { startServer } from "../../server/index";
import { seedDemo } from "../../server/seed/demo";
import { testConfig } from "./config";
import { createTestDatabase, type TestDatabase } from "./db";

export interface TestServer {
  baseUrl: string;
  databaseUrl: string;
  database: TestDatabase;
  mail: MailCatcher;
  stop: () => Promise<void>;
}

// EQUIPOT_STATIC_DIR lets parallel work build the client into its own folder.
const builtClientDir = () => resolve(process.env.EQUIPOT_STATIC_DIR ?? "dist");

/** A throw-away copy of the built client, for tests that change the files a server serves. */
export function copyOfBuiltClient(): string {
  const dir = mkdtempSync(join(tmpdir(), "equipot-client-"));
  cpSync(builtClientDir(), dir, { recursive: true });
  return dir;
}

export async function startTestServer(
  options: { seed?: boolean; staticDir?: string } = {},
): Promise<TestServer> {
  const staticDir = resolve(options.staticDir ?? builtClientDir());
  if (!existsSync(resolve(staticDir, "index.html"))) {
    throw new Error("dist/ is missing: run `npx vite build` first (npm test does it)");
  }
  const database = await createTestDatabase();
  if (options.seed ?? true) await seedDemo(database.db, "test");
  const mail = await startMailCatcher();
  const config = testConfig({
    DATABASE_URL: database.url,
    STATIC_DIR: staticDir,
    SMTP_URL: mail.url,
    DEMO: "true",
  });
  const running = await startServer(config);
  return {
    baseUrl: running.url,
    databaseUrl: database.ownerUrl,
    database,
    mail,
    stop: async () => {
      await running.close();
      await mail.close();
      await database.drop();
    },
  };
}
