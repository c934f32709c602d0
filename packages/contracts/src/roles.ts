import { z } from "zod";

/** Roles a person holds in one shop (per membership). */
export const roles = ["owner", "tooling_manager", "programmer", "operator"] as const;
export const roleSchema = z.enum(roles);
export type Role = z.infer<typeof roleSchema>;

export const roleLabels: Record<Role, string> = {
  owner: "Owner",
  tooling_manager: "Tooling manager",
  programmer: "Programmer",
  operator: "Operator",
};
