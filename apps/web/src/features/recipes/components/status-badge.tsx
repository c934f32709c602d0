import type { RecipeStatus } from "@ringdown/contracts";
import { cn } from "@/lib/cn";
import { statusLabels } from "../labels";

/*
 * The text colours are darker shades of the state colours: on their own 10 % tint the state
 * colours themselves fall just short of 4.5:1 (WCAG 2.2 AA for small text).
 */
const tones: Record<RecipeStatus, string> = {
  draft: "border-rule bg-paper text-muted",
  trial: "border-brand/30 bg-brand-tint text-brand",
  proven: "border-measured/30 bg-measured/10 text-[#185a71]",
  approved: "border-ok/40 bg-ok/10 text-[#24684b]",
  retired: "border-rule bg-paper text-muted line-through decoration-muted/60",
};

export function RecipeStatusBadge({ status, className }: { status: RecipeStatus; className?: string }) {
  return (
    <span className={cn("inline-flex items-center rounded-full border px-2 py-0.5 text-xs font-medium whitespace-nowrap", tones[status], className)}>
      {statusLabels[status]}
    </span>
  );
}
