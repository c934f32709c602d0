import request from "supertest";
import { afterAll, describe, expect, it } from "vitest";
import { meSchema, memberPageSchema } from "@ringdown/contracts";
import { getSequelize } from "../db/sequelize.js";
import { disconnectTestDatabase, makeTestApp } from "../test/harness.js";
import { demoShopIds } from "./demo-ids.js";
import { seedDemo } from "./index.js";
import { demoPeople } from "./people-and-shops.js";

const app = makeTestApp();
afterAll(disconnectTestDatabase);

async function counts() {
  const [rows] = await getSequelize().query(
    `SELECT (SELECT count(*) FROM users WHERE email LIKE '%.example' AND email NOT LIKE '%@tests.example') AS users,
            (SELECT count(*) FROM shops WHERE id IN ($1, $2)) AS shops,
            (SELECT count(*) FROM memberships WHERE shop_id IN ($1, $2)) AS memberships`,
    { bind: [demoShopIds.quillfeather, demoShopIds.ostrander] },
  );
  return rows[0];
}

describe("demo seed", () => {
  it("is idempotent: a second run creates nothing", async () => {
    const lines: string[] = [];
    await seedDemo((l) => lines.push(l));
    const first = await counts();
    await seedDemo((l) => lines.push(l));
    expect(await counts()).toEqual(first);
    expect(first).toEqual({ users: 6, shops: 2, memberships: 7 });
    expect(lines.slice(-5)).toEqual([
      "demo seed: people and shops — already present",
      "demo seed: team plans — already present",
      "demo seed: library (machines, cutters, assemblies) — already present",
      "demo seed: vibration profiles (stiffness and backlash readings, analysed recordings) — already present",
      "demo seed: recipes (revisions, status history, cut logs) — already present",
    ]);
  });

  it("lets every demo person sign in with the listed password and role", async () => {
    for (const person of demoPeople) {
      const res = await request(app).post("/api/auth/login").send({ email: person.email, password: person.password });
      expect(res.status, person.email).toBe(200);
      const me = meSchema.parse(res.body);
      expect(me.memberships.map((m) => [m.shopId, m.role]).sort()).toEqual(
        person.memberships.map((m) => [m.shopId, m.role]).sort(),
      );
    }
  });

  it("gives the demo shop one person per role plus the contractor", async () => {
    const owner = demoPeople[0]!;
    const agent = request.agent(app);
    await agent.post("/api/auth/login").send({ email: owner.email, password: owner.password }).expect(200);
    const page = memberPageSchema.parse((await agent.get(`/api/shops/${demoShopIds.quillfeather}/members`)).body);
    expect(page.items.map((m) => m.role)).toEqual(["owner", "tooling_manager", "programmer", "programmer", "operator"]);
  });
});
