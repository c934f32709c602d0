import type { Cutter, Role } from "@ringdown/contracts";

/** Tooling managers and owners curate the library: approve, retire, reinstate, delete. */
export function canCurate(role: Role): boolean {
  return role === "owner" || role === "tooling_manager";
}

/** Programmers may propose new cutters; curators may add them directly. */
export function canAddCutter(role: Role): boolean {
  return canCurate(role) || role === "programmer";
}

/** Curators edit any cutter; a programmer edits only cutters still proposed. */
export function canEditCutter(role: Role, cutter: Pick<Cutter, "status">): boolean {
  return canCurate(role) || (role === "programmer" && cutter.status === "proposed");
}
