import type { ReactNode } from "react";
import { Wordmark } from "@/components/ui/wordmark";

/** The frame of the signed-out pages: the wordmark, one card, a line on what Ringdown is. */
export function AuthLayout({ title, children, footer }: { title: string; children: ReactNode; footer?: ReactNode }) {
  return (
    <div className="flex min-h-dvh flex-col items-center justify-center px-4 py-10">
      <div className="w-full max-w-sm">
        <div className="mb-8 flex flex-col items-center gap-2 text-center">
          <Wordmark className="text-2xl" />
          <p className="text-sm text-muted">Feeds and speeds held within each machine's measured limits.</p>
        </div>
        <main className="rounded-lg border border-rule bg-surface px-6 py-7 shadow-[0_1px_0_0_var(--color-rule)]">
          <h1 className="mb-5 text-lg font-semibold text-ink">{title}</h1>
          {children}
        </main>
        {footer && <div className="mt-5 text-center text-sm text-muted">{footer}</div>}
      </div>
    </div>
  );
}
