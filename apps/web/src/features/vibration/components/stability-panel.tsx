import type { CutLog, CutOutcome, Machine, UnitSystem } from "@ringdown/contracts";
import type { Recommendation } from "@ringdown/machining";
import { Activity, CheckCircle2, TriangleAlert } from "lucide-react";
import { useDeferredValue, useMemo } from "react";
import { Button } from "@/components/ui/button";
import { formatMeasure, measures } from "@/components/ui/units";
import { formatNumber, formatQuantity } from "@/lib/format";
import { depthAt, isStableAt, lobeEnvelope, nearestSafeSpeed, stablePockets, toothPassingHits, type ResonanceHit } from "../lib/stability";
import { chart } from "./charts/chart-theme";
import { LobeChart } from "./charts/lazy";
import type { EvidenceTone } from "./charts/lobe-chart";

const AXIAL_OPERATIONS = new Set(["drill", "plunge"]);

const outcomeTone: Record<CutOutcome, EvidenceTone> = {
  clean: "clean",
  chatter: "chatter",
  burn_melt: "problem",
  poor_finish: "problem",
  cutter_broke: "problem",
  feed_override: "other",
  other: "other",
};

const ordinal = (k: number) => (k === 1 ? "tooth-passing frequency" : `${k === 2 ? "2nd" : k === 3 ? "3rd" : `${k}th`} harmonic of tooth passing`);

/** A harmonic hit in words. */
export function describeHit(hit: ResonanceHit): string {
  const what = `The ${ordinal(hit.harmonic)} (${formatQuantity(hit.frequencyHz, "Hz", { significantDigits: 4 })})`;
  if (hit.kind === "mode") {
    return `${what} is ${formatNumber(hit.offsetPct ?? 0, { significantDigits: 2 })} % from the ${formatQuantity(hit.targetHz, "Hz", { significantDigits: 4 })} ${hit.direction?.toUpperCase() ?? ""} mode${hit.label ? ` (${hit.label})` : ""}: it can drive the machine to ring there.`;
  }
  return `${what} falls in the avoided band ${formatNumber(hit.targetHz, { significantDigits: 4 })}–${formatQuantity(hit.bandMaxHz ?? hit.targetHz, "Hz", { significantDigits: 4 })}${hit.label ? ` (${hit.label})` : ""}.`;
}

function Legend({ tones }: { tones: ReadonlySet<EvidenceTone> }) {
  const item = (svg: React.ReactNode, label: string) => (
    <li className="inline-flex items-center gap-1.5">
      <svg width="18" height="14" aria-hidden>
        {svg}
      </svg>
      {label}
    </li>
  );
  return (
    <ul className="flex flex-wrap gap-x-5 gap-y-1 text-xs text-muted" aria-label="Legend">
      {item(<line x1="0" x2="18" y1="7" y2="7" stroke={chart.brand} strokeWidth="1.5" />, "Chatter boundary (predicted)")}
      {item(
        <>
          <rect x="0" y="7" width="18" height="7" fill="rgba(47, 125, 91, 0.15)" />
          <line x1="0" x2="18" y1="7" y2="7" stroke={chart.ok} strokeDasharray="4 3" />
        </>,
        "Allowed depth (stable with margin)",
      )}
      {item(<path d="M9 1 L16 7 L9 13 L2 7 Z" fill={chart.brand} stroke="#FFFFFF" />, "This recipe")}
      {tones.has("clean") && item(<circle cx="9" cy="7" r="3.5" fill={chart.ok} />, "Logged cut: ran clean")}
      {tones.has("chatter") && item(<path d="M5.5 3.5 L12.5 10.5 M12.5 3.5 L5.5 10.5" stroke={chart.limit} strokeWidth="1.5" />, "Logged cut: chatter")}
      {tones.has("problem") && item(<path d="M9 3 L13 10.5 L5 10.5 Z" fill="none" stroke={chart.near} strokeWidth="1.5" />, "Logged cut: burn, poor finish or breakage")}
      {tones.has("other") && item(<rect x="5.5" y="3.5" width="7" height="7" fill="none" stroke={chart.muted} strokeWidth="1.5" />, "Logged cut: other")}
    </ul>
  );
}

/**
 * Resonance and stability of one recipe on one machine: tooth-passing harmonics that meet a mode
 * or an avoided band, the stability-lobe chart with the recipe and the shop's logged cuts, the
 * nearest stable pockets, and the nearest speed that is clear of both (offered when it helps).
 */
export function StabilityPanel({
  machine,
  flutes,
  rec,
  cutLogs = [],
  system,
  onUseRpm,
  millingDirection: direction = "climb",
  headingLevel = 2,
}: {
  machine: Pick<Machine, "name" | "modes" | "spindle" | "avoidBands" | "modeMarginPct">;
  flutes: number;
  rec: Recommendation;
  cutLogs?: CutLog[];
  system: UnitSystem;
  /** Offered as "Use this speed" (e.g. the planner's speed override) */
  onUseRpm?: (rpm: number) => void;
  millingDirection?: "climb" | "conventional";
  headingLevel?: 2 | 3;
}) {
  const H = headingLevel === 2 ? "h2" : "h3";
  const deferred = useDeferredValue(rec);
  const axial = AXIAL_OPERATIONS.has(deferred.operation);
  const xyModes = machine.modes.filter((m) => m.direction !== "z");
  const immersion = Number(deferred.radialImmersion.toPrecision(4));
  const kt = Number(deferred.specificCuttingForceNPerMm2.toPrecision(4));
  const safetyFactor = deferred.stability.safetyFactor;

  const curve = useMemo(() => {
    if (axial || xyModes.length === 0 || !(immersion > 0) || !(kt > 0)) return null;
    try {
      return lobeEnvelope({
        modes: xyModes,
        flutes,
        radialImmersion: Math.min(1, immersion),
        specificForceNPerMm2: kt,
        minRpm: machine.spindle.minRpm,
        maxRpm: machine.spindle.maxRpm,
        millingDirection: direction,
      });
    } catch {
      return null;
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [axial, JSON.stringify(xyModes), flutes, immersion, kt, machine.spindle.minRpm, machine.spindle.maxRpm, direction]);

  const depth = deferred.axialDepthMm;
  const hits = useMemo(
    () => toothPassingHits({ rpm: deferred.rpm, flutes, modes: machine.modes, bands: machine.avoidBands, marginPct: machine.modeMarginPct, harmonics: 3 }),
    [deferred.rpm, flutes, machine.modes, machine.avoidBands, machine.modeMarginPct],
  );
  const stableHere = curve ? isStableAt(curve, deferred.rpm, depth, safetyFactor) : null;
  const pockets = useMemo(() => (curve ? stablePockets(curve, depth, safetyFactor, deferred.rpm).slice(0, 4) : []), [curve, depth, safetyFactor, deferred.rpm]);
  const offer = useMemo(() => {
    if (hits.length === 0 && stableHere !== false) return null;
    return nearestSafeSpeed({
      currentRpm: deferred.rpm,
      curve,
      depthMm: depth,
      safetyFactor,
      flutes,
      modes: machine.modes,
      bands: machine.avoidBands,
      marginPct: machine.modeMarginPct,
      dialSettings: machine.spindle.dialSettings,
      minRpm: machine.spindle.minRpm,
      maxRpm: machine.spindle.maxRpm,
    });
  }, [hits.length, stableHere, deferred.rpm, curve, depth, safetyFactor, flutes, machine]);

  const evidence = useMemo(
    () => cutLogs.map((l) => ({ rpm: l.actualRpm, depthMm: l.axialDepthMm, tone: outcomeTone[l.outcome] })),
    [cutLogs],
  );
  const current = useMemo(() => ({ rpm: deferred.rpm, depthMm: depth, label: "This recipe" }), [deferred.rpm, depth]);
  const limitHere = curve ? depthAt(curve, deferred.rpm) : undefined;

  return (
    <section aria-labelledby="stability-title" className="flex flex-col gap-4">
      <div>
        <H id="stability-title" className="flex items-center gap-2 text-base font-semibold text-ink">
          <Activity className="size-4 text-muted" aria-hidden /> Resonance and chatter on {machine.name}
        </H>
        <p className="mt-0.5 text-xs text-muted">
          From the machine's measured modes and the material's cutting force. Zero-order stability model: process damping is left out, so low-speed limits are
          conservative.
        </p>
      </div>

      {hits.length > 0 && (
        <ul aria-label="Resonance warnings" className="flex flex-col gap-2">
          {hits.map((h) => (
            <li key={`${h.harmonic}-${h.kind}-${h.targetHz}`} className="flex items-start gap-2 rounded-md border border-near/50 bg-near/5 px-3 py-2 text-sm text-ink">
              <TriangleAlert className="mt-0.5 size-4 shrink-0 text-near" aria-hidden />
              <span>{describeHit(h)}</span>
            </li>
          ))}
        </ul>
      )}

      {axial ? (
        <p className="text-sm text-muted">Drilling and plunging load the cutter along its axis: the side-milling stability chart does not apply.</p>
      ) : !curve ? (
        <p className="text-sm text-muted">
          {xyModes.length === 0
            ? "This machine has no X or Y mode yet, so there is nothing to draw chatter from. Record a tap test or estimate a mode on the machine's vibration profile."
            : "The spindle has a single speed: there is no range to draw the lobes over."}
        </p>
      ) : (
        <>
          <p className="flex items-start gap-2 text-sm text-ink">
            {stableHere ? <CheckCircle2 className="mt-0.5 size-4 shrink-0 text-ok" aria-hidden /> : <TriangleAlert className="mt-0.5 size-4 shrink-0 text-limit" aria-hidden />}
            <span>
              At {formatQuantity(deferred.rpm, "rpm", { fractionDigits: 0 })} the boundary is{" "}
              {limitHere === null || limitHere === undefined ? "beyond the analysed band" : formatMeasure(limitHere, measures.length, system)}; this recipe cuts{" "}
              {formatMeasure(depth, measures.length, system)} deep, {stableHere ? "inside" : "outside"} the allowed {formatNumber(safetyFactor * 100, { fractionDigits: 0 })} % of it.
            </span>
          </p>
          <LobeChart curve={curve} safetyFactor={safetyFactor} current={current} evidence={evidence} system={system} />
          <Legend tones={new Set(evidence.map((e) => e.tone))} />
          <div>
            <h3 className="text-sm font-semibold text-ink">Nearest stable pockets at {formatMeasure(depth, measures.length, system)} deep</h3>
            {pockets.length === 0 ? (
              <p className="mt-1 text-sm text-muted">No speed in the spindle's range holds this depth: take a shallower cut.</p>
            ) : (
              <ul className="mt-1 flex flex-col gap-0.5 text-sm tabular" aria-label="Stable pockets">
                {pockets.map((p) => (
                  <li key={p.minRpm}>
                    {formatNumber(p.minRpm, { fractionDigits: 0 })}–{formatQuantity(p.maxRpm, "rpm", { fractionDigits: 0 })}
                    <span className="text-muted">
                      {" "}
                      · deepest allowed{" "}
                      {p.maxAllowedDepthMm === null
                        ? "unbounded in the analysed band"
                        : `${formatMeasure(p.maxAllowedDepthMm, measures.length, system)} at ${formatQuantity(p.bestRpm, "rpm", { fractionDigits: 0 })}`}
                      {p.distanceRpm === 0 ? " · this recipe's speed is in it" : ""}
                    </span>
                  </li>
                ))}
              </ul>
            )}
          </div>
        </>
      )}

      {offer && Math.abs(offer.rpm - deferred.rpm) >= 1 && (
        <div role="status" className="flex flex-wrap items-center justify-between gap-3 rounded-md border border-measured/40 bg-measured/5 px-3 py-2 text-sm">
          <p>
            Nearest speed clear of every mode and band{curve ? `, with ${formatMeasure(depth, measures.length, system)} stable` : ""}:{" "}
            <span className="font-semibold tabular">{formatQuantity(offer.rpm, "rpm", { fractionDigits: 0 })}</span>
            {offer.dialLabel && ` (dial setting ${offer.dialLabel})`}.
          </p>
          {onUseRpm && (
            <Button size="sm" variant="secondary" onClick={() => onUseRpm(offer.rpm)}>
              Use {formatQuantity(offer.rpm, "rpm", { fractionDigits: 0 })}
            </Button>
          )}
        </div>
      )}
      {!offer && (hits.length > 0 || stableHere === false) && (
        <p className="text-sm text-muted">No speed in the spindle's range is clear of every mode and band at this depth: a shallower, wider cut is the way out.</p>
      )}
    </section>
  );
}
