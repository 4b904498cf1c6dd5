// A burst of concurrent sign-ins with the right password, spread over the demo accounts, while the
// server samples its own heap and RSS. Every answer must be 200 or 429 (the sign-in throttle);
// anything else fails the benchmark.
import { demoAccounts, demoPassword } from "../../server/seed/demo";
import { median } from "../science/timing";
import type { BenchServer } from "../sync/server-process";
import type { ServerMemory } from "../sync/server";

export interface BurstResult {
  readonly n: number;
  readonly ok: number;
  readonly throttled: number;
  readonly wallMs: number;
  readonly medianMs: number;
  readonly maxMs: number;
  readonly memory: ServerMemory;
}

interface Answer {
  status: number;
  ms: number;
}

async function signInOnce(baseUrl: string, email: string): Promise<Answer> {
  const t0 = performance.now();
  const res = await fetch(`${baseUrl}/api/auth/sign-in`, {
    method: "POST",
    headers: { "content-type": "application/json", "x-equipot-request": "1" },
    body: JSON.stringify({ email, password: demoPassword }),
  });
  // Read the body so the request is timed to its end and the socket is let go.
  await res.arrayBuffer();
  return { status: res.status, ms: performance.now() - t0 };
}

export async function signInBurst(server: BenchServer, n: number): Promise<BurstResult> {
  const emails = Array.from({ length: n }, (_, i) => demoAccounts[i % demoAccounts.length]?.email);
  await server.memoryStart();
  const t0 = performance.now();
  // allSettled: sampling is stopped even when a request fails, then the failure is reported.
  const settled = await Promise.allSettled(
    emails.map((email) => signInOnce(server.url, email ?? "")),
  );
  const wallMs = performance.now() - t0;
  const memory = await server.memoryStop();
  const answers: Answer[] = [];
  for (const s of settled) {
    if (s.status === "rejected")
      throw new Error("sign-in burst: a request failed", { cause: s.reason });
    answers.push(s.value);
  }
  const others = answers.filter((a) => a.status !== 200 && a.status !== 429);
  if (others.length > 0) {
    const statuses = [...new Set(others.map((a) => a.status))].join(", ");
    throw new Error(`sign-in burst: ${others.length} of ${n} answered ${statuses}, not 200/429`);
  }
  const ok = answers.filter((a) => a.status === 200).length;
  return {
    n,
    ok,
    throttled: n - ok,
    wallMs,
    medianMs: median(answers.map((a) => a.ms)),
    maxMs: Math.max(...answers.map((a) => a.ms)),
    memory,
  };
}
