import type { UnitSystem } from "@ringdown/contracts";
import { useEffect, useId, useRef, useState, type ReactNode } from "react";
import { get, useController, useFormContext } from "react-hook-form";
import { useUnitSystem } from "@/lib/auth";
import { cn } from "@/lib/cn";
import { Field, inputClass } from "./field";
import { localiseLimitMessage, parseInputText, toInputText, unitOf, type Measure } from "./units";

export interface NumberFieldProps {
  /** Form path of a number stored in the base unit (mm, W, N/mm…). */
  name: string;
  label: ReactNode;
  measure: Measure;
  hint?: ReactNode;
  /** Defaults to the signed-in person's preference. */
  system?: UnitSystem;
  /** Empty input means null (an optional value) rather than "missing". */
  nullable?: boolean;
  /** Something shown beside the label, e.g. an "estimate" tag. */
  tag?: ReactNode;
  /** Keeps the label for screen readers only (inside a table whose headers say it). */
  hideLabel?: boolean;
  placeholder?: string;
  disabled?: boolean;
  className?: string;
}

/**
 * A number input in the person's unit system, registered with the surrounding <Form>. What is
 * typed is converted to the base unit as it is typed, so the form (and the request) holds metric
 * values only; the unit is shown inside the box. Schema limits in error messages are rewritten
 * into the same unit.
 */
export function NumberField({ name, label, measure, hint, system, nullable = false, tag, hideLabel = false, placeholder, disabled, className }: NumberFieldProps) {
  const id = useId();
  const preferred = useUnitSystem();
  const shownIn = system ?? preferred;
  const { control, formState } = useFormContext();
  const { field } = useController({ name, control });
  const value = field.value as number | null | undefined;

  // The text stays as typed while it parses to the stored value ("0.250" is not rewritten to
  // "0.25" mid-edit); a value set from outside (reset, defaults, unit switch) replaces it.
  const [text, setText] = useState(() => toInputText(value, measure, shownIn));
  const synced = useRef({ value, system: shownIn });
  useEffect(() => {
    if (Object.is(synced.current.value, value) && synced.current.system === shownIn) return;
    synced.current = { value, system: shownIn };
    setText(toInputText(value, measure, shownIn));
  }, [value, shownIn, measure]);

  const raw = (get(formState.errors, name) as { message?: string } | undefined)?.message;
  // A schema without its own wording answers an empty box with zod's "expected number" text.
  const plain = raw && /expected number/i.test(raw) ? `Enter ${typeof label === "string" ? label.toLowerCase() : "a number"}` : raw;
  const error = plain ? localiseLimitMessage(plain, measure, shownIn) : undefined;
  const unit = unitOf(measure, shownIn);
  const describedBy = error ? `${id}-error` : hint ? `${id}-hint` : undefined;

  return (
    <Field
      id={id}
      label={
        <span className={hideLabel ? "sr-only" : "inline-flex flex-wrap items-center gap-x-2 gap-y-1"}>
          <span>
            {label}
            {unit && <span className="sr-only"> ({unit})</span>}
          </span>
          {tag}
        </span>
      }
      hint={hint}
      error={error}
    >
      <div className="relative">
        <input
          id={id}
          ref={field.ref}
          name={field.name}
          type="text"
          inputMode="decimal"
          autoComplete="off"
          placeholder={placeholder}
          disabled={disabled}
          value={text}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy}
          onBlur={field.onBlur}
          onChange={(event) => {
            const next = event.target.value;
            setText(next);
            const parsed = parseInputText(next, measure, shownIn);
            // Empty and required is NaN, not undefined: react-hook-form would read undefined as "use the default".
            const stored = parsed === null ? (nullable ? null : Number.NaN) : parsed;
            synced.current = { value: stored, system: shownIn };
            field.onChange(stored);
          }}
          className={cn(inputClass, "tabular text-right", unit && "pr-16", className)}
        />
        {unit && (
          <span aria-hidden className="pointer-events-none absolute inset-y-0 right-3 flex items-center text-xs text-muted">
            {unit}
          </span>
        )}
      </div>
    </Field>
  );
}
