import type { CutOutcome } from "@ringdown/contracts";
import { cn } from "@/lib/cn";
import { OUTCOMES } from "../outcomes";

// Darker shades of the state colours for the text: on their own 10 % tint the state colours
// fall just short of 4.5:1 (WCAG 2.2 AA, small text).
const toneClass = {
  good: "border-ok/40 bg-ok/10 text-[#24684b]",
  neutral: "border-rule-strong/50 bg-paper text-ink",
  bad: "border-limit/40 bg-limit/10 text-[#9f3127]",
} as const;

export function OutcomeBadge({ outcome, className }: { outcome: CutOutcome; className?: string }) {
  const o = OUTCOMES[outcome];
  return (
    <span className={cn("inline-flex items-center rounded-full border px-2 py-0.5 text-xs font-medium whitespace-nowrap", toneClass[o.tone], className)}>
      {o.label}
    </span>
  );
}
