import type { MigrationFn } from "umzug";
import type { Sequelize } from "sequelize";

/*
 * The recipe list's operation filter: without an index on operation, counting a 10 000-recipe
 * shop's pockets read the table (see recipes-list.test.ts). Same shape as the status index.
 */
export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    CREATE INDEX recipes_list_operation_idx ON recipes (shop_id, operation, updated_at DESC, id DESC) WHERE deleted_at IS NULL;
  `);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`DROP INDEX recipes_list_operation_idx;`);
};
