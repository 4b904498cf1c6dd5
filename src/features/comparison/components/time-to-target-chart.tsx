// σ_H against averaging time from the budget's inputs, with the target, now and the needed time.
import { useCallback, useMemo } from "react";
import type uPlot from "uplot";
import { heightUncertaintyAt } from "../../../../shared/science";
import type { HeightResultView } from "../../../../shared/schemas/comparison";
import { formatDuration, formatMm } from "../lib/durations";
import { tauGrid } from "../lib/tau-grid";
import { themeColour } from "../../../components/charts/use-uplot";
import { chartHeightPx, ChartFrame } from "./chart-frame";
import { decadeMmLabels } from "../lib/axis-labels";

type TimeToTarget = HeightResultView["timeToTarget"];

function marker(u: uPlot, x: number, y: number, colour: string, label: string) {
  if (!(x > 0) || !(y > 0)) return;
  const ctx = u.ctx;
  const px = u.valToPos(x, "x", true);
  const py = u.valToPos(y, "y", true);
  ctx.save();
  ctx.fillStyle = colour;
  ctx.beginPath();
  ctx.arc(px, py, 7 * devicePixelRatio, 0, 2 * Math.PI);
  ctx.fill();
  ctx.font = `${13 * devicePixelRatio}px sans-serif`;
  ctx.fillText(label, px + 10 * devicePixelRatio, py - 8 * devicePixelRatio);
  ctx.restore();
}

export function TimeToTargetChart({ t }: { t: TimeToTarget }) {
  const { input } = t;
  const { taus, sigmas, data } = useMemo(() => {
    const grid = tauGrid({ neededS: t.neededS, accumulatedS: input.accumulatedS });
    const science = { ...input, now: new Date(input.now) };
    const sigma = grid.map((tau) => heightUncertaintyAt(science, tau));
    const aligned: uPlot.AlignedData = [
      grid,
      sigma,
      grid.map(() => input.targetHeightUncertaintyM),
    ];
    return { taus: grid, sigmas: sigma, data: aligned };
  }, [input, t.neededS]);
  const options = useCallback(
    (_U: typeof uPlot, widthPx: number): uPlot.Options => {
      const ink = themeColour("ink", "#1b1f24");
      const primary = themeColour("primary", "#0b6e4f");
      const danger = themeColour("danger", "#a4161a");
      return {
        width: widthPx,
        height: chartHeightPx,
        scales: { x: { time: false, distr: 3 }, y: { distr: 3 } },
        axes: [
          { label: "averaging time (s)", stroke: ink },
          {
            label: "σ_H (mm)",
            stroke: ink,
            size: 70,
            values: (_u, v) => decadeMmLabels(v),
          },
        ],
        series: [
          {},
          { label: "σ_H", stroke: primary, width: 2, points: { show: false } },
          { label: "target", stroke: danger, width: 2, dash: [8, 4], points: { show: false } },
        ],
        hooks: {
          draw: [
            (u) => {
              if (t.nowM !== null && input.accumulatedS > 0)
                marker(u, input.accumulatedS, t.nowM, ink, "now");
              if (t.neededS !== null && t.neededS > 0)
                marker(u, t.neededS, input.targetHeightUncertaintyM, danger, "needed");
            },
          ],
        },
      };
    },
    [input, t.nowM, t.neededS],
  );
  const table = (
    <table className="w-full text-sm tabular-nums">
      <thead>
        <tr className="text-left">
          <th scope="col">averaging time</th>
          <th scope="col">σ_H</th>
        </tr>
      </thead>
      <tbody>
        {taus
          .filter((_, i) => i % 10 === 0)
          .map((tau, i) => (
            <tr key={tau}>
              <td>{formatDuration(tau)}</td>
              <td>{formatMm(sigmas[i * 10] ?? Number.NaN, 2)}</td>
            </tr>
          ))}
      </tbody>
    </table>
  );
  return (
    <ChartFrame
      title="Time to target"
      description={`Height uncertainty against averaging time, log-log; target ${formatMm(input.targetHeightUncertaintyM)}; ${t.neededS === null ? "the target is not reachable" : `needed ${formatDuration(t.neededS)}`}; now ${formatDuration(input.accumulatedS)} accumulated.`}
      options={options}
      data={data}
      table={table}
      caption={
        <>
          Dashed line: the target {formatMm(input.targetHeightUncertaintyM)}. Dots: now and the
          needed time.
        </>
      }
      testId="time-to-target-chart"
    />
  );
}
