import type { CutOutcome } from "@ringdown/contracts";

export type OutcomeTone = "good" | "neutral" | "bad";

/** How each logged outcome reads, and what it says about the recipe. */
export const OUTCOMES: Record<CutOutcome, { label: string; tone: OutcomeTone }> = {
  clean: { label: "Ran clean", tone: "good" },
  chatter: { label: "Chatter", tone: "bad" },
  burn_melt: { label: "Burn or melt", tone: "bad" },
  poor_finish: { label: "Poor finish", tone: "bad" },
  cutter_broke: { label: "Cutter broke", tone: "bad" },
  feed_override: { label: "Ran at a feed override", tone: "neutral" },
  other: { label: "Other", tone: "neutral" },
};
