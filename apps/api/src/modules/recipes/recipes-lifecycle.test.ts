import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { apiErrorSchema, recipePageSchema, recipeSchema, recipeTransitionListSchema, type Recipe, type RecipeStatus } from "@ringdown/contracts";
import { getSequelize } from "../../db/sequelize.js";
import { createPerson, disconnectTestDatabase, joinShop, makeTestApp, type SignedUp } from "../../test/harness.js";
import { insertAssembly, insertCutter, insertMachine, libraryFor, routerMachine } from "./recipe-test-fixtures.js";

const app = makeTestApp();
afterAll(disconnectTestDatabase);

type Role = "owner" | "tooling_manager" | "programmer" | "operator";
let people: Record<Role, SignedUp>;
let lib: Awaited<ReturnType<typeof libraryFor>>;
let shopId: string;
const url = (path = "") => `/api/shops/${shopId}/recipes${path}`;
const params = { axialDepthMm: 3, radialDepthMm: 1.5 };

beforeAll(async () => {
  const owner = await createPerson(app, "lc-owner", "Life-cycle shop");
  shopId = owner.shopId;
  const [tm, prog, op] = await Promise.all([createPerson(app, "lc-tm"), createPerson(app, "lc-prog"), createPerson(app, "lc-op")]);
  await Promise.all([joinShop(tm.userId, shopId, "tooling_manager"), joinShop(prog.userId, shopId, "programmer"), joinShop(op.userId, shopId, "operator")]);
  people = { owner, tooling_manager: tm, programmer: prog, operator: op };
  lib = await libraryFor(shopId);
});

async function create(assemblyId = lib.routerAssemblyId): Promise<Recipe> {
  const res = await people.programmer.agent.post(url()).send({ name: "Life", assemblyId, materialId: lib.aluminiumId, operation: "profile", params });
  if (res.status !== 201) throw new Error(JSON.stringify(res.body));
  return recipeSchema.parse(res.body);
}

function move(who: Role, id: string, to: RecipeStatus, comment?: string) {
  return people[who].agent.post(url(`/${id}/transition`)).send(comment === undefined ? { to } : { to, comment });
}

async function logCut(id: string, outcome = "clean", who: Role = "programmer") {
  const res = await people[who].agent
    .post(url(`/${id}/cut-logs`))
    .send({ outcome, actualRpm: 18000, actualFeedMmPerMin: 1500, axialDepthMm: 3, radialDepthMm: 1.5 });
  expect(res.status).toBe(201);
}

/** A recipe walked to `status` the regular way. */
async function recipeAt(status: "trial" | "proven" | "approved"): Promise<Recipe> {
  const r = await create();
  await move("programmer", r.id, "trial").expect(200);
  if (status === "trial") return r;
  await logCut(r.id);
  await move("programmer", r.id, "proven").expect(200);
  if (status === "proven") return r;
  await move("tooling_manager", r.id, "approved").expect(200);
  return r;
}

describe("POST recipes/:id/transition", () => {
  it("walks draft → trial → proven → approved with the right roles, storing each step", async () => {
    const r = await create();
    const trial = recipeSchema.parse((await move("programmer", r.id, "trial").expect(200)).body);
    expect(trial.status).toBe("trial");

    // Proven needs a clean logged cut on its machine: none yet, then only a chatter, then a clean one.
    const refused = await move("programmer", r.id, "proven");
    expect(refused.status).toBe(409);
    expect(apiErrorSchema.parse(refused.body).error.message).toBe("Log at least one clean cut of this recipe on its machine before marking it proven.");
    await logCut(r.id, "chatter");
    expect((await move("programmer", r.id, "proven")).status).toBe(409);
    await logCut(r.id, "clean");
    expect(recipeSchema.parse((await move("programmer", r.id, "proven").expect(200)).body).status).toBe("proven");

    // Approval is for tooling managers and owners.
    const denied = await move("programmer", r.id, "approved");
    expect(denied.status).toBe(403);
    expect(apiErrorSchema.parse(denied.body).error.message).toBe("Only a tooling manager or owner can make a proven recipe approved.");
    const approved = recipeSchema.parse((await move("tooling_manager", r.id, "approved", "Good on the router").expect(200)).body);
    expect(approved).toMatchObject({ status: "approved", lastComment: "Good on the router" });

    const history = recipeTransitionListSchema.parse((await people.owner.agent.get(url(`/${r.id}/transitions`)).expect(200)).body).items;
    expect(history.map((t) => [t.from, t.to, t.actorName])).toEqual([
      ["proven", "approved", "Test lc-tm"],
      ["trial", "proven", "Test lc-prog"],
      ["draft", "trial", "Test lc-prog"],
    ]);
    expect(history[0]!.comment).toBe("Good on the router");

    // Operators now see it, in the list and on its own.
    expect((await people.operator.agent.get(url(`/${r.id}`))).status).toBe(200);
    expect(recipePageSchema.parse((await people.operator.agent.get(url())).body).items.map((x) => x.id)).toContain(r.id);
  });

  it("refuses skipped steps, staying put and unknown targets", async () => {
    const r = await create();
    const skip = await move("owner", r.id, "approved");
    expect(skip.status).toBe(409);
    expect(apiErrorSchema.parse(skip.body).error.message).toMatch(/^A draft recipe cannot become approved/);
    expect((await move("owner", r.id, "draft")).status).toBe(409);
    expect((await move("owner", r.id, "proven")).status).toBe(409);
    const bad = await people.owner.agent.post(url(`/${r.id}/transition`)).send({ to: "famous" });
    expect(bad.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(bad.body).error.fields ?? {})).toEqual(["to"]);
  });

  it("refuses operators any transition (403)", async () => {
    const r = await recipeAt("proven");
    expect((await move("operator", r.id, "approved")).status).toBe(403);
  });

  it("needs a comment to send a proven or approved recipe back to trial", async () => {
    const proven = await recipeAt("proven");
    const silent = await move("tooling_manager", proven.id, "trial");
    expect(silent.status).toBe(400);
    expect(apiErrorSchema.parse(silent.body).error.fields).toEqual({ comment: "Say why it goes back to trial." });
    expect((await move("tooling_manager", proven.id, "trial", "   ")).status).toBe(400);
    const back = recipeSchema.parse((await move("tooling_manager", proven.id, "trial", "Finish too rough on the last batch").expect(200)).body);
    expect(back).toMatchObject({ status: "trial", lastComment: "Finish too rough on the last batch" });

    const approved = await recipeAt("approved");
    // Only tooling managers and owners take an approval back.
    expect((await move("programmer", approved.id, "trial", "Chatters now")).status).toBe(403);
    expect((await move("owner", approved.id, "trial", "Chatters now")).status).toBe(200);
  });

  it("only proves a recipe with a clean cut on the machine it is on now", async () => {
    const r = await recipeAt("trial");
    await logCut(r.id, "clean");
    // Moved to the mill: the router's clean cut does not prove it there.
    await people.programmer.agent.patch(url(`/${r.id}`)).send({ assemblyId: lib.millAssemblyId, changeNote: "Run it on the mill" }).expect(200);
    expect((await move("programmer", r.id, "proven")).status).toBe(409);
  });

  it("will not approve a recipe whose cutter is not approved", async () => {
    const proposedCutter = await insertCutter(shopId, { name: "Trial 6 mm cutter", status: "proposed" });
    const assembly = await insertAssembly(shopId, lib.routerId, proposedCutter);
    const r = await create(assembly);
    await move("programmer", r.id, "trial").expect(200);
    await logCut(r.id);
    await move("programmer", r.id, "proven").expect(200);
    const res = await move("owner", r.id, "approved");
    expect(res.status).toBe(409);
    expect(apiErrorSchema.parse(res.body).error.message).toBe("The cutter Trial 6 mm cutter is proposed, not approved: approve the cutter before the recipe.");
  });

  it("retires (tooling manager) and reinstates as a draft; a retired recipe cannot be edited", async () => {
    const r = await recipeAt("approved");
    expect((await move("programmer", r.id, "retired")).status).toBe(403);
    await move("tooling_manager", r.id, "retired", "Cutter discontinued").expect(200);
    const edit = await people.programmer.agent.patch(url(`/${r.id}`)).send({ name: "Revived" });
    expect(edit.status).toBe(409);
    expect(apiErrorSchema.parse(edit.body).error.message).toBe("A retired recipe cannot be edited. Reinstate it as a draft first.");
    expect((await move("owner", r.id, "trial")).status).toBe(409);
    const reinstated = recipeSchema.parse((await move("owner", r.id, "draft").expect(200)).body);
    expect(reinstated.status).toBe("draft");
  });
});

describe("editing a proven or approved recipe", () => {
  it("sends it back to trial when the cut changes, and says so", async () => {
    const r = await recipeAt("approved");
    const res = await people.programmer.agent.patch(url(`/${r.id}`)).send({ params: { ...params, axialDepthMm: 4 }, changeNote: "Deeper" });
    expect(res.status).toBe(200);
    const edited = recipeSchema.parse(res.body);
    expect(edited).toMatchObject({ status: "trial", revision: 2 });
    expect(edited.lastComment).toBe("Revision 2 changed the cut of this approved recipe: it is back on trial until it is proven again.");
    const last = recipeTransitionListSchema.parse((await people.owner.agent.get(url(`/${r.id}/transitions`))).body).items[0]!;
    expect(last).toMatchObject({ from: "approved", to: "trial", actorId: people.programmer.userId });
  });

  it("keeps the status when only the name or notes change", async () => {
    const r = await recipeAt("approved");
    const edited = recipeSchema.parse((await people.programmer.agent.patch(url(`/${r.id}`)).send({ name: "Clearer name", notes: "Climb only" }).expect(200)).body);
    expect(edited).toMatchObject({ status: "approved", revision: 2, name: "Clearer name" });
  });

  it("restoring an older revision of an approved recipe also returns it to trial", async () => {
    const r = await create();
    await people.programmer.agent.patch(url(`/${r.id}`)).send({ params: { ...params, radialDepthMm: 1 } }).expect(200);
    await move("programmer", r.id, "trial").expect(200);
    await logCut(r.id);
    await move("programmer", r.id, "proven").expect(200);
    await move("owner", r.id, "approved").expect(200);
    const restored = recipeSchema.parse((await people.programmer.agent.post(url(`/${r.id}/restore`)).send({ revision: 1 }).expect(200)).body);
    expect(restored).toMatchObject({ status: "trial", revision: 3, params: r.params });
  });
});

describe("re-checking against a changed library (PATCH with nothing to change)", () => {
  it("clears the re-check flag and writes nothing when the numbers stay", async () => {
    const r = await create();
    await getSequelize().query(`UPDATE recipes SET needs_recheck = true WHERE id = :id`, { replacements: { id: r.id } });
    expect(recipeSchema.parse((await people.programmer.agent.get(url(`/${r.id}`))).body).needsRecheck).toBe(true);
    const checked = recipeSchema.parse((await people.programmer.agent.patch(url(`/${r.id}`)).send({}).expect(200)).body);
    expect(checked).toMatchObject({ needsRecheck: false, revision: 1 });
  });

  it("writes a recomputed revision and sends a settled recipe back to trial when its numbers move", async () => {
    // Its own machine, re-measured below (the shared fixtures stay as they are).
    const machineId = await insertMachine(shopId, { ...routerMachine, name: "Re-measured router" });
    const assemblyId = await insertAssembly(shopId, machineId, lib.cutterId);
    const r = await create(assemblyId);
    await move("programmer", r.id, "trial").expect(200);
    await logCut(r.id);
    await move("programmer", r.id, "proven").expect(200);
    await move("owner", r.id, "approved").expect(200);
    // The shop re-measures the machine: twice as stiff in X and Y.
    await getSequelize().query(
      `UPDATE machines SET axes = jsonb_set(jsonb_set(axes, '{x,stiffnessNPerMm}', '3000'), '{y,stiffnessNPerMm}', '2400') WHERE id = :id;
       UPDATE recipes SET needs_recheck = true WHERE id = :recipe`,
      { replacements: { id: machineId, recipe: r.id } },
    );
    const res = await people.programmer.agent.patch(url(`/${r.id}`)).send({ changeNote: "Machine re-measured" }).expect(200);
    const after = recipeSchema.parse(res.body);
    expect(after).toMatchObject({ revision: 2, status: "trial", needsRecheck: false, params: r.params });
    // Deflection-bound: the stiffer machine takes a deeper cut at the same chip.
    expect(after.result.axialDepthMm!).toBeGreaterThan(r.result.axialDepthMm! * 1.1);
    expect(after.lastComment).toMatch(/^Revision 2 recomputed this approved recipe against the current library and its numbers moved \(.+\): it is back on trial until it is proven again\.$/);
    const rev = (await people.programmer.agent.get(url(`/${r.id}/revisions`))).body.items[0];
    expect(rev).toMatchObject({ changeNote: "Machine re-measured", changes: ["recomputed against the current library"] });
  });
});

describe("deleting by status", () => {
  it("lets programmers bin drafts but not approved recipes; tooling managers may", async () => {
    const draft = await create();
    await people.programmer.agent.delete(url(`/${draft.id}`)).expect(204);
    const approved = await recipeAt("approved");
    const denied = await people.programmer.agent.delete(url(`/${approved.id}`));
    expect(denied.status).toBe(403);
    expect(apiErrorSchema.parse(denied.body).error.message).toBe("Only a tooling manager or owner can delete an approved recipe.");
    await people.tooling_manager.agent.delete(url(`/${approved.id}`)).expect(204);
    const [rows] = await getSequelize().query(`SELECT deleted_at FROM recipes WHERE id = :id`, { replacements: { id: approved.id } });
    expect((rows as Array<{ deleted_at: Date | null }>)[0]!.deleted_at).not.toBeNull();
  });
});
