/*
 * Ringdown run as it is scaled out: two API processes (the real server, src/server.ts, with the
 * analysis worker off) and one separate analysis worker (src/worker.ts), started at the same time
 * on one empty database and one storage directory, on free ports. A client then moves between
 * the two API processes as a load balancer would send it: the session, the writes, the upload, the
 * analysis and the rate-limit counters must all be visible from either process.
 */
import { spawn, type ChildProcess } from "node:child_process";
import { randomBytes } from "node:crypto";
import { mkdtemp, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  apiErrorSchema,
  healthSchema,
  machineSchema,
  meSchema,
  recordingAcceptedSchema,
  recordingDetailSchema,
  type RecordingDetail,
} from "@ringdown/contracts";
import { repoRoot } from "../config/env.js";
import { recreateDatabase } from "../db/database-admin.js";
import { machineBody } from "../modules/machines/library-test-fixtures.js";
import { toneSignal, wavBytes } from "../modules/recordings/recording-fixtures.js";
import { TEST_PASSWORD, uniqueEmail } from "./harness.js";
import { testDatabaseUrl } from "./database-url.js";
import { freeTcpPort } from "./free-port.js";

/** Where the browser believes the app lives: the load balancer's address (APP_URL of both processes). */
const APP_URL = "http://ringdown.invalid";
/** The client address the load balancer reports in X-Forwarded-For (TEST-NET-3, RFC 5737). */
const CLIENT_IP = "203.0.113.7";
const LOGIN_MAX_PER_ACCOUNT = 4;

interface Child {
  name: string;
  process: ChildProcess;
  output: string[];
  exited: Promise<number | null>;
}

const children: Child[] = [];
let storageDir: string;

/** This file's own database next to the shared test database: it starts empty on every run. */
function ownDatabaseUrl(): string {
  const url = new URL(testDatabaseUrl());
  url.pathname = `${url.pathname.replace(/_test$/, "")}_two_instances_test`;
  return url.toString();
}

/** Runs a TypeScript entry point of the API in its own Node process, as `npm run worker` does. */
function startProcess(name: string, entry: string, env: Record<string, string>): Child {
  const child = spawn(process.execPath, ["--import", "tsx", "--conditions=source", path.join(repoRoot, "apps/api/src", entry)], {
    cwd: repoRoot,
    // Only what the process needs: nothing of this test run's own environment leaks in.
    env: { PATH: process.env.PATH ?? "/usr/bin:/bin", HOME: process.env.HOME ?? tmpdir(), NODE_ENV: "test", ...env },
    stdio: ["ignore", "pipe", "pipe"],
  });
  const output: string[] = [];
  const collect = (chunk: Buffer) => output.push(...chunk.toString("utf8").split("\n").filter(Boolean));
  child.stdout!.on("data", collect);
  child.stderr!.on("data", collect);
  const exited = new Promise<number | null>((resolve) => child.once("exit", (code) => resolve(code)));
  const started = { name, process: child, output, exited };
  children.push(started);
  return started;
}

function describeOutput(child: Child): string {
  return `${child.name} said:\n  ${child.output.slice(-30).join("\n  ")}`;
}

/**
 * Resolves once `ready()` holds; rejects with the process's output if it exits first or takes
 * 100 s (a start takes a few seconds of CPU; the bound only matters on a badly overloaded machine).
 */
async function waitUntil(child: Child, what: string, ready: () => Promise<boolean>): Promise<void> {
  let exitCode: number | null | undefined;
  void child.exited.then((code) => (exitCode = code));
  const deadline = Date.now() + 100_000;
  while (Date.now() < deadline) {
    if (exitCode !== undefined) throw new Error(`${child.name} exited (code ${exitCode}) before ${what}. ${describeOutput(child)}`);
    if (await ready().catch(() => false)) return;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`${child.name}: no ${what} within 100 s. ${describeOutput(child)}`);
}

async function stopAll(): Promise<void> {
  await Promise.all(
    children.map(async (child) => {
      if (child.process.exitCode !== null || child.process.signalCode !== null) return;
      child.process.kill("SIGTERM");
      const timer = setTimeout(() => child.process.kill("SIGKILL"), 15_000);
      await child.exited;
      clearTimeout(timer);
    }),
  );
}

interface Instance {
  name: string;
  base: string;
  child: Child;
}

let a: Instance;
let b: Instance;
let worker: Child;

beforeAll(async () => {
  const databaseUrl = ownDatabaseUrl();
  await recreateDatabase(databaseUrl);
  storageDir = await mkdtemp(path.join(tmpdir(), "ringdown-two-instances-"));
  const shared = {
    DATABASE_URL: databaseUrl,
    STORAGE_DIR: storageDir,
    JWT_SECRET: randomBytes(32).toString("base64url"),
    APP_URL,
    TRUST_PROXY: "1",
    SEED_DEMO: "false",
    LOGIN_MAX_PER_ACCOUNT: String(LOGIN_MAX_PER_ACCOUNT),
    // A web build is not needed here; a path that surely holds none keeps the processes from serving one.
    WEB_DIST: path.join(storageDir, "no-web-build"),
  };
  const [portA, portB] = await Promise.all([freeTcpPort(), freeTcpPort()]);
  // All three start at once on the empty database: their migrations must not collide.
  const apiA = startProcess("API A", "server.ts", { ...shared, PORT: String(portA), RUN_WORKER: "false" });
  const apiB = startProcess("API B", "server.ts", { ...shared, PORT: String(portB), RUN_WORKER: "false" });
  worker = startProcess("analysis worker", "worker.ts", shared);
  a = { name: "A", base: `http://127.0.0.1:${portA}`, child: apiA };
  b = { name: "B", base: `http://127.0.0.1:${portB}`, child: apiB };
  const healthy = (instance: Instance) => async () => {
    const res = await fetch(`${instance.base}/api/health`);
    return res.status === 200 && healthSchema.parse(await res.json()).database === "up";
  };
  await Promise.all([
    waitUntil(apiA, "answer on /api/health", healthy(a)),
    waitUntil(apiB, "answer on /api/health", healthy(b)),
    waitUntil(worker, "start working jobs", async () => worker.output.some((line) => line.includes("working recording analyses"))),
  ]);
}, 120_000);

afterAll(async () => {
  await stopAll();
  if (storageDir) await rm(storageDir, { recursive: true, force: true });
}, 30_000);

/** A request as the load balancer forwards it: the browser's Origin, the client address, the cookie. */
function call(instance: Instance, method: string, route: string, options: { cookie?: string; json?: unknown; form?: FormData } = {}) {
  const headers: Record<string, string> = { "X-Forwarded-For": CLIENT_IP };
  if (method !== "GET") headers.Origin = APP_URL;
  if (options.cookie) headers.Cookie = options.cookie;
  let body: string | FormData | undefined = options.form;
  if (options.json !== undefined) {
    headers["Content-Type"] = "application/json";
    body = JSON.stringify(options.json);
  }
  return fetch(`${instance.base}${route}`, { method, headers, body });
}

function sessionCookie(res: Response): string {
  const line = res.headers.getSetCookie().find((c) => c.startsWith("rd_session="));
  if (!line) throw new Error(`no session cookie in the answer (${res.status})`);
  return line.split(";")[0]!;
}

async function json(res: Response, status: number): Promise<unknown> {
  const body: unknown = await res.json();
  if (res.status !== status) throw new Error(`expected ${status}, got ${res.status}: ${JSON.stringify(body)}`);
  return body;
}

describe("two API processes and one analysis worker on one database and one storage directory", () => {
  const email = uniqueEmail("two-instances");
  let cookie: string;
  let shopId: string;
  let machineId: string;

  it("started together on an empty database: exactly one of them applied the migrations, the others waited and found them applied", () => {
    const all = [a.child, b.child, worker];
    const applied = all.filter((child) => child.output.some((line) => line.includes("applied migrations: 0001-users-shops-memberships")));
    const upToDate = all.filter((child) => child.output.some((line) => line.includes("database schema up to date")));
    expect(applied, all.map(describeOutput).join("\n")).toHaveLength(1);
    expect(upToDate.map((child) => child.name).sort()).toEqual(all.filter((child) => !applied.includes(child)).map((child) => child.name).sort());
  });

  it("a session started on A works on B, and a machine written on B is read on A", async () => {
    const signedUp = meSchema.parse(
      await json(await call(a, "POST", "/api/auth/signup", { json: { email, password: TEST_PASSWORD, name: "Scale Tester", shopName: "Two-instance shop" } }), 201),
    );
    shopId = signedUp.activeShopId!;
    const signIn = await call(a, "POST", "/api/auth/login", { json: { email, password: TEST_PASSWORD } });
    expect(meSchema.parse(await json(signIn, 200)).user.id).toBe(signedUp.user.id);
    cookie = sessionCookie(signIn);

    const onB = meSchema.parse(await json(await call(b, "GET", "/api/me", { cookie }), 200));
    expect(onB.user).toMatchObject({ id: signedUp.user.id, email });

    const created = machineSchema.parse(
      await json(await call(b, "POST", `/api/shops/${shopId}/machines`, { cookie, json: machineBody({ name: "Router written on B" }) }), 201),
    );
    machineId = created.id;
    const readOnA = machineSchema.parse(await json(await call(a, "GET", `/api/shops/${shopId}/machines/${machineId}`, { cookie }), 200));
    expect(readOnA).toMatchObject({ id: machineId, name: "Router written on B" });
  });

  it("a recording uploaded to A is analysed by the separate worker, and B shows the result", async () => {
    // Made as: 8 kHz, 2 s, 0.3·sin(2π·250 t) + 0.005·N(0,1) (seed 1), 16-bit PCM (recording-fixtures.ts):
    // a spindle turning at 250 Hz × 60 = 15 000 rpm, uploaded as running free at a nominal 15 600 rpm.
    const signal = toneSignal({ sampleRateHz: 8000, durationS: 2, tones: [{ frequencyHz: 250, amplitude: 0.3 }], noiseSigma: 0.005, noiseSeed: 1 });
    const form = new FormData();
    form.set("kind", "spindle_free");
    form.set("rpm", "15600");
    form.set("file", new Blob([new Uint8Array(wavBytes(signal, 8000, "16"))], { type: "audio/wav" }), "spindle-250hz.wav");
    const accepted = recordingAcceptedSchema.parse(await json(await call(a, "POST", `/api/shops/${shopId}/machines/${machineId}/recordings`, { cookie, form }), 202));
    expect(accepted.recording.status).toBe("queued");

    let detail: RecordingDetail | undefined;
    const route = `/api/shops/${shopId}/machines/${machineId}/recordings/${accepted.recording.id}`;
    const deadline = Date.now() + 60_000;
    while (detail?.status !== "done" && detail?.status !== "failed" && Date.now() < deadline) {
      if (detail) await new Promise((r) => setTimeout(r, 100));
      detail = recordingDetailSchema.parse(await json(await call(b, "GET", route, { cookie }), 200));
    }
    if (detail?.results?.kind !== "spindle_free") {
      throw new Error(`expected a finished spindle analysis, got ${detail?.status}: ${detail?.failureReason}. ${describeOutput(worker)}`);
    }
    // Welch bins of 8000/8192 = 0.98 Hz, the peak interpolated: well inside 0.1 Hz of the tone made.
    expect(detail.results.rotationFrequencyHz).toBeCloseTo(250, 1);
    expect(Math.abs(detail.results.measuredRpm - 15_000)).toBeLessThan(6);
    expect(detail.results.peaks[0]).toMatchObject({ kind: "spindle", harmonic: 1 });
    // Neither API process analysed it: their worker is off, so the separate worker did.
    for (const api of [a.child, b.child]) expect(api.output.some((line) => line.includes("analysis worker off in this process"))).toBe(true);
  }, 90_000);

  it("failed sign-ins spread over A and B count against one shared limit", async () => {
    const wrong = { email, password: "not the password at all" };
    for (const [i, instance] of [a, b, a, b].entries()) {
      const res = await call(instance, "POST", "/api/auth/login", { json: wrong });
      expect(res.status, `attempt ${i + 1} on ${instance.name}`).toBe(401);
    }
    // Each process alone has seen only two failures; together they have seen the limit.
    for (const instance of [a, b]) {
      const res = await call(instance, "POST", "/api/auth/login", { json: wrong });
      expect(res.status, `attempt after the limit on ${instance.name}`).toBe(429);
      expect(apiErrorSchema.parse(await res.json()).error.message).toMatch(/^Too many failed sign-in attempts for this account\. Try again in/);
    }
  });

  it("signing out on B ends the session on A as well", async () => {
    expect((await call(b, "POST", "/api/auth/logout", { cookie })).status).toBe(204);
    const res = await call(a, "GET", "/api/me", { cookie });
    expect(res.status).toBe(401);
    expect(apiErrorSchema.parse(await res.json()).error.code).toBe("unauthenticated");
  });
});
