import { Navigate, Outlet, useLocation } from "react-router-dom";
import { Link } from "react-router-dom";
import { Button } from "@/components/ui/button";
import { LoadingState } from "@/components/ui/spinner";
import { Wordmark } from "@/components/ui/wordmark";
import { useMe } from "@/lib/auth";

/**
 * Signed-in pages without the rail: the printable setup card and the phone cut-log form that its
 * QR code opens. Nobody signed in → the sign-in page, which comes back here afterwards (the
 * address, query included, rides along in `next`).
 */
export function FocusedLayoutRoute() {
  const me = useMe();
  const location = useLocation();

  if (me.isPending) return <LoadingState label="Loading…" className="min-h-dvh" />;
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
    return <Navigate to={`/sign-in?next=${encodeURIComponent(next)}`} replace />;
  }
  return (
    <div className="min-h-dvh">
      <header className="flex h-14 items-center gap-3 border-b border-rule bg-paper px-4 print:hidden">
        <Link to="/recipes" aria-label="Ringdown: recipes">
          <Wordmark />
        </Link>
        <span className="ml-auto min-w-0 truncate text-sm text-muted">{me.data.user.name}</span>
      </header>
      <main id="main" tabIndex={-1} className="px-4 py-6 outline-none md:px-8 print:p-0">
        <Outlet />
      </main>
    </div>
  );
}
