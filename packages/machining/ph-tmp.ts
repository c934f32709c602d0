import { recommend, type RecommendInput } from "./src/index.ts";
import { PH } from "./src/recommend/recommend.ts";
import { demoAluminium, demoCutter, demoRouter } from "./src/recommend/fixtures/demo-inputs.fixture.ts";
const d = 6;
const r: RecommendInput = { cutter: { ...demoCutter, diameterMm: d, shankDiameterMm: d, flutes: 3, fluteLengthMm: 3 * d, stickoutMm: 4 * d }, material: demoAluminium, machine: demoRouter, operation: "slot", engagement: { axialDepthMm: 3 }, workPosition: { xMm: 100, yMm: 400 } };
for (let k = 0; k < 500; k++) recommend(r);
const acc: Record<string, number[]> = {};
for (let k = 0; k < 300; k++) { for (const key of Object.keys(PH)) delete PH[key]; recommend(r); for (const [p, v] of Object.entries(PH)) (acc[p] ??= []).push(v); }
console.log(Object.fromEntries(Object.entries(acc).map(([k, v]) => [k, ([...v].sort((a, b) => a - b)[Math.floor(v.length * 0.1)]! * 1000).toFixed(1)])));
console.log(recommend(r).adjustments);
