import { useId, type ReactNode, type TextareaHTMLAttributes } from "react";
import { get, useFormContext } from "react-hook-form";
import { cn } from "@/lib/cn";
import { Field } from "./field";

const textareaClass =
  "min-h-20 w-full rounded-md border border-rule-strong bg-surface px-3 py-2 text-sm text-ink placeholder:text-muted/80 " +
  "focus-visible:border-brand focus-visible:outline-2 focus-visible:outline-offset-0 focus-visible:outline-brand/30 " +
  "aria-[invalid=true]:border-limit disabled:bg-paper disabled:text-muted";

/** A multi-line text input registered with the surrounding <Form>. */
export function TextareaField({
  name,
  label,
  hint,
  className,
  ...rest
}: Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, "name" | "id"> & { name: string; label: ReactNode; hint?: ReactNode }) {
  const id = useId();
  const {
    register,
    formState: { errors },
  } = useFormContext();
  const error = (get(errors, name) as { message?: string } | undefined)?.message;
  return (
    <Field id={id} label={label} hint={hint} error={error}>
      <textarea
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined}
        className={cn(textareaClass, className)}
        {...rest}
        {...register(name)}
      />
    </Field>
  );
}
