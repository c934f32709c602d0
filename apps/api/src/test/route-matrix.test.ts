/**
 * Who may call what: every shop-scoped route, read from the router itself, is called by each role
 * of one shop, by a member of another shop, and without a session, and must answer exactly the
 * status its row in ACCESS says. A route the table does not list (or a row for a route that no
 * longer exists) fails the test, so a new route cannot skip this check. Then every route outside
 * the shop scope, read from the app's own routers, must refuse a request without a session with
 * 401 unless it is listed as public.
 *
 * Probes for allowed roles are chosen not to change the shop: writes send a JSON array where every
 * contract wants an object (refused with 400 after the role check has passed), deletes name a
 * record that does not exist (404 for that record, after the role check), and body-less actions
 * ask for what is already so (restoring a live record, 200; cancelling a plan that is not set to
 * end, 409), so the statuses hold in any order.
 */
import { randomUUID } from "node:crypto";
import { mkdtemp, rm } from "node:fs/promises";
import type { Server } from "node:http";
import { tmpdir } from "node:os";
import path from "node:path";
import type { Express, Router } from "express";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { apiErrorSchema, roles, type Role } from "@ringdown/contracts";
import { startStandIns, type StandIns } from "../dev-services/stand-ins.js";
import { startJobQueue, stopJobQueue } from "../jobs/job-queue.js";
import { getSequelize } from "../db/sequelize.js";
import { teamShop, type Team } from "../modules/machines/library-test-fixtures.js";
import { libraryFor } from "../modules/recipes/recipe-test-fixtures.js";
import { seriesCsv } from "../modules/recordings/recording-fixtures.js";
import { createShopScopedRouter, listRoutes } from "../routes.js";
import { testDatabaseUrl } from "./database-url.js";
import { connectTestDatabase, createPerson, disconnectTestDatabase, makeTestApp, testConfig, uniqueEmail, type SignedUp } from "./harness.js";

/** Path parameters the fixture fills with real ids of the team's shop. */
type Ids = Record<string, string>;

interface Access {
  /** Least role allowed (roles are ordered owner → operator). */
  min: Role;
  /** Exact status every allowed role gets for the probe. */
  ok: number;
  /** Allowed roles whose probe the service answers differently (a rule beyond the route's minimum role). */
  byRole?: Partial<Record<Role, number>>;
  /** Path parameters that name a record that does not exist (deletes): allowed roles get 404 for it. */
  missing?: readonly string[];
  /** Overrides of the fixture's ids for this route (e.g. two kinds of `:readingId`). */
  ids?: Ids;
  /** Query string sent with the probe. */
  query?: string;
}

const owner = (ok: number, extra: Partial<Access> = {}): Access => ({ min: "owner", ok, ...extra });
const manager = (ok: number, extra: Partial<Access> = {}): Access => ({ min: "tooling_manager", ok, ...extra });
const programmer = (ok: number, extra: Partial<Access> = {}): Access => ({ min: "programmer", ok, ...extra });
const member = (ok: number, extra: Partial<Access> = {}): Access => ({ min: "operator", ok, ...extra });

/**
 * Every shop-scoped route ("METHOD /path" relative to /api/shops/:shopId) and who may call it.
 * 400 = the probe body was refused by the route's contract (so the role check had passed).
 */
const ACCESS: Record<string, Access> = {
  "GET /": member(200),
  "PATCH /": owner(400),
  "GET /members": member(200),
  "PATCH /members/:userId": owner(400),
  "DELETE /members/:userId": owner(404, { missing: ["userId"] }),
  "GET /invitations": owner(200),
  "POST /invitations": owner(400),
  "POST /invitations/:invitationId/resend": owner(404, { missing: ["invitationId"] }),
  "DELETE /invitations/:invitationId": owner(404, { missing: ["invitationId"] }),
  "GET /audit-events": owner(200),
  "GET /plan": member(200),
  "GET /billing": owner(200),
  "POST /billing/checkout": owner(400),
  "POST /billing/checkout/confirm": owner(400),
  "POST /billing/seats": owner(400),
  "POST /billing/cancel": owner(409),
  "POST /billing/resume": owner(409),
  "GET /materials": member(200),
  "POST /materials": manager(400),
  "GET /materials/:materialId": member(200),
  "PATCH /materials/:materialId": manager(400),
  "DELETE /materials/:materialId": manager(404, { missing: ["materialId"] }),
  "POST /materials/:materialId/copy": manager(400),
  "POST /materials/:materialId/restore": manager(200),
  "GET /cutters": member(200),
  "POST /cutters": programmer(400),
  "GET /cutters/export": member(200),
  "POST /cutters/import": manager(415),
  "GET /cutters/:cutterId": member(200),
  "PATCH /cutters/:cutterId": programmer(400),
  "DELETE /cutters/:cutterId": programmer(404, { missing: ["cutterId"] }),
  // Programmers may restore only proposed cutters; the fixture's cutter is approved.
  "POST /cutters/:cutterId/restore": programmer(200, { byRole: { programmer: 403 } }),
  "POST /cutters/:cutterId/transition": manager(400),
  "GET /machines": member(200),
  "POST /machines": manager(400),
  "GET /machines/defaults": member(200, { query: "kind=gantry_router" }),
  "GET /machines/:machineId": member(200),
  "PATCH /machines/:machineId": manager(400),
  "DELETE /machines/:machineId": manager(404, { missing: ["machineId"] }),
  "POST /machines/:machineId/restore": manager(200),
  "GET /assemblies": member(200),
  "POST /assemblies": programmer(400),
  "GET /assemblies/:assemblyId": member(200),
  "PATCH /assemblies/:assemblyId": programmer(400),
  "DELETE /assemblies/:assemblyId": programmer(404, { missing: ["assemblyId"] }),
  "POST /assemblies/:assemblyId/restore": programmer(200),
  "POST /recommendations": member(400),
  "GET /recipes": member(200),
  "POST /recipes": programmer(400),
  "GET /recipes/:recipeId": member(200),
  "PATCH /recipes/:recipeId": programmer(400),
  "DELETE /recipes/:recipeId": programmer(404, { missing: ["recipeId"] }),
  "POST /recipes/:recipeId/restore-deleted": programmer(409),
  "GET /recipes/:recipeId/revisions": member(200),
  "POST /recipes/:recipeId/restore": programmer(400),
  "GET /recipes/:recipeId/transitions": member(200),
  "POST /recipes/:recipeId/transition": programmer(400),
  "POST /recipes/:recipeId/copy": programmer(400),
  "GET /recipes/:recipeId/cut-logs": member(200),
  "POST /recipes/:recipeId/cut-logs": member(400),
  "GET /cut-logs": member(200),
  "GET /cut-logs/:cutLogId/photos/:photoId": member(200),
  "POST /recipes/:recipeId/ladder": programmer(400),
  "GET /recipes/:recipeId/ladder": member(404),
  "POST /recipes/:recipeId/ladder/score": member(400),
  "POST /recipes/:recipeId/ladder/choose": programmer(400),
  "GET /export": manager(200),
  "GET /export/:file": manager(200),
  "GET /machines/:machineId/stiffness-readings": member(200),
  "POST /machines/:machineId/stiffness-readings": manager(400),
  "DELETE /machines/:machineId/stiffness-readings/:readingId": manager(404, { missing: ["readingId"] }),
  "GET /machines/:machineId/stiffness-map": member(200),
  "GET /machines/:machineId/backlash-readings": member(200),
  "POST /machines/:machineId/backlash-readings": manager(400),
  "DELETE /machines/:machineId/backlash-readings/:readingId": manager(404, { missing: ["readingId"] }),
  "GET /machines/:machineId/modes": member(200),
  "POST /machines/:machineId/modes": manager(400),
  "PATCH /machines/:machineId/modes/:modeId": manager(400),
  "DELETE /machines/:machineId/modes/:modeId": manager(404, { missing: ["modeId"] }),
  "GET /machines/:machineId/ceilings": member(200),
  "PUT /machines/:machineId/ceilings": manager(400),
  "GET /machines/:machineId/recordings": member(200),
  "POST /machines/:machineId/recordings": member(400),
  "GET /machines/:machineId/recordings/:recordingId": member(200),
  "GET /machines/:machineId/recordings/:recordingId/file": member(200),
  "DELETE /machines/:machineId/recordings/:recordingId": manager(404, { missing: ["recordingId"] }),
  "POST /recordings/:recordingId/accept-mode": manager(400),
  "POST /recordings/:recordingId/accept-dial-rpm": manager(400),
};

/**
 * Every /api route outside /api/shops/:shopId, by the mount path app.ts gives its router, and
 * whether it answers without a session. Everything not public must answer 401 without one.
 */
const PUBLIC = "public";
const SIGNED_IN = "signed-in";
const OUTSIDE: Record<string, typeof PUBLIC | typeof SIGNED_IN> = {
  "POST /api/billing/webhook": PUBLIC,
  "GET /api/health": PUBLIC,
  "POST /api/auth/password-reset": PUBLIC,
  "GET /api/auth/password-reset/:token": PUBLIC,
  "POST /api/auth/password-reset/:token": PUBLIC,
  "GET /api/invitations/:token": PUBLIC,
  "POST /api/invitations/:token": PUBLIC,
  "GET /api/dev/mail": PUBLIC,
  "GET /api/dev/mail/:id/html": PUBLIC,
  "POST /api/auth/signup": PUBLIC,
  "POST /api/auth/login": PUBLIC,
  "POST /api/auth/logout": PUBLIC,
  "GET /api/me": SIGNED_IN,
  "PATCH /api/me": SIGNED_IN,
  "POST /api/shops": SIGNED_IN,
};

/** The mount paths of app.ts's /api routers, in the order it mounts them. */
const MOUNTS = ["/billing/webhook", "/health", "/auth/password-reset", "/invitations", "/dev/mail", "/auth", "/me", "/shops/:shopId", "/shops"];

interface Layer {
  route?: { path: string; methods: Record<string, boolean> };
  handle: { stack?: Layer[] };
  match(path: string): boolean;
}

/** "METHOD /api/mount/path" for every route of every router mounted on /api, except the shop scope. */
function outsideRoutes(app: Express): string[] {
  const top = (app as unknown as { router: { stack: Layer[] } }).router.stack;
  const api = top.find((l) => l.handle.stack && l.match("/api/health"));
  if (!api?.handle.stack) throw new Error("no /api router on the app");
  const keys: string[] = [];
  for (const layer of api.handle.stack) {
    const routes = layer.handle.stack;
    if (!routes || layer.route) continue;
    // Which mount is this router on? A layer matches its own mount path and every path below it,
    // so the shortest mount path (with a sample id) it matches is its own.
    const mount = MOUNTS.filter((m) => layer.match(m.replace(":shopId", randomUUID()))).sort((a, b) => a.length - b.length)[0];
    if (!mount) throw new Error("a router is mounted on /api at a path this test does not know");
    if (mount === "/shops/:shopId") continue;
    for (const l of routes) {
      if (!l.route) continue;
      for (const [method, on] of Object.entries(l.route.methods)) {
        if (on && method !== "_all") keys.push(`${method.toUpperCase()} /api${mount}${l.route.path === "/" ? "" : l.route.path}`);
      }
    }
  }
  return keys;
}

// A real 1×1 PNG for the cut-log photo.
const PNG = Buffer.from("iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAQAAAC1HAwCAAAAC0lEQVR42mNkYAAAAAYAAjCB0C8AAAAASUVORK5CYII=", "base64");

let standIns: StandIns;
let storageDir: string;
let app: Express;
let team: Team;
let outsider: SignedUp;
let ids: Ids;
/** One listening server for every probe, and an agent per caller holding their session cookie. */
let server: Server;
let agents: Record<Role | "outsider", Agent>;

beforeAll(async () => {
  storageDir = await mkdtemp(path.join(tmpdir(), "ringdown-matrix-"));
  standIns = await startStandIns();
  app = makeTestApp({ ...standIns.config(testConfig()), storageDir });
  await startJobQueue(testDatabaseUrl());
  team = await teamShop(app, "matrix");
  outsider = await createPerson(app, "matrix-outsider", "Matrix outsider's shop");
  const shop = `/api/shops/${team.shopId}`;
  const lib = await libraryFor(team.shopId);
  const { owner: boss } = team;

  const recipe = await boss.agent
    .post(`${shop}/recipes`)
    .send({ name: "Matrix profile", assemblyId: lib.routerAssemblyId, materialId: lib.aluminiumId, operation: "profile", params: { axialDepthMm: 3, radialDepthMm: 1.5 } });
  if (recipe.status !== 201) throw new Error(`recipe: ${recipe.status} ${JSON.stringify(recipe.body)}`);
  const recipeId = (recipe.body as { id: string }).id;
  // Approved, so operators see it too.
  await getSequelize().query("UPDATE recipes SET status = 'approved' WHERE id = $1", { bind: [recipeId] });

  const log = await boss.agent
    .post(`${shop}/recipes/${recipeId}/cut-logs`)
    .field("data", JSON.stringify({ outcome: "clean", actualRpm: 18000, actualFeedMmPerMin: 1500, axialDepthMm: 3, radialDepthMm: 1.5, note: "Matrix" }))
    .attach("photos", PNG, { filename: "wall.png", contentType: "image/png" });
  if (log.status !== 201) throw new Error(`cut log: ${log.status} ${JSON.stringify(log.body)}`);
  const cutLog = log.body as { id: string; photos: { id: string }[] };

  const stiffness = await boss.agent
    .post(`${shop}/machines/${lib.routerId}/stiffness-readings`)
    .send({ xMm: 300, yMm: 300, zMm: 0, direction: "y", forceN: 50, deflectionMm: 0.2, measuredAt: "2026-03-02" });
  const backlash = await boss.agent.post(`${shop}/machines/${lib.routerId}/backlash-readings`).send({ axis: "x", backlashMm: 0.02, measuredAt: "2026-01-10" });
  const modes = await boss.agent.get(`${shop}/machines/${lib.routerId}/modes`);
  const recording = await boss.agent
    .post(`${shop}/machines/${lib.routerId}/recordings`)
    .field("kind", "cut")
    .attach("file", seriesCsv(new Float64Array(800).map((_, i) => Math.sin(i / 3)), 8000), "cut.csv");
  const invitation = await boss.agent.post(`${shop}/invitations`).send({ email: uniqueEmail("matrix-invitee"), role: "operator" });
  for (const [what, res, status] of [["stiffness", stiffness, 201], ["backlash", backlash, 201], ["modes", modes, 200], ["recording", recording, 202], ["invitation", invitation, 201]] as const) {
    if (res.status !== status) throw new Error(`${what}: ${res.status} ${JSON.stringify(res.body)}`);
  }

  server = app.listen(0, "127.0.0.1");
  const agentOf = (person: SignedUp) => request.agent(server).set("Cookie", person.cookie);
  agents = { owner: agentOf(team.owner), tooling_manager: agentOf(team.tooling_manager), programmer: agentOf(team.programmer), operator: agentOf(team.operator), outsider: agentOf(outsider) };

  ids = {
    userId: team.operator.userId,
    invitationId: (invitation.body as { id: string }).id,
    materialId: lib.aluminiumId,
    cutterId: lib.cutterId,
    machineId: lib.routerId,
    assemblyId: lib.routerAssemblyId,
    recipeId,
    cutLogId: cutLog.id,
    photoId: cutLog.photos[0]!.id,
    modeId: (modes.body as { items: { id: string }[] }).items[0]!.id,
    recordingId: (recording.body as { recording: { id: string } }).recording.id,
    file: "cutters.csv",
  };
  ACCESS["DELETE /machines/:machineId/stiffness-readings/:readingId"]!.ids = { readingId: (stiffness.body as { reading: { id: string } }).reading.id };
  ACCESS["DELETE /machines/:machineId/backlash-readings/:readingId"]!.ids = { readingId: (backlash.body as { reading: { id: string } }).reading.id };
});

afterAll(async () => {
  await new Promise((resolve) => server?.close(resolve));
  await stopJobQueue({ graceful: false });
  await standIns?.close();
  await disconnectTestDatabase();
  await rm(storageDir, { recursive: true, force: true });
});

connectTestDatabase();
const routes = listRoutes(createShopScopedRouter(testConfig()) as Router).map((r) => `${r.method} ${r.path}`);

function urlFor(key: string, shopId: string): string {
  const [, routePath] = key.split(" ") as [string, string];
  const access = ACCESS[key]!;
  const filled = routePath.replace(/:([A-Za-z]+)/g, (_, name: string) => {
    if (access.missing?.includes(name)) return randomUUID();
    const id = access.ids?.[name] ?? ids[name];
    if (!id) throw new Error(`the fixture has no id for :${name} (${key})`);
    return id;
  });
  return `/api/shops/${shopId}${filled === "/" ? "" : filled}${access.query ? `?${access.query}` : ""}`;
}

/** A JSON array where every route wants an object: refused by any body contract, changes nothing. */
const PROBE_BODY: unknown[] = [];

type Agent = ReturnType<typeof request.agent> | ReturnType<typeof request>;

function send(agent: Agent, key: string, shopId: string) {
  const method = key.split(" ")[0]!.toLowerCase() as "get" | "post" | "patch" | "put" | "delete";
  const req = agent[method](urlFor(key, shopId));
  return method === "get" || method === "delete" ? req : req.send(PROBE_BODY);
}

describe("the access table lists exactly the shop-scoped routes", () => {
  it("has a row for every route on the router", () => {
    expect(routes.filter((r) => !(r in ACCESS)).join(", ")).toBe("");
  });

  it("has no row for a route that no longer exists", () => {
    expect(Object.keys(ACCESS).filter((k) => !routes.includes(k)).join(", ")).toBe("");
  });
});

describe("every shop-scoped route × every role × another shop × no session", () => {
  it.each(routes.filter((r) => r in ACCESS))("%s", async (key) => {
    const access = ACCESS[key]!;
    const allowed = (role: Role) => roles.indexOf(role) <= roles.indexOf(access.min);
    const expected: Record<string, number> = { "member of another shop": 404, "no session": 401 };
    for (const role of roles) expected[role] = allowed(role) ? (access.byRole?.[role] ?? access.ok) : 403;

    // Every probe is refused or changes nothing, so they may run side by side.
    const callers: [string, Agent][] = [...roles.map((r): [string, Agent] => [r, agents[r]]), ["member of another shop", agents.outsider], ["no session", request(server)]];
    const answers = await Promise.all(callers.map(async ([who, agent]) => [who, await send(agent, key, team.shopId)] as const));
    const got = Object.fromEntries(answers.map(([who, res]) => [who, res.status]));
    expect(got, JSON.stringify(Object.fromEntries(answers.map(([who, res]) => [who, res.body])))).toEqual(expected);

    for (const [who, res] of answers) {
      if (res.status < 400) continue;
      const error = apiErrorSchema.parse(res.body).error;
      if (who === "member of another shop") expect(error).toEqual({ code: "not_found", message: "Shop not found." });
      else if (who === "no session") expect(error.code).toBe("unauthenticated");
      else {
        expect(error.message, who).not.toBe("Shop not found.");
        expect(error.code, who).toBe({ 400: "validation_failed", 403: "forbidden", 404: "not_found", 409: "conflict", 415: "unsupported_media_type" }[res.status]);
      }
    }
  });
});

describe("routes outside the shop scope", () => {
  const keys = () => outsideRoutes(app);

  it("the table lists exactly the routes mounted on /api", () => {
    const found = keys();
    expect(found.filter((k) => !(k in OUTSIDE)).join(", "), "routes missing from the table").toBe("");
    expect(Object.keys(OUTSIDE).filter((k) => !found.includes(k)).join(", "), "rows without a route").toBe("");
  });

  it("answers 401 without a session everywhere but the public routes", async () => {
    const signedIn = Object.entries(OUTSIDE).filter(([, kind]) => kind === SIGNED_IN);
    expect(signedIn.length).toBeGreaterThan(0);
    for (const [key] of signedIn) {
      const [method, routePath] = key.split(" ") as [string, string];
      const res = await request(server)[method.toLowerCase() as "get"](routePath).send({});
      expect(res.status, key).toBe(401);
      expect(apiErrorSchema.parse(res.body).error.code, key).toBe("unauthenticated");
    }
  });

  it("answers public routes without a session with something other than 401", async () => {
    const token = "A".repeat(43);
    for (const [key, kind] of Object.entries(OUTSIDE)) {
      if (kind !== PUBLIC) continue;
      const [method, routePath] = key.split(" ") as [string, string];
      const url = routePath.replace(":token", token).replace(":id", "no-such-mail");
      const res = await request(server)[method.toLowerCase() as "get"](url).send(method === "GET" ? undefined : {});
      expect(res.status, key).not.toBe(401);
      expect(res.status, key).toBeLessThan(500);
    }
  });
});
