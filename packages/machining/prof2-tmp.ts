import { recommend, type RecommendInput } from "./src/index.ts";
import { demoAluminium, demoCutter, demoRouter } from "./src/recommend/fixtures/demo-inputs.fixture.ts";
const recipes: RecommendInput[] = [];
const ops = ["profile", "slot", "adaptive", "pocket", "finish", "ramp"] as const;
for (const d of [3, 6, 8, 12]) for (const z of [1, 2, 3]) for (const op of ops) for (const aeFrac of [0.1, 0.3, 0.5]) {
  recipes.push({ cutter: { ...demoCutter, diameterMm: d, shankDiameterMm: d, flutes: z, fluteLengthMm: 3 * d, stickoutMm: 4 * d }, material: demoAluminium, machine: demoRouter, operation: op,
    engagement: { axialDepthMm: d * (op === "finish" ? 1.5 : 0.5), radialDepthMm: op === "slot" || op === "ramp" ? undefined : aeFrac * d }, workPosition: { xMm: 100 + 10 * recipes.length, yMm: 400 } });
}
for (let k = 0; k < 20; k++) for (const r of recipes) recommend(r);
