import {
  CUT_LOG_MAX_PHOTOS,
  cutLogBodySchema,
  cutLogPhotoTypes,
  cutOutcomes,
  type CutLog,
  type CutOutcome,
  type Recipe,
  type UnitSystem,
} from "@ringdown/contracts";
import { Camera, CheckCircle2, ImagePlus, X } from "lucide-react";
import { useEffect, useId, useRef, useState } from "react";
import { useFormContext, useWatch } from "react-hook-form";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { Form, FormError } from "@/components/ui/form";
import { NumberField } from "@/components/ui/number-field";
import { TextareaField } from "@/components/ui/textarea";
import { measures } from "@/components/ui/units";
import { cn } from "@/lib/cn";
import { useCreateCutLog } from "../api/create-cut-log";
import { OUTCOMES } from "../outcomes";

const schema = cutLogBodySchema.extend({
  outcome: z.enum(cutOutcomes, { error: "Choose how the cut went" }),
});

/** Largest photo the server takes by default [bytes] (8 MB); the server has the last word. */
const PHOTO_MAX_BYTES = 8 * 1024 * 1024;

export interface CutLogDefaults {
  rpm: number;
  feedMmPerMin: number;
  axialDepthMm: number;
  radialDepthMm: number;
}

function OutcomeChoice() {
  const {
    register,
    formState: { errors },
  } = useFormContext();
  const error = (errors.outcome as { message?: string } | undefined)?.message;
  const id = useId();
  return (
    <fieldset aria-describedby={error ? `${id}-error` : undefined}>
      <legend className="mb-2 text-base font-semibold text-ink">How did the cut go?</legend>
      <div className="grid grid-cols-2 gap-2">
        {cutOutcomes.map((o) => (
          <label
            key={o}
            className={cn(
              "flex min-h-14 cursor-pointer items-center gap-2 rounded-lg border border-rule-strong bg-surface px-3 py-2 text-base text-ink",
              "has-checked:border-brand has-checked:bg-brand has-checked:text-white has-focus-visible:outline-2 has-focus-visible:outline-offset-2 has-focus-visible:outline-brand",
              o === "clean" && "col-span-2",
            )}
          >
            <input type="radio" value={o} className="size-5 shrink-0 accent-white" {...register("outcome")} />
            {OUTCOMES[o].label}
          </label>
        ))}
      </div>
      {error && (
        <p id={`${id}-error`} className="mt-1 text-sm font-medium text-limit">
          {error}
        </p>
      )}
    </fieldset>
  );
}

function FeedOverrideField() {
  const outcome = useWatch({ name: "outcome" }) as CutOutcome | "";
  return (
    <NumberField
      name="feedOverridePct"
      label={outcome === "feed_override" ? "Feed override on the control" : "Feed override (if used)"}
      measure={measures.percent}
      nullable
      placeholder="—"
    />
  );
}

interface PickedPhoto {
  file: File;
  url: string;
}

function photoProblem(file: File): string | null {
  if (!(cutLogPhotoTypes as readonly string[]).includes(file.type)) return `${file.name}: use a JPEG, PNG or WebP photo.`;
  if (file.size > PHOTO_MAX_BYTES) return `${file.name}: at most 8 MB per photo.`;
  return null;
}

/**
 * The cut-log form for a phone at the machine: big targets, the outcome first, the actual numbers
 * already filled in from the recipe, a note and photos, sent in one tap.
 */
export function CutLogForm({
  shopId,
  recipe,
  defaults,
  system,
  onLogged,
}: {
  shopId: string;
  recipe: Recipe;
  defaults: CutLogDefaults;
  system: UnitSystem;
  onLogged: (log: CutLog) => void;
}) {
  const create = useCreateCutLog(shopId);
  const [photos, setPhotos] = useState<PickedPhoto[]>([]);
  const [photoError, setPhotoError] = useState<string | null>(null);
  const cameraRef = useRef<HTMLInputElement>(null);
  const filesRef = useRef<HTMLInputElement>(null);
  const photosLabelId = useId();

  // Previews are object URLs: release them when they go.
  const latest = useRef(photos);
  latest.current = photos;
  useEffect(() => () => latest.current.forEach((p) => URL.revokeObjectURL(p.url)), []);

  const addPhotos = (list: FileList | null) => {
    if (!list) return;
    const problems: string[] = [];
    const next = [...photos];
    for (const file of Array.from(list)) {
      const problem = photoProblem(file);
      if (problem) problems.push(problem);
      else if (next.length >= CUT_LOG_MAX_PHOTOS) problems.push(`At most ${CUT_LOG_MAX_PHOTOS} photos per cut.`);
      else next.push({ file, url: URL.createObjectURL(file) });
    }
    setPhotos(next);
    setPhotoError(problems.length ? [...new Set(problems)].join(" ") : null);
  };

  return (
    <Form
      schema={schema}
      defaultValues={{
        outcome: "" as never,
        actualRpm: Math.round(defaults.rpm),
        actualFeedMmPerMin: Math.round(defaults.feedMmPerMin),
        axialDepthMm: defaults.axialDepthMm,
        radialDepthMm: defaults.radialDepthMm,
        feedOverridePct: null,
        note: "",
      }}
      aria-label="Log a cut"
      className="flex flex-col gap-5"
      onSubmit={async (values) => {
        const log = await create.mutateAsync({ recipeId: recipe.id, body: values, photos: photos.map((p) => p.file) });
        photos.forEach((p) => URL.revokeObjectURL(p.url));
        setPhotos([]);
        onLogged(log);
      }}
    >
      {({ formState }) => (
        <>
          <FormError />
          <OutcomeChoice />

          <fieldset className="flex flex-col gap-3">
            <legend className="mb-1 text-base font-semibold text-ink">What ran</legend>
            <p className="-mt-1 text-sm text-muted">Filled in from the recipe; change what was different.</p>
            <div className="grid grid-cols-2 gap-3">
              <NumberField name="actualRpm" label="Spindle speed" measure={measures.rpm} system={system} className="h-12 text-base" />
              <NumberField name="actualFeedMmPerMin" label="Feed" measure={measures.feedRate} system={system} className="h-12 text-base" />
              <NumberField name="axialDepthMm" label="Axial depth" measure={measures.length} system={system} className="h-12 text-base" />
              <NumberField name="radialDepthMm" label="Radial depth" measure={measures.length} system={system} className="h-12 text-base" />
            </div>
            <FeedOverrideField />
          </fieldset>

          <TextareaField name="note" label="Note (optional)" rows={3} placeholder="Sound, finish, chips, what you changed…" className="text-base" />

          <section aria-labelledby={photosLabelId} className="flex flex-col gap-2">
            <h2 id={photosLabelId} className="text-base font-semibold text-ink">
              Photos <span className="text-sm font-normal text-muted">(optional, up to {CUT_LOG_MAX_PHOTOS})</span>
            </h2>
            <div className="grid grid-cols-2 gap-2">
              <Button variant="secondary" className="h-12 text-base" onClick={() => cameraRef.current?.click()} disabled={photos.length >= CUT_LOG_MAX_PHOTOS}>
                <Camera className="size-5" aria-hidden />
                Take a photo
              </Button>
              <Button variant="secondary" className="h-12 text-base" onClick={() => filesRef.current?.click()} disabled={photos.length >= CUT_LOG_MAX_PHOTOS}>
                <ImagePlus className="size-5" aria-hidden />
                Choose photos
              </Button>
            </div>
            <input
              ref={cameraRef}
              type="file"
              accept={cutLogPhotoTypes.join(",")}
              capture="environment"
              className="sr-only"
              tabIndex={-1}
              aria-label="Take a photo"
              onChange={(e) => {
                addPhotos(e.target.files);
                e.target.value = "";
              }}
            />
            <input
              ref={filesRef}
              type="file"
              accept={cutLogPhotoTypes.join(",")}
              multiple
              className="sr-only"
              tabIndex={-1}
              aria-label="Choose photos"
              onChange={(e) => {
                addPhotos(e.target.files);
                e.target.value = "";
              }}
            />
            {photoError && (
              <p role="alert" className="text-sm text-limit">
                {photoError}
              </p>
            )}
            {photos.length > 0 && (
              <ul aria-label="Photos to send" className="flex flex-wrap gap-2">
                {photos.map((p, i) => (
                  <li key={p.url} className="relative">
                    <img src={p.url} alt={`Photo ${i + 1}: ${p.file.name}`} className="size-24 rounded-md border border-rule object-cover" />
                    <button
                      type="button"
                      onClick={() => {
                        URL.revokeObjectURL(p.url);
                        setPhotos(photos.filter((x) => x !== p));
                      }}
                      className="absolute -top-2 -right-2 flex size-8 cursor-pointer items-center justify-center rounded-full border border-rule bg-surface text-ink shadow"
                      aria-label={`Remove photo ${i + 1}`}
                    >
                      <X className="size-4" aria-hidden />
                    </button>
                  </li>
                ))}
              </ul>
            )}
          </section>

          <Button type="submit" className="h-14 text-lg" pending={formState.isSubmitting}>
            <CheckCircle2 className="size-5" aria-hidden />
            Log the cut
          </Button>
        </>
      )}
    </Form>
  );
}
