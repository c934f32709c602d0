import { Link, Navigate, useLocation, useNavigate } from "react-router-dom";
import { LoadingState } from "@/components/ui/spinner";
import { AuthLayout } from "@/features/auth/components/auth-layout";
import { SignInForm } from "@/features/auth/components/sign-in-form";
import { useMe } from "@/lib/auth";
import { useDocumentTitle } from "@/lib/use-document-title";
import { safeNext } from "../safe-next";

export function SignInRoute() {
  useDocumentTitle("Sign in");
  const { search } = useLocation();
  const navigate = useNavigate();
  const me = useMe();
  const next = safeNext(search);

  if (me.isPending) return <LoadingState className="min-h-dvh" />;
  if (me.data) return <Navigate to={next} replace />;

  return (
    <AuthLayout
      title="Sign in"
      footer={
        <>
          New to Ringdown?{" "}
          <Link to={`/sign-up${search}`} className="font-medium text-brand underline underline-offset-4">
            Create an account
          </Link>
        </>
      }
    >
      <SignInForm onSignedIn={() => void navigate(next, { replace: true })} />
      <p className="mt-4 text-center text-sm">
        <Link to="/forgot-password" className="font-medium text-brand underline underline-offset-4">
          Forgot password?
        </Link>
      </p>
    </AuthLayout>
  );
}
