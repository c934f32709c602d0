import type { Operation, RecipeStatus, Role } from "@ringdown/contracts";

export const statusLabels: Record<RecipeStatus, string> = {
  draft: "Draft",
  trial: "On trial",
  proven: "Proven",
  approved: "Approved",
  retired: "Retired",
};

export const operationLabels: Record<Operation, string> = {
  slot: "Slot",
  profile: "Profile",
  adaptive: "Constant-engagement clearing",
  pocket: "Pocket",
  finish: "Finish pass",
  drill: "Drill",
  ramp: "Ramp entry",
};

const rank: Record<Role, number> = { operator: 0, programmer: 1, tooling_manager: 2, owner: 3 };
export const atLeast = (role: Role, least: Role) => rank[role] >= rank[least];
