import { spawnSync } from "node:child_process";

/** Runs a command in the foreground, inheriting the terminal; throws with its name when it fails. */
export function run(
  label: string,
  command: string,
  args: string[],
  env: NodeJS.ProcessEnv = process.env,
): void {
  console.log(`\n▶ ${label}`);
  const result = spawnSync(command, args, { stdio: "inherit", env });
  if (result.status !== 0)
    throw new Error(`${label} failed (exit ${result.status ?? result.signal})`);
}

export const nodeBin = process.execPath;
