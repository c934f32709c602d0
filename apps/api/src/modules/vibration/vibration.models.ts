import type { Sequelize } from "sequelize";
import { initBacklashReadingModel } from "../backlash/backlash-reading.model.js";
import { initRecordingModel } from "../recordings/recording.model.js";
import { initStiffnessReadingModel } from "../stiffness/stiffness-reading.model.js";

/** Registers the vibration-profile models (stiffness and backlash readings, recordings). */
export function initVibrationModels(sequelize: Sequelize): void {
  initStiffnessReadingModel(sequelize);
  initBacklashReadingModel(sequelize);
  initRecordingModel(sequelize);
}
