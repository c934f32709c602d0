import { cutterShapes, cutterStatuses, toolMaterials, type CutterShape, type CutterStatus, type ToolMaterial } from "@ringdown/contracts";
import type { BadgeTone } from "@/components/ui/badge";

export const shapeLabels: Record<CutterShape, string> = {
  flat: "Flat end",
  ball: "Ball end",
  bull_nose: "Bull nose",
  vee: "V-bit",
  chamfer: "Chamfer",
  drill: "Drill",
  compression: "Compression spiral",
  up_spiral: "Up-cut spiral",
  down_spiral: "Down-cut spiral",
};

export const toolMaterialLabels: Record<ToolMaterial, string> = {
  carbide: "Carbide",
  hss: "HSS",
};

export const statusLabels: Record<CutterStatus, string> = {
  proposed: "Proposed",
  approved: "Approved",
  retired: "Retired",
};

/** Approved is the state that matters at the machine; proposed waits for a decision. */
export const statusTones: Record<CutterStatus, BadgeTone> = {
  proposed: "near",
  approved: "ok",
  retired: "neutral",
};

export const shapeOptions = cutterShapes.map((value) => ({ value, label: shapeLabels[value] }));
export const toolMaterialOptions = toolMaterials.map((value) => ({ value, label: toolMaterialLabels[value] }));
export const statusOptions = cutterStatuses.map((value) => ({ value, label: statusLabels[value] }));

/** Shapes whose point angle matters (V-bits, chamfer cutters, drills). */
export const shapesWithTipAngle: ReadonlySet<CutterShape> = new Set(["vee", "chamfer", "drill"]);
