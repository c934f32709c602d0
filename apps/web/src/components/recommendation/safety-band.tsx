import { ShieldAlert } from "lucide-react";
import { SAFETY_NOTES } from "@ringdown/machining";
import { cn } from "@/lib/cn";

/**
 * The quiet, always-present caution beside recipe numbers: the engine's safety notes, and a
 * reminder that the cutter maker's data and local codes come first. Not a modal, never dismissed.
 */
export function SafetyBand({ notes = SAFETY_NOTES, className, compact = false }: { notes?: readonly string[]; className?: string; compact?: boolean }) {
  return (
    <aside
      aria-label="Safety"
      className={cn("rounded-md border border-rule bg-paper px-4 py-3 text-xs leading-relaxed text-ink print:leading-snug", className)}
    >
      <p className="mb-1 flex items-center gap-1.5 font-semibold">
        <ShieldAlert className="size-3.5 shrink-0 text-muted" aria-hidden />
        Starting points only
      </p>
      <ul className={cn("list-disc space-y-0.5 pl-5 text-muted", compact && "space-y-0")}>
        {notes.map((note) => (
          <li key={note}>{note}</li>
        ))}
      </ul>
    </aside>
  );
}
