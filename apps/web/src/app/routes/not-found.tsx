import { Link } from "react-router-dom";
import { Card } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { useDocumentTitle } from "@/lib/use-document-title";

export function NotFoundRoute() {
  useDocumentTitle("Page not found");
  return (
    <div className="mx-auto max-w-5xl">
      <Card>
        <EmptyState
          title="There is no page at this address"
          action={
            <Link to="/planner" className="text-sm font-medium text-brand underline underline-offset-4">
              Go to the planner
            </Link>
          }
        >
          <p>The link may be mistyped, or the page may have moved.</p>
        </EmptyState>
      </Card>
    </div>
  );
}
