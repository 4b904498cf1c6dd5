// The height result: ΔC and ΔH from the clocks, the budget, the levelled comparison, time to target.
import { Button } from "../../../components/button";
import { StatusShape } from "../../../components/status-shape";
import { downloadBlob } from "../../../lib/download";
import { resultCsv } from "../lib/result-export";
import { formatLocalBeside, formatScientific, formatUtc } from "../../../lib/format";
import type { HeightResultView } from "../../../../shared/schemas/comparison";
import { formatDuration, formatHeightWithSigma, formatMm } from "../lib/durations";
import { TimeToTargetChart } from "./time-to-target-chart";

function Fact({ term, children }: { term: string; children: React.ReactNode }) {
  return (
    <div className="flex flex-col">
      <dt className="text-sm text-muted">{term}</dt>
      <dd className="text-lg font-semibold tabular-nums">{children}</dd>
    </div>
  );
}

function TimeLeftFacts({ t }: { t: HeightResultView["timeToTarget"] }) {
  if (!t.reachable)
    return (
      <div data-testid="time-left" className="flex flex-col gap-1">
        <p className="flex items-center gap-2 text-lg font-semibold">
          <StatusShape shape="octagon" className="text-danger" /> Not reachable
        </p>
        {t.reason !== null && <p>{t.reason}</p>}
        {t.improve !== null && <p className="text-muted">To reach it: {t.improve}</p>}
      </div>
    );
  return (
    <dl data-testid="time-left" className="grid gap-3 sm:grid-cols-2">
      <Fact term="Averaging time left">{formatDuration(t.leftS ?? Number.NaN)}</Fact>
      <Fact term={`Wall-clock time left at ${Math.round(t.input.uptime * 100)} % uptime`}>
        {formatDuration(t.wallClockLeftS ?? Number.NaN)}
      </Fact>
      <Fact term="Expected date">
        {t.eta === null ? (
          "—"
        ) : (
          <span data-testid="expected-date">
            {formatUtc(t.eta)}{" "}
            <span className="text-sm font-normal text-muted">({formatLocalBeside(t.eta)})</span>
          </span>
        )}
      </Fact>
      <Fact term="Dominant term">{t.dominant}</Fact>
    </dl>
  );
}

export function HeightResultPanel({
  result,
  runName,
}: {
  result: HeightResultView;
  runName: string;
}) {
  const { clock, levelled, comparison, timeToTarget: t } = result;
  return (
    <div className="flex flex-col gap-4">
      <section
        aria-labelledby="clock-result"
        className="rounded-xl border-2 border-line bg-surface p-4"
      >
        <h3 id="clock-result" className="mb-2 text-lg font-semibold">
          From the clocks
        </h3>
        {clock === null ? (
          <p className="text-muted">No analysed data yet.</p>
        ) : (
          <dl className="grid gap-3 sm:grid-cols-3">
            <Fact term="Mean fractional offset">{formatScientific(clock.meanFractional)}</Fact>
            <Fact term="ΔC (geopotential number)">
              {clock.geopotentialDifference.toFixed(4).replace("-", "−")} m²/s²
            </Fact>
            <Fact term="ΔH">
              <span data-testid="height-difference">
                {formatHeightWithSigma(clock.heightDifferenceM, clock.sigmaM)}
              </span>
            </Fact>
          </dl>
        )}
      </section>
      <section
        aria-labelledby="budget-heading"
        className="rounded-xl border-2 border-line bg-surface p-4"
      >
        <div className="mb-2 flex flex-wrap items-center justify-between gap-2">
          <h3 id="budget-heading" className="text-lg font-semibold">
            Uncertainty budget
          </h3>
          <Button
            tone="quiet"
            onClick={() =>
              downloadBlob(
                "equipot-height-result.csv",
                new Blob([resultCsv(runName, result)], { type: "text/csv" }),
              )
            }
          >
            Download result (CSV)
          </Button>
        </div>
        <table className="w-full text-left tabular-nums">
          <thead>
            <tr>
              <th scope="col">Term</th>
              <th scope="col">Fractional</th>
              <th scope="col">Height</th>
            </tr>
          </thead>
          <tbody>
            {result.budget.map((row) => (
              <tr key={row.term} className="border-t border-line">
                <td>{row.term}</td>
                <td>{formatScientific(row.fractional)}</td>
                <td>{formatMm(row.heightM, 2)}</td>
              </tr>
            ))}
            <tr className="border-t-2 border-line font-semibold">
              <td>Combined</td>
              <td />
              <td>{formatMm(result.combinedHeightUncertaintyM, 2)}</td>
            </tr>
          </tbody>
        </table>
      </section>
      <section
        aria-labelledby="levelled-heading"
        className="rounded-xl border-2 border-line bg-surface p-4"
      >
        <h3 id="levelled-heading" className="mb-2 text-lg font-semibold">
          Against levelling
        </h3>
        {levelled === null ? (
          <p className="text-muted">{result.levelledMissing ?? "No levelled value."}</p>
        ) : (
          <dl className="grid gap-3 sm:grid-cols-3">
            <Fact term={`Levelled ΔH (mark ${levelled.mark})`}>
              {formatHeightWithSigma(levelled.heightDifferenceM, levelled.sigmaM)}
            </Fact>
            {comparison !== null && (
              <>
                <Fact term="Clock minus levelled">
                  {formatHeightWithSigma(comparison.differenceM, comparison.sigmaM)}
                </Fact>
                <Fact term={`z = ${comparison.z.toFixed(2)}`}>
                  <span className="flex items-center gap-2">
                    <StatusShape
                      shape={comparison.consistent ? "disc" : "triangle"}
                      className={comparison.consistent ? "text-primary" : "text-attention"}
                    />
                    {comparison.consistent ? "Consistent (95 %)" : "Not consistent (95 %)"}
                  </span>
                </Fact>
              </>
            )}
          </dl>
        )}
      </section>
      <section
        aria-labelledby="ttt-heading"
        className="flex flex-col gap-3 rounded-xl border-2 border-line bg-surface p-4"
      >
        <h3 id="ttt-heading" className="text-lg font-semibold">
          Time to target {formatMm(t.input.targetHeightUncertaintyM)}
        </h3>
        <TimeLeftFacts t={t} />
        <p className="text-sm text-muted">
          {t.instabilitySource === "data"
            ? "Instability from the data (white-FM level fitted to the series)."
            : "Instability from the instruments' stated figures (no fit from the data yet)."}{" "}
          Floor {formatMm(t.floorM, 2)}. Counted from the last sample, {formatUtc(t.input.now)}.
        </p>
        <TimeToTargetChart t={t} />
      </section>
    </div>
  );
}
