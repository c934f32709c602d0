import type { ReactNode } from "react";

/** A page's title, one line on what it is for, and its main actions on the right. */
export function PageHeader({ title, description, actions, eyebrow }: { title: ReactNode; description?: ReactNode; actions?: ReactNode; eyebrow?: ReactNode }) {
  return (
    <header className="flex flex-wrap items-end justify-between gap-x-6 gap-y-3">
      <div className="min-w-0">
        {eyebrow && <div className="mb-1 text-sm text-muted">{eyebrow}</div>}
        <h1 className="text-xl font-semibold text-ink">{title}</h1>
        {description && <div className="mt-1 max-w-prose text-sm text-muted">{description}</div>}
      </div>
      {actions && <div className="flex flex-wrap items-center gap-2">{actions}</div>}
    </header>
  );
}

/** A quiet, dismissable confirmation of what just happened (announced to screen readers). */
const noticeTones = {
  ok: "border-ok/30 bg-ok/5 text-ink",
  near: "border-near/50 bg-near/10 text-ink",
  limit: "border-limit/40 bg-limit/5 text-limit",
} as const;

export function Notice({ children, onDismiss, tone = "ok" }: { children: ReactNode; onDismiss?: () => void; tone?: keyof typeof noticeTones }) {
  return (
    <div
      role={tone === "limit" ? "alert" : "status"}
      className={`flex items-start justify-between gap-3 rounded-md border px-3 py-2 text-sm ${noticeTones[tone]}`}
    >
      <div>{children}</div>
      {onDismiss && (
        <button type="button" onClick={onDismiss} className="cursor-pointer text-xs font-medium text-ink/75 underline hover:text-ink">
          Dismiss
        </button>
      )}
    </div>
  );
}
