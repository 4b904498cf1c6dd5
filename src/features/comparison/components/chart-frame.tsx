// A uPlot chart with a title, a text alternative and a table of the same numbers behind a toggle.
import { useCallback, useState, type ReactNode } from "react";
import type uPlot from "uplot";
import { Button } from "../../../components/button";
import { Loading } from "../../../components/loading";
import { Notice } from "../../../components/notice";
import { useUplot } from "../../../components/charts/use-uplot";

export const chartHeightPx = 300;

interface ChartFrameProps {
  title: string;
  /** Said to screen readers in place of the picture. */
  description: string;
  options: (UPlot: typeof uPlot, widthPx: number) => uPlot.Options;
  data: uPlot.AlignedData;
  table: ReactNode;
  caption: ReactNode;
  testId: string;
}

/** Room on the right so the last x-axis label (e.g. "100,000") is not cut off at the edge. */
const rightPaddingPx = 32;

export function ChartFrame(props: ChartFrameProps) {
  const { title, description, options, data, table, caption, testId } = props;
  const padded = useCallback(
    (UPlot: typeof uPlot, widthPx: number): uPlot.Options => {
      const made = options(UPlot, widthPx);
      return { ...made, padding: made.padding ?? [12, rightPaddingPx, 0, 0] };
    },
    [options],
  );
  const { box, state } = useUplot(padded, data, chartHeightPx);
  const [showTable, setShowTable] = useState(false);

  return (
    <figure className="flex min-w-0 flex-col gap-2 rounded-xl border-2 border-line bg-surface p-3">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 className="text-lg font-semibold">{title}</h3>
        <Button tone="quiet" aria-pressed={showTable} onClick={() => setShowTable((v) => !v)}>
          {showTable ? "Hide table" : "Show as table"}
        </Button>
      </div>
      {state === "loading" && <Loading label="Drawing the chart…" />}
      {state === "failed" && (
        <Notice tone="attention" title="Chart not available">
          The chart could not be loaded on this device; the table holds the same numbers.
        </Notice>
      )}
      <div ref={box} role="img" aria-label={description} className="w-full" data-testid={testId} />
      <figcaption className="text-sm text-muted">{caption}</figcaption>
      {showTable && <div className="max-h-80 overflow-auto">{table}</div>}
    </figure>
  );
}
