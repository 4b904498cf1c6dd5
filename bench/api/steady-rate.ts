// One endpoint at a fixed arrival rate: requests are due at even intervals (500 per second means
// one every 2 ms) over a keep-alive pool of 50 connections, whether or not earlier answers came
// back, and each latency runs from the moment the request was due, not from when a connection
// was free. A slow server therefore shows as long latencies instead of hiding behind fewer
// requests (the closed-loop run in load.ts measures capacity instead). node:http, no library:
// autocannon's rate cap sends each second's budget in a burst at the start of the second.
import { Agent, request } from "node:http";

export interface SteadyResult {
  readonly path: string;
  readonly ratePerS: number;
  readonly connections: number;
  readonly sent: number;
  /** Answers per second over the measured run (the arrival rate when the server keeps up). */
  readonly answeredPerS: number;
  readonly p50Ms: number;
  readonly p99Ms: number;
  readonly maxMs: number;
}

function get(agent: Agent, url: URL, token: string | undefined): Promise<number> {
  return new Promise((resolve, reject) => {
    const req = request(
      url,
      { agent, headers: token === undefined ? {} : { authorization: `Bearer ${token}` } },
      (res) => {
        res.resume();
        res.on("end", () => resolve(res.statusCode ?? 0));
        res.on("error", reject);
      },
    );
    req.on("error", reject);
    req.end();
  });
}

const quantile = (sorted: readonly number[], q: number) =>
  sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))] ?? Number.NaN;

/** Sends `ratePerS` requests a second for `seconds`, then waits for the last answer. */
async function run(
  url: URL,
  token: string | undefined,
  ratePerS: number,
  connections: number,
  seconds: number,
): Promise<{ latencies: number[]; wallMs: number }> {
  const agent = new Agent({ keepAlive: true, maxSockets: connections });
  const total = Math.round(ratePerS * seconds);
  const interval = 1000 / ratePerS;
  const latencies: number[] = [];
  const pending: Promise<void>[] = [];
  const t0 = performance.now();
  let next = 0;
  await new Promise<void>((done) => {
    const tick = () => {
      const now = performance.now();
      // Everything due by now goes out, so a late timer never lowers the rate.
      for (; next < total && t0 + next * interval <= now; next++) {
        const due = t0 + next * interval;
        pending.push(
          get(agent, url, token).then((status) => {
            if (status < 200 || status > 299) throw new Error(`${url.pathname}: HTTP ${status}`);
            latencies.push(performance.now() - due);
          }),
        );
      }
      if (next < total) setTimeout(tick, Math.max(0, t0 + next * interval - performance.now()));
      else done();
    };
    tick();
  });
  await Promise.all(pending);
  const wallMs = performance.now() - t0;
  agent.destroy();
  return { latencies, wallMs };
}

export async function steadyLoad(
  baseUrl: string,
  path: string,
  token: string | undefined,
  options: { ratePerS: number; connections: number; warmUpS: number; measureS: number },
): Promise<SteadyResult> {
  const url = new URL(path, baseUrl);
  const { ratePerS, connections } = options;
  await run(url, token, ratePerS, connections, options.warmUpS);
  const { latencies, wallMs } = await run(url, token, ratePerS, connections, options.measureS);
  const sorted = latencies.sort((a, b) => a - b);
  return {
    path,
    ratePerS,
    connections,
    sent: sorted.length,
    answeredPerS: (sorted.length / wallMs) * 1000,
    p50Ms: quantile(sorted, 0.5),
    p99Ms: quantile(sorted, 0.99),
    maxMs: sorted.at(-1) ?? Number.NaN,
  };
}
