// ADEV and MDEV on log-log axes with 68 % interval bars and the fitted white-FM line.
import { useCallback, useMemo } from "react";
import type uPlot from "uplot";
import type { SeriesAnalysisResult } from "../../../../shared/comparison";
import { formatScientific } from "../../../lib/format";
import { themeColour } from "../../../components/charts/use-uplot";
import { chartHeightPx, ChartFrame } from "./chart-frame";
import { decadeLabels } from "../lib/axis-labels";

type Stability = Pick<SeriesAnalysisResult, "adev" | "mdev" | "fit" | "noiseType">;

/** Vertical bars from low68 to high68 for one series, drawn after the series. */
function intervalBars(seriesIdx: number, low: number[], high: number[]) {
  return (u: uPlot) => {
    const ctx = u.ctx;
    const xs = u.data[0];
    ctx.save();
    ctx.strokeStyle = String(
      u.series[seriesIdx]?.stroke instanceof Function
        ? "#888"
        : (u.series[seriesIdx]?.stroke ?? "#888"),
    );
    ctx.lineWidth = 1.5;
    for (let i = 0; i < xs.length; i++) {
      const lo = low[i];
      const hi = high[i];
      const x = xs[i];
      if (lo === undefined || hi === undefined || x === undefined || !(lo > 0) || !(hi > 0))
        continue;
      const px = u.valToPos(x, "x", true);
      ctx.beginPath();
      ctx.moveTo(px, u.valToPos(lo, "y", true));
      ctx.lineTo(px, u.valToPos(hi, "y", true));
      ctx.stroke();
    }
    ctx.restore();
  };
}

export function StabilityChart({ analysis, testId }: { analysis: Stability; testId: string }) {
  const { adev, mdev, fit } = analysis;
  // One x axis for both: MDEV is computed at the same octave τ values as ADEV.
  const data = useMemo<uPlot.AlignedData>(() => {
    const taus = adev.map((p) => p.tau);
    const mdevAt = new Map(mdev.map((p) => [p.tau, p.deviation]));
    const fitLine = taus.map((t) => (fit === null ? null : fit.sigmaAt1s / Math.sqrt(t)));
    return [taus, adev.map((p) => p.deviation), taus.map((t) => mdevAt.get(t) ?? null), fitLine];
  }, [adev, mdev, fit]);
  const options = useCallback(
    (_U: typeof uPlot, widthPx: number): uPlot.Options => {
      const ink = themeColour("ink", "#1b1f24");
      const primary = themeColour("primary", "#0b6e4f");
      const accent = themeColour("attention", "#8a5a00");
      const mdevLow = adev.map((p) => mdev.find((m) => m.tau === p.tau)?.low68 ?? Number.NaN);
      const mdevHigh = adev.map((p) => mdev.find((m) => m.tau === p.tau)?.high68 ?? Number.NaN);
      return {
        width: widthPx,
        height: chartHeightPx,
        scales: { x: { time: false, distr: 3 }, y: { distr: 3 } },
        axes: [
          { label: "τ (s)", stroke: ink },
          {
            label: "deviation",
            stroke: ink,
            size: 80,
            values: (_u, v) => decadeLabels(v),
          },
        ],
        series: [
          {},
          { label: "ADEV", stroke: primary, width: 2, points: { show: true, size: 7 } },
          {
            label: "MDEV",
            stroke: accent,
            width: 2,
            dash: [6, 4],
            points: { show: true, size: 7 },
          },
          { label: "white-FM fit", stroke: ink, width: 1, dash: [2, 3], points: { show: false } },
        ],
        hooks: {
          draw: [
            intervalBars(
              1,
              adev.map((p) => p.low68),
              adev.map((p) => p.high68),
            ),
            intervalBars(2, mdevLow, mdevHigh),
          ],
        },
      };
    },
    [adev, mdev],
  );
  const table = (
    <table className="w-full text-sm tabular-nums">
      <thead>
        <tr className="text-left">
          <th scope="col">τ (s)</th>
          <th scope="col">ADEV</th>
          <th scope="col">68 % interval</th>
          <th scope="col">MDEV</th>
          <th scope="col">noise</th>
        </tr>
      </thead>
      <tbody>
        {adev.map((p) => {
          const m = mdev.find((q) => q.tau === p.tau);
          return (
            <tr key={p.tau}>
              <td>{p.tau}</td>
              <td>{formatScientific(p.deviation)}</td>
              <td>
                {formatScientific(p.low68)} – {formatScientific(p.high68)}
              </td>
              <td>{m === undefined ? "—" : formatScientific(m.deviation)}</td>
              <td>{p.noise}</td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
  const fitText =
    fit === null
      ? "No white-FM fit."
      : `White-FM level σ(1 s) = ${formatScientific(fit.sigmaAt1s)} ± ${formatScientific(fit.sigmaAt1sUncertainty)}, fitted from ${fit.fromTauS} s to ${fit.toTauS} s.`;
  return (
    <ChartFrame
      title="Stability (ADEV and MDEV)"
      description={`Allan and modified Allan deviation against averaging time, log-log, ${adev.length} points. Noise type: ${analysis.noiseType}. ${fitText}`}
      options={options}
      data={data}
      table={table}
      caption={
        <>
          Noise type: {analysis.noiseType}. {fitText} Bars: 68 % intervals.
        </>
      }
      testId={testId}
    />
  );
}
