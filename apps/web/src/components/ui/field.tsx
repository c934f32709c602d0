import { Eye, EyeOff } from "lucide-react";
import { useId, useState, type InputHTMLAttributes, type ReactNode } from "react";
import { get, useFormContext } from "react-hook-form";
import { cn } from "@/lib/cn";

/** Label, control, hint and error, wired together for assistive technology. */
export function Field({
  id,
  label,
  hint,
  error,
  children,
}: {
  id: string;
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  children: ReactNode;
}) {
  return (
    <div className="flex flex-col gap-1.5">
      <label htmlFor={id} className="text-sm font-medium text-ink">
        {label}
      </label>
      {children}
      {hint && !error && (
        <p id={`${id}-hint`} className="text-xs text-muted">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="text-xs font-medium text-limit">
          {error}
        </p>
      )}
    </div>
  );
}

export const inputClass =
  "h-10 w-full rounded-md border border-rule-strong bg-surface px-3 text-sm text-ink placeholder:text-muted/80 " +
  "focus-visible:border-brand focus-visible:outline-2 focus-visible:outline-offset-0 focus-visible:outline-brand/30 " +
  "aria-[invalid=true]:border-limit disabled:bg-paper disabled:text-muted";

export type InputProps = InputHTMLAttributes<HTMLInputElement> & { invalid?: boolean; describedBy?: string };

export function Input({ className, invalid, describedBy, ...rest }: InputProps) {
  return (
    <input
      className={cn(inputClass, className)}
      aria-invalid={invalid || undefined}
      aria-describedby={describedBy}
      {...rest}
    />
  );
}

interface TextFieldProps extends Omit<InputHTMLAttributes<HTMLInputElement>, "name" | "id"> {
  name: string;
  label: ReactNode;
  hint?: ReactNode;
}

/** A text-like input registered with the surrounding <Form>. */
export function TextField({ name, label, hint, type = "text", ...rest }: TextFieldProps) {
  const id = useId();
  const {
    register,
    formState: { errors },
  } = useFormContext();
  const error = (get(errors, name) as { message?: string } | undefined)?.message;
  const describedBy = error ? `${id}-error` : hint ? `${id}-hint` : undefined;
  return (
    <Field id={id} label={label} hint={hint} error={error}>
      <Input id={id} type={type} invalid={Boolean(error)} describedBy={describedBy} {...rest} {...register(name)} />
    </Field>
  );
}

/** A password input with a show/hide toggle. */
export function PasswordField({ name, label, hint, ...rest }: Omit<TextFieldProps, "type">) {
  const id = useId();
  const [visible, setVisible] = useState(false);
  const {
    register,
    formState: { errors },
  } = useFormContext();
  const error = (get(errors, name) as { message?: string } | undefined)?.message;
  const describedBy = error ? `${id}-error` : hint ? `${id}-hint` : undefined;
  return (
    <Field id={id} label={label} hint={hint} error={error}>
      <div className="relative">
        <Input
          id={id}
          type={visible ? "text" : "password"}
          invalid={Boolean(error)}
          describedBy={describedBy}
          className="pr-11"
          {...rest}
          {...register(name)}
        />
        <button
          type="button"
          onClick={() => setVisible((v) => !v)}
          aria-pressed={visible}
          aria-label="Show password"
          className="absolute inset-y-0 right-0 flex w-10 cursor-pointer items-center justify-center rounded-r-md text-muted hover:text-ink"
        >
          {visible ? <EyeOff className="size-4" aria-hidden /> : <Eye className="size-4" aria-hidden />}
        </button>
      </div>
    </Field>
  );
}
