import { Navigate, Outlet, useLocation } from "react-router-dom";
import { Button } from "@/components/ui/button";
import { LoadingState } from "@/components/ui/spinner";
import { AppShell } from "@/features/shell/components/app-shell";
import { useMe } from "@/lib/auth";

/** Guards every signed-in page: nobody signed in (or a 401 anywhere) → the sign-in page. */
export function AppLayoutRoute() {
  const me = useMe();
  const location = useLocation();

  if (me.isPending) return <LoadingState label="Loading your shop…" className="min-h-dvh" />;
  if (me.isError && me.data === undefined) {
    return (
      <div role="alert" className="mx-auto flex max-w-md flex-col items-start gap-3 px-6 py-16">
        <h1 className="text-lg font-semibold text-ink">Ringdown cannot load your account</h1>
        <p className="text-sm text-muted">{me.error.message}</p>
        <Button onClick={() => void me.refetch()} pending={me.isFetching}>
          Try again
        </Button>
      </div>
    );
  }
  if (!me.data) {
    const next = location.pathname + location.search;
    return <Navigate to={next === "/" ? "/sign-in" : `/sign-in?next=${encodeURIComponent(next)}`} replace />;
  }
  return (
    <AppShell me={me.data}>
      <Outlet />
    </AppShell>
  );
}
