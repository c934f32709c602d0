import { passwordResetBodySchema, passwordResetRequestBodySchema } from "@ringdown/contracts";
import { useState } from "react";
import { Link, useNavigate } from "react-router-dom";
import { Button } from "@/components/ui/button";
import { PasswordField, TextField } from "@/components/ui/field";
import { Form, FormError } from "@/components/ui/form";
import { LoadingState } from "@/components/ui/spinner";
import { isApiError } from "@/lib/api-client";
import { useRequestPasswordReset, useResetLink, useResetPassword } from "../api/password-reset";

/** Asks for a reset link. The answer never says whether the address has an account. */
export function RequestResetForm() {
  const request = useRequestPasswordReset();
  const [sent, setSent] = useState<{ email: string; message: string } | null>(null);
  if (sent) {
    return (
      <div role="status" className="flex flex-col gap-3 text-sm text-ink">
        <p>{sent.message}</p>
        <p className="text-muted">Sent to: {sent.email}. Nothing arriving? Check the spam folder, or ask again in a few minutes.</p>
        <Button variant="secondary" onClick={() => setSent(null)}>
          Use another address
        </Button>
      </div>
    );
  }
  return (
    <Form
      schema={passwordResetRequestBodySchema}
      defaultValues={{ email: "" }}
      aria-label="Ask for a password-reset link"
      className="flex flex-col gap-4"
      onSubmit={async (values) => {
        const answer = await request.mutateAsync(values.email);
        setSent({ email: values.email, message: answer.message });
      }}
    >
      {({ formState }) => (
        <>
          <FormError />
          <TextField name="email" label="E-mail" type="email" autoComplete="username" inputMode="email" autoFocus />
          <Button type="submit" pending={formState.isSubmitting} className="mt-1 w-full">
            Send the link
          </Button>
        </>
      )}
    </Form>
  );
}

/** Chooses the new password from a link; expired or used links say so and offer a new one. */
export function ResetPasswordForm({ token }: { token: string }) {
  const link = useResetLink(token);
  const reset = useResetPassword(token);
  const navigate = useNavigate();
  if (link.isPending) return <LoadingState label="Checking the link…" />;
  const problem = link.isError
    ? isApiError(link.error) && (link.error.status === 404 || link.error.status === 400)
      ? "This password-reset link is not valid. Check that the whole link was copied from the e-mail."
      : link.error.message
    : link.data.status === "expired"
      ? "This password-reset link has expired: links work for 1 hour."
      : link.data.status === "used"
        ? "This password-reset link has already been used: each link works once."
        : null;
  if (problem) {
    return (
      <div className="flex flex-col gap-4 text-sm">
        <p role="alert" className="text-ink">
          {problem}
        </p>
        <Link to="/forgot-password" className="font-medium text-brand underline underline-offset-4">
          Ask for a new link
        </Link>
      </div>
    );
  }
  return (
    <Form
      schema={passwordResetBodySchema}
      defaultValues={{ password: "" }}
      aria-label="Choose a new password"
      className="flex flex-col gap-4"
      onSubmit={async (values) => {
        await reset.mutateAsync(values.password);
        void navigate("/", { replace: true });
      }}
    >
      {({ formState }) => (
        <>
          <FormError />
          <PasswordField name="password" label="New password" autoComplete="new-password" hint="At least 10 characters." autoFocus />
          <p className="text-xs text-muted">Saving it signs you out on every other device.</p>
          <Button type="submit" pending={formState.isSubmitting} className="mt-1 w-full">
            Save the new password
          </Button>
        </>
      )}
    </Form>
  );
}
