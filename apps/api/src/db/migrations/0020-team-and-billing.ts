import type { MigrationFn } from "umzug";
import type { Sequelize } from "sequelize";

/**
 * Invitations, password-reset links, each shop's subscription state and the payment provider's
 * processed webhook events. Link tokens are stored only as SHA-256 hashes: a copy of the database
 * does not let anyone use a link.
 */
export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    CREATE TABLE invitations (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      shop_id uuid NOT NULL REFERENCES shops (id) ON DELETE CASCADE,
      email varchar(254) NOT NULL CHECK (email = lower(email)),
      role text NOT NULL CHECK (role IN ('owner', 'tooling_manager', 'programmer', 'operator')),
      token_hash char(64) NOT NULL,
      invited_by uuid REFERENCES users (id) ON DELETE SET NULL,
      sent_at timestamptz NOT NULL DEFAULT now(),
      expires_at timestamptz NOT NULL,
      accepted_at timestamptz,
      accepted_by uuid REFERENCES users (id) ON DELETE SET NULL,
      revoked_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT invitations_token_hash_key UNIQUE (token_hash),
      CONSTRAINT invitations_closed_once CHECK (accepted_at IS NULL OR revoked_at IS NULL)
    );
    -- One open invitation per address and shop: inviting again replaces its link.
    CREATE UNIQUE INDEX invitations_open_email_key ON invitations (shop_id, email)
      WHERE accepted_at IS NULL AND revoked_at IS NULL;

    CREATE TABLE password_reset_tokens (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
      token_hash char(64) NOT NULL,
      expires_at timestamptz NOT NULL,
      used_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT password_reset_tokens_token_hash_key UNIQUE (token_hash)
    );
    CREATE INDEX password_reset_tokens_user_idx ON password_reset_tokens (user_id);

    -- A shop without a row is on the free plan and never subscribed.
    CREATE TABLE shop_subscriptions (
      shop_id uuid PRIMARY KEY REFERENCES shops (id) ON DELETE CASCADE,
      provider_customer_id text,
      provider_subscription_id text UNIQUE,
      provider_subscription_item_id text,
      status text NOT NULL DEFAULT 'none' CHECK (status IN (
        'none', 'incomplete', 'incomplete_expired', 'trialing', 'active', 'past_due', 'unpaid', 'canceled', 'paused')),
      seats integer NOT NULL DEFAULT 0 CHECK (seats >= 0),
      current_period_end timestamptz,
      cancel_at_period_end boolean NOT NULL DEFAULT false,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );

    -- Webhook events already processed: a replayed event id changes nothing.
    CREATE TABLE billing_events (
      event_id text PRIMARY KEY,
      type text NOT NULL,
      shop_id uuid REFERENCES shops (id) ON DELETE SET NULL,
      received_at timestamptz NOT NULL DEFAULT now()
    );
  `);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(
    `DROP TABLE billing_events; DROP TABLE shop_subscriptions; DROP TABLE password_reset_tokens; DROP TABLE invitations;`,
  );
};
