// σ0, degrees of freedom and the global test (χ², two-sided) with its verdict as shape and word.
import type { AdjustmentView } from "../../../../shared/schemas/height-network";
import { Notice } from "../../../components/notice";
import { StatusShape } from "../../../components/status-shape";
import { formatLocalBeside, formatUtc } from "../../../lib/format";
import { formatNumber } from "../lib/format";

function GlobalTest({ test }: { test: NonNullable<AdjustmentView["globalTest"]> }) {
  return (
    <div className="flex flex-col gap-1" data-testid="global-test">
      <p className="flex items-center gap-2 font-semibold">
        <StatusShape
          shape={test.passed ? "disc" : "octagon"}
          className={test.passed ? "text-primary" : "text-danger"}
        />
        Global test {test.passed ? "passed" : "failed"}
      </p>
      <p className="tabular-nums">
        vᵀWv = {formatNumber(test.statistic, 4)}, accepted between {formatNumber(test.lower, 4)} and{" "}
        {formatNumber(test.upper, 4)} (χ², significance {test.significance})
      </p>
    </div>
  );
}

export function AdjustmentSummary({ view }: { view: AdjustmentView }) {
  return (
    <div className="flex flex-col gap-3">
      <p className="text-sm">
        Computed {formatUtc(view.computedAt)}{" "}
        <span className="text-muted">({formatLocalBeside(view.computedAt)})</span>
        {view.computedByName !== null && ` by ${view.computedByName}`}; σ per √km{" "}
        {view.options.sigmaPerSqrtKmMm} mm, {view.options.excluded.length} left out.
      </p>
      <dl className="grid grid-cols-2 gap-x-6 gap-y-1 tabular-nums sm:grid-cols-4">
        <dt className="text-muted">σ0 (a posteriori)</dt>
        <dd className="font-semibold">
          {view.sigma0 === null ? "—" : formatNumber(view.sigma0, 4)}
        </dd>
        <dt className="text-muted">Degrees of freedom</dt>
        <dd className="font-semibold">{view.dof}</dd>
      </dl>
      {view.globalTest !== null ? (
        <GlobalTest test={view.globalTest} />
      ) : (
        <Notice tone="attention" title="No redundancy">
          With 0 degrees of freedom the heights follow from the observations alone: no global test
          and no blunder check. Add an observation that closes a loop or joins a second benchmark.
        </Notice>
      )}
      {view.unconnected.length > 0 && (
        <Notice tone="attention" title="Marks not joined to a benchmark">
          Left out of the adjustment: {view.unconnected.join(", ")}.
        </Notice>
      )}
    </div>
  );
}
