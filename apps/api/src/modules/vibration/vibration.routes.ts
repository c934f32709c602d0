import type { Router } from "express";
import { readConfig } from "../../config/env.js";
import type { Storage } from "../../storage/storage.js";
import { LocalDirectoryStorage } from "../../storage/local-directory-storage.js";
import { registerBacklashRoutes } from "../backlash/backlash.router.js";
import { registerCeilingRoutes } from "../ceilings/ceilings.router.js";
import { registerModeRoutes } from "../modes/modes.router.js";
import { registerRecordingRoutes } from "../recordings/recordings.router.js";
import { registerStiffnessRoutes } from "../stiffness/stiffness.router.js";

/**
 * A machine's vibration profile: stiffness readings and map, backlash readings, modes, ceilings,
 * recordings and their analysis. Files go to `storage`, by default the configured storage directory.
 */
export function registerVibrationRoutes(router: Router, deps: { storage?: Storage; storageDir?: string } = {}): void {
  const storage = deps.storage ?? new LocalDirectoryStorage(deps.storageDir ?? readConfig().storageDir);
  registerStiffnessRoutes(router);
  registerBacklashRoutes(router);
  registerModeRoutes(router);
  registerCeilingRoutes(router);
  registerRecordingRoutes(router, { storage });
}
