import { ChevronDown } from "lucide-react";
import { useId, type ReactNode, type SelectHTMLAttributes } from "react";
import { get, useFormContext } from "react-hook-form";
import { cn } from "@/lib/cn";
import { Field, inputClass } from "./field";

export interface SelectOption {
  value: string;
  label: string;
}

type SelectProps = SelectHTMLAttributes<HTMLSelectElement> & { options: readonly SelectOption[]; invalid?: boolean; placeholder?: string };

/** A native select in the input style (the browser's own list: keyboard and screen readers for free). */
export function Select({ options, invalid, placeholder, className, ...rest }: SelectProps) {
  return (
    <div className="relative">
      <select aria-invalid={invalid || undefined} className={cn(inputClass, "cursor-pointer appearance-none pr-9", className)} {...rest}>
        {placeholder !== undefined && <option value="">{placeholder}</option>}
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      <ChevronDown aria-hidden className="pointer-events-none absolute top-1/2 right-3 size-4 -translate-y-1/2 text-muted" />
    </div>
  );
}

/** A select registered with the surrounding <Form>. */
export function SelectField({
  name,
  label,
  hint,
  options,
  placeholder,
  tag,
  disabled,
  hideLabel = false,
}: {
  name: string;
  label: ReactNode;
  hint?: ReactNode;
  options: readonly SelectOption[];
  placeholder?: string;
  tag?: ReactNode;
  disabled?: boolean;
  /** Keeps the label for screen readers only (inside a table whose headers say it). */
  hideLabel?: boolean;
}) {
  const id = useId();
  const {
    register,
    formState: { errors },
  } = useFormContext();
  const error = (get(errors, name) as { message?: string } | undefined)?.message;
  return (
    <Field
      id={id}
      label={
        <span className={hideLabel ? "sr-only" : "inline-flex flex-wrap items-center gap-x-2"}>
          {label}
          {tag}
        </span>
      }
      hint={hint}
      error={error}
    >
      <Select
        id={id}
        options={options}
        placeholder={placeholder}
        invalid={Boolean(error)}
        disabled={disabled}
        aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined}
        {...register(name)}
      />
    </Field>
  );
}
