import type { CutLog, CutOutcome, UnitSystem } from "@ringdown/contracts";
import { Link } from "react-router-dom";
import { cn } from "@/lib/cn";
import { formatNumber, formatQuantity } from "@/lib/format";
import { toUnitSystem } from "@ringdown/machining";
import { OUTCOMES } from "../outcomes";
import { OutcomeBadge } from "./outcome-badge";

function feedText(mmPerMin: number, system: UnitSystem) {
  const v = toUnitSystem({ value: mmPerMin, quantity: "feedRate", system });
  return formatQuantity(v.value, v.unit, { system, ...(v.value >= 100 ? { fractionDigits: 0 } : { significantDigits: 3 }) });
}
function lengthText(mm: number, system: UnitSystem) {
  const v = toUnitSystem({ value: mm, quantity: "length", system });
  return formatQuantity(v.value, v.unit, { system, significantDigits: 3 });
}

/**
 * What the shop has logged on this machine in this material, next to the prediction: a tally by
 * outcome and the latest cuts with their actual speed, feed and depths.
 */
export function LoggedOutcomes({
  logs,
  total,
  system,
  predicted,
  limit = 6,
  className,
}: {
  logs: CutLog[];
  total: number;
  system: UnitSystem;
  /** The prediction to compare with (spindle speed [rpm], feed [mm/min]). */
  predicted?: { rpm: number; feedMmPerMin: number };
  limit?: number;
  className?: string;
}) {
  if (logs.length === 0) {
    return (
      <p className={cn("text-sm text-muted", className)}>
        No cuts logged on this machine in this material yet. Log the first test cut from the recipe page or its setup card.
      </p>
    );
  }
  const tally = new Map<CutOutcome, number>();
  for (const log of logs) tally.set(log.outcome, (tally.get(log.outcome) ?? 0) + 1);
  return (
    <div className={cn("flex flex-col gap-3", className)}>
      <p className="text-sm text-ink">
        {formatNumber(total)} {total === 1 ? "cut" : "cuts"} logged
        {logs.length < total ? ` (latest ${formatNumber(logs.length)} shown)` : ""}:{" "}
        {[...tally.entries()].map(([o, n]) => `${formatNumber(n)} ${OUTCOMES[o].label.toLowerCase()}`).join(", ")}.
      </p>
      {predicted && (
        <p className="tabular rounded-md bg-paper px-2 py-1 text-xs text-ink">
          <span className="text-muted">This plan: </span>
          {formatQuantity(predicted.rpm, "rpm", { system, fractionDigits: 0 })} · {feedText(predicted.feedMmPerMin, system)}
        </p>
      )}
      <ul className="flex flex-col divide-y divide-rule/70 text-sm">
        {logs.slice(0, limit).map((log) => (
          <li key={log.id} className="flex flex-col gap-1 py-2">
            <div className="flex flex-wrap items-center gap-2">
              <OutcomeBadge outcome={log.outcome} />
              <span className="text-xs text-muted">
                {new Date(log.createdAt).toLocaleDateString("en-GB", { day: "numeric", month: "short", year: "numeric" })} · {log.userName}
              </span>
              <Link to={`/recipes/${log.recipeId}`} className="ml-auto max-w-[50%] truncate text-xs text-brand underline underline-offset-2">
                {log.recipeName ?? "Recipe"}
              </Link>
            </div>
            <p className="tabular text-xs text-ink">
              <span className="text-muted">{log.cutterName ? `${log.cutterName}: ran at ` : "Ran at "}</span>
              {formatQuantity(log.actualRpm, "rpm", { system, fractionDigits: 0 })}
              {" · "}
              {feedText(log.actualFeedMmPerMin, system)}
              {" · "}ap {lengthText(log.axialDepthMm, system)} · ae {lengthText(log.radialDepthMm, system)}
            </p>
            {log.note && <p className="text-xs text-muted">{log.note}</p>}
          </li>
        ))}
      </ul>
    </div>
  );
}
