import { useEffect, useRef } from "react";
import uPlot from "uplot";
import "uplot/dist/uPlot.min.css";

/**
 * Mounts a uPlot chart in `container`, sized to its width, rebuilt when `options`/`data` change
 * (callers memoise both), resized with the container, destroyed on unmount.
 */
export function useUplot(options: Omit<uPlot.Options, "width"> | null, data: uPlot.AlignedData | null, height: number) {
  const container = useRef<HTMLDivElement>(null);
  const plot = useRef<uPlot | null>(null);

  useEffect(() => {
    const el = container.current;
    if (!el || !options || !data) return;
    const width = Math.max(280, el.clientWidth);
    const u = new uPlot({ ...options, width, height } as uPlot.Options, data, el);
    plot.current = u;
    const observer = new ResizeObserver(() => {
      const w = Math.max(280, el.clientWidth);
      if (Math.abs(w - u.width) > 1) u.setSize({ width: w, height });
    });
    observer.observe(el);
    return () => {
      observer.disconnect();
      u.destroy();
      plot.current = null;
    };
  }, [options, data, height]);

  return { container, plot };
}
