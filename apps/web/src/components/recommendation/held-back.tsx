import type { Recommendation, UnitSystem } from "@ringdown/machining";
import { CircleCheck, OctagonAlert, TriangleAlert } from "lucide-react";
import { cn } from "@/lib/cn";
import { brokenLimits, heldBackBy, type WorkContext } from "./readout";

/** The binding limit in words, right under the headline numbers. */
export function HeldBack({ rec, where, system, className }: { rec: Recommendation; where: WorkContext; system: UnitSystem; className?: string }) {
  const broken = brokenLimits(rec);
  const words = heldBackBy(rec, where, system);
  if (broken.length > 0) {
    return (
      <div role="alert" className={cn("flex items-start gap-2 rounded-md border border-limit/50 bg-limit/5 px-3 py-2 text-sm text-limit", className)}>
        <OctagonAlert className="mt-0.5 size-4 shrink-0" aria-hidden />
        <p>
          <span className="font-semibold">Outside a limit:</span> {broken.map((l) => l.label.toLowerCase()).join("; ")}. The engine could not bring
          this cut within it; change the cut before running it.
        </p>
      </div>
    );
  }
  if (words) {
    return (
      <p className={cn("flex items-start gap-2 text-sm font-medium text-limit", className)} data-testid="held-back">
        <TriangleAlert className="mt-0.5 size-4 shrink-0" aria-hidden />
        <span>Held back by: {words}</span>
      </p>
    );
  }
  return (
    <p className={cn("flex items-start gap-2 text-sm text-ok", className)} data-testid="held-back">
      <CircleCheck className="mt-0.5 size-4 shrink-0" aria-hidden />
      <span>Nothing held this cut back: every limit has room.</span>
    </p>
  );
}
