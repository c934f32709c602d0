import type { MigrationFn } from "umzug";
import type { Sequelize } from "sequelize";

/**
 * The shop's audit log: one row per change, written in the same transaction as the change. Names
 * are snapshots (the actor's and the subject's at the time), so the log still reads right after a
 * rename or a deletion; `actor_id` loses its link when the account goes. `detail` holds a few
 * facts about the change, never secrets.
 */
export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    CREATE TABLE audit_events (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      shop_id uuid NOT NULL REFERENCES shops (id) ON DELETE CASCADE,
      actor_id uuid REFERENCES users (id) ON DELETE SET NULL,
      actor_name varchar(200) NOT NULL,
      action varchar(60) NOT NULL CHECK (action ~ '^[a-z_]+\\.[a-z_]+$'),
      subject_type varchar(40) NOT NULL,
      subject_id text,
      subject_label varchar(300) NOT NULL DEFAULT '',
      detail jsonb NOT NULL DEFAULT '{}'::jsonb CHECK (jsonb_typeof(detail) = 'object' AND octet_length(detail::text) <= 8192),
      ip inet,
      created_at timestamptz NOT NULL DEFAULT now()
    );
    -- The list: a shop's events newest first (id breaks ties within one transaction's timestamp).
    CREATE INDEX audit_events_shop_created_idx ON audit_events (shop_id, created_at DESC, id DESC);
    -- Filters: by action code or its prefix (text_pattern_ops serves LIKE 'recipe.%'), by subject, by actor.
    CREATE INDEX audit_events_shop_action_idx ON audit_events (shop_id, action text_pattern_ops, created_at DESC);
    CREATE INDEX audit_events_shop_subject_idx ON audit_events (shop_id, subject_type, subject_id, created_at DESC);
    CREATE INDEX audit_events_shop_actor_idx ON audit_events (shop_id, actor_id, created_at DESC);
  `);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`DROP TABLE audit_events;`);
};
