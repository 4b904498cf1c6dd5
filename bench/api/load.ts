// One endpoint under load: autocannon with a fixed number of connections, first a short warm-up
// whose figures are dropped (JIT, pool connections, caches), then the measured run, each
// connection sending its next request as soon as the last is answered. No rate cap: autocannon
// spends a rate's whole budget at the start of each second, so a capped run is a burst, not a
// steady load. An answer other than 2xx fails the benchmark: figures for 401s would say nothing.
import autocannon from "autocannon";

export const CONNECTIONS = 50;
export const WARM_UP_S = 2;
export const MEASURE_S = 10;

export interface LoadResult {
  readonly path: string;
  readonly requests: number;
  readonly requestsPerS: number;
  readonly p50Ms: number;
  readonly p99Ms: number;
  readonly maxMs: number;
}

function describeFailures(result: autocannon.Result): string {
  const codes = Object.entries(result.statusCodeStats ?? {})
    .filter(([code]) => !code.startsWith("2"))
    .map(([code, stats]) => `${code} × ${stats.count ?? 0}`);
  return [
    `${result.non2xx} non-2xx (${codes.join(", ") || "codes not reported"})`,
    `${result.errors} errors`,
    `${result.timeouts} timeouts`,
  ].join(", ");
}

async function fire(
  url: string,
  token: string | undefined,
  durationS: number,
): Promise<autocannon.Result> {
  const result = await autocannon({
    url,
    connections: CONNECTIONS,
    duration: durationS,
    headers: token === undefined ? {} : { authorization: `Bearer ${token}` },
  });
  if (result.non2xx > 0 || result.errors > 0 || result.timeouts > 0 || result["2xx"] === 0)
    throw new Error(`load on ${url} got ${describeFailures(result)}: the figures would be wrong`);
  return result;
}

function summarise(path: string, result: autocannon.Result): LoadResult {
  return {
    path,
    requests: result["2xx"],
    // Whole-run throughput; result.requests.average is a mean of per-second samples.
    requestsPerS: result["2xx"] / result.duration,
    p50Ms: result.latency.p50,
    p99Ms: result.latency.p99,
    maxMs: result.latency.max,
  };
}

export async function loadEndpoint(
  baseUrl: string,
  path: string,
  token?: string,
): Promise<LoadResult> {
  const url = `${baseUrl}${path}`;
  await fire(url, token, WARM_UP_S);
  return summarise(path, await fire(url, token, MEASURE_S));
}
