/**
 * Shared pieces of the load benchmarks: start a server as a child process (so the load generator
 * never shares its event loop), sign people in over HTTP, drive a request mix with autocannon and
 * summarise latency per kind of request. Prints figures; asserts nothing.
 */
import autocannon from "autocannon";
import { spawn, type ChildProcess } from "node:child_process";
import http from "node:http";
import { setTimeout as sleep } from "node:timers/promises";
import { once } from "node:events";
import { cpus, loadavg, tmpdir } from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { seededRandom } from "../src/modules/recordings/recording-fixtures.js";

/** A deterministic pseudo-random source (same mix on every run). */
export { seededRandom };

export const apiDir = fileURLToPath(new URL("../", import.meta.url));

/** Seconds a load phase runs: RINGDOWN_BENCH_SECONDS overrides every phase (e.g. 5 while developing). */
export function benchSeconds(fallback: number): number {
  const raw = Number(process.env.RINGDOWN_BENCH_SECONDS);
  return Number.isFinite(raw) && raw > 0 ? raw : fallback;
}

export function machineLine(): string {
  const [one, five, fifteen] = loadavg().map((x) => x.toFixed(2));
  return `${cpus().length} cores (${cpus()[0]?.model.trim() ?? "unknown CPU"}), Node ${process.versions.node}, load average ${one} / ${five} / ${fifteen} (1 / 5 / 15 min)`;
}

/** Servers started here, stopped if this process is interrupted (they must not outlive it). */
const children = new Set<ChildProcess>();
for (const signal of ["SIGINT", "SIGTERM"] as const) {
  process.once(signal, () => {
    for (const child of children) child.kill("SIGTERM");
    process.exit(signal === "SIGINT" ? 130 : 143);
  });
}

export interface RunningServer {
  baseUrl: string;
  child: ChildProcess;
  stop(): Promise<void>;
}

/**
 * Starts `node <args>` (or any command) with `env` and waits until GET <healthPath> answers 200.
 * Its output is kept and shown only if it fails to start.
 */
export async function startServer(name: string, command: string, args: string[], env: Record<string, string>, port: number, healthPath: string): Promise<RunningServer> {
  const child = spawn(command, args, { cwd: apiDir, env: { ...process.env, ...env }, stdio: ["ignore", "pipe", "pipe"] });
  children.add(child);
  child.once("exit", () => children.delete(child));
  let output = "";
  child.stdout!.on("data", (d: Buffer) => (output += d.toString()));
  child.stderr!.on("data", (d: Buffer) => (output += d.toString()));
  const baseUrl = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 60_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`${name} exited during start-up:\n${output}`);
    try {
      const res = await fetch(`${baseUrl}${healthPath}`);
      if (res.ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) {
      child.kill("SIGKILL");
      throw new Error(`${name} did not answer ${healthPath} within 60 s:\n${output}`);
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  return {
    baseUrl,
    child,
    async stop() {
      if (child.exitCode !== null) return;
      child.kill("SIGTERM");
      const timer = setTimeout(() => child.kill("SIGKILL"), 15_000);
      await once(child, "exit");
      clearTimeout(timer);
    },
  };
}

/** The built API (dist/server.js, what ships) on `port` against `databaseUrl`, in production mode. */
export function startApi(databaseUrl: string, port: number): Promise<RunningServer> {
  return startServer(
    "the API",
    process.execPath,
    ["dist/server.js"],
    {
      NODE_ENV: "production",
      NODE_OPTIONS: "",
      PORT: String(port),
      DATABASE_URL: databaseUrl,
      APP_URL: `http://127.0.0.1:${port}`,
      JWT_SECRET: "bench-only-secret-bench-only-secret-0123456789",
      SEED_DEMO: "false",
      // Recording analysis is not part of these workloads.
      RUN_WORKER: "false",
      STORAGE_DIR: path.join(tmpdir(), "ringdown-bench-storage"),
      // Sign-in of every bench account from one address.
      LOGIN_MAX_PER_IP: "10000",
    },
    port,
    "/api/health",
  );
}

/** Signs in over HTTP and returns the session cookie pair. */
export async function signIn(baseUrl: string, email: string, password: string): Promise<string> {
  const res = await fetch(`${baseUrl}/api/auth/login`, {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ email, password }),
  });
  if (res.status !== 200) throw new Error(`sign-in of ${email} answered ${res.status}: ${await res.text()}`);
  const cookie = res.headers.getSetCookie().find((c) => c.startsWith("rd_session="));
  if (!cookie) throw new Error(`sign-in of ${email} set no session cookie`);
  return cookie.split(";")[0]!;
}

export interface PlannedRequest {
  /** What the request does, for the per-kind table ("list", "create recipe"…). */
  kind: string;
  method: "GET" | "POST" | "PATCH";
  path: string;
  headers?: Record<string, string>;
  body?: unknown;
}

export interface KindStats {
  kind: string;
  count: number;
  statuses: Map<number, number>;
  latencies: number[];
}

export interface LoadResult {
  seconds: number;
  requests: number;
  requestsPerSecond: number;
  /** Connection errors and timeouts (no HTTP answer at all). */
  errors: number;
  timeouts: number;
  all: KindStats;
  kinds: KindStats[];
}

function newStats(kind: string): KindStats {
  return { kind, count: 0, statuses: new Map(), latencies: [] };
}

/**
 * Runs autocannon against `baseUrl` for `seconds` with `connections` keep-alive connections; each
 * request is the next one `plan()` returns. Latency is recorded per request from autocannon's
 * own timing (send to last byte), per kind and overall.
 */
export async function runLoad(
  baseUrl: string,
  connections: number,
  seconds: number,
  plan: () => PlannedRequest,
): Promise<LoadResult> {
  const all = newStats("all");
  const byKind = new Map<string, KindStats>();
  const url = new URL(baseUrl);
  let instance: autocannon.Instance | undefined;
  const done = new Promise<autocannon.Result>((resolve, reject) => {
    instance = autocannon(
      {
        url: baseUrl,
        connections,
        duration: seconds,
        timeout: 30,
        // Each connection sends its next request as soon as the last one is answered (saturation).
        requests: [
          {
            setupRequest: (req, context) => {
              const next = plan();
              (context as { kind?: string }).kind = next.kind;
              const headers: Record<string, string> = { ...(req.headers as Record<string, string>), ...next.headers, host: url.host };
              let body: string | undefined;
              if (next.body !== undefined) {
                body = JSON.stringify(next.body);
                headers["content-type"] = "application/json";
              }
              return { ...req, method: next.method, path: next.path, headers, body };
            },
          },
        ],
      },
      (error, result) => (error ? reject(error) : resolve(result)),
    );
  });
  instance!.on("response", (client: unknown, statusCode: number, _bytes: number, responseTime: number) => {
    const kind = String((client as { requestIterator: { context: { kind?: string } } }).requestIterator.context.kind ?? "?");
    let stats = byKind.get(kind);
    if (!stats) byKind.set(kind, (stats = newStats(kind)));
    for (const s of [all, stats]) {
      s.count++;
      s.statuses.set(statusCode, (s.statuses.get(statusCode) ?? 0) + 1);
      s.latencies.push(responseTime);
    }
  });
  const result = await done;
  return {
    seconds,
    requests: all.count,
    requestsPerSecond: all.count / seconds,
    errors: result.errors,
    timeouts: result.timeouts,
    all,
    kinds: [...byKind.values()].sort((a, b) => b.count - a.count),
  };
}

/** Several runs of the same mix (e.g. rounds interleaved with another server's) as one. */
export function mergeLoads(results: LoadResult[]): LoadResult {
  const all = newStats("all");
  const byKind = new Map<string, KindStats>();
  for (const r of results) {
    for (const from of [r.all, ...r.kinds]) {
      let into = from === r.all ? all : byKind.get(from.kind);
      if (!into) byKind.set(from.kind, (into = newStats(from.kind)));
      into.count += from.count;
      for (const [code, n] of from.statuses) into.statuses.set(code, (into.statuses.get(code) ?? 0) + n);
      for (const x of from.latencies) into.latencies.push(x);
    }
  }
  const seconds = results.reduce((t, r) => t + r.seconds, 0);
  return {
    seconds,
    requests: all.count,
    requestsPerSecond: all.count / seconds,
    errors: results.reduce((t, r) => t + r.errors, 0),
    timeouts: results.reduce((t, r) => t + r.timeouts, 0),
    all,
    kinds: [...byKind.values()].sort((a, b) => b.count - a.count),
  };
}

/** Nearest-rank percentile of unsorted samples [same unit]. */
export function percentile(samples: number[], p: number): number {
  if (samples.length === 0) return Number.NaN;
  const sorted = Float64Array.from(samples).sort();
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))]!;
}

const ms = (x: number) => (Number.isFinite(x) ? `${x.toFixed(1)} ms` : "—");

export function statusSummary(stats: KindStats): string {
  return [...stats.statuses.entries()]
    .sort(([a], [b]) => a - b)
    .map(([code, n]) => `${code}×${n}`)
    .join(" ");
}

/** One table row per kind and a total line. */
export function printLoad(title: string, result: LoadResult): void {
  console.log(`\n  ${title}`);
  console.log(`  ${"kind".padEnd(22)} ${"requests".padStart(9)} ${"p50".padStart(10)} ${"p95".padStart(10)} ${"p99".padStart(10)}  statuses`);
  for (const s of [...result.kinds, result.all]) {
    const label = s === result.all ? "all" : s.kind;
    console.log(
      `  ${label.padEnd(22)} ${String(s.count).padStart(9)} ${ms(percentile(s.latencies, 50)).padStart(10)} ${ms(percentile(s.latencies, 95)).padStart(10)} ${ms(percentile(s.latencies, 99)).padStart(10)}  ${statusSummary(s)}`,
    );
  }
  console.log(
    `  ${result.requests} requests in ${result.seconds} s = ${result.requestsPerSecond.toFixed(1)} requests/s; connection errors ${result.errors}, timeouts ${result.timeouts}`,
  );
}

export const pick = <T>(random: () => number, items: readonly T[]): T => items[Math.floor(random() * items.length)]!;

/**
 * Open (paced) load: requests start at evenly spaced moments, `rate` a second, over at most
 * `connections` keep-alive connections, however long the answers take. Latency counts from the
 * moment a request was due, so a request that waited for a free connection counts its wait too.
 * (autocannon's own `overallRate` lets every connection send its share at the start of each second,
 * which turns pacing into bursts of `rate` requests at once.)
 */
export async function runPaced(baseUrl: string, connections: number, seconds: number, rate: number, plan: () => PlannedRequest): Promise<LoadResult> {
  const agent = new http.Agent({ keepAlive: true, maxSockets: connections });
  const url = new URL(baseUrl);
  const all = newStats("all");
  const byKind = new Map<string, KindStats>();
  let errors = 0;
  let timeouts = 0;
  const send = (next: PlannedRequest): Promise<number> =>
    new Promise((resolve, reject) => {
      const body = next.body === undefined ? undefined : JSON.stringify(next.body);
      const headers: Record<string, string> = { ...next.headers, ...(body ? { "content-type": "application/json" } : {}) };
      const req = http.request({ host: url.hostname, port: url.port, method: next.method, path: next.path, headers, agent, timeout: 30_000 }, (res) => {
        res.resume();
        res.once("end", () => resolve(res.statusCode ?? 0));
        res.once("error", reject);
      });
      req.once("timeout", () => {
        timeouts++;
        req.destroy(new Error("timeout"));
      });
      req.once("error", reject);
      req.end(body);
    });
  const total = Math.round(seconds * rate);
  const start = performance.now();
  const inFlight: Array<Promise<void>> = [];
  for (let i = 0; i < total; i++) {
    const due = start + (i * 1000) / rate;
    const wait = due - performance.now();
    if (wait > 0) await sleep(wait);
    const next = plan();
    inFlight.push(
      send(next).then(
        (status) => {
          let stats = byKind.get(next.kind);
          if (!stats) byKind.set(next.kind, (stats = newStats(next.kind)));
          for (const s of [all, stats]) {
            s.count++;
            s.statuses.set(status, (s.statuses.get(status) ?? 0) + 1);
            s.latencies.push(performance.now() - due);
          }
        },
        () => {
          errors++;
        },
      ),
    );
  }
  await Promise.all(inFlight);
  agent.destroy();
  return {
    seconds,
    requests: all.count,
    requestsPerSecond: all.count / seconds,
    errors: Math.max(0, errors - timeouts),
    timeouts,
    all,
    kinds: [...byKind.values()].sort((a, b) => b.count - a.count),
  };
}
