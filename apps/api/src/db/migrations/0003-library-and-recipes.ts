import type { MigrationFn } from "umzug";
import type { Sequelize } from "sequelize";

/*
 * The shop's library (materials, cutters, machines with their modes, cutter assemblies) and
 * recipes with their revisions, status transitions, cut logs and test-cut ladders.
 * Engineering quantities are DOUBLE PRECISION in SI-ish shop units (mm, rpm, mm/min, N, W, Hz).
 * Soft delete (`deleted_at`) where users expect undo: cutters, machines, assemblies, recipes.
 * Every shop-owned row carries shop_id so each query can be filtered by the active shop.
 */
export const up: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    CREATE EXTENSION IF NOT EXISTS pg_trgm;

    CREATE TABLE materials (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      shop_id uuid REFERENCES shops (id) ON DELETE CASCADE,          -- NULL: global, read-only
      global_key text UNIQUE,                                         -- stable key of a global row (seed)
      copied_from_id uuid REFERENCES materials (id) ON DELETE SET NULL,
      name varchar(120) NOT NULL,
      material_group text NOT NULL,
      hardness varchar(60) NOT NULL DEFAULT '',
      cutting_speed jsonb NOT NULL,
      chip_load jsonb NOT NULL,
      kc11_n_per_mm2 double precision,
      mc double precision,
      unit_power_j_per_mm3 double precision,
      min_chip_thickness_mm double precision NOT NULL,
      source_note text NOT NULL,
      deleted_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      CHECK ((shop_id IS NULL) = (global_key IS NOT NULL)),
      CHECK (kc11_n_per_mm2 IS NOT NULL OR unit_power_j_per_mm3 IS NOT NULL)
    );
    CREATE INDEX materials_shop_idx ON materials (shop_id);

    CREATE TABLE cutters (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      shop_id uuid NOT NULL REFERENCES shops (id) ON DELETE CASCADE,
      name varchar(120) NOT NULL,
      shape text NOT NULL,
      diameter_mm double precision NOT NULL CHECK (diameter_mm > 0),
      flutes integer NOT NULL CHECK (flutes >= 1),
      flute_length_mm double precision NOT NULL CHECK (flute_length_mm > 0),
      overall_length_mm double precision NOT NULL CHECK (overall_length_mm > 0),
      shank_diameter_mm double precision NOT NULL CHECK (shank_diameter_mm > 0),
      helix_deg double precision NOT NULL DEFAULT 0,
      corner_radius_mm double precision NOT NULL DEFAULT 0,
      tip_angle_deg double precision,
      tool_material text NOT NULL CHECK (tool_material IN ('carbide', 'hss')),
      coating varchar(60) NOT NULL DEFAULT '',
      maker varchar(120) NOT NULL DEFAULT '',
      part_number varchar(120) NOT NULL DEFAULT '',
      max_rpm double precision,
      notes text NOT NULL DEFAULT '',
      status text NOT NULL DEFAULT 'proposed' CHECK (status IN ('proposed', 'approved', 'retired')),
      deleted_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX cutters_shop_status_idx ON cutters (shop_id, status);

    CREATE TABLE machines (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      shop_id uuid NOT NULL REFERENCES shops (id) ON DELETE CASCADE,
      name varchar(120) NOT NULL,
      kind text NOT NULL,
      spindle jsonb NOT NULL,          -- { minRpm, maxRpm, powerW, powerCurve[], dialSettings[] }
      axes jsonb NOT NULL,             -- { x|y|z: { drive, travelMm, maxFeedMmPerMin, accelerationMmPerS2, backlashMm, movingMassKg, stiffnessNPerMm } }
      deflection_ceiling_mm double precision NOT NULL DEFAULT 0.025 CHECK (deflection_ceiling_mm > 0),
      avoid_bands jsonb NOT NULL DEFAULT '[]',
      mode_margin_pct double precision NOT NULL DEFAULT 10,
      estimated_fields jsonb NOT NULL DEFAULT '[]',
      notes text NOT NULL DEFAULT '',
      deleted_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX machines_shop_idx ON machines (shop_id);

    CREATE TABLE machine_modes (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      shop_id uuid NOT NULL REFERENCES shops (id) ON DELETE CASCADE,
      machine_id uuid NOT NULL REFERENCES machines (id) ON DELETE CASCADE,
      direction text NOT NULL CHECK (direction IN ('x', 'y', 'z')),
      frequency_hz double precision NOT NULL CHECK (frequency_hz > 0),
      damping_ratio double precision NOT NULL CHECK (damping_ratio > 0),
      stiffness_n_per_mm double precision NOT NULL CHECK (stiffness_n_per_mm > 0),
      source text NOT NULL DEFAULT 'manual' CHECK (source IN ('manual', 'estimated', 'measured', 'fitted')),
      note varchar(500) NOT NULL DEFAULT '',
      measured_at timestamptz NOT NULL DEFAULT now(),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX machine_modes_machine_idx ON machine_modes (shop_id, machine_id);

    CREATE TABLE assemblies (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      shop_id uuid NOT NULL REFERENCES shops (id) ON DELETE CASCADE,
      machine_id uuid NOT NULL REFERENCES machines (id) ON DELETE RESTRICT,
      cutter_id uuid NOT NULL REFERENCES cutters (id) ON DELETE RESTRICT,
      holder varchar(120) NOT NULL,
      stickout_mm double precision NOT NULL CHECK (stickout_mm > 0),
      runout_mm double precision NOT NULL DEFAULT 0 CHECK (runout_mm >= 0),
      notes text NOT NULL DEFAULT '',
      deleted_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX assemblies_shop_machine_idx ON assemblies (shop_id, machine_id);
    CREATE INDEX assemblies_cutter_idx ON assemblies (cutter_id);

    CREATE TABLE recipes (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      shop_id uuid NOT NULL REFERENCES shops (id) ON DELETE CASCADE,
      name varchar(160) NOT NULL,
      assembly_id uuid NOT NULL REFERENCES assemblies (id) ON DELETE RESTRICT,
      machine_id uuid NOT NULL REFERENCES machines (id) ON DELETE RESTRICT,
      cutter_id uuid NOT NULL REFERENCES cutters (id) ON DELETE RESTRICT,
      material_id uuid NOT NULL REFERENCES materials (id) ON DELETE RESTRICT,
      operation text NOT NULL,
      status text NOT NULL DEFAULT 'draft' CHECK (status IN ('draft', 'trial', 'proven', 'approved', 'retired')),
      revision integer NOT NULL DEFAULT 1,
      params jsonb NOT NULL,
      result jsonb NOT NULL,            -- summary of the engine's result, recomputed by the server
      rpm double precision NOT NULL,    -- denormalised from result for sorting and filtering
      feed_mm_per_min double precision NOT NULL,
      notes text NOT NULL DEFAULT '',
      needs_recheck boolean NOT NULL DEFAULT false,
      author_id uuid NOT NULL REFERENCES users (id) ON DELETE RESTRICT,
      last_comment text,
      deleted_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX recipes_shop_updated_idx ON recipes (shop_id, updated_at DESC) WHERE deleted_at IS NULL;
    CREATE INDEX recipes_shop_status_idx ON recipes (shop_id, status) WHERE deleted_at IS NULL;
    CREATE INDEX recipes_shop_machine_idx ON recipes (shop_id, machine_id);
    CREATE INDEX recipes_shop_material_idx ON recipes (shop_id, material_id);
    CREATE INDEX recipes_shop_cutter_idx ON recipes (shop_id, cutter_id);
    CREATE INDEX recipes_name_trgm_idx ON recipes USING gin (name gin_trgm_ops);

    CREATE TABLE recipe_revisions (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      shop_id uuid NOT NULL REFERENCES shops (id) ON DELETE CASCADE,
      recipe_id uuid NOT NULL REFERENCES recipes (id) ON DELETE CASCADE,
      revision integer NOT NULL,
      name varchar(160) NOT NULL,
      assembly_id uuid NOT NULL,
      material_id uuid NOT NULL,
      operation text NOT NULL,
      params jsonb NOT NULL,
      result jsonb NOT NULL,
      notes text NOT NULL DEFAULT '',
      change_note varchar(500) NOT NULL DEFAULT '',
      author_id uuid NOT NULL REFERENCES users (id) ON DELETE RESTRICT,
      created_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT recipe_revisions_recipe_revision_key UNIQUE (recipe_id, revision)
    );

    CREATE TABLE recipe_transitions (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      shop_id uuid NOT NULL REFERENCES shops (id) ON DELETE CASCADE,
      recipe_id uuid NOT NULL REFERENCES recipes (id) ON DELETE CASCADE,
      from_status text NOT NULL,
      to_status text NOT NULL,
      comment text NOT NULL DEFAULT '',
      actor_id uuid NOT NULL REFERENCES users (id) ON DELETE RESTRICT,
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX recipe_transitions_recipe_idx ON recipe_transitions (recipe_id, created_at);

    CREATE TABLE cut_logs (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      shop_id uuid NOT NULL REFERENCES shops (id) ON DELETE CASCADE,
      recipe_id uuid NOT NULL REFERENCES recipes (id) ON DELETE CASCADE,
      recipe_revision integer NOT NULL,
      machine_id uuid NOT NULL REFERENCES machines (id) ON DELETE CASCADE,
      material_id uuid NOT NULL REFERENCES materials (id) ON DELETE CASCADE,
      user_id uuid NOT NULL REFERENCES users (id) ON DELETE RESTRICT,
      outcome text NOT NULL CHECK (outcome IN ('clean', 'chatter', 'burn_melt', 'poor_finish', 'cutter_broke', 'feed_override', 'other')),
      actual_rpm double precision NOT NULL,
      actual_feed_mm_per_min double precision NOT NULL,
      axial_depth_mm double precision NOT NULL,
      radial_depth_mm double precision NOT NULL,
      feed_override_pct double precision,
      note text NOT NULL DEFAULT '',
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX cut_logs_recipe_idx ON cut_logs (recipe_id, created_at DESC);
    CREATE INDEX cut_logs_machine_material_idx ON cut_logs (shop_id, machine_id, material_id);

    CREATE TABLE cut_log_photos (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      shop_id uuid NOT NULL REFERENCES shops (id) ON DELETE CASCADE,
      cut_log_id uuid NOT NULL REFERENCES cut_logs (id) ON DELETE CASCADE,
      storage_key text NOT NULL,
      content_type text NOT NULL,
      size_bytes integer NOT NULL,
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX cut_log_photos_log_idx ON cut_log_photos (cut_log_id);

    CREATE TABLE test_cut_ladders (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      shop_id uuid NOT NULL REFERENCES shops (id) ON DELETE CASCADE,
      recipe_id uuid NOT NULL REFERENCES recipes (id) ON DELETE CASCADE,
      parameter text NOT NULL CHECK (parameter IN ('rpm', 'feed', 'depth')),
      rungs jsonb NOT NULL,
      chosen_rung integer,
      created_by uuid NOT NULL REFERENCES users (id) ON DELETE RESTRICT,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX test_cut_ladders_recipe_idx ON test_cut_ladders (recipe_id);
  `);
};

export const down: MigrationFn<Sequelize> = async ({ context: sequelize }) => {
  await sequelize.query(`
    DROP TABLE test_cut_ladders; DROP TABLE cut_log_photos; DROP TABLE cut_logs;
    DROP TABLE recipe_transitions; DROP TABLE recipe_revisions; DROP TABLE recipes;
    DROP TABLE assemblies; DROP TABLE machine_modes; DROP TABLE machines; DROP TABLE cutters; DROP TABLE materials;
  `);
};
