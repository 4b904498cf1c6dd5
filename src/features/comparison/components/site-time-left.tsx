// The site board's time left: each run whose remote site is this one, from the persisted cache
// when the device is offline ("last seen online at …").
import { StatusShape } from "../../../components/status-shape";
import { formatLocalBeside, formatUtc } from "../../../lib/format";
import { useConnectivity } from "../../../lib/use-connectivity";
import { useRuns } from "../api/list-runs";
import { useRunResults } from "../hooks/use-run-results";
import { formatMm } from "../lib/durations";
import { runStateOf } from "../lib/run-state";
import { RunStateLine } from "./run-state-line";

function Frame({ children }: { children: React.ReactNode }) {
  return (
    <section
      aria-label="Comparison time left"
      data-testid="time-left-card"
      className="flex flex-col gap-2 rounded-xl border-2 border-line bg-surface p-4"
    >
      <h2 className="text-sm font-semibold tracking-wide text-muted uppercase">Time left</h2>
      {children}
    </section>
  );
}

export function SiteTimeLeft({ campaignId, siteId }: { campaignId: string; siteId: string }) {
  const runs = useRuns(campaignId);
  const here = (runs.data ?? []).filter((r) => r.remoteSiteId === siteId);
  const withResults = useRunResults(campaignId, here);
  const offline = useConnectivity() !== "online";
  if (here.length === 0)
    return (
      <Frame>
        <p className="flex items-center gap-2 text-lg font-semibold">
          <StatusShape shape="ring" className="text-muted" />
          No comparison run here yet
        </p>
        <p className="text-sm text-muted">
          The estimate appears once comparison data for this site has been analysed, and stays
          readable offline.
        </p>
      </Frame>
    );
  return (
    <Frame>
      <ul className="flex flex-col gap-3">
        {withResults.map(({ run, result, fetchedAtMs }) => {
          const t = result?.timeToTarget;
          const seen = fetchedAtMs > 0 ? new Date(fetchedAtMs).toISOString() : null;
          return (
            <li key={run.id} className="flex flex-col gap-1 tabular-nums">
              <p className="font-semibold">
                {run.name} · target {formatMm(run.targetHeightUncertaintyM)}
              </p>
              <RunStateLine state={runStateOf(result)} />
              {t !== undefined && t.reachable && result?.clock != null && (
                <p className="text-sm">Dominant term: {t.dominant}</p>
              )}
              {t !== undefined && !t.reachable && t.improve !== null && (
                <p className="text-sm">To reach it: {t.improve}</p>
              )}
              {result !== undefined && (
                <p className="text-sm text-muted">
                  As of {formatUtc(result.computedAt)} ({formatLocalBeside(result.computedAt)})
                </p>
              )}
              {offline && seen !== null && (
                <p className="flex items-center gap-2 text-sm">
                  <StatusShape shape="dots" className="text-attention" />
                  Offline: last seen online at {formatUtc(seen)} ({formatLocalBeside(seen)})
                </p>
              )}
            </li>
          );
        })}
      </ul>
    </Frame>
  );
}
