import type { MigrationFn } from "umzug";
import type { Sequelize } from "sequelize";

/*
 * 1. Test-cut ladders remember the revision they were built from, the stepped parameter's window
 *    and how it was chosen.
 * 2. Recipe list indexes: one per sort order of the list (with the id as tie-breaker, as the query
 *    orders), over live rows only, so a page is read in order from an index even in a shop with
 *    10 000 recipes; and the status filter with the default newest-first order (what operators
 *    open), covering indexes for the machine, material and cutter filters and name sorts, and a
 *    trigram index on notes for the free-text search (0003 has one on name). They replace 0003's (shop_id, updated_at) and (shop_id, status) indexes, which lacked
 *    the tie-breaker. See recipes-list.test.ts for the EXPLAIN check.
 */
export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    ALTER TABLE test_cut_ladders
      ADD COLUMN base_revision integer NOT NULL DEFAULT 1,
      ADD COLUMN step_window jsonb NOT NULL DEFAULT '{}',
      ADD COLUMN note text NOT NULL DEFAULT '';
    CREATE INDEX test_cut_ladders_recipe_created_idx ON test_cut_ladders (shop_id, recipe_id, created_at DESC);

    DROP INDEX recipes_shop_updated_idx;
    DROP INDEX recipes_shop_status_idx;
    CREATE INDEX recipes_list_updated_idx ON recipes (shop_id, updated_at DESC, id DESC) WHERE deleted_at IS NULL;
    CREATE INDEX recipes_list_status_updated_idx ON recipes (shop_id, status, updated_at DESC, id DESC) WHERE deleted_at IS NULL;
    CREATE INDEX recipes_list_name_idx ON recipes (shop_id, name, id) WHERE deleted_at IS NULL;
    CREATE INDEX recipes_list_rpm_idx ON recipes (shop_id, rpm, id) WHERE deleted_at IS NULL;
    CREATE INDEX recipes_list_feed_idx ON recipes (shop_id, feed_mm_per_min, id) WHERE deleted_at IS NULL;
    CREATE INDEX recipes_list_life_cycle_idx ON recipes
      (shop_id, (CASE status WHEN 'draft' THEN 0 WHEN 'trial' THEN 1 WHEN 'proven' THEN 2 WHEN 'approved' THEN 3 ELSE 4 END), id)
      WHERE deleted_at IS NULL;
    CREATE INDEX recipes_list_machine_idx ON recipes (shop_id, machine_id, id) WHERE deleted_at IS NULL;
    CREATE INDEX recipes_list_material_idx ON recipes (shop_id, material_id, id) WHERE deleted_at IS NULL;
    CREATE INDEX recipes_list_cutter_idx ON recipes (shop_id, cutter_id, id) WHERE deleted_at IS NULL;
    CREATE INDEX recipes_notes_trgm_idx ON recipes USING gin (notes gin_trgm_ops);
    CREATE INDEX recipes_bin_idx ON recipes (shop_id, deleted_at DESC) WHERE deleted_at IS NOT NULL;
    CREATE INDEX cut_logs_shop_created_idx ON cut_logs (shop_id, created_at DESC, id DESC);
  `);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    DROP INDEX cut_logs_shop_created_idx;
    DROP INDEX recipes_bin_idx;
    DROP INDEX recipes_notes_trgm_idx;
    DROP INDEX recipes_list_cutter_idx;
    DROP INDEX recipes_list_material_idx;
    DROP INDEX recipes_list_machine_idx;
    DROP INDEX recipes_list_life_cycle_idx;
    DROP INDEX recipes_list_feed_idx;
    DROP INDEX recipes_list_rpm_idx;
    DROP INDEX recipes_list_name_idx;
    DROP INDEX recipes_list_status_updated_idx;
    DROP INDEX recipes_list_updated_idx;
    CREATE INDEX recipes_shop_updated_idx ON recipes (shop_id, updated_at DESC) WHERE deleted_at IS NULL;
    CREATE INDEX recipes_shop_status_idx ON recipes (shop_id, status) WHERE deleted_at IS NULL;
    DROP INDEX test_cut_ladders_recipe_created_idx;
    ALTER TABLE test_cut_ladders DROP COLUMN base_revision, DROP COLUMN step_window, DROP COLUMN note;
  `);
};
