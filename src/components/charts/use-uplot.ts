// One uPlot chart in a box: loaded on demand (uPlot stays out of the first download), sized to the
// box's width and redrawn when it changes, and destroyed with the component. uPlot draws on a
// canvas, so the theme's colours are read from the page's CSS variables.
import { useEffect, useRef, useState } from "react";
import type uPlot from "uplot";

export type ChartState = "loading" | "ready" | "failed";

export function themeColour(name: string, fallback: string): string {
  const value = getComputedStyle(document.documentElement).getPropertyValue(`--eq-${name}`).trim();
  return value === "" ? fallback : value;
}

/**
 * `options` and `data` should be stable (useCallback / useMemo): a new one redraws the chart.
 * The returned ref goes on the box the chart is drawn into.
 */
export function useUplot(
  options: (UPlot: typeof uPlot, widthPx: number) => uPlot.Options,
  data: uPlot.AlignedData,
  heightPx: number,
) {
  const box = useRef<HTMLDivElement>(null);
  const [state, setState] = useState<ChartState>("loading");

  useEffect(() => {
    const element = box.current;
    if (element === null) return;
    let plot: uPlot | null = null;
    let gone = false;
    const resize = new ResizeObserver(() =>
      plot?.setSize({ width: element.clientWidth, height: heightPx }),
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
  }, [options, data, heightPx]);

  return { box, state };
}
