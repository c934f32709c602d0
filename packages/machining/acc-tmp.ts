import { directionalFactors } from "./src/dynamics/directional-factors.ts";
import { boundaryAtRpm, frequencyBandHz, frfOnGrid, frequencyGrid, solveBranches, refineHit, FAST_GRID, FINE_GRID } from "./src/dynamics/internal/stability-model.ts";
import { zoa3Cut, benchmarkCut } from "./src/dynamics/test-systems.fixture.ts";
function lim(cut: typeof zoa3Cut, imm: number, dir: "climb" | "conventional", rpm: number, density: { basePoints: number; perModePoints: number }) {
  const alpha = directionalFactors({ radialImmersion: imm, radialForceRatio: cut.radialForceRatio, millingDirection: dir });
  const band = frequencyBandHz(cut.modes, cut.flutes, rpm, rpm);
  const grid = frfOnGrid(cut.modes, frequencyGrid(cut.modes, band.loHz, band.hiHz, density));
  const br = solveBranches(grid, alpha, cut.flutes, cut.specificForceNPerMm2, false);
  const h = boundaryAtRpm(br, cut.flutes, rpm);
  if (!h) return null;
  return refineHit(h, br, cut.modes, alpha, cut.flutes, cut.specificForceNPerMm2, rpm, false).limitingDepthMm;
}
const REF = { basePoints: 4000, perModePoints: 8000 };
let worstFine = 0, worstFast = 0, wf = "", wfa = "";
for (const [cut, name] of [[benchmarkCut, "bench"], [zoa3Cut, "zoa3"]] as const) for (const imm of [0.05, 0.1, 0.4, 1]) for (const dir of ["climb", "conventional"] as const) for (let rpm = 2000; rpm <= 24000; rpm += 211) {
  const ref = lim(cut, imm, dir, rpm, REF); if (ref === null) continue;
  const fine = lim(cut, imm, dir, rpm, FINE_GRID)!; const fast = lim(cut, imm, dir, rpm, FAST_GRID)!;
  const ef = Math.abs(fine / ref - 1), ea = Math.abs(fast / ref - 1);
  if (ef > worstFine) { worstFine = ef; wf = `${name} ${rpm} ${imm} ${dir} ref ${ref.toFixed(3)} fine ${fine.toFixed(3)}`; }
  if (ea > worstFast) { worstFast = ea; wfa = `${name} ${rpm} ${imm} ${dir} ref ${ref.toFixed(3)} fast ${fast.toFixed(3)}`; }
}
console.log("fine worst", worstFine.toExponential(2), wf);
console.log("fast worst", worstFast.toExponential(2), wfa);
{
  const cut = benchmarkCut; const imm = 0.05; const dir = "climb"; const rpm = 13605;
  for (const [name, d] of [["ref", REF], ["fast", FAST_GRID]] as const) {
    const alpha = directionalFactors({ radialImmersion: imm, radialForceRatio: cut.radialForceRatio, millingDirection: dir });
    const band = frequencyBandHz(cut.modes, cut.flutes, rpm, rpm);
    const grid = frfOnGrid(cut.modes, frequencyGrid(cut.modes, band.loHz, band.hiHz, d));
    const br = solveBranches(grid, alpha, cut.flutes, cut.specificForceNPerMm2, false);
    const h = boundaryAtRpm(br, cut.flutes, rpm)!;
    console.log(name, h.chatterFrequencyHz.toFixed(3), h.lobeIndex, h.branch, h.limitingDepthMm.toFixed(3), "t=(f/fn-1)/ζ", ((h.chatterFrequencyHz / 922 - 1) / 0.011).toFixed(3));
  }
}
