import { zodResolver } from "@hookform/resolvers/zod";
import { TriangleAlert } from "lucide-react";
import type { FormHTMLAttributes, ReactNode } from "react";
import {
  FormProvider,
  get,
  useForm,
  useFormContext,
  type DefaultValues,
  type FieldValues,
  type Path,
  type UseFormReturn,
} from "react-hook-form";
import type { z } from "zod";
import { isApiError } from "@/lib/api-client";

/** Where server messages that belong to no field are kept. */
export const SERVER_ERROR_KEY = "root.server" as const;

type AnyFormSchema = z.ZodType<FieldValues, FieldValues>;

/**
 * Puts a failed submission's errors where the person will see them: each
 * server field error on its field (the first one focused), everything else —
 * the message, unknown fields, network trouble — in the form-level alert.
 * A field counts as present when the form holds a value for it, so every form
 * passes `defaultValues` for all its fields.
 */
export function applySubmitError<T extends FieldValues>(form: UseFormReturn<T, unknown, FieldValues>, error: unknown): void {
  if (!isApiError(error)) {
    const detail = error instanceof Error && error.message ? ` (${error.message})` : "";
    form.setError(SERVER_ERROR_KEY, { type: "server", message: `Something went wrong${detail}. Nothing was saved; try again.` });
    return;
  }
  const values = form.getValues();
  const unmatched: string[] = [];
  let focused = false;
  for (const [path, message] of Object.entries(error.fields)) {
    if (path !== "" && get(values, path) !== undefined) {
      form.setError(path as Path<T>, { type: "server", message }, { shouldFocus: !focused });
      focused = true;
    } else {
      unmatched.push(message);
    }
  }
  // The overall message is left out when a field already says exactly that.
  const shownOnFields = new Set(Object.values(error.fields).filter((m) => !unmatched.includes(m)));
  const summary = [error.message, ...unmatched]
    .filter((m, i, all) => m && all.indexOf(m) === i && !shownOnFields.has(m))
    .join(" ");
  if (summary) form.setError(SERVER_ERROR_KEY, { type: error.code, message: summary });
}

export interface FormProps<S extends AnyFormSchema>
  extends Omit<FormHTMLAttributes<HTMLFormElement>, "onSubmit" | "children" | "defaultValue"> {
  /** Contract schema: validates on the client with the exact rules the server applies. */
  schema: S;
  /** Resolve when saved; throw (an ApiError) to have the errors shown on the form. */
  onSubmit: (values: z.output<S>) => Promise<unknown> | unknown;
  /** Give every field a default, so server errors can find their field. */
  defaultValues: DefaultValues<z.input<S>>;
  children: (form: UseFormReturn<z.input<S>, unknown, z.output<S>>) => ReactNode;
}

/** The one form wrapper: zod schema in, react-hook-form context out, server errors mapped back. */
export function Form<S extends AnyFormSchema>({ schema, onSubmit, defaultValues, children, ...rest }: FormProps<S>) {
  const form = useForm<z.input<S>, unknown, z.output<S>>({
    resolver: zodResolver(schema),
    defaultValues,
    // Check on submit, then live while correcting: no errors for fields merely passed through.
    mode: "onSubmit",
    reValidateMode: "onChange",
  });
  const submit = form.handleSubmit(async (values) => {
    try {
      await onSubmit(values);
    } catch (error) {
      applySubmitError(form as unknown as UseFormReturn<FieldValues, unknown, FieldValues>, error);
    }
  });
  return (
    <FormProvider {...form}>
      <form noValidate {...rest} onSubmit={(event) => void submit(event)}>
        {children(form)}
      </form>
    </FormProvider>
  );
}

/** The form-level alert: shown when the server refused the submission as a whole. */
export function FormError() {
  const {
    formState: { errors },
  } = useFormContext();
  const message = (get(errors, SERVER_ERROR_KEY) as { message?: string } | undefined)?.message;
  if (!message) return null;
  return (
    <div role="alert" className="flex items-start gap-2 rounded-md border border-limit/40 bg-limit/5 px-3 py-2 text-sm text-limit">
      <TriangleAlert className="mt-0.5 size-4 shrink-0" aria-hidden />
      <p>{message}</p>
    </div>
  );
}

/** Returns the form-level server error's code, e.g. to offer a different action on 429. */
export function isFormErrorCode(form: UseFormReturn<FieldValues>, code: string): boolean {
  return (get(form.formState.errors, SERVER_ERROR_KEY) as { type?: string } | undefined)?.type === code;
}
