/**
 * The API's configuration. This is the only module that reads `process.env`; everything else
 * receives an `AppConfig`. Every variable is described in the repository's `.env.example`.
 */
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { parseEnv } from "node:util";
import { z } from "zod";

/** Repository root: this file sits at apps/api/{src,dist}/config/. */
export const repoRoot = fileURLToPath(new URL("../../../../", import.meta.url));

const DEV_JWT_SECRET = "ringdown-local-development-secret-not-for-production";

export interface RateLimitRule {
  /** Requests (or failed attempts) allowed per window. */
  limit: number;
  /** Window length [ms]. */
  windowMs: number;
}

export interface AppConfig {
  nodeEnv: "development" | "test" | "production";
  isProduction: boolean;
  port: number;
  databaseUrl: string;
  jwtSecret: string;
  /** Lifetime of a session cookie and its token [h]. */
  sessionTtlHours: number;
  /** Absolute path of the built web app. */
  webDist: string;
  seedDemo: boolean;
  /** Origin the web app is served from, e.g. http://localhost:3000 (no trailing slash). */
  appOrigin: string;
  /** Express "trust proxy" hop count: 0 when the API faces clients directly. */
  trustProxy: number;
  /** Absolute path of the directory holding uploaded files (cut-log photos). */
  storageDir: string;
  /** Largest accepted photo upload [bytes]. */
  photoMaxBytes: number;
  rateLimits: {
    /** Failed sign-in attempts per client IP. */
    loginPerIp: RateLimitRule;
    /** Failed sign-in attempts per e-mail address. */
    loginPerAccount: RateLimitRule;
    /** Sign-ups per client IP. */
    signupPerIp: RateLimitRule;
  };
}

const positiveInt = (fallback: number) => z.coerce.number<string>().int().positive().default(fallback);
const minutes = (n: number) => n * 60_000;

const envSchema = z
  .object({
    NODE_ENV: z.enum(["development", "test", "production"]).default("development"),
    PORT: z.coerce.number<string>().int().min(1).max(65535).default(3000),
    DATABASE_URL: z
      .string()
      .trim()
      .regex(/^postgres(ql)?:\/\//, "must be a postgres:// URL")
      .optional(),
    JWT_SECRET: z.string().min(32, "must be at least 32 characters").optional(),
    SESSION_TTL_HOURS: z.coerce.number<string>().positive().max(24 * 90).default(12),
    WEB_DIST: z.string().trim().min(1).default("apps/web/dist"),
    SEED_DEMO: z.stringbool().default(false),
    APP_URL: z.url({ protocol: /^https?$/ }).optional(),
    TRUST_PROXY: z.coerce.number<string>().int().min(0).max(10).default(0),
    STORAGE_DIR: z.string().trim().min(1).default(".data/storage"),
    PHOTO_MAX_MB: z.coerce.number<string>().positive().max(50).default(8),
    LOGIN_MAX_PER_IP: positiveInt(30),
    LOGIN_MAX_PER_ACCOUNT: positiveInt(10),
    SIGNUP_MAX_PER_IP: positiveInt(20),
    // Ports of the local clusters (docker-free-db/pg.sh), used for the default DATABASE_URL.
    RINGDOWN_PG_DEV_PORT: z.coerce.number<string>().int().min(1).max(65535).default(5433),
    RINGDOWN_PG_TEST_PORT: z.coerce.number<string>().int().min(1).max(65535).default(5434),
  })
  .superRefine((env, ctx) => {
    if (env.NODE_ENV !== "production") return;
    if (!env.JWT_SECRET) ctx.addIssue({ code: "custom", path: ["JWT_SECRET"], message: "is required in production" });
    if (!env.DATABASE_URL) ctx.addIssue({ code: "custom", path: ["DATABASE_URL"], message: "is required in production" });
    if (!env.APP_URL) ctx.addIssue({ code: "custom", path: ["APP_URL"], message: "is required in production" });
  });

export class ConfigError extends Error {}

/** Parses an environment into an `AppConfig`; throws `ConfigError` listing every bad variable. */
export function parseConfig(env: Record<string, string | undefined>): AppConfig {
  // Empty strings count as unset, as in most .env tooling.
  const cleaned = Object.fromEntries(Object.entries(env).filter(([, v]) => v !== undefined && v !== ""));
  const result = envSchema.safeParse(cleaned);
  if (!result.success) {
    const lines = result.error.issues.map((i) => `  ${i.path.join(".") || "(environment)"}: ${i.message}`);
    throw new ConfigError(`Invalid configuration:\n${lines.join("\n")}`);
  }
  const e = result.data;
  const isProduction = e.NODE_ENV === "production";
  return {
    nodeEnv: e.NODE_ENV,
    isProduction,
    port: e.PORT,
    // Without DATABASE_URL: the local dev cluster, or the test cluster's test database in tests.
    databaseUrl:
      e.DATABASE_URL ??
      (e.NODE_ENV === "test"
        ? `postgres://postgres@127.0.0.1:${e.RINGDOWN_PG_TEST_PORT}/ringdown_test`
        : `postgres://postgres@127.0.0.1:${e.RINGDOWN_PG_DEV_PORT}/ringdown`),
    jwtSecret: e.JWT_SECRET ?? DEV_JWT_SECRET,
    sessionTtlHours: e.SESSION_TTL_HOURS,
    webDist: path.resolve(repoRoot, e.WEB_DIST),
    seedDemo: e.SEED_DEMO,
    appOrigin: new URL(e.APP_URL ?? `http://localhost:${e.PORT}`).origin,
    trustProxy: e.TRUST_PROXY,
    storageDir: path.resolve(repoRoot, e.STORAGE_DIR),
    photoMaxBytes: Math.round(e.PHOTO_MAX_MB * 1024 * 1024),
    rateLimits: {
      loginPerIp: { limit: e.LOGIN_MAX_PER_IP, windowMs: minutes(15) },
      loginPerAccount: { limit: e.LOGIN_MAX_PER_ACCOUNT, windowMs: minutes(15) },
      signupPerIp: { limit: e.SIGNUP_MAX_PER_IP, windowMs: minutes(60) },
    },
  };
}

/** Values from the repository's `.env` file, if there is one. */
function dotenvFile(): Record<string, string | undefined> {
  const file = path.join(repoRoot, ".env");
  return existsSync(file) ? parseEnv(readFileSync(file, "utf8")) : {};
}

let cached: AppConfig | undefined;

/**
 * The process's configuration, parsed once from `process.env` over the repository's `.env`
 * (the environment wins). Tests (NODE_ENV=test) ignore `.env` so a developer's settings never
 * point them at another database.
 */
export function readConfig(): AppConfig {
  cached ??= parseConfig(process.env.NODE_ENV === "test" ? process.env : { ...dotenvFile(), ...process.env });
  return cached;
}
