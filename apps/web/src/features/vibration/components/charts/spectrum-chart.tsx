import type { RecordingPeakResult, SpectrumSeries } from "@ringdown/contracts";
import { useMemo, useRef } from "react";
import type uPlot from "uplot";
import { formatNumber } from "@/lib/format";
import { axis, chart } from "./chart-theme";
import { useUplot } from "./use-uplot";

export interface SpectrumChartProps {
  spectrum: SpectrumSeries;
  peaks: RecordingPeakResult[];
  /** Faint vertical guides [Hz] */
  spindleHarmonicsHz?: number[];
  toothPassingHarmonicsHz?: number[];
  /** Extra marked frequencies, e.g. a fitted mode or a ring-down frequency [Hz] */
  marks?: Array<{ frequencyHz: number; label: string }>;
  /** Axis label of the magnitude, with its unit */
  magnitudeLabel: string;
  /** Unit of the magnitude for the pointer read-out; without one it is read as relative. */
  magnitudeUnit?: string;
  height?: number;
}

const peakColours: Record<RecordingPeakResult["kind"], string> = {
  "chatter-candidate": chart.limit,
  "tooth-passing": chart.ink,
  spindle: chart.muted,
  unclassified: chart.ink,
};

/**
 * A spectrum on a log magnitude scale (uPlot, canvas): the measured amplitude as one line, the
 * spindle and tooth-passing harmonics as faint vertical guides, detected peaks as markers
 * (chatter candidates in the limit colour). Drag to zoom, double-click to reset.
 */
export default function SpectrumChart({ spectrum, peaks, spindleHarmonicsHz = [], toothPassingHarmonicsHz = [], marks = [], magnitudeLabel, magnitudeUnit, height = 320 }: SpectrumChartProps) {
  const readout = useRef<HTMLParagraphElement>(null);

  const data = useMemo<uPlot.AlignedData>(() => {
    // A log scale cannot show zero: clamp to a floor below the smallest positive value.
    let minPositive = Number.POSITIVE_INFINITY;
    for (const m of spectrum.magnitude) if (m > 0 && m < minPositive) minPositive = m;
    const floor = Number.isFinite(minPositive) ? minPositive : 1e-12;
    return [Float64Array.from(spectrum.frequencyHz), Float64Array.from(spectrum.magnitude, (m) => (m > 0 ? m : floor))] as unknown as uPlot.AlignedData;
  }, [spectrum]);

  const options = useMemo<Omit<uPlot.Options, "width">>(() => {
    const drawGuides = (u: uPlot) => {
      const ctx = u.ctx;
      const { top, height: h } = u.bbox;
      const [xMin, xMax] = [u.scales.x!.min!, u.scales.x!.max!];
      const line = (hz: number, colour: string, dash: number[]) => {
        if (hz < xMin || hz > xMax) return;
        const x = Math.round(u.valToPos(hz, "x", true)) + 0.5;
        ctx.strokeStyle = colour;
        ctx.setLineDash(dash);
        ctx.beginPath();
        ctx.moveTo(x, top);
        ctx.lineTo(x, top + h);
        ctx.stroke();
      };
      ctx.save();
      ctx.lineWidth = devicePixelRatio;
      for (const hz of spindleHarmonicsHz) line(hz, "rgba(107, 111, 118, 0.28)", [2 * devicePixelRatio, 4 * devicePixelRatio]);
      for (const hz of toothPassingHarmonicsHz) line(hz, "rgba(51, 64, 122, 0.35)", []);
      for (const m of marks) line(m.frequencyHz, "rgba(31, 111, 139, 0.7)", [6 * devicePixelRatio, 3 * devicePixelRatio]);
      ctx.restore();
    };
    const drawPeaks = (u: uPlot) => {
      const ctx = u.ctx;
      const dpr = devicePixelRatio;
      ctx.save();
      for (const p of peaks) {
        if (p.frequencyHz < u.scales.x!.min! || p.frequencyHz > u.scales.x!.max! || !(p.magnitude > 0)) continue;
        const x = u.valToPos(p.frequencyHz, "x", true);
        const y = u.valToPos(p.magnitude, "y", true) - 7 * dpr;
        ctx.fillStyle = peakColours[p.kind];
        ctx.strokeStyle = "#FFFFFF";
        ctx.lineWidth = 1.5 * dpr;
        ctx.beginPath();
        if (p.kind === "chatter-candidate") {
          ctx.arc(x, y, 4.5 * dpr, 0, 2 * Math.PI);
        } else {
          // Downward triangle over the peak.
          ctx.moveTo(x - 4.5 * dpr, y - 4 * dpr);
          ctx.lineTo(x + 4.5 * dpr, y - 4 * dpr);
          ctx.lineTo(x, y + 3.5 * dpr);
          ctx.closePath();
        }
        ctx.stroke();
        ctx.fill();
      }
      ctx.restore();
    };
    return {
      height,
      legend: { show: false },
      cursor: { drag: { x: true, y: false }, points: { size: 6, fill: chart.measured } },
      scales: { x: { time: false }, y: { distr: 3 } },
      axes: [
        axis("Frequency [Hz]", { values: (_u: uPlot, ticks: number[]) => ticks.map((t) => formatNumber(t, { significantDigits: 6 })) }),
        axis(magnitudeLabel, {
          size: 64,
          // Decades only (or 1-2-5 steps over a narrow range): a light grid on a log scale.
          filter: (u: uPlot, splits: number[]) => {
            const { min, max } = u.scales.y!;
            const wide = Math.log10((max ?? 10) / (min ?? 1)) >= 2;
            return splits.map((v) => {
              const mantissa = Math.round((v / 10 ** Math.floor(Math.log10(v) + 1e-9)) * 1000) / 1000;
              return mantissa === 1 || (!wide && (mantissa === 2 || mantissa === 5)) ? v : null;
            });
          },
          values: (_u: uPlot, ticks: Array<number | null>) => ticks.map((t) => (t === null ? "" : formatNumber(t, { significantDigits: 2 }))),
        }),
      ],
      series: [{}, { label: "Amplitude", stroke: chart.measured, width: 1.25, points: { show: false } }],
      hooks: {
        // Open on the part of the spectrum with something in it; double-click shows it all.
        ready: [
          (u: uPlot) => {
            const last = (u.data[0] as unknown as Float64Array)[u.data[0].length - 1] ?? 0;
            const interesting = Math.max(0, ...peaks.map((p) => p.frequencyHz), ...marks.map((m) => m.frequencyHz));
            const max = interesting > 0 ? Math.max(1000, Math.ceil((interesting * 2.5) / 500) * 500) : last;
            if (max < last) u.setScale("x", { min: 0, max });
          },
        ],
        drawAxes: [drawGuides],
        draw: [drawPeaks],
        setCursor: [
          (u: uPlot) => {
            const el = readout.current;
            if (!el) return;
            const i = u.cursor.idx;
            if (i === null || i === undefined) {
              el.textContent = "Point at the spectrum to read it; drag to zoom, double-click to show it all.";
              return;
            }
            const f = (u.data[0] as unknown as Float64Array)[i]!;
            const m = (u.data[1] as unknown as Float64Array)[i]!;
            el.textContent = `${formatNumber(f, { significantDigits: 5 })} Hz: ${formatNumber(m, { significantDigits: 3 })}${magnitudeUnit ? ` ${magnitudeUnit}` : " (relative)"}`;
          },
        ],
      },
    };
  }, [peaks, spindleHarmonicsHz, toothPassingHarmonicsHz, marks, magnitudeLabel, magnitudeUnit, height]);

  const { container } = useUplot(options, data, height);
  return (
    <div className="flex flex-col gap-1">
      <div ref={container} className="w-full" />
      <p ref={readout} className="min-h-5 text-xs text-muted tabular">
        Point at the spectrum to read it; drag to zoom, double-click to show it all.
      </p>
    </div>
  );
}
