import type { RecipeStatus, Role } from "@ringdown/contracts";
import { atLeast } from "./labels";

export interface LifeAction {
  to: RecipeStatus;
  label: string;
  /** What the step means, shown in its confirmation. */
  explain: string;
  comment: "required" | "optional";
  primary: boolean;
  danger: boolean;
  /** Why the step cannot be taken yet (the button is shown disabled with this). */
  disabledReason: string | null;
}

interface Rule {
  least: Role;
  label: string;
  explain: string;
  comment?: "required";
  primary?: boolean;
  danger?: boolean;
}

/** The recipe's life, as the server enforces it: draft → trial → proven → approved, retired at any point. */
const RULES: Record<RecipeStatus, Partial<Record<RecipeStatus, Rule>>> = {
  draft: {
    trial: { least: "programmer", label: "Start trial", explain: "Put the recipe on trial: cut it on scrap, log how it went.", primary: true },
    retired: { least: "tooling_manager", label: "Retire", explain: "Take the recipe out of use. It can be reopened as a draft later.", danger: true },
  },
  trial: {
    proven: {
      least: "programmer",
      label: "Mark proven",
      explain: "Logged cuts show the recipe runs clean on its machine; it goes to a tooling manager for approval.",
      primary: true,
    },
    draft: { least: "programmer", label: "Back to draft", explain: "Take the recipe off trial to rework it." },
    retired: { least: "tooling_manager", label: "Retire", explain: "Take the recipe out of use. It can be reopened as a draft later.", danger: true },
  },
  proven: {
    approved: { least: "tooling_manager", label: "Approve", explain: "Approved recipes are what operators see and run.", primary: true },
    trial: { least: "programmer", label: "Send back to trial", explain: "Say what has to be tried again.", comment: "required" },
    retired: { least: "tooling_manager", label: "Retire", explain: "Take the recipe out of use. It can be reopened as a draft later.", danger: true },
  },
  approved: {
    trial: { least: "tooling_manager", label: "Send back to trial", explain: "Operators will no longer see it. Say why.", comment: "required" },
    retired: { least: "tooling_manager", label: "Retire", explain: "Operators will no longer see it. It can be reopened as a draft later.", danger: true },
  },
  retired: {
    draft: { least: "tooling_manager", label: "Reopen as draft", explain: "Bring the recipe back as a draft, to go through trial and approval again." },
  },
};

/**
 * The status steps this person may take on a recipe now. "Mark proven" is offered but disabled,
 * with the reason, until a clean cut of the recipe is logged on its machine.
 */
export function lifeActions(status: RecipeStatus, role: Role, evidence: { cleanCutsOnMachine: number; machineName: string }): LifeAction[] {
  const out: LifeAction[] = [];
  for (const [to, rule] of Object.entries(RULES[status]) as Array<[RecipeStatus, Rule]>) {
    if (!atLeast(role, rule.least)) continue;
    out.push({
      to,
      label: rule.label,
      explain: rule.explain,
      comment: rule.comment ?? "optional",
      primary: rule.primary ?? false,
      danger: rule.danger ?? false,
      disabledReason:
        to === "proven" && evidence.cleanCutsOnMachine === 0 ? `Log a clean cut of this recipe on ${evidence.machineName} first.` : null,
    });
  }
  return out;
}

/** Who may edit, copy, restore and build ladders: programmers and up (the server checks too). */
export const canEditRecipes = (role: Role) => atLeast(role, "programmer");

/** Programmers may delete drafts and trials; anything further along needs a tooling manager or owner. */
export const canDeleteRecipe = (role: Role, status: RecipeStatus) => atLeast(role, status === "draft" || status === "trial" ? "programmer" : "tooling_manager");
