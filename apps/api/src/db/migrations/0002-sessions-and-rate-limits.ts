import type { MigrationFn } from "umzug";
import type { Sequelize } from "sequelize";

export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    -- Tokens of signed-out sessions, kept until they would have expired.
    CREATE TABLE revoked_sessions (
      token_id uuid PRIMARY KEY,
      expires_at timestamptz NOT NULL
    );
    CREATE INDEX revoked_sessions_expires_at_idx ON revoked_sessions (expires_at);

    -- Fixed-window counters shared by every API instance (see http/rate-limit-store.ts).
    CREATE TABLE rate_limit_counters (
      key text PRIMARY KEY,
      hits integer NOT NULL,
      reset_at timestamptz NOT NULL
    );
    CREATE INDEX rate_limit_counters_reset_at_idx ON rate_limit_counters (reset_at);
  `);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`DROP TABLE rate_limit_counters; DROP TABLE revoked_sessions;`);
};
