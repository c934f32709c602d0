import type { ReactNode } from "react";
import { cn } from "@/lib/cn";

/**
 * A small label for a state. Tones follow the palette: colour only when it means something
 * (ok = within limits / approved, near = needs attention, limit = refused / unsafe, measured =
 * measured data, brand = the shop's own, neutral = everything else).
 */
export type BadgeTone = "neutral" | "brand" | "ok" | "near" | "limit" | "measured";

const tones: Record<BadgeTone, string> = {
  neutral: "border-rule bg-paper text-muted",
  brand: "border-brand/30 bg-brand-tint text-brand",
  // Text darker than the state colour itself: on its own tint, over paper, the plain colour falls
  // below 4.5:1 for small text (checked for every tone in src/lib/contrast.test.ts).
  ok: "border-ok/30 bg-ok/10 text-[#24654a]",
  near: "border-near/40 bg-near/10 text-[#8a5a12]",
  limit: "border-limit/30 bg-limit/10 text-[#a3342a]",
  measured: "border-measured/30 bg-measured/10 text-[#1b6580]",
};

export function Badge({ tone = "neutral", children, className, title }: { tone?: BadgeTone; children: ReactNode; className?: string; title?: string }) {
  return (
    <span
      title={title}
      className={cn("inline-flex items-center gap-1 rounded-full border px-2 py-0.5 text-xs font-medium whitespace-nowrap", tones[tone], className)}
    >
      {children}
    </span>
  );
}
