import { cutOutcomes, ladderParameters, type Ladder, type LadderParameter, type LadderRung, type Recipe, type UnitSystem } from "@ringdown/contracts";
import { CheckCircle2, FlaskConical } from "lucide-react";
import { useId, useState, type ReactNode } from "react";
import { useFormContext } from "react-hook-form";
import { z } from "zod";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { Dialog } from "@/components/ui/dialog";
import { Form, FormError } from "@/components/ui/form";
import { MeasureValue } from "@/components/ui/measure";
import { NumberField } from "@/components/ui/number-field";
import { SelectField } from "@/components/ui/select";
import { LoadingState } from "@/components/ui/spinner";
import { TextareaField } from "@/components/ui/textarea";
import { measures } from "@/components/ui/units";
import { LoadError } from "@/components/ui/load-error";
import { useLadder } from "../api/get-ladder";
import { useChooseRung, useCreateLadder, useScoreRung } from "../api/ladder-actions";

export const ladderParameterLabels: Record<LadderParameter, string> = {
  rpm: "Spindle speed",
  feed: "Feed (chip load)",
  depth: "Axial depth",
};

const outcomeLabels: Record<(typeof cutOutcomes)[number], string> = {
  clean: "Ran clean",
  chatter: "Chatter",
  burn_melt: "Burn or melt",
  poor_finish: "Poor finish",
  cutter_broke: "Cutter broke",
  feed_override: "Ran at a feed override",
  other: "Other",
};

const chipsLabels = { chips: "Chips", mixed: "Mixed", dust: "Dust" } as const;

/**
 * The test-cut ladder: a plan for scrap stock that steps one parameter through the window the
 * engine allows, a score for each rung, and the best rung written as the recipe's next revision.
 */
export function LadderSection({
  shopId,
  recipe,
  system,
  canBuild,
  canScore,
}: {
  shopId: string;
  recipe: Recipe;
  system: UnitSystem;
  /** Programmers and up build ladders and choose rungs. */
  canBuild: boolean;
  /** Whoever may log cuts on the recipe scores rungs. */
  canScore: boolean;
}) {
  const ladder = useLadder(shopId, recipe.id);
  const [rebuilding, setRebuilding] = useState(false);

  if (ladder.isPending) return <LoadingState label="Loading the test-cut ladder…" />;
  if (ladder.isError)
    return (
      <LoadError onRetry={() => void ladder.refetch()}>Cannot load the ladder: {ladder.error.message}</LoadError>
    );

  const current = ladder.data;
  if (!current || rebuilding) {
    if (!canBuild) return <p className="text-sm text-muted">No test-cut ladder for this recipe yet; a programmer plans one.</p>;
    return <BuildLadderForm shopId={shopId} recipe={recipe} onBuilt={() => setRebuilding(false)} onCancel={current ? () => setRebuilding(false) : undefined} />;
  }
  return (
    <LadderPlan
      shopId={shopId}
      recipe={recipe}
      ladder={current}
      system={system}
      canBuild={canBuild}
      canScore={canScore}
      onRebuild={() => setRebuilding(true)}
    />
  );
}

const buildSchema = z.object({
  parameter: z.enum(ladderParameters),
  rungs: z.coerce.number<string>().int("Whole rungs only").min(3, "At least 3 rungs").max(7, "At most 7 rungs"),
});

function BuildLadderForm({ shopId, recipe, onBuilt, onCancel }: { shopId: string; recipe: Recipe; onBuilt: () => void; onCancel: (() => void) | undefined }) {
  const create = useCreateLadder(shopId, recipe.id);
  return (
    <Form
      schema={buildSchema}
      defaultValues={{ parameter: "feed", rungs: "5" }}
      aria-label="Plan a test-cut ladder"
      className="flex flex-col gap-4"
      onSubmit={async (values) => {
        await create.mutateAsync(values);
        onBuilt();
      }}
    >
      {({ formState }) => (
        <>
          <p className="text-sm text-muted">
            Step one parameter through the window the engine allows on {recipe.machineName}; cut each rung on scrap stock of the same material and
            score it. Every rung stays within the machine's, spindle's and cutter's limits.
          </p>
          <FormError />
          <div className="grid gap-3 sm:grid-cols-[1fr_8rem]">
            <SelectField
              name="parameter"
              label="Parameter to step"
              options={ladderParameters.map((p) => ({ value: p, label: ladderParameterLabels[p] }))}
            />
            <SelectField name="rungs" label="Rungs" options={[3, 4, 5, 6, 7].map((n) => ({ value: String(n), label: String(n) }))} />
          </div>
          <div className="flex justify-end gap-2">
            {onCancel && (
              <Button variant="secondary" onClick={onCancel}>
                Cancel
              </Button>
            )}
            <Button type="submit" pending={formState.isSubmitting}>
              <FlaskConical className="size-4" aria-hidden />
              Plan the ladder
            </Button>
          </div>
        </>
      )}
    </Form>
  );
}

function scoreSummary(score: NonNullable<LadderRung["score"]>): string {
  return `edge ${score.edgeQuality}/5 · ${chipsLabels[score.chips].toLowerCase()} · sound ${score.sound}/5 · heat ${score.heat}/5`;
}

function LadderPlan({
  shopId,
  recipe,
  ladder,
  system,
  canBuild,
  canScore,
  onRebuild,
}: {
  shopId: string;
  recipe: Recipe;
  ladder: Ladder;
  system: UnitSystem;
  canBuild: boolean;
  canScore: boolean;
  onRebuild: () => void;
}) {
  const [scoring, setScoring] = useState<LadderRung | null>(null);
  const [choosing, setChoosing] = useState<LadderRung | null>(null);
  const choose = useChooseRung(shopId, recipe.id);
  const stale = ladder.baseRevision !== undefined && ladder.baseRevision !== recipe.revision && ladder.chosenRung === null;
  const anyScored = ladder.rungs.some((r) => r.score);
  const th = "sticky top-0 border-b border-rule bg-paper px-3 py-2 text-xs font-medium whitespace-nowrap text-muted";

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div className="text-sm">
          <p className="text-ink">
            Stepping <span className="font-medium">{ladderParameterLabels[ladder.parameter].toLowerCase()}</span> in {ladder.rungs.length} rungs
            {ladder.createdByName ? `, planned by ${ladder.createdByName}` : ""}.
          </p>
          {ladder.note && <p className="mt-0.5 text-xs text-muted">{ladder.note}</p>}
          <p className="mt-0.5 text-xs text-muted">Cut each rung on scrap stock of the same material, in the same setup, then score it.</p>
        </div>
        {canBuild && (
          <Button variant="secondary" size="sm" onClick={onRebuild}>
            Plan a new ladder
          </Button>
        )}
      </div>
      {stale && (
        <p role="status" className="rounded-md border border-near/50 bg-near/5 px-3 py-2 text-sm text-ink">
          The recipe changed since this ladder was planned (revision {ladder.baseRevision}, now {recipe.revision}). Plan a new ladder before choosing a rung.
        </p>
      )}
      <div className="overflow-x-auto rounded-lg border border-rule" role="region" aria-label="Ladder rungs" tabIndex={0}>
        <table className="w-full min-w-[50rem] border-collapse text-sm">
          <caption className="sr-only">Test-cut ladder rungs</caption>
          <thead>
            <tr>
              <th scope="col" className={`${th} text-left`}>
                Rung
              </th>
              <th scope="col" className={`${th} text-right`}>
                Spindle speed
              </th>
              <th scope="col" className={`${th} text-right`}>
                Feed
              </th>
              <th scope="col" className={`${th} text-right`}>
                Chip load
              </th>
              <th scope="col" className={`${th} text-right`}>
                Axial depth
              </th>
              <th scope="col" className={`${th} text-right`}>
                Radial depth
              </th>
              <th scope="col" className={`${th} min-w-52 text-left`}>
                Score
              </th>
              <th scope="col" className={`${th} text-right`}>
                Actions
              </th>
            </tr>
          </thead>
          <tbody>
            {ladder.rungs.map((rung) => {
              const chosen = ladder.chosenRung === rung.index;
              return (
                <tr key={rung.index} className={chosen ? "bg-ok/5" : "border-b border-rule/70 last:border-b-0"}>
                  <th scope="row" className="px-3 py-2 text-left font-medium whitespace-nowrap">
                    {rung.index + 1}
                    {chosen && (
                      <Badge tone="ok" className="ml-2">
                        <CheckCircle2 className="size-3" aria-hidden />
                        Chosen
                      </Badge>
                    )}
                  </th>
                  <td className="tabular px-3 py-2 text-right whitespace-nowrap">
                    <MeasureValue value={Math.round(rung.params.rpm)} measure={measures.rpm} system={system} />
                  </td>
                  <td className="tabular px-3 py-2 text-right whitespace-nowrap">
                    <MeasureValue value={rung.params.feedMmPerMin} measure={measures.feedRate} system={system} />
                  </td>
                  <td className="tabular px-3 py-2 text-right whitespace-nowrap">
                    <MeasureValue value={rung.chipLoadMm ?? null} measure={measures.chipLoad} system={system} />
                  </td>
                  <td className="tabular px-3 py-2 text-right whitespace-nowrap">
                    <MeasureValue value={rung.params.axialDepthMm} measure={measures.length} system={system} />
                  </td>
                  <td className="tabular px-3 py-2 text-right whitespace-nowrap">
                    <MeasureValue value={rung.params.radialDepthMm} measure={measures.length} system={system} />
                  </td>
                  <td className="px-3 py-2 text-xs">
                    {rung.score ? (
                      <span className="flex flex-col">
                        <span className="text-ink">{scoreSummary(rung.score)}</span>
                        {rung.score.outcome && <span className="text-muted">{outcomeLabels[rung.score.outcome]}</span>}
                        {rung.score.measuredSizeMm !== null && (
                          <span className="text-muted">
                            measured <MeasureValue value={rung.score.measuredSizeMm} measure={measures.length} system={system} />
                          </span>
                        )}
                      </span>
                    ) : (
                      <span className="text-muted">not scored</span>
                    )}
                  </td>
                  <td className="px-3 py-1.5 text-right whitespace-nowrap">
                    <div className="flex justify-end gap-1">
                      {canScore && ladder.chosenRung === null && (
                        <Button variant="secondary" size="sm" onClick={() => setScoring(rung)} aria-label={`Score rung ${rung.index + 1}`}>
                          {rung.score ? "Rescore" : "Score"}
                        </Button>
                      )}
                      {canBuild && ladder.chosenRung === null && (
                        <Button
                          variant="quiet"
                          size="sm"
                          disabled={!rung.score || stale}
                          title={!rung.score ? "Score this rung before choosing it" : stale ? "Plan a new ladder first" : undefined}
                          onClick={() => {
                            choose.reset();
                            setChoosing(rung);
                          }}
                          aria-label={`Choose rung ${rung.index + 1}`}
                        >
                          Choose
                        </Button>
                      )}
                    </div>
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      {ladder.chosenRung !== null ? (
        <p className="flex items-center gap-2 text-sm text-ok">
          <CheckCircle2 className="size-4" aria-hidden />
          Rung {ladder.chosenRung + 1} was chosen and written as a revision of the recipe.
        </p>
      ) : (
        canBuild && (
          <p className="text-xs text-muted">{anyScored ? "Choose the best scored rung: it becomes the recipe's next revision." : "Score the rungs, then choose the best."}</p>
        )
      )}
      {scoring && <ScoreRungDialog shopId={shopId} recipe={recipe} rung={scoring} system={system} onClose={() => setScoring(null)} />}
      {choosing && (
        <ConfirmDialog
          open
          onClose={() => setChoosing(null)}
          title={`Choose rung ${choosing.index + 1}`}
          confirmLabel={`Make rung ${choosing.index + 1} revision ${recipe.revision + 1}`}
          pending={choose.isPending}
          error={choose.isError ? choose.error.message : null}
          onConfirm={() => {
            choose.mutate({ index: choosing.index, changeNote: "" }, { onSuccess: () => setChoosing(null) });
          }}
        >
          <p>
            The recipe takes this rung's parameters as revision {recipe.revision + 1}:{" "}
            <MeasureValue value={Math.round(choosing.params.rpm)} measure={measures.rpm} system={system} />,{" "}
            <MeasureValue value={choosing.params.feedMmPerMin} measure={measures.feedRate} system={system} />,{" "}
            <MeasureValue value={choosing.params.axialDepthMm} measure={measures.length} system={system} /> deep.
          </p>
        </ConfirmDialog>
      )}
    </div>
  );
}

const scoreSchema = z.object({
  edgeQuality: z.coerce.number<string>({ error: "Score the edge" }).int().min(1, "Score 1–5").max(5, "Score 1–5"),
  chips: z.enum(["chips", "mixed", "dust"], { error: "Say what came off" }),
  sound: z.coerce.number<string>({ error: "Score the sound" }).int().min(1, "Score 1–5").max(5, "Score 1–5"),
  heat: z.coerce.number<string>({ error: "Score the heat" }).int().min(1, "Score 1–5").max(5, "Score 1–5"),
  measuredSizeMm: z.number().finite("Enter the size as a number").gt(0, "The size must be more than 0").nullable(),
  outcome: z.enum(["", ...cutOutcomes]).transform((v) => (v === "" ? undefined : v)),
  note: z.string().trim().max(1000, "Use at most 1000 characters"),
});

function ScaleField({ name, legend, low, high }: { name: string; legend: string; low: string; high: string }) {
  const id = useId();
  const {
    register,
    formState: { errors },
  } = useFormContext();
  const error = (errors[name] as { message?: string } | undefined)?.message;
  return (
    <fieldset aria-describedby={error ? `${id}-error` : `${id}-hint`}>
      <legend className="mb-1 text-sm font-medium text-ink">{legend}</legend>
      <div className="flex gap-1">
        {[1, 2, 3, 4, 5].map((n) => (
          <label
            key={n}
            className="flex size-10 cursor-pointer items-center justify-center rounded-md border border-rule-strong text-sm has-checked:border-brand has-checked:bg-brand has-checked:text-white has-focus-visible:outline-2 has-focus-visible:outline-brand"
          >
            <input type="radio" value={String(n)} className="sr-only" {...register(name)} />
            {n}
          </label>
        ))}
      </div>
      <p id={`${id}-hint`} className="mt-1 text-xs text-muted">
        1 = {low}, 5 = {high}
      </p>
      {error && (
        <p id={`${id}-error`} className="text-xs font-medium text-limit">
          {error}
        </p>
      )}
    </fieldset>
  );
}

function ChoiceField({ name, legend, options }: { name: string; legend: string; options: Array<{ value: string; label: ReactNode }> }) {
  const {
    register,
    formState: { errors },
  } = useFormContext();
  const error = (errors[name] as { message?: string } | undefined)?.message;
  return (
    <fieldset>
      <legend className="mb-1 text-sm font-medium text-ink">{legend}</legend>
      <div className="flex flex-wrap gap-1">
        {options.map((o) => (
          <label
            key={o.value}
            className="flex h-10 cursor-pointer items-center rounded-md border border-rule-strong px-3 text-sm has-checked:border-brand has-checked:bg-brand has-checked:text-white has-focus-visible:outline-2 has-focus-visible:outline-brand"
          >
            <input type="radio" value={o.value} className="sr-only" {...register(name)} />
            {o.label}
          </label>
        ))}
      </div>
      {error && <p className="mt-1 text-xs font-medium text-limit">{error}</p>}
    </fieldset>
  );
}

function ScoreRungDialog({ shopId, recipe, rung, system, onClose }: { shopId: string; recipe: Recipe; rung: LadderRung; system: UnitSystem; onClose: () => void }) {
  const score = useScoreRung(shopId, recipe.id);
  const s = rung.score;
  return (
    <Dialog
      open
      onClose={onClose}
      title={`Score rung ${rung.index + 1}`}
      description={
        <>
          <MeasureValue value={Math.round(rung.params.rpm)} measure={measures.rpm} system={system} /> ·{" "}
          <MeasureValue value={rung.params.feedMmPerMin} measure={measures.feedRate} system={system} /> ·{" "}
          <MeasureValue value={rung.params.axialDepthMm} measure={measures.length} system={system} /> deep. The score is also written to the cut log.
        </>
      }
    >
      <Form
        schema={scoreSchema}
        defaultValues={{
          edgeQuality: s ? String(s.edgeQuality) : "",
          chips: s?.chips ?? ("" as never),
          sound: s ? String(s.sound) : "",
          heat: s ? String(s.heat) : "",
          measuredSizeMm: s?.measuredSizeMm ?? null,
          outcome: s?.outcome ?? "",
          note: s?.note ?? "",
        }}
        aria-label={`Score rung ${rung.index + 1}`}
        className="flex flex-col gap-4"
        onSubmit={async (values) => {
          await score.mutateAsync({ index: rung.index, ...values, ...(values.outcome ? { outcome: values.outcome } : {}) });
          onClose();
        }}
      >
        {({ formState }) => (
          <>
            <FormError />
            <ScaleField name="edgeQuality" legend="Edge quality" low="torn or fuzzy" high="crisp" />
            <ChoiceField name="chips" legend="What came off" options={(["chips", "mixed", "dust"] as const).map((v) => ({ value: v, label: chipsLabels[v] }))} />
            <ScaleField name="sound" legend="Sound" low="screams or chatters" high="steady" />
            <ScaleField name="heat" legend="Heat" low="cool chips and cutter" high="burnt or melted" />
            <NumberField name="measuredSizeMm" label="Measured size (optional)" measure={measures.length} nullable placeholder="—" />
            <SelectField
              name="outcome"
              label="How it went (optional)"
              hint="Left empty, it is read from the scores for the cut log."
              options={cutOutcomes.map((o) => ({ value: o, label: outcomeLabels[o] }))}
              placeholder="Read from the scores"
            />
            <TextareaField name="note" label="Note (optional)" rows={2} />
            <div className="flex justify-end gap-2">
              <Button variant="secondary" onClick={onClose}>
                Cancel
              </Button>
              <Button type="submit" pending={formState.isSubmitting}>
                Save score
              </Button>
            </div>
          </>
        )}
      </Form>
    </Dialog>
  );
}
