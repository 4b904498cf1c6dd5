// `npm test`: every check in one command. Installs what a fresh Debian machine lacks (PostgreSQL
// server, Chromium), then type-checks, lints, checks migrations, builds the PWA and runs all tests.
import { ensureChromiumInstalled } from "./lib/chromium";
import { ensurePostgresInstalled } from "./lib/postgres";
import { nodeBin, run } from "./lib/run";

const extra = process.argv.slice(2);

try {
  if (!process.env.DATABASE_URL) ensurePostgresInstalled();
  ensureChromiumInstalled();
  run("Type check", nodeBin, [
    "node_modules/typescript/bin/tsc",
    "--noEmit",
    "-p",
    "tsconfig.json",
  ]);
  run("Lint", nodeBin, ["node_modules/eslint/bin/eslint.js", "--max-warnings", "0", "."]);
  run("Format", nodeBin, [
    "node_modules/prettier/bin/prettier.cjs",
    "--check",
    "--log-level",
    "warn",
    ".",
  ]);
  run("Migrations match the schema", nodeBin, ["--import", "tsx", "scripts/check-migrations.ts"]);
  run("Build the PWA", nodeBin, ["node_modules/vite/bin/vite.js", "build", "--logLevel", "warn"]);
  run("Unit, integration and end-to-end tests", nodeBin, [
    "node_modules/vitest/vitest.mjs",
    "run",
    ...extra,
  ]);
} catch (error) {
  console.error(`\n✗ ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
}
