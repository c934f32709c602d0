import type { Recommendation } from "@ringdown/machining";
import { Info, TriangleAlert } from "lucide-react";
import { cn } from "@/lib/cn";

/** The engine's warnings (worst first) and what it moved or reduced, in plain language. */
export function RecommendationWarnings({
  rec,
  className,
  exclude = [],
  severity,
  adjustments = true,
}: {
  rec: Recommendation;
  className?: string;
  exclude?: string[];
  /** Only warnings of this severity (default: both, warnings first). */
  severity?: "warning" | "caution";
  /** Also list what the limits changed. */
  adjustments?: boolean;
}) {
  const warnings = rec.warnings
    .filter((w) => !exclude.includes(w.id) && (!severity || w.severity === severity))
    .sort((a, b) => (a.severity === b.severity ? 0 : a.severity === "warning" ? -1 : 1));
  const showAdjustments = adjustments && rec.adjustments.length > 0;
  if (warnings.length === 0 && !showAdjustments) return null;
  return (
    <div className={cn("flex flex-col gap-3", className)}>
      {warnings.length > 0 && (
        <ul aria-label="Warnings" className="flex flex-col gap-2">
          {warnings.map((w, i) => (
            <li
              key={`${w.id}-${i}`}
              className={cn(
                "flex items-start gap-2 rounded-md border px-3 py-2 text-sm",
                w.severity === "warning" ? "border-limit/40 bg-limit/5 text-ink" : "border-near/50 bg-near/5 text-ink",
              )}
            >
              {w.severity === "warning" ? (
                <TriangleAlert className="mt-0.5 size-4 shrink-0 text-limit" aria-label="Warning" />
              ) : (
                <Info className="mt-0.5 size-4 shrink-0 text-near" aria-label="Caution" />
              )}
              <span>{w.message}</span>
            </li>
          ))}
        </ul>
      )}
      {showAdjustments && (
        <div>
          <h3 className="mb-1 text-xs font-medium tracking-wide text-muted uppercase">What the limits changed</h3>
          <ol className="list-decimal space-y-0.5 pl-5 text-sm text-ink">
            {rec.adjustments.map((a) => (
              <li key={a}>{a}</li>
            ))}
          </ol>
        </div>
      )}
    </div>
  );
}
