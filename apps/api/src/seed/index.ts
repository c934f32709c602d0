import { seedLibrary } from "./library.js";
import { seedPeopleAndShops } from "./people-and-shops.js";
import { seedRecipes } from "./recipes.js";
import { seedTeamPlans } from "./team-plans.js";

/** Seed modules, one per area, run in order. Later areas append theirs here. */
const steps: Array<{ area: string; run: () => Promise<number> }> = [
  { area: "people and shops", run: seedPeopleAndShops },
  { area: "team plans", run: () => seedTeamPlans() },
  { area: "library (machines, cutters, assemblies)", run: seedLibrary },
  { area: "recipes (revisions, status history, cut logs)", run: () => seedRecipes() },
];

/** Loads the invented demo scenario; safe to run on every start. */
export async function seedDemo(log: (line: string) => void = () => undefined): Promise<void> {
  for (const step of steps) {
    const created = await step.run();
    log(created > 0 ? `demo seed: ${step.area} — ${created} records created` : `demo seed: ${step.area} — already present`);
  }
}
