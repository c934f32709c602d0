/** Cautions shown wherever a recipe is shown. */
export const SAFETY_NOTES: readonly string[] = [
  "These are starting points computed from your measurements, not guarantees: make a test cut and adjust.",
  "Never exceed the cutter maker's or the spindle maker's limits; their data and your local codes take precedence over these numbers.",
  "Keep guards in place, wear eye protection, and make sure the work is held firmly before the spindle starts.",
  "Stop at once if the cut screams, chatters or the part moves; reduce the depth or change the speed before trying again.",
];
