import { Link, useParams } from "react-router-dom";
import { AuthLayout } from "@/features/auth/components/auth-layout";
import { ResetPasswordForm } from "@/features/password-reset/components/password-reset-forms";
import { useDocumentTitle } from "@/lib/use-document-title";

export function ResetPasswordRoute() {
  useDocumentTitle("Choose a new password");
  const { token = "" } = useParams();
  return (
    <AuthLayout
      title="Choose a new password"
      footer={
        <Link to="/sign-in" className="font-medium text-brand underline underline-offset-4">
          Back to sign-in
        </Link>
      }
    >
      <ResetPasswordForm token={token} />
    </AuthLayout>
  );
}
