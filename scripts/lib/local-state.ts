// Files Equipot keeps for itself in the git-ignored .equipot/ folder of the checkout.
import { randomBytes } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { join, resolve } from "node:path";

export const stateDir = resolve(".equipot");

export function ensureStateDir(): string {
  mkdirSync(stateDir, { recursive: true, mode: 0o755 });
  return stateDir;
}

/** A secret made once per checkout and kept, so tokens survive a restart of `npm start`. */
export function persistentSecret(name: string): string {
  const file = join(ensureStateDir(), name);
  if (existsSync(file)) return readFileSync(file, "utf8").trim();
  const secret = randomBytes(48).toString("base64url");
  writeFileSync(file, secret, { mode: 0o600 });
  return secret;
}
