/**
 * Hostile input against the running API: fast-check generates requests for every shop-scoped route
 * (read from the router) and the sign-in, sign-up, password-reset, invitation and account routes,
 * each with one hostile part: a body field, a query parameter or a path parameter replaced by
 * something nasty (lone surrogates, NUL, right-to-left and zero-width marks, numbers out of range,
 * "NaN", -0, huge exponents, SQL and script injection, arrays for objects, __proto__ keys…), a
 * malformed or oversized body, or a wrong content type. Over real HTTP against real PostgreSQL:
 *  - no answer is a 5xx;
 *  - no answer shows a stack trace, a source path or a database error;
 *  - every error answer is the envelope `{ error: { code, message, fields? } }`, and a validation
 *    error caused by a body or query field names that field in `fields`;
 *  - nothing reaches Object.prototype.
 */
import { randomUUID } from "node:crypto";
import http, { type Server } from "node:http";
import fc from "fast-check";
import type { Express } from "express";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { apiErrorSchema, loginBodySchema, passwordResetBodySchema, signupBodySchema, acceptInvitationBodySchema } from "@ringdown/contracts";
import type { z } from "zod";
import { startStandIns, type StandIns } from "../dev-services/stand-ins.js";
import { cutterBody, machineBody, materialBody, teamShop, type Team } from "../modules/machines/library-test-fixtures.js";
import { libraryFor } from "../modules/recipes/recipe-test-fixtures.js";
import { createShopScopedRouter, listRoutes } from "../routes.js";
import { connectTestDatabase, disconnectTestDatabase, makeTestApp, testConfig } from "./harness.js";

/** The JSON body limit of app.ts (`express.json({ limit: "1mb" })`). */
const JSON_LIMIT_BYTES = 1024 * 1024;
/** Requests per fast-check run, sent side by side. */
const BATCH = 16;
const RUNS = 660;
const SEED = 20_260_301;

// ------------------------------------------------------------------------------ hostile values

/** A hostile JSON value, as JSON text (so that 1e999, -0 and deep nesting survive as written). */
type JsonText = string;

const LONE_AND_ODD = [
  "\uD800",
  "\uDFFF",
  "a\uDC00b",
  "\u0000",
  "nul\u0000inside",
  "\u202Eevil\u202C",
  "\u200F\u05E9\u05DC\u05D5\u05DD",
  "zero\u200Bwidth\u200D\uFEFF",
  "🛠️👩‍🔧🔩",
  "e\u0301\u0301\u0301",
  "\u0085\u2028\u2029",
  "１２３",
  "ǅ",
  "\t\n\r ",
];
const NUMERIC_STRINGS = ["NaN", "Infinity", "-Infinity", "-0", "1e309", "-1e309", "0x1F", " 12 ", "12abc", "1_000", "", "0.1e-400", "9".repeat(400)];
const INJECTIONS = [
  "' OR '1'='1",
  "'; DROP TABLE users; --",
  "1) OR pg_sleep(0)--",
  "%' AND 1=1 --",
  "\\",
  "\\x00",
  "<script>alert(1)</script>",
  '"><img src=x onerror=alert(1)>',
  "javascript:alert(1)",
  "{{7*7}}${7*7}",
  "../../../../etc/passwd",
  "__proto__",
  "constructor",
  "prototype",
];
const NUMBER_TEXTS = [
  "0",
  "-0",
  "-1",
  "1.5",
  "1e999",
  "-1e999",
  "1e-999",
  "1.7976931348623157e308",
  "5e-324",
  "9007199254740993",
  "-9007199254740993",
  "2147483648",
  "-2147483649",
  "123456789012345678901234567890",
  "0.30000000000000004",
];
const STRUCTURES = [
  "null",
  "true",
  "false",
  "[]",
  "{}",
  "[1,2,3]",
  '["a",{"b":null}]',
  '{"__proto__":{"polluted":true}}',
  '{"constructor":{"prototype":{"polluted":true}}}',
  `${"[".repeat(2000)}${"]".repeat(2000)}`,
  `${"[".repeat(200_000)}"\\u0000"${"]".repeat(200_000)}`,
  `${'{"a":'.repeat(1000)}1${"}".repeat(1000)}`,
  `{${Array.from({ length: 500 }, (_, i) => `"k${i}":${i}`).join(",")}}`,
];
const PROTO_KEYS = ["__proto__", "constructor", "prototype", "__defineGetter__", "hasOwnProperty", "toString", "valueOf"];

/** Longer than every text limit of the contracts (the longest is 4000 characters). */
const OVERLONG = ["x".repeat(4_100), "é".repeat(4_100), "🔩".repeat(4_100)];
const hostileString = fc.oneof(
  { weight: 10, arbitrary: fc.constantFrom(...LONE_AND_ODD, ...NUMERIC_STRINGS, ...INJECTIONS) },
  { weight: 5, arbitrary: fc.string({ unit: "binary", maxLength: 40 }) },
  { weight: 5, arbitrary: fc.string({ unit: "grapheme", maxLength: 20 }) },
  { weight: 1, arbitrary: fc.constantFrom(...OVERLONG) },
);

const hostileJson: fc.Arbitrary<JsonText> = fc.oneof(
  { weight: 4, arbitrary: hostileString.map((s) => JSON.stringify(s)) },
  { weight: 3, arbitrary: fc.constantFrom(...NUMBER_TEXTS) },
  { weight: 1, arbitrary: fc.double().map((n) => (Number.isFinite(n) ? JSON.stringify(n) : n > 0 ? "1e999" : n < 0 ? "-1e999" : "null")) },
  { weight: 2, arbitrary: fc.constantFrom(...STRUCTURES) },
  { weight: 1, arbitrary: fc.array(hostileString, { maxLength: 3 }).map((a) => JSON.stringify(a)) },
);

/** Percent-encodes every byte of the string's UTF-8 form (a lone surrogate becomes EF BF BD). */
const encodeAll = (s: string): string => [...Buffer.from(s, "utf8")].map((b) => `%${b.toString(16).padStart(2, "0").toUpperCase()}`).join("");
/** Raw pieces of a URL that are not valid %-encodings of anything. */
const BROKEN_ESCAPES = ["%", "%zz", "%E0%A4%A", "%ED%A0%80", "%C0%AE", "%00", "%FF%FE", "..", "%2e%2e", "%2F", "%5C"];
const hostileUrlPart = fc.oneof(
  { weight: 3, arbitrary: hostileString.filter((s) => s.length < 3000).map(encodeAll) },
  { weight: 2, arbitrary: fc.constantFrom(...BROKEN_ESCAPES) },
  { weight: 1, arbitrary: fc.constantFrom("00000000-0000-0000-0000-000000000000", "00000000-0000-0000-0000-00000000000G", "FFFFFFFF-FFFF-FFFF-FFFF-FFFFFFFFFFFF", "1", "-1", "0x10", "a".repeat(5000)) },
  { weight: 1, arbitrary: fc.uuid().map((u) => u) },
);

// ------------------------------------------------------------------------------ the routes

type Json = null | boolean | number | string | Json[] | { [key: string]: Json };

interface RouteInput {
  /** A valid body (the fuzzer breaks one part of it); undefined: the route reads no body. */
  body?: () => Json;
  /** Query parameters the route reads. */
  query?: readonly string[];
  /**
   * A body that passes this contract would reach bcrypt (cost 12, ~¼ s): only bodies the contract
   * refuses are sent, which is what hostile input is about anyway.
   */
  refuseOnly?: z.ZodType;
  /** Send without a session (the sign-out route would end the shared one). */
  anonymous?: boolean;
}

const page = ["page", "pageSize"] as const;
let ids: Record<string, string> = {};

/** Valid bodies and known query parameters of the shop-scoped routes ("METHOD /path" under the shop). */
const SHOP_INPUTS: Record<string, RouteInput> = {
  "PATCH /": { body: () => ({ name: "Fuzzed shop" }) },
  "GET /members": { query: page },
  "PATCH /members/:userId": { body: () => ({ role: "programmer" }) },
  "POST /invitations": { body: () => ({ email: "invitee@tests.example", role: "operator" }) },
  "GET /audit-events": { query: [...page, "action", "subjectType", "subjectId", "actorId", "from", "to"] },
  "POST /billing/checkout": { body: () => ({ seats: 3 }) },
  "POST /billing/checkout/confirm": { body: () => ({ sessionId: "cs_test_not_a_session" }) },
  "POST /billing/seats": { body: () => ({ seats: 4 }) },
  "GET /materials": { query: [...page, "group", "q", "scope", "deleted"] },
  "POST /materials": { body: () => materialBody() as Json },
  "PATCH /materials/:materialId": { body: () => ({ name: "Fuzzed walnut", minChipThicknessMm: 0.04 }) },
  "POST /materials/:materialId/copy": { body: () => ({ name: "Fuzzed copy" }) },
  "GET /cutters": { query: [...page, "status", "shape", "toolMaterial", "q", "sort", "dir", "deleted"] },
  "POST /cutters": { body: () => cutterBody() as Json },
  "GET /cutters/export": { query: ["units", "status"] },
  "POST /cutters/import": { query: ["dryRun"] },
  "PATCH /cutters/:cutterId": { body: () => ({ name: "Fuzzed cutter", flutes: 3 }) },
  "POST /cutters/:cutterId/transition": { body: () => ({ to: "approved" }) },
  "GET /machines": { query: [...page, "kind", "q", "deleted"] },
  "POST /machines": { body: () => machineBody() as Json },
  "GET /machines/defaults": { query: ["kind"] },
  "PATCH /machines/:machineId": { body: () => ({ name: "Fuzzed router", spindle: { minRpm: 6000, maxRpm: 24000, powerW: 1500 } }) },
  "GET /assemblies": { query: [...page, "machineId", "cutterId", "deleted"] },
  "POST /assemblies": { body: () => ({ machineId: ids.machineId!, cutterId: ids.cutterId!, holder: "ER20", stickoutMm: 20, runoutMm: 0.01 }) },
  "PATCH /assemblies/:assemblyId": { body: () => ({ stickoutMm: 22, holder: "ER25" }) },
  "POST /recommendations": { body: () => ({ assemblyId: ids.assemblyId!, materialId: ids.materialId!, operation: "profile", params: { axialDepthMm: 3, radialDepthMm: 1 } }) },
  "GET /recipes": { query: [...page, "machineId", "materialId", "cutterId", "operation", "status", "q", "sort", "order", "deleted"] },
  "POST /recipes": {
    body: () => ({ name: "Fuzzed recipe", assemblyId: ids.assemblyId!, materialId: ids.materialId!, operation: "slot", params: { axialDepthMm: 2, radialDepthMm: 6 } }),
  },
  "PATCH /recipes/:recipeId": { body: () => ({ name: "Fuzzed recipe renamed", notes: "n" }) },
  "POST /recipes/:recipeId/restore": { body: () => ({ revision: 1, changeNote: "back" }) },
  "POST /recipes/:recipeId/transition": { body: () => ({ to: "trial", comment: "try it" }) },
  "POST /recipes/:recipeId/copy": { body: () => ({ assemblyId: ids.assemblyId!, name: "Fuzzed copy" }) },
  "GET /recipes/:recipeId/cut-logs": { query: page },
  "POST /recipes/:recipeId/cut-logs": { body: () => ({ outcome: "clean", actualRpm: 18000, actualFeedMmPerMin: 1500, axialDepthMm: 2, radialDepthMm: 6, note: "ok" }) },
  "GET /cut-logs": { query: [...page, "machineId", "materialId", "cutterId", "outcome"] },
  "POST /recipes/:recipeId/ladder": { body: () => ({ parameter: "feed", rungs: 3 }) },
  "POST /recipes/:recipeId/ladder/score": { body: () => ({ index: 0, edgeQuality: 4, chips: "chips", sound: 4, heat: 2, measuredSizeMm: 6.01, note: "" }) },
  "POST /recipes/:recipeId/ladder/choose": { body: () => ({ index: 1, changeNote: "" }) },
  "GET /export": { query: ["format"] },
  "GET /export/:file": { query: ["units"] },
  "POST /machines/:machineId/stiffness-readings": { body: () => ({ xMm: 100, yMm: 100, zMm: 0, direction: "x", forceN: 50, deflectionMm: 0.1, measuredAt: "2026-03-02" }) },
  "GET /machines/:machineId/stiffness-map": { query: ["cells"] },
  "POST /machines/:machineId/backlash-readings": { body: () => ({ axis: "y", backlashMm: 0.03, measuredAt: "2026-03-02" }) },
  "POST /machines/:machineId/modes": { body: () => ({ source: "manual", direction: "x", frequencyHz: 400, dampingRatio: 0.04, stiffnessNPerMm: 2000 }) },
  "PATCH /machines/:machineId/modes/:modeId": { body: () => ({ frequencyHz: 410, note: "re-tapped" }) },
  "PUT /machines/:machineId/ceilings": { body: () => ({ deflectionCeilingMm: 0.03, avoidBands: [{ minHz: 100, maxHz: 120, note: "pump" }], modeMarginPct: 12 }) },
  "GET /machines/:machineId/recordings": { query: ["kind"] },
  "POST /recordings/:recordingId/accept-mode": { body: () => ({ direction: "x", note: "" }) },
  "POST /recordings/:recordingId/accept-dial-rpm": { body: () => ({ dialSetting: "3" }) },
};

/** Routes outside the shop scope: signing up and in, password reset, invitations, the account. */
const TOKEN = "A".repeat(43);
const OUTSIDE_INPUTS: Record<string, RouteInput> = {
  "POST /api/auth/signup": {
    body: () => ({ email: "new@tests.example", password: "correct horse battery", name: "New person", shopName: "New shop" }),
    refuseOnly: signupBodySchema,
    anonymous: true,
  },
  "POST /api/auth/login": { body: () => ({ email: "someone@tests.example", password: "correct horse battery" }), refuseOnly: loginBodySchema, anonymous: true },
  "POST /api/auth/logout": { anonymous: true },
  "POST /api/auth/password-reset": { body: () => ({ email: "someone@tests.example" }), anonymous: true },
  "GET /api/auth/password-reset/:token": { anonymous: true },
  "POST /api/auth/password-reset/:token": { body: () => ({ password: "a new long password" }), refuseOnly: passwordResetBodySchema, anonymous: true },
  "GET /api/invitations/:token": { anonymous: true },
  "POST /api/invitations/:token": { body: () => ({ name: "Invitee", password: "a new long password" }), refuseOnly: acceptInvitationBodySchema, anonymous: true },
  "PATCH /api/me": { body: () => ({ name: "Fuzzed name", unitSystem: "imperial" }) },
  "POST /api/shops": { body: () => ({ name: "Fuzzed second shop" }) },
};

interface RouteCase extends RouteInput {
  method: string;
  /** Path with :params, absolute (the shop's routes are prefixed with /api/shops/:shopId). */
  path: string;
}

// ------------------------------------------------------------------------------ requests

type Mutation =
  | { kind: "field"; path: (string | number)[]; value: JsonText }
  | { kind: "drop"; path: (string | number)[] }
  | { kind: "add"; path: (string | number)[]; key: string; value: JsonText }
  | { kind: "body"; value: JsonText };

interface Probe {
  route: RouteCase;
  /** Path parameter → raw (already encoded) segment. */
  params: Record<string, string>;
  query: string;
  /** What is sent: JSON text of a (broken) body, or raw bytes with a content type. */
  payload?: { text: string | Buffer; contentType?: string };
  /** The field a validation error must name, if one was broken on purpose. */
  field?: string;
  /** The broken body field's new value is a number or a string: well typed, it may break a rule between fields instead. */
  wellTyped?: boolean;
  description: string;
}

/** Every path of a JSON value, parents before children (objects and arrays included). */
function pathsOf(value: Json, prefix: (string | number)[] = []): (string | number)[][] {
  const out: (string | number)[][] = [];
  if (Array.isArray(value)) value.forEach((v, i) => out.push([...prefix, i], ...pathsOf(v, [...prefix, i])));
  else if (value !== null && typeof value === "object") for (const [k, v] of Object.entries(value)) out.push([...prefix, k], ...pathsOf(v, [...prefix, k]));
  return out;
}

const samePath = (a: (string | number)[], b: (string | number)[]) => a.length === b.length && a.every((p, i) => p === b[i]);

/** JSON text of `value` with the mutation applied (hostile parts are spliced in as written). */
function serialize(value: Json, m: Mutation, at: (string | number)[] = []): string {
  if (m.kind === "body") return m.value;
  if (m.kind === "field" && samePath(m.path, at)) return m.value;
  if (Array.isArray(value)) {
    const items = value.map((v, i) => [i, v] as const).filter(([i]) => !(m.kind === "drop" && samePath(m.path, [...at, i])));
    return `[${items.map(([i, v]) => serialize(v, m, [...at, i])).join(",")}]`;
  }
  if (value !== null && typeof value === "object") {
    const parts = Object.entries(value)
      .filter(([k]) => !(m.kind === "drop" && samePath(m.path, [...at, k])))
      .map(([k, v]) => `${JSON.stringify(k)}:${serialize(v, m, [...at, k])}`);
    if (m.kind === "add" && samePath(m.path, at)) parts.push(`${JSON.stringify(m.key)}:${m.value}`);
    return `{${parts.join(",")}}`;
  }
  return JSON.stringify(value);
}

const paramNames = (path: string) => [...path.matchAll(/:([A-Za-z]+)/g)].map((m) => m[1]!);

/** One hostile request to any of `routes` (each route equally likely); the arbitraries are built once per route. */
function probeArbitrary(routes: RouteCase[]): fc.Arbitrary<Probe> {
  return fc.oneof(...routes.map(routeProbe));
}

function routeProbe(route: RouteCase): fc.Arbitrary<Probe> {
  const names = paramNames(route.path);
  const base = (): Omit<Probe, "description"> => ({ route, params: {}, query: "" });
  const kinds: fc.WeightedArbitrary<Probe>[] = [];

  if (route.query?.length) {
    kinds.push({
      weight: 60,
      arbitrary: fc.tuple(fc.constantFrom(...route.query), hostileUrlPart, fc.boolean()).map(([key, value, twice]) => ({
        ...base(),
        query: twice ? `${key}=${value}&${key}=1` : `${key}=${value}`,
        field: `query.${key}`,
        description: `query ${key}=${value}${twice ? " (twice)" : ""}`,
      })),
    });
  }
  kinds.push({
    weight: 20,
    arbitrary: fc.tuple(fc.constantFrom(...PROTO_KEYS, "page", "q", "x[y]", "a.b"), hostileUrlPart).map(([key, value]) => ({
      ...base(),
      query: `${encodeAll(key)}=${value}`,
      description: `query ${key}=${value}`,
    })),
  });
  if (names.length > 0) {
    kinds.push({
      weight: 60,
      arbitrary: fc.tuple(fc.constantFrom(...names), hostileUrlPart).map(([name, value]) => ({
        ...base(),
        params: { [name]: value },
        field: `params.${name}`,
        description: `:${name} = ${value}`,
      })),
    });
  }

  const method = route.method;
  if (method !== "GET" && method !== "DELETE") {
    const seed = route.body?.();
    const mutations: fc.WeightedArbitrary<Mutation>[] = [
      { weight: 2, arbitrary: hostileJson.map((value): Mutation => ({ kind: "body", value })) },
      { weight: 1, arbitrary: fc.constantFrom(...PROTO_KEYS).chain((key) => hostileJson.map((value): Mutation => ({ kind: "add", path: [], key, value }))) },
    ];
    const paths = seed === undefined ? [] : pathsOf(seed);
    if (paths.length > 0) {
      mutations.push(
        { weight: 8, arbitrary: fc.tuple(fc.constantFrom(...paths), hostileJson).map(([path, value]): Mutation => ({ kind: "field", path, value })) },
        { weight: 1, arbitrary: fc.constantFrom(...paths).map((path): Mutation => ({ kind: "drop", path })) },
      );
      const objects = [[], ...paths].filter((p) => {
        const v = p.reduce<Json>((acc, k) => (acc as Record<string, Json>)[k as string] as Json, seed!);
        return v !== null && typeof v === "object" && !Array.isArray(v);
      });
      mutations.push({
        weight: 1,
        arbitrary: fc.tuple(fc.constantFrom(...objects), fc.constantFrom(...PROTO_KEYS), hostileJson).map(([path, key, value]): Mutation => ({ kind: "add", path, key, value })),
      });
    }
    kinds.push({
      weight: 160,
      arbitrary: fc.oneof(...mutations).map((m): Probe => {
        const text = serialize(seed ?? {}, m);
        const field = m.kind === "field" || m.kind === "drop" ? m.path.join(".") : undefined;
        return {
          ...base(),
          payload: { text, contentType: "application/json" },
          ...(field ? { field } : {}),
          ...(m.kind === "field" && /^(-?\d|")/.test(m.value) ? { wellTyped: true } : {}),
          description: `${m.kind} ${"path" in m ? m.path.join(".") : ""} ${"key" in m ? m.key : ""} = ${"value" in m ? m.value.slice(0, 120) : "(dropped)"}`,
        };
      }),
    });
    kinds.push({
      weight: 40,
      arbitrary: fc
        .constantFrom<[string | Buffer, string | undefined]>(
          ['{"name": "x",', "application/json"],
          ["{'single': 'quotes'}", "application/json"],
          ['{"a": NaN}', "application/json"],
          ['{"a": Infinity}', "application/json"],
          ['{"a": 1e999999999999}', "application/json"],
          ['{"a": 01}', "application/json"],
          ['"just a string"', "application/json"],
          ["12", "application/json"],
          ["null", "application/json"],
          ["", "application/json"],
          ["\uFEFF{}", "application/json"],
          [Buffer.from([0x7b, 0x22, 0x6e, 0x22, 0x3a, 0x22, 0xed, 0xa0, 0x80, 0xff, 0x22, 0x7d]), "application/json"],
          [Buffer.from('{"name":"x"}', "utf16le"), "application/json; charset=utf-16"],
          ['{"name":"x"}', "application/json; charset=latin1"],
          ['{"name":"x"}', "text/plain"],
          ["name=x&role=owner", "application/x-www-form-urlencoded"],
          ["<name>x</name>", "application/xml"],
          ['{"name":"x"}', "application/vnd.api+json"],
          ["--xx\r\nContent-Disposition: form-data; name=\"data\"\r\n\r\n{}\r\n--xx--\r\n", "multipart/form-data; boundary=xx"],
          ["--broken", "multipart/form-data; boundary=nope"],
          ['{"name":"x"}', undefined],
        )
        .map(([text, contentType]) => ({
          ...base(),
          payload: { text, ...(contentType ? { contentType } : {}) },
          description: `raw body as ${contentType ?? "no content type"}: ${String(text).slice(0, 60)}`,
        })),
    });
    kinds.push({
      weight: 1,
      arbitrary: fc.constantFrom(1, 100, 4096).map((extra) => ({
        ...base(),
        payload: { text: `{"name":"${"x".repeat(JSON_LIMIT_BYTES - 11 + extra)}"}`, contentType: "application/json" },
        description: `body ${extra} bytes past the limit`,
      })),
    });
  }
  return fc.oneof(...kinds);
}

/** Signs of an internal leak: stack frames, source paths, database error wording. */
const LEAKS = [
  /\n\s+at /,
  /\bat (?:async )?[\w$.<>]+ \([^)]*:\d+:\d+\)/,
  /node_modules/,
  /\/work\/|\/home\/|\/usr\/|\/tmp\//,
  /\.(?:ts|js|mjs|cjs):\d+/,
  /Sequelize\w*Error/,
  /invalid input syntax for|invalid byte sequence|violates [\w ]*constraint|relation "\w+"|column "\w+"/,
  /TypeError|ReferenceError|RangeError|SyntaxError: /,
];

// ------------------------------------------------------------------------------ the test

let standIns: StandIns;
let app: Express;
let server: Server;
/** One pool of kept-alive connections for all probes (a new TCP connection per request costs more than the request). */
const keepAlive = new http.Agent({ keepAlive: true, maxSockets: BATCH });
let team: Team;

beforeAll(async () => {
  standIns = await startStandIns();
  const roomy = { limit: 1_000_000, windowMs: 60_000 };
  app = makeTestApp({
    ...standIns.config(testConfig()),
    teamRateLimits: { passwordResetPerIp: roomy, passwordResetPerAccount: roomy, invitationsPerShop: roomy, invitationAcceptPerIp: roomy },
  });
  server = app.listen(0, "127.0.0.1");
  team = await teamShop(app, "fuzz");
  const lib = await libraryFor(team.shopId);
  const recipe = await team.owner.agent
    .post(`/api/shops/${team.shopId}/recipes`)
    .send({ name: "Fuzz base", assemblyId: lib.routerAssemblyId, materialId: lib.aluminiumId, operation: "profile", params: { axialDepthMm: 3, radialDepthMm: 1.5 } });
  if (recipe.status !== 201) throw new Error(`recipe: ${recipe.status}`);
  const modes = (await team.owner.agent.get(`/api/shops/${team.shopId}/machines/${lib.routerId}/modes`)).body as { items: { id: string }[] };
  const unknown = randomUUID();
  ids = {
    shopId: team.shopId,
    userId: team.operator.userId,
    invitationId: unknown,
    materialId: lib.aluminiumId,
    cutterId: lib.cutterId,
    machineId: lib.routerId,
    assemblyId: lib.routerAssemblyId,
    recipeId: (recipe.body as { id: string }).id,
    modeId: modes.items[0]!.id,
    cutLogId: unknown,
    photoId: unknown,
    readingId: unknown,
    recordingId: unknown,
    file: "recipes.csv",
    token: TOKEN,
  };
});

afterAll(async () => {
  keepAlive.destroy();
  await new Promise((resolve) => server?.close(resolve));
  await standIns?.close();
  await disconnectTestDatabase();
});

connectTestDatabase();
const shopRoutes: RouteCase[] = listRoutes(createShopScopedRouter(testConfig())).map((r) => ({
  method: r.method,
  path: `/api/shops/:shopId${r.path === "/" ? "" : r.path}`,
  ...SHOP_INPUTS[`${r.method} ${r.path}`],
}));
const outsideRoutes: RouteCase[] = Object.entries(OUTSIDE_INPUTS).map(([key, input]) => {
  const [method, path] = key.split(" ") as [string, string];
  return { method, path, ...input };
});

function urlOf(probe: Probe): string {
  const path = probe.route.path.replace(/:([A-Za-z]+)/g, (_, name: string) => probe.params[name] ?? ids[name] ?? "missing");
  return probe.query ? `${path}?${probe.query}` : path;
}

/** Whether a broken body would still pass a contract (and so reach bcrypt): such probes are skipped. */
function passesContract(probe: Probe): boolean {
  if (!probe.route.refuseOnly || !probe.payload || typeof probe.payload.text !== "string") return false;
  try {
    return probe.route.refuseOnly.safeParse(JSON.parse(probe.payload.text)).success;
  } catch {
    return false;
  }
}

/** The message of `validate()` when a contract refuses a body or query field. */
const CONTRACT_REFUSAL = "Some fields need attention.";

/** What is wrong with an answer to a probe, or undefined when it is as it should be. */
function problemWith(probe: Probe, status: number, text: string): string | undefined {
  if (status >= 500) return "a 5xx answer";
  const leak = LEAKS.find((pattern) => pattern.test(text));
  if (leak) return `the body shows internals (${String(leak)})`;
  if (status < 400) return undefined;
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch {
    return "an error answer that is not JSON";
  }
  const parsed = apiErrorSchema.safeParse(body);
  if (!parsed.success || Object.keys(body as object).join() !== "error") return "an error answer that is not { error: { code, message, fields? } }";
  const { code, message, fields } = parsed.data.error;
  const field = probe.field;
  if (status === 400 && code === "validation_failed" && field && !field.startsWith("params.")) {
    const keys = Object.keys(fields ?? {});
    if (keys.length === 0) return `a validation error without fields after breaking ${field}`;
    // When the contract refused the request, it names the broken field itself, a part of it, or the
    // object it sits in (e.g. a whole replaced list); a well-typed value may instead break a rule
    // between fields, which names a field beside it (overall length 0.3 mm: "Flute length cannot
    // exceed the overall length" on fluteLengthMm). A rule of the service may name another field
    // (restoring a revision whose assembly was deleted meanwhile names assemblyId).
    const named = keys.some((k) => k === field || k.startsWith(`${field}.`) || field.startsWith(`${k}.`));
    const parent = (path: string) => path.split(".").slice(0, -1).join(".");
    const besideIt = probe.wellTyped === true && keys.every((k) => parent(k) === parent(field));
    if (message === CONTRACT_REFUSAL && !named && !besideIt) return `fields ${JSON.stringify(fields)} do not name ${field}`;
  }
  return undefined;
}

describe("inputs the fuzzing once broke (1)", () => {
  it("a stiffness reading whose force ÷ deflection no machine axis can have is refused with its field (a vanishing deflection made it infinite: 500)", async () => {
    const url = `/api/shops/${team.shopId}/machines/${ids.machineId}/stiffness-readings`;
    const reading = (forceN: number, deflectionMm: number) => ({ xMm: 10, yMm: 10, direction: "x", forceN, deflectionMm, measuredAt: "2026-03-02" });
    for (const [forceN, deflectionMm] of [[50, 5e-324], [50, 1e-300], [5000, 0.0001]] as const) {
      const res = await team.owner.agent.post(url).send(reading(forceN, deflectionMm));
      expect(res.status).toBe(400);
      expect(apiErrorSchema.parse(res.body).error.fields).toEqual({ deflectionMm: "Force ÷ deflection is stiffer than any machine axis may be: check the dial reading and its units" });
    }
    // 1000 N / 0.0001 mm = 10⁷ N/mm, the stiffest a machine axis may be: accepted.
    const stiffest = await team.owner.agent.post(url).send(reading(1000, 0.0001));
    expect(stiffest.status).toBe(201);
    expect((stiffest.body as { reading: { stiffnessNPerMm: number } }).reading.stiffnessNPerMm).toBeCloseTo(1e7, 0);
    const cleanUp = await team.owner.agent.delete(`${url}/${(stiffest.body as { reading: { id: string } }).reading.id}`);
    expect(cleanUp.status).toBe(200);
  });

  it("text holding a NUL character is refused with its field, on every route alike (raw queries failed with a 500, others stored it altered)", async () => {
    const shop = `/api/shops/${team.shopId}`;
    const message = "Remove the NUL character (U+0000)";
    const ladder = await team.owner.agent.post(`${shop}/recipes/${ids.recipeId}/ladder`).send({ parameter: "feed", rungs: 3 });
    expect(ladder.status).toBe(201);
    const cases = [
      [team.owner.agent.post(`${shop}/recipes/${ids.recipeId}/transition`).send({ to: "trial", comment: "ok\u0000" }), { comment: message }],
      [team.owner.agent.post(`${shop}/recipes/${ids.recipeId}/ladder/score`).send({ index: 0, edgeQuality: 4, chips: "chips", sound: 4, heat: 2, note: "\u0000" }), { note: message }],
      [team.owner.agent.post(`${shop}/machines`).send(machineBody({ name: "Router\u0000" })), { name: message }],
      [team.owner.agent.patch(`${shop}/cutters/${ids.cutterId}`).send({ notes: "a\u0000" }), { notes: message }],
      [team.owner.agent.get(`${shop}/machines?q=a%00b`), { "query.q": message }],
      [team.owner.agent.post(`${shop}/recipes/${ids.recipeId}/cut-logs`).send({ outcome: "clean", actualRpm: 18000, actualFeedMmPerMin: 1500, axialDepthMm: 2, radialDepthMm: 1, note: "a\u0000" }), { note: message }],
      [team.owner.agent.patch("/api/me").send({ name: "Me\u0000" }), { name: message }],
    ] as const;
    for (const [pending, fields] of cases) {
      const res = await pending;
      expect(res.status, JSON.stringify(res.body)).toBe(400);
      expect(apiErrorSchema.parse(res.body).error.fields).toEqual(fields);
    }
    // Nested far deeper than any contract reaches (the first version of the check overflowed the stack: 500).
    const deep = await team.owner.agent.post("/api/shops").set("Content-Type", "application/json").send(`{"name":${"[".repeat(200_000)}"\\u0000"${"]".repeat(200_000)}}`);
    expect(deep.status).toBe(400);
    expect(apiErrorSchema.parse(deep.body).error.fields).toEqual({ name: expect.any(String) });
  });

  it("a checkout id the provider's client cannot put in a URL is refused with its field (was a 400 blaming the address)", async () => {
    const res = await team.owner.agent.post(`/api/shops/${team.shopId}/billing/checkout/confirm`).send({ sessionId: "\udfff" });
    expect(res.status).toBe(400);
    expect(apiErrorSchema.parse(res.body).error.fields).toEqual({ sessionId: "This is not a checkout id" });
  });
});

describe("inputs the fuzzing once broke (2)", () => {
  it.each([
    ["cut log", () => `/recipes/${ids.recipeId}/cut-logs`],
    ["recording", () => `/machines/${ids.machineId}/recordings`],
  ])("a %s upload whose multipart body cannot be read is refused with 400 (was a 500)", async (_what, path) => {
    for (const [body, type] of [
      ["--broken", "multipart/form-data; boundary=nope"],
      ['--xx\r\nContent-Disposition: form-data; name="data"\r\n\r\n{"outcome"', "multipart/form-data; boundary=xx"],
    ]) {
      const res = await team.owner.agent.post(`/api/shops/${team.shopId}${path()}`).set("Content-Type", type!).send(body!);
      expect(res.status).toBe(400);
      expect(apiErrorSchema.parse(res.body).error).toMatchObject({ code: "validation_failed", message: expect.stringMatching(/^The upload could not be read/) });
    }
  });
});

describe("hostile input", () => {
  it("never answers 5xx, never leaks internals, and always answers errors with the envelope", async () => {
    const routes = [...shopRoutes, ...outsideRoutes];
    const prototypeBefore = Object.getOwnPropertyNames(Object.prototype).sort();
    let sent = 0;
    let fieldChecks = 0;
    const statuses = new Set<number>();

    const send = async (probe: Probe) => {
      const method = probe.route.method.toLowerCase() as "get" | "post" | "patch" | "put" | "delete";
      let req = request(server)[method](urlOf(probe)).agent(keepAlive);
      if (!probe.route.anonymous) req = req.set("Cookie", team.owner.cookie);
      if (probe.payload) {
        if (probe.payload.contentType) req = req.set("Content-Type", probe.payload.contentType);
        req = req.send(probe.payload.text);
      }
      sent++;
      // The body as text, whatever its type: leaks are looked for in what was sent, not in a parse of it.
      const res = await req.buffer(true).parse((response, done) => {
        const chunks: Buffer[] = [];
        response.on("data", (c: Buffer) => chunks.push(c));
        response.on("end", () => done(null, Buffer.concat(chunks).toString("utf8")));
      });
      statuses.add(res.status);
      if (res.status === 400 && probe.field && !probe.field.startsWith("params.")) fieldChecks++;
      const problem = problemWith(probe, res.status, res.body as string);
      return problem && `${probe.route.method} ${probe.route.path} with ${probe.description} → ${res.status} ${String(res.body).slice(0, 300)}: ${problem}`;
    };

    await fc.assert(
      fc.asyncProperty(fc.array(probeArbitrary(routes), { minLength: BATCH, maxLength: BATCH }), async (batch) => {
        const problems = await Promise.all(batch.filter((p) => !passesContract(p)).map(send));
        expect(problems.filter(Boolean)).toEqual([]);
      }),
      { seed: SEED, numRuns: RUNS, endOnFailure: true },
    );

    expect(sent).toBeGreaterThanOrEqual(10_000);
    expect(fieldChecks).toBeGreaterThan(1_000);
    expect([...statuses].filter((s) => s < 500).length).toBeGreaterThan(5);
    expect(Object.getOwnPropertyNames(Object.prototype).sort()).toEqual(prototypeBefore);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    // The shared session survived the whole run (nothing hostile signed it out or broke it).
    expect((await request(server).get("/api/me").set("Cookie", team.owner.cookie)).status).toBe(200);
  }, 300_000);
});
