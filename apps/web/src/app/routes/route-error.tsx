import { isRouteErrorResponse, useRouteError } from "react-router-dom";
import { Button } from "@/components/ui/button";

/** Shown when a page fails to load or render; keeps the person oriented and offers a way on. */
export function RouteError() {
  const error = useRouteError();
  // A chunk that no longer exists usually means Ringdown was updated since the page was opened.
  const staleBuild = error instanceof TypeError && /dynamically imported module|Importing a module script failed/i.test(error.message);
  const message = isRouteErrorResponse(error)
    ? `${error.status} ${error.statusText}`
    : staleBuild
      ? "Ringdown was updated since this page was opened. Reload to get the new version."
      : error instanceof Error
        ? error.message
        : "An unexpected error occurred.";
  return (
    <div role="alert" className="mx-auto flex max-w-md flex-col items-start gap-3 px-6 py-16">
      <h1 className="text-lg font-semibold text-ink">This page could not be shown</h1>
      <p className="text-sm text-muted">{message}</p>
      <p className="text-sm text-muted">Nothing you saved was lost.</p>
      <Button onClick={() => window.location.reload()}>Reload the page</Button>
    </div>
  );
}
