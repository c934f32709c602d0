import { lazy, Suspense, type ComponentProps } from "react";
import { LoadingState } from "@/components/ui/spinner";

/**
 * The charts load on first use: uPlot and the chart code stay out of the first page's bundle.
 */
const SpectrumChartLazy = lazy(() => import("./spectrum-chart"));
const LobeChartLazy = lazy(() => import("./lobe-chart"));

export function SpectrumChart(props: ComponentProps<typeof SpectrumChartLazy>) {
  return (
    <Suspense fallback={<LoadingState label="Loading the chart…" className="h-80" />}>
      <SpectrumChartLazy {...props} />
    </Suspense>
  );
}

export function LobeChart(props: ComponentProps<typeof LobeChartLazy>) {
  return (
    <Suspense fallback={<LoadingState label="Loading the chart…" className="h-80" />}>
      <LobeChartLazy {...props} />
    </Suspense>
  );
}
