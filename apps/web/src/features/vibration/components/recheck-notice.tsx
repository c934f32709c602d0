import { RECHECK_THRESHOLD_PCT, type RecheckOutcome, type UnitSystem, type VibrationChange } from "@ringdown/contracts";
import { Link } from "react-router-dom";
import { Notice } from "@/components/ui/page-header";
import { formatMeasure, measures, type Measure } from "@/components/ui/units";
import { formatNumber, formatQuantity } from "@/lib/format";

const whatLabels: Record<VibrationChange["what"], string> = {
  stiffness: "Stiffness",
  backlash: "Backlash",
  mode_frequency: "Mode frequency",
  mode_stiffness: "Modal stiffness",
  mode_added: "Mode added",
  mode_removed: "Mode removed",
};

const unitMeasure: Record<VibrationChange["unit"], Measure> = {
  "N/mm": measures.stiffness,
  Hz: { unit: "Hz" },
  mm: measures.length,
};

/** One change in words: "Stiffness Y: 1 200 → 950 N/mm (−20.8 %)". */
export function describeChange(change: VibrationChange, system: UnitSystem): string {
  const label = `${whatLabels[change.what]} ${change.direction.toUpperCase()}`;
  const measure = unitMeasure[change.unit];
  if (change.before === null || change.after === null) {
    const value = change.after ?? change.before;
    return value === null ? label : `${label}: ${formatMeasure(value, measure, system)}`;
  }
  const pct = change.changePct === null ? "" : ` (${change.after >= change.before ? "+" : "−"}${formatNumber(Math.abs(change.changePct), { significantDigits: 3 })} %)`;
  return `${label}: ${formatMeasure(change.before, measure, system)} → ${formatMeasure(change.after, measure, system)}${pct}`;
}

/**
 * What a measurement did to the machine: each change it made, and whether recipes on the machine
 * were flagged for a re-check (a change of more than the threshold flags them).
 */
export function RecheckNotice({ saved, outcome, system, onDismiss }: { saved: string; outcome: RecheckOutcome | { recipesFlagged: number; changes?: never }; system: UnitSystem; onDismiss: () => void }) {
  const changes = outcome.changes ?? [];
  const flagged = outcome.recipesFlagged;
  return (
    <Notice tone={flagged > 0 ? "near" : "ok"} onDismiss={onDismiss}>
      <p>{saved}</p>
      {changes.length > 0 && (
        <ul className="mt-1 list-disc pl-5 text-sm">
          {changes.map((c, i) => (
            <li key={`${c.what}-${c.direction}-${i}`}>
              {describeChange(c, system)}
              {c.changePct !== null && !c.material && <span className="text-ink/75"> — within {formatQuantity(RECHECK_THRESHOLD_PCT, "%")}</span>}
            </li>
          ))}
        </ul>
      )}
      {flagged > 0 ? (
        <p className="mt-1 font-medium">
          {flagged === 1 ? "1 recipe on this machine is" : `${formatNumber(flagged)} recipes on this machine are`} flagged for re-check.{" "}
          <Link to="/recipes" className="text-brand underline underline-offset-2">
            Review recipes
          </Link>
        </p>
      ) : changes.some((c) => c.material) ? (
        <p className="mt-1 text-ink/75">The change passes {formatQuantity(RECHECK_THRESHOLD_PCT, "%")}, but no recipe on this machine needed flagging.</p>
      ) : (
        <p className="mt-1 text-ink/75">No recipe needs a re-check: nothing moved by more than {formatQuantity(RECHECK_THRESHOLD_PCT, "%")}.</p>
      )}
    </Notice>
  );
}
