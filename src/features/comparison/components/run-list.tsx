// The campaign's comparison runs: name, remote site, target and state (shape + word).
import { Link } from "react-router-dom";
import { formatMm } from "../lib/durations";
import { runStateOf } from "../lib/run-state";
import type { RunWithResult } from "../hooks/use-run-results";
import { RunStateLine } from "./run-state-line";

interface RunListProps {
  runs: readonly RunWithResult[];
  siteName: (siteId: string) => string;
  runHref: (runId: string) => string;
}

export function RunList({ runs, siteName, runHref }: RunListProps) {
  if (runs.length === 0)
    return <p className="text-muted">No comparison runs in this campaign yet.</p>;
  return (
    <ul aria-label="Comparison runs" className="grid gap-3 md:grid-cols-2">
      {runs.map(({ run, result }) => (
        <li
          key={run.id}
          className="flex flex-col gap-2 rounded-xl border-2 border-line bg-surface p-4"
        >
          <Link
            to={runHref(run.id)}
            className="inline-flex min-h-touch items-center text-xl font-semibold"
          >
            {run.name}
          </Link>
          <p className="text-sm text-muted">
            {siteName(run.remoteSiteId)} · target{" "}
            <span className="tabular-nums">{formatMm(run.targetHeightUncertaintyM)}</span>
          </p>
          <RunStateLine state={runStateOf(result)} />
        </li>
      ))}
    </ul>
  );
}
