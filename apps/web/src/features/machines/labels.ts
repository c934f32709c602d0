import { axisDrives, machineKinds, modeSources, type MachineKind, type Role } from "@ringdown/contracts";

export const kindLabels: Record<MachineKind, string> = {
  gantry_router: "Gantry router",
  bench_mill: "Bench mill",
  knee_mill: "Knee mill",
  machining_centre: "Machining centre",
  other: "Other",
};
export const kindOptions = machineKinds.map((value) => ({ value, label: kindLabels[value] }));

export const driveLabels: Record<(typeof axisDrives)[number], string> = {
  belt: "Belt",
  lead_screw: "Lead screw",
  ball_screw: "Ball screw",
  rack_pinion: "Rack and pinion",
};
export const driveOptions = axisDrives.map((value) => ({ value, label: driveLabels[value] }));

export const sourceLabels: Record<(typeof modeSources)[number], string> = {
  manual: "Entered by hand",
  estimated: "Estimate",
  measured: "Measured",
  fitted: "Fitted to a test",
};
export const sourceOptions = modeSources.map((value) => ({ value, label: sourceLabels[value] }));

export const directionOptions = [
  { value: "x", label: "X" },
  { value: "y", label: "Y" },
  { value: "z", label: "Z" },
];

/** Tooling managers and owners add and edit machines. */
export function canEditMachines(role: Role): boolean {
  return role === "owner" || role === "tooling_manager";
}
