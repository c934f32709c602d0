import { useId, type InputHTMLAttributes, type ReactNode } from "react";
import { Field, Input } from "@/components/ui/field";
import { cn } from "@/lib/cn";

/**
 * A number input with its unit inside the box on the right. Typed as text with a decimal keypad:
 * the planner reads it itself (decimal comma accepted) and shows the error under the field.
 */
export function NumberField({
  label,
  unit,
  hint,
  error,
  className,
  ...rest
}: {
  label: ReactNode;
  unit: string;
  hint?: ReactNode;
  error?: string | undefined;
  className?: string;
} & Omit<InputHTMLAttributes<HTMLInputElement>, "id" | "type">) {
  const id = useId();
  const describedBy = error ? `${id}-error` : hint ? `${id}-hint` : undefined;
  return (
    <div className={className}>
      <Field
        id={id}
        label={
          <>
            {label}
            <span className="sr-only">{` (${unit})`}</span>
          </>
        }
        hint={hint}
        error={error}
      >
        <div className="relative">
          <Input
            id={id}
            type="text"
            inputMode="decimal"
            autoComplete="off"
            spellCheck={false}
            invalid={Boolean(error)}
            describedBy={describedBy}
            className={cn("tabular text-right", unit.length > 5 ? "pr-24" : "pr-14")}
            {...rest}
          />
          <span aria-hidden className="pointer-events-none absolute inset-y-0 right-3 flex items-center text-sm text-muted">
            {unit}
          </span>
        </div>
      </Field>
    </div>
  );
}
