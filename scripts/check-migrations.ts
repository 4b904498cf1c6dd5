// Fails when drizzle/ does not match server/db/schema.ts: `drizzle-kit generate` must produce nothing new.
import { cpSync, mkdirSync, readdirSync, rmSync } from "node:fs";
import { spawnSync } from "node:child_process";

// drizzle-kit wants a path relative to the project, so the scratch copy lives in .equipot/.
const scratch = `.equipot/migration-check-${process.pid}`;
try {
  mkdirSync(scratch, { recursive: true });
  cpSync("drizzle", scratch, { recursive: true });
  const before = readdirSync(scratch).sort();
  const args = [
    "node_modules/drizzle-kit/bin.cjs",
    "generate",
    "--dialect",
    "postgresql",
    "--schema",
    "./server/db/schema.ts",
    "--out",
    scratch,
  ];
  const result = spawnSync(process.execPath, args, { encoding: "utf8" });
  const output = `${result.stdout}${result.stderr}`;
  // drizzle-kit can print an error and still exit 0: require its own "nothing to do" line too.
  if (result.status !== 0 || /error/i.test(result.stderr))
    throw new Error(`drizzle-kit generate failed:\n${output}`);
  const after = readdirSync(scratch).sort();
  const added = after.filter((f) => !before.includes(f));
  if (added.length > 0 || !/No schema changes/.test(output)) {
    console.error(
      `drizzle/ is behind server/db/schema.ts: generate would add ${added.join(", ") || "changes"}. Run \`npm run db:generate\` and commit the migration.`,
    );
    process.exit(1);
  }
  console.log("drizzle/ matches the schema.");
} finally {
  rmSync(scratch, { recursive: true, force: true });
}
