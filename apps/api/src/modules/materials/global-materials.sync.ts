import { materialBodySchema } from "@ringdown/contracts";
import type { Sequelize } from "sequelize";
import { globalMaterials } from "../../seed/global-materials.js";

/**
 * Upserts the global (read-only) material library by `global_key`. It is reference data every
 * database needs, not demo data, so it runs after every migration run (server start and the test
 * set-up both call `migrate`). Rows whose values already match are left untouched (updated_at
 * keeps its meaning); keys no longer in the list are kept, since recipes may use them.
 * Returns how many rows were inserted or changed.
 */
export async function syncGlobalMaterials(sequelize: Sequelize): Promise<number> {
  let changed = 0;
  await sequelize.transaction(async (transaction) => {
    for (const { key, ...raw } of globalMaterials) {
      // The seed file is typed, but run it through the contract too: a bad row must fail loudly.
      const m = materialBodySchema.parse(raw);
      const [, affected] = await sequelize.query(
        `INSERT INTO materials (global_key, shop_id, name, material_group, hardness, cutting_speed, chip_load,
                                kc11_n_per_mm2, mc, unit_power_j_per_mm3, min_chip_thickness_mm, source_note)
         VALUES ($1, NULL, $2, $3, $4, $5::jsonb, $6::jsonb, $7, $8, $9, $10, $11)
         ON CONFLICT (global_key) DO UPDATE SET
           name = EXCLUDED.name, material_group = EXCLUDED.material_group, hardness = EXCLUDED.hardness,
           cutting_speed = EXCLUDED.cutting_speed, chip_load = EXCLUDED.chip_load,
           kc11_n_per_mm2 = EXCLUDED.kc11_n_per_mm2, mc = EXCLUDED.mc,
           unit_power_j_per_mm3 = EXCLUDED.unit_power_j_per_mm3,
           min_chip_thickness_mm = EXCLUDED.min_chip_thickness_mm, source_note = EXCLUDED.source_note,
           deleted_at = NULL, updated_at = now()
         WHERE (materials.name, materials.material_group, materials.hardness, materials.cutting_speed,
                materials.chip_load, materials.kc11_n_per_mm2, materials.mc, materials.unit_power_j_per_mm3,
                materials.min_chip_thickness_mm, materials.source_note, materials.deleted_at)
           IS DISTINCT FROM
               (EXCLUDED.name, EXCLUDED.material_group, EXCLUDED.hardness, EXCLUDED.cutting_speed,
                EXCLUDED.chip_load, EXCLUDED.kc11_n_per_mm2, EXCLUDED.mc, EXCLUDED.unit_power_j_per_mm3,
                EXCLUDED.min_chip_thickness_mm, EXCLUDED.source_note, NULL::timestamptz)`,
        {
          bind: [
            key,
            m.name,
            m.group,
            m.hardness,
            JSON.stringify(m.cuttingSpeed),
            JSON.stringify(m.chipLoad),
            m.kc11NPerMm2,
            m.mc,
            m.unitPowerJPerMm3,
            m.minChipThicknessMm,
            m.sourceNote,
          ],
          transaction,
        },
      );
      changed += typeof affected === "number" ? affected : 0;
    }
  });
  return changed;
}
