import { Link } from "react-router-dom";
import { AuthLayout } from "@/features/auth/components/auth-layout";
import { RequestResetForm } from "@/features/password-reset/components/password-reset-forms";
import { useDocumentTitle } from "@/lib/use-document-title";

export function ForgotPasswordRoute() {
  useDocumentTitle("Reset your password");
  return (
    <AuthLayout
      title="Reset your password"
      footer={
        <Link to="/sign-in" className="font-medium text-brand underline underline-offset-4">
          Back to sign-in
        </Link>
      }
    >
      <p className="mb-4 text-sm text-muted">Enter the address you sign in with; we send a link to choose a new password.</p>
      <RequestResetForm />
    </AuthLayout>
  );
}
