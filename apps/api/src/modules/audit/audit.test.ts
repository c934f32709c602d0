/**
 * The shop's audit log over real HTTP and PostgreSQL: representative changes leave exactly one
 * event naming who did what to which record; refused and rolled-back changes leave none; only the
 * shop's owners read it, and a shop's events never appear in another shop's log.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { apiErrorSchema, auditEventPageSchema, cutterSchema, recipeSchema, type AuditEvent } from "@ringdown/contracts";
import { getSequelize, inTransaction } from "../../db/sequelize.js";
import { createPerson, disconnectTestDatabase, makeTestApp } from "../../test/harness.js";
import { cutterBody, teamShop, type Team } from "../machines/library-test-fixtures.js";
import { libraryFor } from "../recipes/recipe-test-fixtures.js";
import { recordAuditEvent } from "./audit.service.js";

const app = makeTestApp();
afterAll(disconnectTestDatabase);

let team: Team;
let other: Team;
beforeAll(async () => {
  [team, other] = await Promise.all([teamShop(app, "audit-a"), teamShop(app, "audit-b")]);
});

/** Every event of the shop, newest first, straight from the table (independent of the route). */
async function eventsOf(shopId: string): Promise<Array<{ action: string; actor_id: string | null; actor_name: string; subject_type: string; subject_id: string | null; subject_label: string; detail: Record<string, unknown> }>> {
  const [rows] = await getSequelize().query(`SELECT * FROM audit_events WHERE shop_id = $1 ORDER BY created_at DESC, id DESC`, { bind: [shopId] });
  return rows as never;
}

/** The events written while `work` ran (the shop's log is shared by the tests of this file). */
async function newEvents(shopId: string, work: () => Promise<unknown>) {
  const before = (await eventsOf(shopId)).length;
  await work();
  const after = await eventsOf(shopId);
  return after.slice(0, after.length - before);
}

const list = async (t: Team, query: Record<string, string | number> = {}) => {
  const res = await t.owner.agent.get(`/api/shops/${t.shopId}/audit-events`).query(query);
  expect(res.status).toBe(200);
  return auditEventPageSchema.parse(res.body);
};

describe("changes leave exactly one event naming actor, action and subject", () => {
  it("a programmer proposing a cutter", async () => {
    let id = "";
    const events = await newEvents(team.shopId, async () => {
      const res = await team.programmer.agent.post(`/api/shops/${team.shopId}/cutters`).send(cutterBody({ name: "Audit 3 mm flat" }));
      expect(res.status).toBe(201);
      id = cutterSchema.parse(res.body).id;
    });
    expect(events).toHaveLength(1);
    expect(events[0]).toMatchObject({
      action: "cutter.created",
      actor_id: team.programmer.userId,
      actor_name: "Test audit-a-programmer",
      subject_type: "cutter",
      subject_id: id,
      subject_label: "Audit 3 mm flat",
      detail: { status: "proposed" },
    });
  });

  it("an owner changing a member's role, with the roles before and after", async () => {
    const events = await newEvents(team.shopId, async () => {
      await team.owner.agent.patch(`/api/shops/${team.shopId}/members/${team.operator.userId}`).send({ role: "programmer" }).expect(200);
    });
    expect(events).toHaveLength(1);
    expect(events[0]).toMatchObject({
      action: "member.role_changed",
      actor_id: team.owner.userId,
      subject_type: "member",
      subject_id: team.operator.userId,
      subject_label: "Test audit-a-operator",
      detail: { from: "operator", to: "programmer" },
    });
    await team.owner.agent.patch(`/api/shops/${team.shopId}/members/${team.operator.userId}`).send({ role: "operator" }).expect(200);
  });

  it("an import of three rows is one event carrying the row count", async () => {
    const header = "name,shape,tool_material,status,diameter_mm,flutes,flute_length_mm,overall_length_mm,shank_diameter_mm";
    const rows = ["Audit import A,flat,carbide,approved,6,2,22,60,6", "Audit import B,flat,carbide,approved,8,3,22,60,8", "Audit import C,ball,carbide,,4,2,12,50,4"];
    const events = await newEvents(team.shopId, async () => {
      const res = await team.tooling_manager.agent
        .post(`/api/shops/${team.shopId}/cutters/import`)
        .attach("file", Buffer.from(`${[header, ...rows].join("\n")}\n`), { filename: "audit-cutters.csv", contentType: "text/csv" });
      expect(res.status).toBe(201);
    });
    expect(events).toHaveLength(1);
    expect(events[0]).toMatchObject({
      action: "cutter.imported",
      actor_id: team.tooling_manager.userId,
      subject_type: "cutter",
      subject_id: null,
      subject_label: "Cutter list audit-cutters.csv",
      detail: { rows: 3 },
    });
  });

  it("a recipe moved on in its life cycle, and the shop renamed", async () => {
    const lib = await libraryFor(team.shopId);
    const created = await team.programmer.agent
      .post(`/api/shops/${team.shopId}/recipes`)
      .send({ name: "Audit pocket", assemblyId: lib.routerAssemblyId, materialId: lib.aluminiumId, operation: "profile", params: { axialDepthMm: 2, radialDepthMm: 1 } });
    expect(created.status).toBe(201);
    const recipe = recipeSchema.parse(created.body);
    const moved = await newEvents(team.shopId, async () => {
      await team.programmer.agent.post(`/api/shops/${team.shopId}/recipes/${recipe.id}/transition`).send({ to: "trial" }).expect(200);
    });
    expect(moved).toHaveLength(1);
    expect(moved[0]).toMatchObject({
      action: "recipe.status_changed",
      actor_id: team.programmer.userId,
      subject_type: "recipe",
      subject_id: recipe.id,
      subject_label: "Audit pocket",
      detail: { from: "draft", to: "trial" },
    });

    const renamed = await newEvents(team.shopId, async () => {
      await team.owner.agent.patch(`/api/shops/${team.shopId}`).send({ name: "Audit shop renamed" }).expect(200);
    });
    expect(renamed).toHaveLength(1);
    expect(renamed[0]).toMatchObject({ action: "shop.renamed", subject_type: "shop", subject_id: team.shopId, detail: { from: "Library shop audit-a", to: "Audit shop renamed" } });
  });

  it("the route shows the events newest first with names, subjects and the caller's address", async () => {
    const page = await list(team, { pageSize: 2 });
    expect(page.total).toBeGreaterThanOrEqual(5);
    expect(page.items.map((e) => e.action)).toEqual(["shop.renamed", "recipe.status_changed"]);
    const [first] = page.items as [AuditEvent];
    expect(first).toMatchObject({ actorId: team.owner.userId, actorName: "Test audit-a-owner", subjectLabel: "Audit shop renamed" });
    // supertest connects over loopback.
    expect(first.ip === "127.0.0.1" || first.ip === "::1").toBe(true);
    expect(Date.parse(first.createdAt)).not.toBeNaN();
  });
});

describe("refused or rolled-back changes leave no event", () => {
  it("a cutter edit that fails validation, and a demotion of the last owner", async () => {
    const cutter = cutterSchema.parse(
      (await team.tooling_manager.agent.post(`/api/shops/${team.shopId}/cutters`).send(cutterBody({ name: "Audit refused edits" }))).body,
    );
    const events = await newEvents(team.shopId, async () => {
      const bad = await team.tooling_manager.agent.patch(`/api/shops/${team.shopId}/cutters/${cutter.id}`).send({ diameterMm: -3 });
      expect(bad.status).toBe(400);
      const lastOwner = await team.owner.agent.patch(`/api/shops/${team.shopId}/members/${team.owner.userId}`).send({ role: "programmer" });
      expect(lastOwner.status).toBe(409);
      const programmerApproves = await team.programmer.agent.post(`/api/shops/${team.shopId}/cutters/${cutter.id}/transition`).send({ to: "approved" });
      expect(programmerApproves.status).toBe(403);
    });
    expect(events).toEqual([]);
  });

  it("an event recorded in a transaction that then fails is rolled back with it", async () => {
    const boom = new Error("the change failed after its event was recorded");
    const events = await newEvents(team.shopId, async () => {
      await expect(
        inTransaction(async (tx) => {
          await recordAuditEvent(tx, {
            shopId: team.shopId,
            actor: { userId: team.owner.userId, name: "Test audit-a-owner", ip: null },
            action: "shop.renamed",
            subject: { type: "shop", id: team.shopId, label: "Never saved" },
          });
          throw boom;
        }),
      ).rejects.toBe(boom);
    });
    expect(events).toEqual([]);
  });

  it("a restore that is refused (the recipe is not deleted) records nothing", async () => {
    const recipes = (await list(team, { action: "recipe.status_changed" })).items;
    const recipeId = recipes[0]!.subjectId!;
    const events = await newEvents(team.shopId, async () => {
      expect((await team.programmer.agent.post(`/api/shops/${team.shopId}/recipes/${recipeId}/restore-deleted`)).status).toBe(409);
    });
    expect(events).toEqual([]);
  });

  it("never stores secrets a caller passes in the detail", async () => {
    const events = await newEvents(team.shopId, () =>
      inTransaction((tx) =>
        recordAuditEvent(tx, {
          shopId: team.shopId,
          actor: { userId: null, name: "Test set-up", ip: null },
          action: "shop.exported",
          subject: { type: "shop", id: team.shopId, label: "x" },
          detail: { file: "json", password: "hunter22", nested: { tokenHash: "abc", kept: 1 } },
        }),
      ),
    );
    expect(events[0]!.detail).toEqual({ file: "json", nested: { kept: 1 } });
  });
});

describe("who may read the log", () => {
  it("owners only: 403 for every other role, 404 for another shop's member", async () => {
    for (const role of ["tooling_manager", "programmer", "operator"] as const) {
      const res = await team[role].agent.get(`/api/shops/${team.shopId}/audit-events`);
      expect(res.status).toBe(403);
      expect(apiErrorSchema.parse(res.body).error.message).toBe("Only the owner of this shop can do this.");
    }
    const stranger = await other.owner.agent.get(`/api/shops/${team.shopId}/audit-events`);
    expect(stranger.status).toBe(404);
    const nobody = await createPerson(app, "audit-nobody");
    expect((await nobody.agent.get(`/api/shops/${team.shopId}/audit-events`)).status).toBe(404);
  });

  it("a shop's events never appear in another shop's log", async () => {
    await other.programmer.agent.post(`/api/shops/${other.shopId}/cutters`).send(cutterBody({ name: "Audit B only" })).expect(201);
    const mine = await list(team, { pageSize: 200 });
    const theirs = await list(other, { pageSize: 200 });
    expect(theirs.items.map((e) => e.subjectLabel)).toContain("Audit B only");
    expect(mine.items.map((e) => e.subjectLabel)).not.toContain("Audit B only");
    const theirIds = new Set(theirs.items.map((e) => e.id));
    expect(mine.items.some((e) => theirIds.has(e.id))).toBe(false);
    // Filtering by another shop's person finds nothing here either.
    expect((await list(team, { actorId: other.programmer.userId })).total).toBe(0);
  });
});

describe("paging and filters", () => {
  it("pages without overlap and filters by action prefix, exact action, subject, person and period", async () => {
    const all = await list(team, { pageSize: 200 });
    const first = await list(team, { pageSize: 3, page: 1 });
    const second = await list(team, { pageSize: 3, page: 2 });
    expect(first.total).toBe(all.total);
    expect([...first.items, ...second.items].map((e) => e.id)).toEqual(all.items.slice(0, 6).map((e) => e.id));

    const cutters = await list(team, { action: "cutter.", pageSize: 200 });
    expect(cutters.items.length).toBeGreaterThanOrEqual(3);
    expect(cutters.items.every((e) => e.action.startsWith("cutter."))).toBe(true);
    expect((await list(team, { action: "cutter" })).total).toBe(cutters.total);
    const imported = await list(team, { action: "cutter.imported" });
    expect(imported.items.map((e) => e.action)).toEqual(["cutter.imported"]);

    const members = await list(team, { subjectType: "member", pageSize: 200 });
    expect(members.items.length).toBe(2);
    expect(members.items.every((e) => e.subjectType === "member")).toBe(true);
    const byProgrammer = await list(team, { actorId: team.programmer.userId, pageSize: 200 });
    expect(byProgrammer.items.length).toBeGreaterThan(0);
    expect(byProgrammer.items.every((e) => e.actorId === team.programmer.userId)).toBe(true);

    // Bare dates are whole UTC days: the days of the oldest and newest event cover them all.
    const firstDay = all.items.at(-1)!.createdAt.slice(0, 10);
    const lastDay = all.items[0]!.createdAt.slice(0, 10);
    expect((await list(team, { from: firstDay, to: lastDay })).total).toBe(all.total);
    expect((await list(team, { from: all.items[0]!.createdAt })).items.map((e) => e.id)).toEqual([all.items[0]!.id]);
    expect((await list(team, { to: "2001-01-01" })).total).toBe(0);
    const later = new Date(Date.now() + 60_000).toISOString();
    expect((await list(team, { from: later })).total).toBe(0);
  });

  it("answers 400 naming the field for a bad filter", async () => {
    const cases: Array<[Record<string, string>, string]> = [
      [{ action: "DROP TABLE" }, "query.action"],
      [{ subjectType: "spaceship" }, "query.subjectType"],
      [{ actorId: "me" }, "query.actorId"],
      [{ from: "yesterday" }, "query.from"],
      [{ from: "2025-03-02", to: "2025-03-01" }, "query.to"],
      [{ pageSize: "0" }, "query.pageSize"],
    ];
    for (const [query, field] of cases) {
      const res = await team.owner.agent.get(`/api/shops/${team.shopId}/audit-events`).query(query);
      expect(res.status).toBe(400);
      expect(Object.keys(apiErrorSchema.parse(res.body).error.fields ?? {})).toEqual([field]);
    }
  });
});
