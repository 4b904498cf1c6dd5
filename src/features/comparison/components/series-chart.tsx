// The series, decimated by the server: per bin the min–max band and the mean, time in UTC.
import { useCallback, useMemo } from "react";
import type uPlot from "uplot";
import type { SeriesAnalysis } from "../../../../shared/schemas/comparison";
import { formatUtc } from "../../../lib/format";
import { formatScientific } from "../../../lib/format";
import { themeColour } from "../../../components/charts/use-uplot";
import { chartHeightPx, ChartFrame } from "./chart-frame";
import { exponentLabels, utcTimeLabels } from "../lib/axis-labels";

export function SeriesChart({ display }: { display: SeriesAnalysis["display"] }) {
  const data = useMemo<uPlot.AlignedData>(
    () => [display.t, display.max, display.min, display.mean],
    [display],
  );
  const options = useCallback((_U: typeof uPlot, widthPx: number): uPlot.Options => {
    const ink = themeColour("ink", "#1b1f24");
    const primary = themeColour("primary", "#0b6e4f");
    const band = themeColour("primary-soft", "rgba(11, 110, 79, 0.2)");
    return {
      width: widthPx,
      height: chartHeightPx,
      tzDate: (ts) => new Date(ts * 1000 + new Date(ts * 1000).getTimezoneOffset() * 60_000),
      axes: [
        { label: "time (UTC)", stroke: ink, values: (_u, v) => utcTimeLabels(v) },
        {
          label: "fractional",
          stroke: ink,
          size: 80,
          values: (_u, v) => exponentLabels(v),
        },
      ],
      series: [
        {},
        { label: "max", stroke: band, points: { show: false } },
        { label: "min", stroke: band, points: { show: false } },
        { label: "mean", stroke: primary, width: 1.5, points: { show: false } },
      ],
      bands: [{ series: [1, 2], fill: band }],
    };
  }, []);
  const step = Math.max(1, Math.floor(display.t.length / 50));
  const table = (
    <table className="w-full text-sm tabular-nums">
      <thead>
        <tr className="text-left">
          <th scope="col">time (UTC)</th>
          <th scope="col">mean</th>
          <th scope="col">min</th>
          <th scope="col">max</th>
        </tr>
      </thead>
      <tbody>
        {display.t
          .map((t, i) => ({ t, i }))
          .filter(({ i }) => i % step === 0)
          .map(({ t, i }) => (
            <tr key={t}>
              <td>{formatUtc(new Date(t * 1000).toISOString())}</td>
              <td>{formatScientific(display.mean[i] ?? Number.NaN)}</td>
              <td>{formatScientific(display.min[i] ?? Number.NaN)}</td>
              <td>{formatScientific(display.max[i] ?? Number.NaN)}</td>
            </tr>
          ))}
      </tbody>
    </table>
  );
  return (
    <ChartFrame
      title="Series"
      description={`Fractional frequency difference over time, ${display.t.length} bins, min–max band and mean.`}
      options={options}
      data={data}
      table={table}
      caption="Band: min to max per bin; line: the mean. Time axis in UTC."
      testId="series-chart"
    />
  );
}
