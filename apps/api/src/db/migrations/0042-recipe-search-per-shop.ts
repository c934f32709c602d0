import type { MigrationFn } from "umzug";
import type { Sequelize } from "sequelize";

/*
 * Free-text search of the recipe list, per shop. The trigram indexes of 0003 and 0010 cover every
 * shop's names and notes: a word common in one shop's recipes is common in all of them, so the
 * planner read the whole shop's rows instead (≈ 4 800 pages for "bracket" in a shop of 5 000
 * recipes among 100 000: 100 ms; measured by the recipe-search benchmark, apps/api/bench). With the
 * shop in the key (btree_gin lets a GIN index hold a plain column beside the trigrams) the search
 * reads that shop's matches only, and the query asks each field separately (see
 * recipes.repository's listWhere) so every arm has an index (≈ 80 pages, 6 ms).
 */
export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    CREATE EXTENSION IF NOT EXISTS btree_gin;
    DROP INDEX recipes_name_trgm_idx;
    DROP INDEX recipes_notes_trgm_idx;
    CREATE INDEX recipes_search_name_idx ON recipes USING gin (shop_id, name gin_trgm_ops);
    CREATE INDEX recipes_search_notes_idx ON recipes USING gin (shop_id, notes gin_trgm_ops);
  `);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    DROP INDEX recipes_search_name_idx;
    DROP INDEX recipes_search_notes_idx;
    CREATE INDEX recipes_name_trgm_idx ON recipes USING gin (name gin_trgm_ops);
    CREATE INDEX recipes_notes_trgm_idx ON recipes USING gin (notes gin_trgm_ops);
  `);
};
