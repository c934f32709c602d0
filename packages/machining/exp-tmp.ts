import { recommend, type RecommendInput } from "./src/index.ts";
import { demoAluminium, demoCutter, demoRouter, demoInput } from "./src/recommend/fixtures/demo-inputs.fixture.ts";
const recipes: RecommendInput[] = [];
const ops = ["profile", "slot", "adaptive", "pocket", "finish", "ramp"] as const;
for (const d of [3, 6, 8, 12]) for (const z of [1, 2, 3]) for (const op of ops) for (const aeFrac of [0.1, 0.3, 0.5]) {
  recipes.push({ cutter: { ...demoCutter, diameterMm: d, shankDiameterMm: d, flutes: z, fluteLengthMm: 3 * d, stickoutMm: 4 * d }, material: demoAluminium, machine: demoRouter, operation: op,
    engagement: { axialDepthMm: d * (op === "finish" ? 1.5 : 0.5), radialDepthMm: op === "slot" || op === "ramp" ? undefined : aeFrac * d }, workPosition: { xMm: 100 + 10 * recipes.length, yMm: 400 } });
}
const noModes = recipes.map((r) => ({ ...r, machine: { ...r.machine, modes: [] } }));
function cpu(list: RecommendInput[], reps = 5) {
  for (const r of list) recommend(r);
  const out: number[] = [];
  for (let k = 0; k < reps; k++) { const c0 = process.cpuUsage(); for (const r of list) recommend(r); const c = process.cpuUsage(c0); out.push((c.user + c.system) / list.length); }
  out.sort((a, b) => a - b); return out[Math.floor(out.length / 2)]!.toFixed(1);
}
let s = 0;
const c0 = process.cpuUsage(); for (let i = 0; i < 2e7; i++) s += Math.sqrt(i); const c = process.cpuUsage(c0);
console.log("calib ns/sqrt", ((c.user + c.system) / 2e7 * 1000).toFixed(2), s > 0);
console.log("all recipes us/call CPU", cpu(recipes));
console.log("no modes us/call CPU", cpu(noModes));
