import { randomUUID } from "node:crypto";
import { mkdtemp, readdir, rm } from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { apiErrorSchema, cutLogPageSchema, cutLogSchema, recipeSchema, type Recipe } from "@ringdown/contracts";
import { getSequelize } from "../../db/sequelize.js";
import { createPerson, disconnectTestDatabase, joinShop, makeTestApp, type SignedUp } from "../../test/harness.js";
import { LocalDirectoryStorage } from "../../storage/local-directory-storage.js";
import type { Storage } from "../../storage/storage.js";
import { libraryFor } from "../recipes/recipe-test-fixtures.js";
import { createCutLog } from "./cut-logs.service.js";

// A real 1×1 PNG and a JPEG header (the type is read from these bytes).
const PNG = Buffer.from("iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAQAAAC1HAwCAAAAC0lEQVR42mNkYAAAAAYAAjCB0C8AAAAASUVORK5CYII=", "base64");
const JPEG = Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10]), Buffer.from("JFIF\0"), Buffer.alloc(200, 7), Buffer.from([0xff, 0xd9])]);
const PHOTO_MAX = 64 * 1024;

let storageDir: string;
let app: ReturnType<typeof makeTestApp>;
afterAll(async () => {
  await disconnectTestDatabase();
  await rm(storageDir, { recursive: true, force: true });
});

type Role = "owner" | "programmer" | "operator";
let people: Record<Role, SignedUp>;
let outsider: SignedUp;
let lib: Awaited<ReturnType<typeof libraryFor>>;
let shopId: string;
let draft: Recipe;
let approved: Recipe;
let trial: Recipe;
const url = (path = "") => `/api/shops/${shopId}${path}`;
const body = { outcome: "clean", actualRpm: 18000, actualFeedMmPerMin: 1500, axialDepthMm: 3, radialDepthMm: 1.5, note: "Ran clean, bright finish" };

async function makeRecipe(name: string, status: string, materialId = lib.aluminiumId): Promise<Recipe> {
  const res = await people.owner.agent
    .post(url("/recipes"))
    .send({ name, assemblyId: lib.routerAssemblyId, materialId, operation: "profile", params: { axialDepthMm: 3, radialDepthMm: 1.5 } });
  const recipe = recipeSchema.parse(res.body);
  await getSequelize().query(`UPDATE recipes SET status = :status WHERE id = :id`, { replacements: { id: recipe.id, status } });
  return { ...recipe, status: status as Recipe["status"] };
}

async function countRows(recipeId: string): Promise<{ logs: number; photos: number }> {
  const [row] = await getSequelize().query<{ logs: number; photos: number }>(
    `SELECT (SELECT count(*) FROM cut_logs WHERE recipe_id = :id) AS logs,
            (SELECT count(*) FROM cut_log_photos p JOIN cut_logs l ON l.id = p.cut_log_id WHERE l.recipe_id = :id) AS photos`,
    { replacements: { id: recipeId }, type: QueryTypes.SELECT },
  );
  return row!;
}

async function filesUnder(dir: string): Promise<string[]> {
  try {
    return (await readdir(dir, { recursive: true, withFileTypes: true })).filter((e) => e.isFile()).map((e) => path.join(e.parentPath, e.name));
  } catch {
    return [];
  }
}

beforeAll(async () => {
  storageDir = await mkdtemp(path.join(os.tmpdir(), "ringdown-cut-logs-"));
  app = makeTestApp({ storageDir, photoMaxBytes: PHOTO_MAX });
  const owner = await createPerson(app, "cl-owner", "Cut-log shop");
  shopId = owner.shopId;
  const [prog, op] = await Promise.all([createPerson(app, "cl-prog"), createPerson(app, "cl-op")]);
  await Promise.all([joinShop(prog.userId, shopId, "programmer"), joinShop(op.userId, shopId, "operator")]);
  people = { owner, programmer: prog, operator: op };
  outsider = await createPerson(app, "cl-outsider", "Other cut-log shop");
  lib = await libraryFor(shopId);
  draft = await makeRecipe("Draft edge", "draft");
  approved = await makeRecipe("Approved edge", "approved");
  trial = await makeRecipe("Trial edge", "trial", lib.mdfId);
});

describe("POST recipes/:id/cut-logs (JSON)", () => {
  it("lets an operator log a cut of an approved recipe", async () => {
    const res = await people.operator.agent.post(url(`/recipes/${approved.id}/cut-logs`)).send(body);
    expect(res.status).toBe(201);
    const log = cutLogSchema.parse(res.body);
    expect(log).toMatchObject({
      ...body,
      recipeId: approved.id,
      recipeRevision: 1,
      machineId: lib.routerId,
      materialId: lib.aluminiumId,
      userId: people.operator.userId,
      userName: "Test cl-op",
      feedOverridePct: null,
      photos: [],
      recipeName: "Approved edge",
      cutterName: "Test 6 mm 2F flat",
    });
  });

  it("lets operators log test cuts of recipes on trial, but not of drafts (404)", async () => {
    expect((await people.operator.agent.post(url(`/recipes/${trial.id}/cut-logs`)).send(body)).status).toBe(201);
    const hidden = await people.operator.agent.post(url(`/recipes/${draft.id}/cut-logs`)).send(body);
    expect(hidden.status).toBe(404);
    expect((await people.programmer.agent.post(url(`/recipes/${draft.id}/cut-logs`)).send(body)).status).toBe(201);
  });

  it("answers 400 with field messages for a bad body", async () => {
    const res = await people.programmer.agent
      .post(url(`/recipes/${draft.id}/cut-logs`))
      .send({ outcome: "exploded", actualRpm: 0, axialDepthMm: "deep", feedOverridePct: 900 });
    expect(res.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(res.body).error.fields ?? {}).sort()).toEqual(
      ["actualFeedMmPerMin", "actualRpm", "axialDepthMm", "feedOverridePct", "outcome", "radialDepthMm"].sort(),
    );
  });

  it("answers 404 for unknown and other shops' recipes", async () => {
    expect((await people.owner.agent.post(url(`/recipes/${randomUUID()}/cut-logs`)).send(body)).status).toBe(404);
    expect((await outsider.agent.post(url(`/recipes/${approved.id}/cut-logs`)).send(body)).status).toBe(404);
    expect((await outsider.agent.get(url(`/recipes/${approved.id}/cut-logs`))).status).toBe(404);
  });
});

describe("POST recipes/:id/cut-logs (multipart with photos)", () => {
  it("stores up to four photos and streams each back with its sniffed type", async () => {
    const res = await people.operator.agent
      .post(url(`/recipes/${approved.id}/cut-logs`))
      .field("data", JSON.stringify({ ...body, outcome: "chatter", note: "Chatter on the long wall" }))
      .attach("photos", PNG, { filename: "wall.png", contentType: "image/png" })
      // Named and declared wrongly: the bytes say JPEG, and JPEG is what is stored.
      .attach("photos", JPEG, { filename: "wall.bin", contentType: "application/octet-stream" });
    expect(res.status).toBe(201);
    const log = cutLogSchema.parse(res.body);
    expect(log.outcome).toBe("chatter");
    expect(log.photos.map((p) => [p.contentType, p.sizeBytes])).toEqual([
      ["image/png", PNG.length],
      ["image/jpeg", JPEG.length],
    ]);
    expect(await countRows(approved.id)).toMatchObject({ photos: 2 });

    const png = await people.operator.agent.get(log.photos[0]!.url).buffer(true).parse((r, done) => {
      const chunks: Buffer[] = [];
      r.on("data", (c: Buffer) => chunks.push(c));
      r.on("end", () => done(null, Buffer.concat(chunks)));
    });
    expect(png.status).toBe(200);
    expect(png.headers["content-type"]).toBe("image/png");
    expect(png.headers["x-content-type-options"]).toBe("nosniff");
    expect(Buffer.compare(png.body as Buffer, PNG)).toBe(0);

    // Shop-scoped: another shop's member gets 404; so do unknown or mismatched ids.
    expect((await outsider.agent.get(log.photos[0]!.url)).status).toBe(404);
    expect((await people.owner.agent.get(url(`/cut-logs/${log.id}/photos/${randomUUID()}`))).status).toBe(404);
    expect((await people.owner.agent.get(url(`/cut-logs/${randomUUID()}/photos/${log.photos[0]!.id}`))).status).toBe(404);
    expect((await people.owner.agent.get(url(`/cut-logs/not-an-id/photos/also-not`))).status).toBe(404);
  });

  it("refuses a file that is not an image, whatever it claims, leaving no rows or files", async () => {
    const before = await countRows(draft.id);
    const filesBefore = await filesUnder(storageDir);
    const res = await people.programmer.agent
      .post(url(`/recipes/${draft.id}/cut-logs`))
      .field("data", JSON.stringify(body))
      .attach("photos", PNG, { filename: "ok.png", contentType: "image/png" })
      .attach("photos", Buffer.from("<svg xmlns='http://www.w3.org/2000/svg'><script/></svg>"), { filename: "evil.jpg", contentType: "image/jpeg" });
    expect(res.status).toBe(415);
    const error = apiErrorSchema.parse(res.body).error;
    expect(error).toMatchObject({ code: "unsupported_media_type", message: "evil.jpg is not a JPEG, PNG or WebP image." });
    expect(await countRows(draft.id)).toEqual(before);
    expect(await filesUnder(storageDir)).toEqual(filesBefore);
  });

  it("refuses a photo over the size limit (413) and more than four photos (400), leaving nothing", async () => {
    const before = await countRows(draft.id);
    const filesBefore = await filesUnder(storageDir);
    const big = Buffer.concat([PNG, Buffer.alloc(PHOTO_MAX, 1)]);
    const tooBig = await people.programmer.agent.post(url(`/recipes/${draft.id}/cut-logs`)).field("data", JSON.stringify(body)).attach("photos", big, "big.png");
    expect(tooBig.status).toBe(413);
    expect(apiErrorSchema.parse(tooBig.body).error).toMatchObject({ code: "payload_too_large", message: "Each photo must be at most 0.1 MB." });

    let five = people.programmer.agent.post(url(`/recipes/${draft.id}/cut-logs`)).field("data", JSON.stringify(body));
    for (let i = 0; i < 5; i++) five = five.attach("photos", PNG, `p${i}.png`);
    const tooMany = await five;
    expect(tooMany.status).toBe(400);
    expect(apiErrorSchema.parse(tooMany.body).error.fields).toEqual({ photos: "At most 4 photos" });

    expect(await countRows(draft.id)).toEqual(before);
    expect(await filesUnder(storageDir)).toEqual(filesBefore);
  });

  it("needs the cut log as JSON in the field data", async () => {
    const missing = await people.programmer.agent.post(url(`/recipes/${draft.id}/cut-logs`)).attach("photos", PNG, "a.png");
    expect(missing.status).toBe(400);
    expect(apiErrorSchema.parse(missing.body).error.fields).toEqual({ data: "Required" });
    const broken = await people.programmer.agent.post(url(`/recipes/${draft.id}/cut-logs`)).field("data", "{not json");
    expect(apiErrorSchema.parse(broken.body).error.fields).toEqual({ data: "Not valid JSON" });
    const invalid = await people.programmer.agent.post(url(`/recipes/${draft.id}/cut-logs`)).field("data", JSON.stringify({ ...body, outcome: "meh" }));
    expect(apiErrorSchema.parse(invalid.body).error.fields).toHaveProperty("outcome");
  });

  it("removes stored files and rows when storing a later photo fails", async () => {
    const root = await mkdtemp(path.join(os.tmpdir(), "ringdown-flaky-"));
    const local = new LocalDirectoryStorage(root);
    let puts = 0;
    const flaky: Storage = {
      put: async (key, bytes, type) => {
        puts += 1;
        if (puts === 2) throw new Error("disk full");
        await local.put(key, bytes, type);
      },
      get: (key) => local.get(key),
      delete: (key) => local.delete(key),
    };
    const before = await countRows(draft.id);
    await expect(
      createCutLog(shopId, draft.id, { ...body, outcome: "clean", feedOverridePct: null }, [
        { originalName: "one.png", bytes: PNG },
        { originalName: "two.jpg", bytes: JPEG },
      ], { userId: people.programmer.userId, role: "programmer", name: "Test programmer", ip: null }, flaky),
    ).rejects.toThrow("disk full");
    expect(puts).toBe(2);
    expect(await countRows(draft.id)).toEqual(before);
    expect(await filesUnder(root)).toEqual([]);
    await rm(root, { recursive: true, force: true });
  });
});

describe("GET recipes/:id/cut-logs and GET cut-logs", () => {
  it("lists a recipe's log newest first, in pages", async () => {
    const page = cutLogPageSchema.parse((await people.operator.agent.get(url(`/recipes/${approved.id}/cut-logs?pageSize=1`)).expect(200)).body);
    expect(page.total).toBe(2);
    expect(page.items).toHaveLength(1);
    expect(page.items[0]!.outcome).toBe("chatter");
    expect((await people.operator.agent.get(url(`/recipes/${draft.id}/cut-logs`))).status).toBe(404);
    expect((await people.owner.agent.get(url(`/recipes/${draft.id}/cut-logs?pageSize=0`))).status).toBe(400);
  });

  it("lists the shop's logs for a machine and material (planner evidence)", async () => {
    const al = cutLogPageSchema.parse((await people.programmer.agent.get(url(`/cut-logs?machineId=${lib.routerId}&materialId=${lib.aluminiumId}`)).expect(200)).body);
    expect(al.items.every((l) => l.machineId === lib.routerId && l.materialId === lib.aluminiumId)).toBe(true);
    expect(new Set(al.items.map((l) => l.recipeId))).toEqual(new Set([approved.id, draft.id]));
    const chatter = cutLogPageSchema.parse((await people.programmer.agent.get(url(`/cut-logs?outcome=chatter`))).body);
    expect(chatter.items.map((l) => l.note)).toEqual(["Chatter on the long wall"]);
    const mill = cutLogPageSchema.parse((await people.programmer.agent.get(url(`/cut-logs?machineId=${lib.millId}`))).body);
    expect(mill.total).toBe(0);
    // Operators see the evidence of approved recipes and recipes on trial only (not the draft's).
    const forOperator = cutLogPageSchema.parse((await people.operator.agent.get(url(`/cut-logs?materialId=${lib.aluminiumId}`))).body);
    expect(forOperator.items.every((l) => l.recipeId === approved.id)).toBe(true);
    expect((await people.owner.agent.get(url(`/cut-logs?machineId=nope`))).status).toBe(400);
  });
});
