import { recommend, validateRecommendInput, type RecommendInput } from "./src/index.ts";
import { demoInput, demoRouter } from "./src/recommend/fixtures/demo-inputs.fixture.ts";
const simple: RecommendInput = { ...demoInput, machine: { ...demoRouter, stiffnessNPerMm: { x: 1e6, y: 1e6 }, modes: [] }, engagement: { axialDepthMm: 1, radialDepthMm: 1 }, preferences: { cuttingSpeedMPerMin: 300 } };
const withModes: RecommendInput = { ...simple, machine: { ...simple.machine, modes: demoRouter.modes } };
function cpu(f: () => void, n: number) { for (let i = 0; i < n / 10; i++) f(); const c0 = process.cpuUsage(); for (let i = 0; i < n; i++) f(); const c = process.cpuUsage(c0); return ((c.user + c.system) / n).toFixed(2); }
let s = 0;
console.log("calib sqrt-iter ns", cpu(() => { for (let i = 0; i < 1000; i++) s += Math.sqrt(i); }, 20000), "(per 1000)");
console.log("validate", cpu(() => validateRecommendInput(simple), 20000));
console.log("simple nomodes", cpu(() => recommend(simple), 5000), recommend(simple).adjustments);
console.log("simple modes", cpu(() => recommend(withModes), 5000), recommend(withModes).adjustments);
console.log("simple modes + read explain", cpu(() => recommend(withModes).explain.rpm, 5000));
