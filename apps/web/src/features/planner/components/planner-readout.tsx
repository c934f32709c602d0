import type { RecipeParams, UnitSystem } from "@ringdown/contracts";
import type { Recommendation } from "@ringdown/machining";
import { Lightbulb } from "lucide-react";
import type { ReactNode } from "react";
import { Card } from "@/components/ui/card";
import { HeldBack } from "@/components/recommendation/held-back";
import { LimitBars } from "@/components/recommendation/limit-bars";
import { engagementAdvice } from "@/components/recommendation/readout";
import { ReadoutNumbers } from "@/components/recommendation/readout-numbers";
import { SafetyBand } from "@/components/recommendation/safety-band";
import { RecommendationWarnings } from "@/components/recommendation/warnings";
import { Spinner } from "@/components/ui/spinner";

/**
 * The right pane: the engine's result for what is typed on the left, or why there is none yet.
 * The safety band stays in place whatever the state.
 */
export function PlannerReadout({
  rec,
  error,
  loading,
  cutterError,
  hasInputErrors,
  noAssembly,
  system,
  requested,
  machineName,
}: {
  rec: Recommendation | null;
  error: string | null;
  loading: boolean;
  cutterError: string | null;
  hasInputErrors: boolean;
  noAssembly: boolean;
  system: UnitSystem;
  requested: RecipeParams | null;
  machineName: string | null;
}) {
  let placeholder: ReactNode = null;
  if (!rec) {
    if (cutterError) placeholder = <p className="text-sm text-limit">Cannot load the cutter of this assembly: {cutterError}</p>;
    else if (loading)
      placeholder = (
        <p role="status" className="flex items-center gap-2 text-sm text-muted">
          <Spinner /> Loading the cutter…
        </p>
      );
    else if (noAssembly) placeholder = <p className="text-sm text-muted">Choose a cutter assembly on this machine to see the recipe.</p>;
    else if (hasInputErrors) placeholder = <p className="text-sm text-muted">Correct the highlighted inputs to see the recipe.</p>;
    else if (error)
      placeholder = (
        <p role="alert" className="text-sm text-limit">
          The engine cannot compute this cut: {error}
        </p>
      );
    else placeholder = <p className="text-sm text-muted">Choose a machine, cutter assembly and material.</p>;
  }
  const advice = rec ? engagementAdvice(rec) : null;

  return (
    <>
      <Card>
        <section aria-labelledby="readout-title" className="flex flex-col gap-5 px-5 py-4">
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <h2 id="readout-title" className="text-base font-semibold text-ink">
              Recipe read-out
            </h2>
            {machineName && <p className="text-xs text-muted">held within the measured limits of {machineName}</p>}
          </div>
          {rec && requested ? (
            <>
              <HeldBack rec={rec} where={requested} system={system} />
              <RecommendationWarnings rec={rec} severity="warning" adjustments={false} exclude={["engagement-sensitive"]} />
              <ReadoutNumbers
                rec={rec}
                system={system}
                context={{ requestedAxialDepthMm: requested.axialDepthMm, requestedRadialDepthMm: requested.radialDepthMm }}
              />
            </>
          ) : (
            <div aria-live="polite">{placeholder}</div>
          )}
          <SafetyBand notes={rec?.safetyNotes} />
        </section>
      </Card>

      {rec && (
        <Card>
          <section aria-labelledby="limits-title" className="flex flex-col gap-4 px-5 py-4">
            <div>
              <h2 id="limits-title" className="text-base font-semibold text-ink">
                Limits
              </h2>
              <p className="mt-0.5 text-xs text-muted">Each bar is the recipe's value against the ceiling (the dark mark); binding limits first.</p>
            </div>
            <LimitBars rec={rec} system={system} />
          </section>
        </Card>
      )}

      {rec && (advice || rec.warnings.some((w) => w.severity === "caution") || rec.adjustments.length > 0) && (
        <Card>
          <section aria-labelledby="warnings-title" className="flex flex-col gap-4 px-5 py-4">
            <h2 id="warnings-title" className="text-base font-semibold text-ink">
              Cautions and advice
            </h2>
            {advice && (
              <div className="flex items-start gap-2 rounded-md border border-measured/40 bg-measured/5 px-3 py-2 text-sm text-ink">
                <Lightbulb className="mt-0.5 size-4 shrink-0 text-measured" aria-hidden />
                <p>
                  <span className="font-semibold">Deep and narrow, or shallow and wide? </span>
                  {advice}
                </p>
              </div>
            )}
            <RecommendationWarnings rec={rec} severity="caution" exclude={["engagement-sensitive"]} />
          </section>
        </Card>
      )}
    </>
  );
}
