// argon2id at OWASP's minimum parameters (m = 19 MiB, t = 2, p = 1), with bounded concurrency so a
// burst of sign-ins cannot exhaust memory.
import argon2 from "argon2";

const params = { type: argon2.argon2id, memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const;
const maxConcurrent = 4;
let running = 0;
const waiting: (() => void)[] = [];

async function bounded<T>(work: () => Promise<T>): Promise<T> {
  if (running >= maxConcurrent) await new Promise<void>((resolve) => waiting.push(resolve));
  running += 1;
  try {
    return await work();
  } finally {
    running -= 1;
    waiting.shift()?.();
  }
}

export const hashPassword = (password: string) => bounded(() => argon2.hash(password, params));

export async function verifyPassword(hash: string, password: string): Promise<boolean> {
  return bounded(async () => {
    try {
      return await argon2.verify(hash, password);
    } catch {
      return false;
    }
  });
}

// Verified against when the account is unknown, so both answers take about as long.
let dummyHash: Promise<string> | undefined;
export async function verifyAgainstDummy(password: string): Promise<false> {
  dummyHash ??= hashPassword("equipot-timing-equaliser");
  await verifyPassword(await dummyHash, password);
  return false;
}
