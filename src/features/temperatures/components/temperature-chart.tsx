// The crate's temperatures over time (UTC axis), the allowed band shaded between its two limits and
// readings outside it marked with dots.
import { useCallback, useMemo } from "react";
import type uPlot from "uplot";
import type { TemperatureBand } from "../../../../shared/science/transport/temperature";
import { themeColour as colour, useUplot } from "../../../components/charts/use-uplot";
import { Notice } from "../../../components/notice";
import { Loading } from "../../../components/loading";
import { toChartColumns, type MergedSample } from "../series";

const heightPx = 320;

const pad = (v: number) => String(v).padStart(2, "0");
function utcLabel(seconds: number): string {
  const d = new Date(seconds * 1000);
  return `${d.getUTCFullYear()}-${pad(d.getUTCMonth() + 1)}-${pad(d.getUTCDate())} ${pad(d.getUTCHours())}:${pad(d.getUTCMinutes())} UTC`;
}
/** Dates over a span of days, else month-day and time; always UTC, never the US order. */
function timeLabels(splits: number[]): string[] {
  const spanS = (splits.at(-1) ?? 0) - (splits[0] ?? 0);
  return splits.map((s) => {
    const iso = new Date(s * 1000).toISOString();
    return spanS > 3 * 86_400 ? iso.slice(0, 10) : `${iso.slice(5, 10)} ${iso.slice(11, 16)}`;
  });
}
const celsius = (v: number | null | undefined) => (v == null ? "—" : `${v.toFixed(1)} °C`);

function options(UPlot: typeof uPlot, widthPx: number, band: TemperatureBand): uPlot.Options {
  const ink = colour("ink", "#0F3B3A");
  const line = colour("line", "#857A66");
  const primary = colour("primary", "#12524E");
  const danger = colour("danger", "#B0271C");
  const attention = colour("attention", "#A86300");
  const soft = colour("primary-soft", "#D6E6E1");
  const limit = (label: string): uPlot.Series => ({
    label,
    stroke: attention,
    width: 2,
    dash: [8, 5],
    points: { show: false },
    value: (_u, v) => celsius(v),
  });
  return {
    width: widthPx,
    height: heightPx,
    tzDate: (ts) => UPlot.tzDate(new Date(ts * 1000), "Etc/UTC"),
    scales: { x: { time: true } },
    // Room on the right for the last time label, which is centred on its tick.
    padding: [12, 40, 0, 0],
    cursor: { points: { size: 10 } },
    legend: { live: true },
    axes: [
      {
        stroke: ink,
        grid: { stroke: line, width: 0.5 },
        ticks: { stroke: line },
        label: "UTC",
        space: 90,
        values: (_u, splits) => timeLabels(splits),
      },
      {
        stroke: ink,
        grid: { stroke: line, width: 0.5 },
        ticks: { stroke: line },
        label: "°C",
        values: (_u, splits) => splits.map((v) => v.toFixed(Number.isInteger(v) ? 0 : 1)),
      },
    ],
    series: [
      { label: "Time", value: (_u, v) => (v == null ? "—" : utcLabel(v)) },
      // The band first, so its shading lies under the temperature line.
      limit(`Lowest allowed (${band.minC} °C)`),
      limit(`Highest allowed (${band.maxC} °C)`),
      {
        label: "Temperature",
        stroke: primary,
        width: 2,
        points: { show: false },
        value: (_u, v) => celsius(v),
      },
      {
        label: "Outside the band",
        stroke: danger,
        width: 0,
        paths: () => null,
        points: { show: true, size: 9, width: 2, stroke: danger, fill: danger, space: 0 },
        value: (_u, v) => celsius(v),
      },
    ],
    bands: [{ series: [2, 1], fill: soft }],
  };
}

interface TemperatureChartProps {
  samples: readonly MergedSample[];
  band: TemperatureBand;
  /** Intervals longer than this are drawn as breaks (the statistics' gap threshold). */
  maxGapS?: number;
  /** Said to screen readers in place of the picture. */
  description: string;
}

export function TemperatureChart({
  samples,
  band,
  maxGapS = Infinity,
  description,
}: TemperatureChartProps) {
  const { minC, maxC } = band;
  const makeOptions = useCallback(
    (UPlot: typeof uPlot, widthPx: number) => options(UPlot, widthPx, { minC, maxC }),
    [minC, maxC],
  );
  const data = useMemo(
    () => toChartColumns(samples, { minC, maxC }, maxGapS),
    [samples, minC, maxC, maxGapS],
  );
  const { box, state } = useUplot(makeOptions, data, heightPx);

  return (
    <figure className="flex flex-col gap-2 self-start rounded-xl border-2 border-line bg-surface p-3">
      {state === "loading" && <Loading label="Drawing the chart…" />}
      {state === "failed" && (
        <Notice tone="attention" title="Chart not available">
          The chart could not be loaded on this device; the statistics beside it still hold.
        </Notice>
      )}
      <div
        ref={box}
        role="img"
        aria-label={description}
        className="w-full"
        data-testid="temperature-chart"
      />
      <figcaption className="text-sm text-muted">
        Times in UTC. The shaded band between the dashed lines is the crate's allowed range; dots
        mark readings outside it.
      </figcaption>
    </figure>
  );
}
