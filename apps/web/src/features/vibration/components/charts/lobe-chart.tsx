import type { UnitSystem } from "@ringdown/contracts";
import { useMemo, useRef } from "react";
import type uPlot from "uplot";
import { formatMeasure, measures, toDisplay, unitOf } from "@/components/ui/units";
import { formatNumber } from "@/lib/format";
import type { LobeCurve } from "../../lib/stability";
import { axis, chart } from "./chart-theme";
import { useUplot } from "./use-uplot";

/** Logged outcomes as the chart groups them: ran clean, chattered, another problem, other. */
export type EvidenceTone = "clean" | "chatter" | "problem" | "other";

export interface LobeChartProps {
  curve: LobeCurve;
  safetyFactor: number;
  /** The recipe being looked at: its speed and depth [rpm, mm] */
  current: { rpm: number; depthMm: number; label: string } | null;
  /** Logged cuts on this machine and material [rpm, mm] */
  evidence: Array<{ rpm: number; depthMm: number; tone: EvidenceTone }>;
  system: UnitSystem;
  height?: number;
}

type Shape = "circle" | "cross" | "square" | "triangle" | "diamond";

const evidenceStyle: Record<EvidenceTone, { colour: string; shape: Shape }> = {
  clean: { colour: chart.ok, shape: "circle" },
  chatter: { colour: chart.limit, shape: "cross" },
  problem: { colour: chart.near, shape: "triangle" },
  other: { colour: chart.muted, shape: "square" },
};

/** Draws one evidence symbol or the recipe's marker at canvas pixels (x, y). */
function drawSymbol(ctx: CanvasRenderingContext2D, shape: Shape, x: number, y: number, r: number, colour: string) {
  ctx.beginPath();
  ctx.strokeStyle = colour;
  ctx.fillStyle = colour;
  switch (shape) {
    case "circle":
      ctx.arc(x, y, r, 0, 2 * Math.PI);
      ctx.globalAlpha = 0.85;
      ctx.fill();
      ctx.globalAlpha = 1;
      break;
    case "square":
      ctx.rect(x - r, y - r, 2 * r, 2 * r);
      ctx.stroke();
      break;
    case "triangle":
      ctx.moveTo(x, y - r * 1.15);
      ctx.lineTo(x + r, y + r * 0.85);
      ctx.lineTo(x - r, y + r * 0.85);
      ctx.closePath();
      ctx.stroke();
      break;
    case "cross":
      ctx.moveTo(x - r, y - r);
      ctx.lineTo(x + r, y + r);
      ctx.moveTo(x + r, y - r);
      ctx.lineTo(x - r, y + r);
      ctx.stroke();
      break;
    case "diamond":
      ctx.moveTo(x, y - r);
      ctx.lineTo(x + r, y);
      ctx.lineTo(x, y + r);
      ctx.lineTo(x - r, y);
      ctx.closePath();
      ctx.fill();
      ctx.strokeStyle = "#FFFFFF";
      ctx.stroke();
      break;
  }
}

/**
 * Stability-lobe chart: the predicted chatter boundary (limiting axial depth against spindle
 * speed), the depth the engine allows under it (its safety factor), the recipe as a distinct
 * marker and the shop's logged cuts as small symbols.
 */
export default function LobeChart({ curve, safetyFactor, current, evidence, system, height = 340 }: LobeChartProps) {
  const readout = useRef<HTMLParagraphElement>(null);
  const unit = unitOf(measures.length, system);
  const show = (mm: number) => toDisplay(mm, measures.length, system);

  const data = useMemo<uPlot.AlignedData>(() => {
    const boundary = curve.limitingDepthMm.map((d) => (d === null ? null : show(d)));
    const allowed = curve.limitingDepthMm.map((d) => (d === null ? null : show(d * safetyFactor)));
    return [curve.rpm, boundary, allowed];
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [curve, safetyFactor, system]);

  const options = useMemo<Omit<uPlot.Options, "width">>(() => {
    // Room above the highest boundary point, the recipe and the evidence.
    // The lobes' peaks reach far above their floor, where the choice of speed matters: the axis
    // stops at 3 × the lowest boundary (points above are drawn at the top edge) unless the recipe
    // or a logged cut needs more.
    const finite = curve.limitingDepthMm.filter((d): d is number => d !== null);
    const lowest = finite.length > 0 ? Math.min(...finite) : 0;
    const boundaryTop = finite.length > 0 ? Math.min(Math.max(...finite), 3 * lowest) : 0;
    const top = show(Math.max(boundaryTop, current?.depthMm ?? 0, ...evidence.map((e) => e.depthMm), 0.001) * 1.15);
    const drawMarks = (u: uPlot) => {
      const ctx = u.ctx;
      const dpr = devicePixelRatio;
      ctx.save();
      ctx.lineWidth = 1.5 * dpr;
      for (const e of evidence) {
        const s = evidenceStyle[e.tone];
        if (e.rpm < u.scales.x!.min! || e.rpm > u.scales.x!.max!) continue;
        drawSymbol(ctx, s.shape, u.valToPos(e.rpm, "x", true), u.valToPos(Math.min(show(e.depthMm), top), "y", true), 3.5 * dpr, s.colour);
      }
      if (current) {
        const x = u.valToPos(current.rpm, "x", true);
        const y = u.valToPos(Math.min(show(current.depthMm), top), "y", true);
        ctx.lineWidth = 2 * dpr;
        drawSymbol(ctx, "diamond", x, y, 7 * dpr, chart.brand);
      }
      ctx.restore();
    };
    return {
      height,
      legend: { show: false },
      cursor: { drag: { x: true, y: false }, points: { show: false } },
      scales: { x: { time: false }, y: { range: () => [0, top] } },
      axes: [
        axis("Spindle speed [rpm]", { values: (_u: uPlot, ticks: number[]) => ticks.map((t) => formatNumber(t, { fractionDigits: 0, system })) }),
        axis(`Axial depth [${unit}]`, { size: 56, values: (_u: uPlot, ticks: number[]) => ticks.map((t) => formatNumber(t, { significantDigits: 3, system })) }),
      ],
      series: [
        {},
        { label: "Chatter boundary", stroke: chart.brand, width: 1.5, points: { show: false }, spanGaps: false },
        {
          label: "Allowed depth",
          stroke: chart.ok,
          width: 1,
          dash: [5, 4],
          fill: "rgba(47, 125, 91, 0.09)",
          points: { show: false },
          spanGaps: false,
        },
      ],
      hooks: {
        draw: [drawMarks],
        setCursor: [
          (u: uPlot) => {
            const el = readout.current;
            if (!el) return;
            const i = u.cursor.idx;
            if (i === null || i === undefined) {
              el.textContent = "Point at the chart to read the boundary; drag to zoom, double-click to reset.";
              return;
            }
            const rpm = curve.rpm[i]!;
            const d = curve.limitingDepthMm[i];
            el.textContent =
              d === null || d === undefined
                ? `${formatNumber(rpm, { fractionDigits: 0 })} rpm: no chatter predicted in the analysed band`
                : `${formatNumber(rpm, { fractionDigits: 0 })} rpm: boundary ${formatMeasure(d, measures.length, system)}, allowed ${formatMeasure(d * safetyFactor, measures.length, system)} (feed along ${curve.feedAxis[i]?.toUpperCase() ?? "—"})`;
          },
        ],
      },
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [curve, safetyFactor, current, evidence, system, height, unit]);

  const { container } = useUplot(options, data, height);
  return (
    <div className="flex flex-col gap-1">
      <div ref={container} className="w-full" />
      <p ref={readout} className="min-h-5 text-xs text-muted tabular">
        Point at the chart to read the boundary; drag to zoom, double-click to reset.
      </p>
    </div>
  );
}
