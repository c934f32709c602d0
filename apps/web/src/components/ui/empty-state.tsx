import type { LucideIcon } from "lucide-react";
import type { ReactNode } from "react";

/** What an area shows when it has nothing yet: what will be here and what to do next. */
export function EmptyState({
  icon: Icon,
  title,
  children,
  action,
}: {
  icon?: LucideIcon;
  title: string;
  children?: ReactNode;
  action?: ReactNode;
}) {
  return (
    <div className="flex flex-col items-center px-6 py-12 text-center">
      {Icon && (
        <div className="mb-4 flex size-12 items-center justify-center rounded-full border border-rule bg-paper text-brand">
          <Icon className="size-6" aria-hidden />
        </div>
      )}
      <h2 className="text-base font-semibold text-ink">{title}</h2>
      {children && <div className="mt-2 max-w-prose text-sm leading-relaxed text-muted">{children}</div>}
      {action && <div className="mt-5">{action}</div>}
    </div>
  );
}
