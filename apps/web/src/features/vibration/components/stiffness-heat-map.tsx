import type { StiffnessMap, UnitSystem } from "@ringdown/contracts";
import { useId, useMemo, useState } from "react";
import { formatMeasure, formatMeasureNumber, fromDisplay, measures, toDisplay, unitOf } from "@/components/ui/units";
import { cn } from "@/lib/cn";
import { heatColour, heatScale, niceTicks } from "../lib/heat-scale";

type Direction = "x" | "y" | "z";

const WIDTH = 560;
const PAD = { left: 56, right: 24, top: 12, bottom: 40 };

/** Cell edges around grid positions: halfway between neighbours, the envelope's ends outside. */
function edges(positions: number[], extent: number): number[] {
  const out = [0];
  for (let i = 1; i < positions.length; i++) out.push((positions[i - 1]! + positions[i]!) / 2);
  out.push(extent);
  return out;
}

const methodLabels = {
  single: "one reading: the same value everywhere",
  linear: "readings along a line: interpolated along it",
  bilinear: "readings on a grid: interpolated between them",
  "inverse-distance": "scattered readings: weighted by distance",
} as const;

/**
 * The bed seen from above (X to the right, Y away from the operator, origin at the front-left
 * corner) coloured by the interpolated stiffness in one direction, with the reading positions,
 * the measured area and the softest place marked.
 */
export function StiffnessHeatMap({ map, system }: { map: StiffnessMap; system: UnitSystem }) {
  const withData = map.directions.filter((d) => d.stiffnessNPerMm !== null);
  const [chosen, setChosen] = useState<Direction>(() => (withData[0]?.direction ?? "x") as Direction);
  const [hover, setHover] = useState<{ i: number; j: number } | null>(null);
  const titleId = useId();
  const legendId = useId();
  const dir = map.directions.find((d) => d.direction === chosen);
  const grid = dir?.stiffnessNPerMm ?? null;

  const ex = map.envelope.xMm;
  const ey = map.envelope.yMm;
  const plotW = WIDTH - PAD.left - PAD.right;
  const plotH = Math.max(120, Math.min(420, (plotW * ey) / ex));
  const height = plotH + PAD.top + PAD.bottom;
  const sx = (x: number) => PAD.left + (x / ex) * plotW;
  const sy = (y: number) => PAD.top + plotH - (y / ey) * plotH;

  const xEdges = useMemo(() => edges(map.xMm, ex), [map.xMm, ex]);
  const yEdges = useMemo(() => edges(map.yMm, ey), [map.yMm, ey]);
  const scale = dir && dir.minNPerMm !== null && dir.maxNPerMm !== null ? heatScale(dir.minNPerMm, dir.maxNPerMm, 5) : null;
  const readings = map.readings.filter((r) => r.direction === chosen);
  const stiffness = measures.stiffness;
  // Nice round positions in the person's unit, converted back to mm for placing.
  const lengthTicks = (extentMm: number) =>
    niceTicks(0, toDisplay(extentMm, measures.length, system), 6).map((v) => fromDisplay(v, measures.length, system));
  const fmtLen = (mm: number) => formatMeasureNumber(mm, measures.length, system);
  const lengthUnit = unitOf(measures.length, system);

  const hovered = grid && hover ? { x: map.xMm[hover.i]!, y: map.yMm[hover.j]!, k: grid[hover.j]![hover.i]! } : null;
  const summary = dir
    ? grid && scale
      ? `Stiffness in ${chosen.toUpperCase()} across the bed, from ${formatMeasure(scale.min, stiffness, system)} to ${formatMeasure(scale.max, stiffness, system)}` +
        (dir.softestAt ? `; softest at X ${formatMeasure(dir.softestAt.xMm, measures.length, system)}, Y ${formatMeasure(dir.softestAt.yMm, measures.length, system)}` : "") +
        `. ${readings.length} reading${readings.length === 1 ? "" : "s"} in this direction.`
      : `No readings in ${chosen.toUpperCase()} yet.`
    : "";

  return (
    <figure className="flex flex-col gap-3" aria-labelledby={titleId}>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <figcaption id={titleId} className="text-sm font-medium text-ink">
          Stiffness map, push and deflection in {chosen.toUpperCase()}
        </figcaption>
        <div role="group" aria-label="Direction shown" className="inline-flex rounded-md border border-rule bg-paper p-0.5">
          {(["x", "y", "z"] as const).map((d) => {
            const has = map.directions.find((m) => m.direction === d)?.stiffnessNPerMm !== null;
            return (
              <button
                key={d}
                type="button"
                aria-pressed={chosen === d}
                onClick={() => setChosen(d)}
                className={cn(
                  "h-7 cursor-pointer rounded px-3 text-sm font-medium",
                  chosen === d ? "bg-surface text-ink shadow-sm" : "text-muted hover:text-ink",
                )}
              >
                {d.toUpperCase()}
                {!has && <span className="sr-only"> (no readings)</span>}
              </button>
            );
          })}
        </div>
      </div>

      <p className="min-h-5 text-sm text-muted tabular" aria-live="polite">
        {hovered
          ? `At X ${fmtLen(hovered.x)} ${lengthUnit}, Y ${fmtLen(hovered.y)} ${lengthUnit}: ${formatMeasure(hovered.k, stiffness, system)}`
          : dir?.method
            ? `${dir.pointCount} measured position${dir.pointCount === 1 ? "" : "s"}, ${methodLabels[dir.method]}. Outside the dashed area the edge value is held.`
            : "Point at the map to read the stiffness there."}
      </p>

      <svg
        viewBox={`0 0 ${WIDTH} ${height}`}
        className="w-full max-w-[560px] select-none"
        role="img"
        aria-label={summary}
        aria-describedby={legendId}
        onMouseLeave={() => setHover(null)}
      >
        <rect x={PAD.left} y={PAD.top} width={plotW} height={plotH} fill="#F6F4EE" stroke="#DAD6CC" />
        {grid && scale
          ? grid.map((row, j) =>
              row.map((k, i) => (
                <rect
                  key={`${i}-${j}`}
                  x={sx(xEdges[i]!)}
                  y={sy(yEdges[j + 1]!)}
                  width={sx(xEdges[i + 1]!) - sx(xEdges[i]!) + 0.5}
                  height={sy(yEdges[j]!) - sy(yEdges[j + 1]!) + 0.5}
                  fill={scale.colour(k)}
                  onMouseEnter={() => setHover({ i, j })}
                />
              )),
            )
          : (
            <text x={PAD.left + plotW / 2} y={PAD.top + plotH / 2} textAnchor="middle" className="fill-[#6B6F76] text-[13px]">
              No readings in {chosen.toUpperCase()}: add one to map this direction
            </text>
          )}
        {dir?.measuredArea && (
          <rect
            x={sx(dir.measuredArea.xMinMm)}
            y={sy(dir.measuredArea.yMaxMm)}
            width={Math.max(1, sx(dir.measuredArea.xMaxMm) - sx(dir.measuredArea.xMinMm))}
            height={Math.max(1, sy(dir.measuredArea.yMinMm) - sy(dir.measuredArea.yMaxMm))}
            fill="none"
            stroke="#22252A"
            strokeOpacity={0.55}
            strokeDasharray="4 3"
            pointerEvents="none"
          />
        )}
        {dir?.softestAt && (
          <g pointerEvents="none">
            <circle cx={sx(dir.softestAt.xMm)} cy={sy(dir.softestAt.yMm)} r={9} fill="none" stroke="#B83A2E" strokeWidth={2} />
            <text
              x={sx(dir.softestAt.xMm) + (sx(dir.softestAt.xMm) > PAD.left + plotW - 70 ? -13 : 13)}
              y={sy(dir.softestAt.yMm) + 4}
              textAnchor={sx(dir.softestAt.xMm) > PAD.left + plotW - 70 ? "end" : "start"}
              className="fill-[#B83A2E] text-[12px] font-medium"
              stroke="#FFFFFF"
              strokeWidth={3}
              paintOrder="stroke"
            >
              softest
            </text>
          </g>
        )}
        {readings.map((r) => (
          <circle key={r.id} cx={sx(r.xMm)} cy={sy(r.yMm)} r={4} fill="#22252A" stroke="#FFFFFF" strokeWidth={1.5}>
            <title>
              {`Reading of ${r.measuredAt.slice(0, 10)} at X ${fmtLen(r.xMm)}, Y ${fmtLen(r.yMm)} ${lengthUnit}: ${formatMeasure(r.stiffnessNPerMm, stiffness, system)}`}
            </title>
          </circle>
        ))}
        {/* axes */}
        {lengthTicks(ex).map((x) => (
          <g key={`x${x}`}>
            <line x1={sx(x)} x2={sx(x)} y1={PAD.top + plotH} y2={PAD.top + plotH + 4} stroke="#6B6F76" />
            <text x={sx(x)} y={PAD.top + plotH + 16} textAnchor="middle" className="fill-[#6B6F76] text-[11px] tabular">
              {fmtLen(x)}
            </text>
          </g>
        ))}
        {lengthTicks(ey).map((y) => (
          <g key={`y${y}`}>
            <line x1={PAD.left - 4} x2={PAD.left} y1={sy(y)} y2={sy(y)} stroke="#6B6F76" />
            <text x={PAD.left - 7} y={sy(y) + 4} textAnchor="end" className="fill-[#6B6F76] text-[11px] tabular">
              {fmtLen(y)}
            </text>
          </g>
        ))}
        <text x={PAD.left + plotW / 2} y={height - 6} textAnchor="middle" className="fill-[#22252A] text-[12px]">
          X position [{lengthUnit}]
        </text>
        <text transform={`translate(13 ${PAD.top + plotH / 2}) rotate(-90)`} textAnchor="middle" className="fill-[#22252A] text-[12px]">
          Y position [{lengthUnit}]
        </text>
      </svg>

      <div id={legendId} className="flex flex-col gap-1.5">
        {scale ? (
          <HeatLegend min={scale.min} max={scale.max} ticks={scale.ticks} system={system} />
        ) : null}
        <ul className="flex flex-wrap gap-x-5 gap-y-1 text-xs text-muted">
          <li className="inline-flex items-center gap-1.5">
            <svg width="12" height="12" aria-hidden>
              <circle cx="6" cy="6" r="4" fill="#22252A" stroke="#FFFFFF" strokeWidth="1.5" />
            </svg>
            Reading position
          </li>
          <li className="inline-flex items-center gap-1.5">
            <svg width="14" height="14" aria-hidden>
              <circle cx="7" cy="7" r="5.5" fill="none" stroke="#B83A2E" strokeWidth="2" />
            </svg>
            Softest place (sets the machine's value: worst case)
          </li>
          <li className="inline-flex items-center gap-1.5">
            <svg width="18" height="10" aria-hidden>
              <rect x="1" y="1" width="16" height="8" fill="none" stroke="#22252A" strokeOpacity="0.55" strokeDasharray="4 3" />
            </svg>
            Measured area
          </li>
        </ul>
      </div>
    </figure>
  );
}

/** The colour bar: light = softer, dark = stiffer, with the scale's ticks in the person's unit. */
export function HeatLegend({ min, max, ticks, system }: { min: number; max: number; ticks: number[]; system: UnitSystem }) {
  const stops = Array.from({ length: 11 }, (_, i) => i / 10);
  const span = max - min;
  const gradientId = useId();
  const unit = unitOf(measures.stiffness, system);
  return (
    <div className="max-w-[560px]">
      <p className="mb-1 text-xs text-muted">
        Static stiffness [{unit}]: lighter is softer, darker is stiffer
      </p>
      <svg viewBox="0 0 560 34" className="w-full" aria-hidden>
        <defs>
          <linearGradient id={gradientId} x1="0" x2="1" y1="0" y2="0">
            {stops.map((t) => (
              <stop key={t} offset={t} stopColor={heatColour(span === 0 ? 0.5 : t)} />
            ))}
          </linearGradient>
        </defs>
        <rect x="56" y="2" width="492" height="12" fill={`url(#${gradientId})`} stroke="#DAD6CC" />
        {[min, ...ticks.filter((t) => t > min + 0.08 * span && t < max - 0.08 * span), ...(max > min ? [max] : [])].map((t) => {
          const x = 56 + (span === 0 ? 0.5 : (t - min) / span) * 492;
          return (
            <g key={t}>
              <line x1={x} x2={x} y1="14" y2="18" stroke="#6B6F76" />
              <text x={x} y="30" textAnchor="middle" className="fill-[#6B6F76] text-[11px] tabular">
                {formatMeasureNumber(t, measures.stiffness, system)}
              </text>
            </g>
          );
        })}
      </svg>
    </div>
  );
}
