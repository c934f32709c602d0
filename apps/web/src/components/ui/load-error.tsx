import type { ReactNode } from "react";
import { cn } from "@/lib/cn";
import { Button } from "./button";

/**
 * What could not be loaded and why, announced as an alert, with a way to ask again when the
 * caller can (a query's refetch). The counterpart of LoadingState.
 */
export function LoadError({ children, onRetry, className }: { children: ReactNode; onRetry?: () => void; className?: string }) {
  return (
    <div role="alert" className={cn("flex flex-col items-start gap-3 text-sm", className)}>
      <p className="text-limit">{children}</p>
      {onRetry && (
        <Button variant="secondary" size="sm" onClick={onRetry}>
          Try again
        </Button>
      )}
    </div>
  );
}
