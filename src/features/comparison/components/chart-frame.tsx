// A uPlot chart loaded on demand, with a text alternative and a table of the same numbers behind a
// toggle. uPlot draws on a canvas, so the theme's colours are read from the page's CSS variables.
import { useEffect, useRef, useState, type ReactNode } from "react";
import type uPlot from "uplot";
import { Button } from "../../../components/button";
import { Loading } from "../../../components/loading";
import { Notice } from "../../../components/notice";

export const chartHeightPx = 300;

export function themeColour(name: string, fallback: string): string {
  const value = getComputedStyle(document.documentElement).getPropertyValue(`--eq-${name}`).trim();
  return value === "" ? fallback : value;
}

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

export function ChartFrame(props: ChartFrameProps) {
  const { title, description, options, data, table, caption, testId } = props;
  const box = useRef<HTMLDivElement>(null);
  const [state, setState] = useState<"loading" | "ready" | "failed">("loading");
  const [showTable, setShowTable] = useState(false);

  useEffect(() => {
    const element = box.current;
    if (element === null) return;
    let plot: uPlot | null = null;
    let gone = false;
    const resize = new ResizeObserver(() =>
      plot?.setSize({ width: element.clientWidth, height: chartHeightPx }),
    );
    import("./uplot-loader")
      .then(({ default: UPlot }) => {
        if (gone) return;
        plot = new UPlot(options(UPlot, element.clientWidth || 640), data, element);
        resize.observe(element);
        setState("ready");
      })
      .catch(() => {
        if (!gone) setState("failed");
      });
    return () => {
      gone = true;
      resize.disconnect();
      plot?.destroy();
    };
  }, [options, data]);

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
