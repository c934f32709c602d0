import { Link, Navigate, useLocation, useNavigate } from "react-router-dom";
import { LoadingState } from "@/components/ui/spinner";
import { AuthLayout } from "@/features/auth/components/auth-layout";
import { SignUpForm } from "@/features/auth/components/sign-up-form";
import { useMe } from "@/lib/auth";
import { useDocumentTitle } from "@/lib/use-document-title";
import { safeNext } from "../safe-next";

export function SignUpRoute() {
  useDocumentTitle("Create an account");
  const { search } = useLocation();
  const navigate = useNavigate();
  const me = useMe();
  const next = safeNext(search);

  if (me.isPending) return <LoadingState className="min-h-dvh" />;
  if (me.data) return <Navigate to={next} replace />;

  return (
    <AuthLayout
      title="Create an account"
      footer={
        <>
          Already have an account?{" "}
          <Link to={`/sign-in${search}`} className="font-medium text-brand underline underline-offset-4">
            Sign in
          </Link>
        </>
      }
    >
      <SignUpForm onSignedUp={() => void navigate(next, { replace: true })} />
    </AuthLayout>
  );
}
