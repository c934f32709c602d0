import { cn } from "@/lib/cn";

/** Ringdown's mark: a decaying ring-down trace, then the name. */
export function Wordmark({ className, compact = false }: { className?: string; compact?: boolean }) {
  return (
    <span className={cn("inline-flex items-center gap-2 font-semibold tracking-tight text-brand", className)}>
      <svg viewBox="0 0 32 32" className="size-[1.3em] shrink-0" aria-hidden>
        <rect width="32" height="32" rx="7" fill="currentColor" />
        <path
          d="M4 16h3l2.2-8 3.4 16 3.2-12 2.6 8 2.2-5 2 3 1.8-1.5H28"
          fill="none"
          stroke="#F6F4EE"
          strokeWidth="2"
          strokeLinecap="round"
          strokeLinejoin="round"
        />
      </svg>
      {!compact && <span>Ringdown</span>}
    </span>
  );
}
