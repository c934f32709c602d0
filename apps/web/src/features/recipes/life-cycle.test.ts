import { describe, expect, it } from "vitest";
import { canDeleteRecipe, lifeActions } from "./life-cycle";

const noCuts = { cleanCutsOnMachine: 0, machineName: "Gantry A" };
const cut = { cleanCutsOnMachine: 1, machineName: "Gantry A" };
const steps = (status: Parameters<typeof lifeActions>[0], role: Parameters<typeof lifeActions>[1], ev = cut) => lifeActions(status, role, ev).map((a) => a.to);

// The rules mirror the server's (apps/api recipes.service RULES); these pin the ones the page depends on.
describe("recipe life-cycle actions", () => {
  it("lets a programmer start a trial, but not retire", () => {
    expect(steps("draft", "programmer")).toEqual(["trial"]);
    expect(steps("draft", "tooling_manager")).toEqual(["trial", "retired"]);
  });

  it("offers 'Mark proven' disabled, with the reason, until a clean cut is logged on the machine", () => {
    const proven = lifeActions("trial", "programmer", noCuts).find((a) => a.to === "proven")!;
    expect(proven.disabledReason).toBe("Log a clean cut of this recipe on Gantry A first.");
    expect(lifeActions("trial", "programmer", cut).find((a) => a.to === "proven")!.disabledReason).toBeNull();
  });

  it("leaves approval to tooling managers and owners, and asks for a comment when sending back", () => {
    expect(steps("proven", "programmer")).toEqual(["trial"]);
    expect(steps("proven", "owner")).toEqual(["approved", "trial", "retired"]);
    expect(lifeActions("proven", "tooling_manager", cut).find((a) => a.to === "trial")!.comment).toBe("required");
    expect(steps("approved", "programmer")).toEqual([]);
  });

  it("gives operators no status steps at all", () => {
    for (const status of ["draft", "trial", "proven", "approved", "retired"] as const) expect(steps(status, "operator")).toEqual([]);
  });

  it("lets programmers delete only drafts and trials", () => {
    expect(canDeleteRecipe("programmer", "trial")).toBe(true);
    expect(canDeleteRecipe("programmer", "approved")).toBe(false);
    expect(canDeleteRecipe("tooling_manager", "approved")).toBe(true);
    expect(canDeleteRecipe("operator", "draft")).toBe(false);
  });
});
