import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { recipePageSchema, recipeRevisionListSchema, recipeSchema } from "@ringdown/contracts";
import { getSequelize } from "../db/sequelize.js";
import { computePlan } from "../modules/recommendations/recommendations.service.js";
import { disconnectTestDatabase, makeTestApp } from "../test/harness.js";
import { demoMachineIds, demoShopIds } from "./demo-ids.js";
import { seedDemo } from "./index.js";
import { demoPeople } from "./people-and-shops.js";
import { demoRecipes, seedRecipes } from "./recipes.js";

const app = makeTestApp();
afterAll(disconnectTestDatabase);

const Q = demoShopIds.quillfeather;

async function rows<T extends object>(sql: string, replacements: Record<string, unknown> = {}): Promise<T[]> {
  return getSequelize().query<T>(sql, { replacements, type: QueryTypes.SELECT });
}

async function signIn(email: string) {
  const person = demoPeople.find((p) => p.email === email)!;
  const agent = request.agent(app);
  await agent.post("/api/auth/login").send({ email: person.email, password: person.password }).expect(200);
  return agent;
}

beforeAll(async () => {
  await seedDemo();
});

describe("demo recipes seed", () => {
  it("is idempotent: a second run creates nothing and changes nothing", async () => {
    const before = await rows(`SELECT id, revision, status, updated_at FROM recipes WHERE shop_id IN (:q, :o) ORDER BY id`, { q: Q, o: demoShopIds.ostrander });
    expect(await seedRecipes()).toBe(0);
    expect(await rows(`SELECT id, revision, status, updated_at FROM recipes WHERE shop_id IN (:q, :o) ORDER BY id`, { q: Q, o: demoShopIds.ostrander })).toEqual(before);
    expect(before).toHaveLength(demoRecipes.length);
  });

  it("shows every status on both of Quillfeather's machines' recipes", async () => {
    const byStatus = await rows<{ status: string; n: number }>(`SELECT status, count(*) AS n FROM recipes WHERE shop_id = :q GROUP BY status`, { q: Q });
    expect(byStatus.map((r) => r.status).sort()).toEqual(["approved", "draft", "proven", "retired", "trial"]);
    for (const machine of [demoMachineIds.heronRouter, demoMachineIds.wrenMill]) {
      const statuses = await rows<{ status: string }>(`SELECT DISTINCT status FROM recipes WHERE machine_id = :m`, { m: machine });
      expect(statuses.length, machine).toBeGreaterThanOrEqual(3);
    }
  });

  it("backs every proven or approved recipe with a clean cut on its machine, and keeps several outcomes", async () => {
    const unbacked = await rows(
      `SELECT r.name FROM recipes r WHERE r.shop_id IN (:q, :o) AND r.status IN ('proven', 'approved')
         AND NOT EXISTS (SELECT 1 FROM cut_logs l WHERE l.recipe_id = r.id AND l.machine_id = r.machine_id AND l.outcome = 'clean')`,
      { q: Q, o: demoShopIds.ostrander },
    );
    expect(unbacked).toEqual([]);
    const outcomes = await rows<{ outcome: string }>(`SELECT DISTINCT outcome FROM cut_logs WHERE shop_id = :q`, { q: Q });
    expect(outcomes.map((o) => o.outcome).sort()).toEqual(["burn_melt", "chatter", "clean", "cutter_broke", "feed_override", "poor_finish"]);
  });

  it("stores what the engine computes from the demo library (the server's own numbers)", async () => {
    for (const r of demoRecipes) {
      const [row] = await rows<{ assembly_id: string; material_id: string; operation: "slot"; params: never; result: unknown; revision: number }>(
        `SELECT assembly_id, material_id, operation, params, result, revision FROM recipes WHERE id = :id`,
        { id: r.id },
      );
      const plan = await computePlan(r.shopId, { assemblyId: row!.assembly_id, materialId: row!.material_id, operation: row!.operation, params: row!.params });
      expect(row!.result, r.name).toEqual(JSON.parse(JSON.stringify(plan.summary)));
      const revisions = await rows<{ n: number }>(`SELECT count(*) AS n FROM recipe_revisions WHERE recipe_id = :id`, { id: r.id });
      expect(revisions[0]!.n, r.name).toBe(row!.revision);
    }
  });

  it("reads well through the API: history for the tooling manager, approved recipes for the operator", async () => {
    const imke = await signIn("imke@quillfeather.example");
    const all = recipePageSchema.parse((await imke.get(`/api/shops/${Q}/recipes?pageSize=50`).expect(200)).body);
    expect(all.total).toBe(demoRecipes.filter((r) => r.shopId === Q).length);
    const ply = all.items.find((r) => r.name.startsWith("Birch ply 18 mm"))!;
    expect(ply).toMatchObject({ status: "approved", revision: 2, cutLogCount: 4 });
    expect(recipeSchema.parse((await imke.get(`/api/shops/${Q}/recipes/${ply.id}`).expect(200)).body).revision).toBe(2);
    const revisions = recipeRevisionListSchema.parse((await imke.get(`/api/shops/${Q}/recipes/${ply.id}/revisions`)).body).items;
    expect(revisions.map((v) => v.changeNote)).toEqual(["Lighter stepover so the corners keep moving", "Created"]);
    expect(revisions[0]!.changes).toEqual(["radial depth 3 mm → 2 mm"]);

    const sunniva = await signIn("sunniva@quillfeather.example");
    const seen = recipePageSchema.parse((await sunniva.get(`/api/shops/${Q}/recipes?pageSize=50`).expect(200)).body);
    expect(seen.items.length).toBeGreaterThan(0);
    expect(seen.items.every((r) => r.status === "approved")).toBe(true);
  });
});
