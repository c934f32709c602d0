import { afterAll, describe, expect, it } from "vitest";
import { getSequelize } from "./sequelize.js";
import { migrate, pendingMigrations } from "./migrate.js";
import { connectTestDatabase, disconnectTestDatabase } from "../test/harness.js";
import { testDatabaseUrl } from "../test/database-url.js";

connectTestDatabase();
afterAll(disconnectTestDatabase);

describe("migrations", () => {
  it("leaves nothing pending after the test set-up, and re-running (even concurrently) applies nothing", async () => {
    expect(await pendingMigrations(getSequelize())).toEqual([]);
    const runs = await Promise.all([migrate(getSequelize(), testDatabaseUrl()), migrate(getSequelize(), testDatabaseUrl())]);
    expect(runs).toEqual([[], []]);
  });

  it("creates the tables with UUID keys and the integrity rules the API relies on", async () => {
    const [columns] = await getSequelize().query(
      `SELECT table_name, data_type FROM information_schema.columns
       WHERE table_schema = 'public' AND column_name = 'id' AND table_name IN ('users', 'shops', 'memberships')
       ORDER BY table_name`,
    );
    expect(columns).toEqual([
      { table_name: "memberships", data_type: "uuid" },
      { table_name: "shops", data_type: "uuid" },
      { table_name: "users", data_type: "uuid" },
    ]);
    // An unknown role is refused by the database itself.
    await expect(
      getSequelize().query(
        `INSERT INTO memberships (shop_id, user_id, role) VALUES (gen_random_uuid(), gen_random_uuid(), 'janitor')`,
      ),
    ).rejects.toThrow();
  });
});
