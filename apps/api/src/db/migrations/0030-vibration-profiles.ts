import type { MigrationFn } from "umzug";
import type { Sequelize } from "sequelize";

/*
 * A machine's vibration profile: dial-indicator stiffness and backlash readings, recordings
 * (cut, tap test, spindle running free, frequency response) with their analysis state and results,
 * and the link from a mode to the recording it was accepted from. The analysis jobs themselves
 * live in pg-boss's own schema ("pgboss"), which pg-boss creates and migrates on start.
 */
export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    CREATE TABLE stiffness_readings (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      shop_id uuid NOT NULL REFERENCES shops (id) ON DELETE CASCADE,
      machine_id uuid NOT NULL REFERENCES machines (id) ON DELETE CASCADE,
      x_mm double precision NOT NULL CHECK (x_mm >= 0),
      y_mm double precision NOT NULL CHECK (y_mm >= 0),
      z_mm double precision NOT NULL DEFAULT 0 CHECK (z_mm >= 0),
      direction text NOT NULL CHECK (direction IN ('x', 'y', 'z')),
      force_n double precision NOT NULL CHECK (force_n > 0),
      deflection_mm double precision NOT NULL CHECK (deflection_mm > 0),
      stiffness_n_per_mm double precision GENERATED ALWAYS AS (force_n / deflection_mm) STORED,
      note varchar(500) NOT NULL DEFAULT '',
      measured_at timestamptz NOT NULL,
      created_by uuid REFERENCES users (id) ON DELETE SET NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX stiffness_readings_machine_idx ON stiffness_readings (shop_id, machine_id, direction);

    CREATE TABLE backlash_readings (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      shop_id uuid NOT NULL REFERENCES shops (id) ON DELETE CASCADE,
      machine_id uuid NOT NULL REFERENCES machines (id) ON DELETE CASCADE,
      axis text NOT NULL CHECK (axis IN ('x', 'y', 'z')),
      backlash_mm double precision NOT NULL CHECK (backlash_mm >= 0),
      note varchar(500) NOT NULL DEFAULT '',
      measured_at timestamptz NOT NULL,
      created_by uuid REFERENCES users (id) ON DELETE SET NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX backlash_readings_machine_idx ON backlash_readings (shop_id, machine_id, axis, measured_at DESC);

    CREATE TABLE recordings (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      shop_id uuid NOT NULL REFERENCES shops (id) ON DELETE CASCADE,
      machine_id uuid NOT NULL REFERENCES machines (id) ON DELETE CASCADE,
      kind text NOT NULL CHECK (kind IN ('cut', 'tap', 'spindle_free', 'frf')),
      format text NOT NULL CHECK (format IN ('wav', 'csv_series', 'csv_frf')),
      storage_key text NOT NULL UNIQUE,
      original_name varchar(255) NOT NULL,
      size_bytes integer NOT NULL CHECK (size_bytes > 0),
      sample_rate_hz double precision,
      duration_s double precision,
      channels integer,
      rpm double precision CHECK (rpm > 0),
      flutes integer CHECK (flutes >= 1),
      direction text CHECK (direction IN ('x', 'y', 'z')),
      dial_setting varchar(20),
      note varchar(500) NOT NULL DEFAULT '',
      status text NOT NULL DEFAULT 'queued' CHECK (status IN ('queued', 'analysing', 'done', 'failed')),
      progress double precision NOT NULL DEFAULT 0 CHECK (progress >= 0 AND progress <= 1),
      failure_reason text,
      attempts integer NOT NULL DEFAULT 0,
      results jsonb,
      accepted_mode_id uuid REFERENCES machine_modes (id) ON DELETE SET NULL,
      dial_rpm_applied boolean NOT NULL DEFAULT false,
      created_by uuid REFERENCES users (id) ON DELETE SET NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      started_at timestamptz,
      analysed_at timestamptz,
      CHECK ((status = 'done') = (results IS NOT NULL)),
      CHECK (status <> 'failed' OR failure_reason IS NOT NULL)
    );
    CREATE INDEX recordings_machine_created_idx ON recordings (shop_id, machine_id, created_at DESC);

    ALTER TABLE machine_modes
      ADD COLUMN mass_kg double precision CHECK (mass_kg > 0),
      ADD COLUMN recording_id uuid REFERENCES recordings (id) ON DELETE SET NULL;
  `);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    ALTER TABLE machine_modes DROP COLUMN recording_id, DROP COLUMN mass_kg;
    DROP TABLE recordings;
    DROP TABLE backlash_readings;
    DROP TABLE stiffness_readings;
  `);
};
