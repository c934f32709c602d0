/**
 * A database outage in the middle of a stream of writes. The real API server runs as a child
 * process against a PostgreSQL cluster of this file's own (created by docker-free-db/pg.sh in a
 * temporary folder, with the durable settings of the dev profile), signs someone up over HTTP, and
 * receives a steady stream of cutter creations while the cluster is stopped and started again.
 */
import { spawn, type ChildProcess } from "node:child_process";
import { mkdtemp, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { apiErrorSchema, cutterSchema, healthSchema, meSchema } from "@ringdown/contracts";
import { repoRoot } from "../config/env.js";
import { cutterBody } from "../modules/machines/library-test-fixtures.js";
import { freeTcpPort } from "../test/free-port.js";
import { runScript } from "../test/run-script.js";

/** Longest a client waits for any one answer [ms]: an answer later than this counts as a hang. */
const REQUEST_TIMEOUT_MS = 4_000;
/** The API must answer writes normally again within this long of the database's return [ms]. */
const RECOVERY_LIMIT_MS = 5_000;
/** Writers sending one request after another, side by side. */
const WRITERS = 2;

interface Outcome {
  seq: number;
  startedAt: number;
  endedAt: number;
  /** HTTP status, or "timeout" (no answer within REQUEST_TIMEOUT_MS) or "network" (no HTTP answer). */
  status: number | "timeout" | "network";
  body: unknown;
}

let dataRoot = "";
let pgEnv: Record<string, string> = {};
let server: ChildProcess | undefined;
let serverLog = "";
let baseUrl = "";
let databaseUrl = "";

const pgScript = (command: string) => runScript("docker-free-db/pg.sh", [command, "dev"], pgEnv);

/** Starts a fresh cluster on a random port in 5460-5499, trying another port when one is taken. */
async function startOwnCluster(): Promise<number> {
  let last = "";
  for (let attempt = 0; attempt < 4; attempt++) {
    const port = 5460 + Math.floor(Math.random() * 40);
    pgEnv = { RINGDOWN_PG_DATA_ROOT: dataRoot, RINGDOWN_PG_DEV_PORT: String(port) };
    const started = await pgScript("start");
    if (started.code === 0) return port;
    last = started.stderr;
    if (!/is taken by another server/.test(started.stderr)) break;
  }
  throw new Error(`could not start the outage test's own PostgreSQL cluster:\n${last}`);
}

async function call(method: string, url: string, cookie: string, body?: unknown): Promise<Omit<Outcome, "seq">> {
  const startedAt = performance.now();
  try {
    const res = await fetch(`${baseUrl}${url}`, {
      method,
      headers: { cookie, ...(body === undefined ? {} : { "content-type": "application/json" }) },
      body: body === undefined ? undefined : JSON.stringify(body),
      signal: AbortSignal.timeout(REQUEST_TIMEOUT_MS),
    });
    const text = await res.text();
    let parsed: unknown = text;
    try {
      parsed = JSON.parse(text);
    } catch {
      // Not JSON: kept as text, and the assertions on the body say so.
    }
    return { startedAt, endedAt: performance.now(), status: res.status, body: parsed };
  } catch (error) {
    const name = (error as Error).name;
    return { startedAt, endedAt: performance.now(), status: name === "TimeoutError" ? "timeout" : "network", body: String(error) };
  }
}

async function waitForHealthy(limitMs: number): Promise<void> {
  const deadline = Date.now() + limitMs;
  while (Date.now() < deadline) {
    if (server?.exitCode !== null) throw new Error(`the API exited with ${String(server?.exitCode)}:\n${serverLog}`);
    const res = await call("GET", "/api/health", "");
    if (res.status === 200) return;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`the API was not healthy after ${limitMs} ms:\n${serverLog}`);
}

async function stopServer(): Promise<void> {
  const child = server;
  if (!child || child.exitCode !== null || child.signalCode !== null) return;
  const exited = new Promise<void>((resolve) => child.once("exit", () => resolve()));
  child.kill("SIGTERM");
  const timer = setTimeout(() => child.kill("SIGKILL"), 12_000);
  await exited;
  clearTimeout(timer);
}

// Registered first so that it also runs when the set-up below fails half-way.
afterAll(async () => {
  await stopServer();
  if (dataRoot) {
    await pgScript("stop");
    await rm(dataRoot, { recursive: true, force: true });
  }
}, 60_000);

beforeAll(async () => {
  dataRoot = await mkdtemp(path.join(tmpdir(), "ringdown-outage-"));
  const pgPort = await startOwnCluster();
  databaseUrl = `postgres://postgres@127.0.0.1:${pgPort}/ringdown_outage`;
  const apiPort = await freeTcpPort();
  baseUrl = `http://127.0.0.1:${apiPort}`;
  server = spawn(process.execPath, ["--import", "tsx", "--conditions=source", "src/server.ts"], {
    cwd: path.join(repoRoot, "apps/api"),
    env: {
      ...process.env,
      NODE_ENV: "test",
      PORT: String(apiPort),
      APP_URL: baseUrl,
      DATABASE_URL: databaseUrl,
      SEED_DEMO: "false",
      RUN_WORKER: "false",
      STORAGE_DIR: path.join(dataRoot, "storage"),
    },
    stdio: ["ignore", "pipe", "pipe"],
  });
  const keep = (chunk: Buffer) => (serverLog += chunk.toString());
  server.stdout?.on("data", keep);
  server.stderr?.on("data", keep);
  await waitForHealthy(90_000);
}, 150_000);

describe("the API while PostgreSQL stops and starts again under a stream of writes", () => {
  it("answers 503 promptly while the database is down, recovers by itself, and keeps every acknowledged write", async () => {
    // A signed-in owner of a new shop.
    const signup = await fetch(`${baseUrl}/api/auth/signup`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ email: "outage-owner@tests.example", password: "correct horse battery", name: "Outage owner", shopName: "Outage shop" }),
    });
    expect(signup.status, serverLog).toBe(201);
    const me = meSchema.parse(await signup.json());
    const cookie = (signup.headers.get("set-cookie") ?? "").split(";")[0] ?? "";
    expect(cookie).toMatch(/^rd_session=/);
    const cuttersPath = `/api/shops/${me.activeShopId}/cutters`;

    // The stream: WRITERS loops, each sending its next cutter as soon as the previous one answered.
    const outcomes: Outcome[] = [];
    let nextSeq = 0;
    let streaming = true;
    const writer = async () => {
      while (streaming) {
        const seq = nextSeq++;
        const outcome = await call("POST", cuttersPath, cookie, cutterBody({ name: `Stream cutter ${seq}` }));
        outcomes.push({ seq, ...outcome });
        await new Promise((r) => setTimeout(r, 20));
      }
    };
    const writers = Array.from({ length: WRITERS }, writer);
    const waitFor = async (what: string, ok: () => boolean, limitMs: number) => {
      const deadline = performance.now() + limitMs;
      while (!ok()) {
        if (performance.now() > deadline) throw new Error(`gave up waiting for ${what}`);
        await new Promise((r) => setTimeout(r, 25));
      }
    };
    const acknowledged = () => outcomes.filter((o) => o.status === 201);

    try {
      await waitFor("writes before the outage", () => acknowledged().length >= 10, 20_000);

      // Stop PostgreSQL (fast shutdown: open sessions are ended with admin_shutdown) mid-stream.
      const stopped = await pgScript("stop");
      expect(stopped.code, stopped.stderr).toBe(0);
      const downAt = performance.now();
      await waitFor("writes while the database is down", () => outcomes.filter((o) => o.startedAt >= downAt).length >= 8, 15_000);
      const healthDown = await call("GET", "/api/health", "");
      const downUntil = performance.now();

      const started = await pgScript("start");
      expect(started.code, started.stderr).toBe(0);
      const upAt = performance.now();
      const firstWriteAfter = () => outcomes.find((o) => o.startedAt >= upAt && o.status === 201);
      await waitFor("a write acknowledged after the database's return", () => firstWriteAfter() !== undefined, 15_000);
      const recovered = firstWriteAfter() as Outcome;
      await waitFor("writes after the recovery", () => outcomes.filter((o) => o.startedAt >= recovered.endedAt && o.status === 201).length >= 6, 10_000);
      streaming = false;
      await Promise.all(writers);

      // While down: every request answered promptly with the 503 envelope.
      const duringOutage = outcomes.filter((o) => o.startedAt >= downAt && o.endedAt <= downUntil);
      expect(duringOutage.length).toBeGreaterThanOrEqual(8);
      for (const o of duringOutage) {
        expect(o.status, JSON.stringify(o)).toBe(503);
        expect(apiErrorSchema.parse(o.body)).toEqual({
          error: { code: "service_unavailable", message: "The database is unavailable. Try again in a moment." },
        });
      }
      expect(healthDown.status).toBe(503);
      expect(healthSchema.parse(healthDown.body)).toMatchObject({ status: "degraded", database: "down" });

      // Over the whole stream, including the moments of stopping and starting: nothing but 201 or
      // 503, never a 500 or a request left hanging.
      const unexpected = outcomes.filter((o) => o.status !== 201 && o.status !== 503);
      expect(unexpected, `${JSON.stringify(unexpected)}\n--- API log (tail) ---\n${serverLog.slice(-4_000)}`).toEqual([]);
      expect(outcomes.some((o) => o.status === 503)).toBe(true);

      // Back within the limit of the database accepting connections again.
      expect(recovered.endedAt - upAt).toBeLessThan(RECOVERY_LIMIT_MS);
      const healthUp = await call("GET", "/api/health", "");
      expect(healthUp.status).toBe(200);
      expect(healthSchema.parse(healthUp.body)).toMatchObject({ status: "ok", database: "up" });

      // Every acknowledged write is in the database, and nothing else but writes whose answer was
      // an error while the database was going down (committed, then the connection was cut).
      const ackedIds = acknowledged().map((o) => cutterSchema.parse(o.body).id);
      const client = new pg.Client({ connectionString: databaseUrl });
      await client.connect();
      const stored = await client
        .query<{ id: string; name: string }>("SELECT id, name FROM cutters WHERE shop_id = $1", [me.activeShopId])
        .finally(() => client.end());
      const storedIds = new Set(stored.rows.map((r) => r.id));
      expect(ackedIds.filter((id) => !storedIds.has(id))).toEqual([]);
      const ackedSet = new Set(ackedIds);
      const unacknowledgedStored = stored.rows.filter((r) => !ackedSet.has(r.id));
      const cutOff = new Set(outcomes.filter((o) => o.status !== 201 && o.startedAt < downAt).map((o) => `Stream cutter ${o.seq}`));
      expect(unacknowledgedStored.filter((r) => !cutOff.has(r.name))).toEqual([]);
      expect(new Set(ackedIds).size).toBe(ackedIds.length);
      expect(stored.rows.length - ackedIds.length).toBeGreaterThanOrEqual(0);
      expect(stored.rows.length - ackedIds.length).toBeLessThanOrEqual(cutOff.size);
    } finally {
      streaming = false;
      await Promise.all(writers);
    }
  });
});
