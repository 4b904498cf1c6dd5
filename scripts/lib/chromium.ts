// Debian's Chromium for the end-to-end tests; installed by the test command when it is missing.
import { execFileSync } from "node:child_process";
import { existsSync } from "node:fs";

export const chromiumPath = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium";

export function ensureChromiumInstalled(log: (line: string) => void = console.log): string {
  if (existsSync(chromiumPath)) return chromiumPath;
  if (process.getuid?.() !== 0) {
    throw new Error(
      `Chromium is missing at ${chromiumPath}. Install it with \`sudo apt-get install -y chromium\`, or set CHROMIUM_PATH.`,
    );
  }
  log("Chromium is not installed: installing Debian's chromium package (about a minute)…");
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  execFileSync("apt-get", ["update", "-qq"], { stdio: "inherit", env });
  execFileSync("apt-get", ["install", "-y", "-qq", "chromium"], { stdio: "inherit", env });
  if (!existsSync(chromiumPath))
    throw new Error(`apt-get installed chromium but ${chromiumPath} is missing`);
  return chromiumPath;
}
