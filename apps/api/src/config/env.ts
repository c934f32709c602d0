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
  /** Outgoing e-mail (invitations, password resets). */
  mail: MailConfig;
  /** Payments through the provider's SDK (the local fake in development and tests). */
  billing: BillingConfig;
  /** Limits of the team features, counted like `rateLimits`. */
  teamRateLimits: {
    /** Password-reset requests per client IP. */
    passwordResetPerIp: RateLimitRule;
    /** Password-reset requests per e-mail address. */
    passwordResetPerAccount: RateLimitRule;
    /** Invitations sent (or re-sent) per shop. */
    invitationsPerShop: RateLimitRule;
    /** Invitation acceptances per client IP. */
    invitationAcceptPerIp: RateLimitRule;
  };
  rateLimits: {
    /** Failed sign-in attempts per client IP. */
    loginPerIp: RateLimitRule;
    /** Failed sign-in attempts per e-mail address. */
    loginPerAccount: RateLimitRule;
    /** Sign-ups per client IP. */
    signupPerIp: RateLimitRule;
  };
  /** Background jobs (recording analysis) on the pg-boss queue. */
  jobs: {
    /** The API process also works analysis jobs (false: only separate `npm run worker -w @ringdown/api` processes do). */
    runWorker: boolean;
    /** Analysis jobs one process works at once. */
    analysisConcurrency: number;
  };
}

export interface MailConfig {
  smtp: {
    host: string;
    port: number;
    /** TLS from the first byte (port 465); otherwise STARTTLS when the server offers it. */
    secure: boolean;
    /** Never upgrade with STARTTLS: only for a capture server on loopback. */
    ignoreTls: boolean;
    user: string | undefined;
    password: string | undefined;
  };
  /** From header of every message, e.g. `Ringdown <no-reply@example.com>`. */
  from: string;
  /**
   * Folder the local capture server writes messages to; the development mail page reads it.
   * Null in production, where the page does not exist.
   */
  captureDir: string | null;
}

export interface BillingConfig {
  /** False when no secret key is configured: the billing routes answer 503, plan limits still hold. */
  enabled: boolean;
  secretKey: string;
  webhookSecret: string;
  /** Base URL of the provider's API; null = the SDK's default (the real service). */
  apiUrl: URL | null;
  /** A price id to bill seats with; when unset, found (or created) by `seatPriceLookupKey`. */
  seatPriceId: string | undefined;
  seatPriceLookupKey: string;
  /** Price per seat per month used when the price has to be created [minor currency unit]. */
  seatAmountMinor: number;
  currency: string;
}

const LOCAL_FAKE_SECRET_KEY = "sk_test_ringdown_local_fake";
const LOCAL_FAKE_WEBHOOK_SECRET = "whsec_ringdown_local_fake_webhook_secret";

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
    SMTP_HOST: z.string().trim().min(1).default("127.0.0.1"),
    SMTP_PORT: z.coerce.number<string>().int().min(1).max(65535).optional(),
    SMTP_SECURE: z.stringbool().default(false),
    SMTP_IGNORE_TLS: z.stringbool().optional(),
    SMTP_USER: z.string().optional(),
    SMTP_PASSWORD: z.string().optional(),
    MAIL_FROM: z.string().trim().min(3).default("Ringdown <no-reply@ringdown.localhost>"),
    MAIL_CAPTURE_DIR: z.string().trim().min(1).optional(),
    STRIPE_SECRET_KEY: z.string().trim().regex(/^(sk|rk)_(test|live)_/, "must be a secret key (sk_test_… or sk_live_…)").optional(),
    STRIPE_WEBHOOK_SECRET: z.string().trim().regex(/^whsec_/, "must start with whsec_").optional(),
    STRIPE_API_URL: z.url({ protocol: /^https?$/ }).optional(),
    BILLING_SEAT_PRICE_ID: z.string().trim().min(1).optional(),
    BILLING_SEAT_PRICE_LOOKUP_KEY: z.string().trim().min(1).default("ringdown_team_seat_monthly"),
    BILLING_SEAT_AMOUNT_MINOR: z.coerce.number<string>().int().min(0).default(1900),
    BILLING_CURRENCY: z.string().trim().regex(/^[a-z]{3}$/i, "must be a 3-letter ISO currency code").default("eur"),
    // Ports the local stand-ins listen on (scripts start them); used for the defaults above.
    RINGDOWN_SMTP_DEV_PORT: z.coerce.number<string>().int().min(1).max(65535).default(2525),
    RINGDOWN_SMTP_TEST_PORT: z.coerce.number<string>().int().min(1).max(65535).default(2526),
    RINGDOWN_PAYMENTS_DEV_PORT: z.coerce.number<string>().int().min(1).max(65535).default(12111),
    RINGDOWN_PAYMENTS_TEST_PORT: z.coerce.number<string>().int().min(1).max(65535).default(12112),
    PASSWORD_RESET_MAX_PER_IP: positiveInt(20),
    PASSWORD_RESET_MAX_PER_ACCOUNT: positiveInt(5),
    INVITATIONS_MAX_PER_SHOP: positiveInt(50),
    INVITATION_ACCEPT_MAX_PER_IP: positiveInt(30),
    LOGIN_MAX_PER_IP: positiveInt(30),
    LOGIN_MAX_PER_ACCOUNT: positiveInt(10),
    SIGNUP_MAX_PER_IP: positiveInt(20),
    RUN_WORKER: z.stringbool().default(true),
    ANALYSIS_CONCURRENCY: z.coerce.number<string>().int().min(1).max(8).default(1),
    // Ports of the local clusters (docker-free-db/pg.sh), used for the default DATABASE_URL.
    RINGDOWN_PG_DEV_PORT: z.coerce.number<string>().int().min(1).max(65535).default(5433),
    RINGDOWN_PG_TEST_PORT: z.coerce.number<string>().int().min(1).max(65535).default(5434),
  })
  .superRefine((env, ctx) => {
    if (env.NODE_ENV !== "production") return;
    if (!env.JWT_SECRET) ctx.addIssue({ code: "custom", path: ["JWT_SECRET"], message: "is required in production" });
    if (!env.DATABASE_URL) ctx.addIssue({ code: "custom", path: ["DATABASE_URL"], message: "is required in production" });
    if (!env.APP_URL) ctx.addIssue({ code: "custom", path: ["APP_URL"], message: "is required in production" });
    if (env.STRIPE_SECRET_KEY && !env.STRIPE_WEBHOOK_SECRET) {
      ctx.addIssue({ code: "custom", path: ["STRIPE_WEBHOOK_SECRET"], message: "is required when STRIPE_SECRET_KEY is set" });
    }
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
  const isTest = e.NODE_ENV === "test";
  // Outside production, e-mail and payments default to the local stand-ins (scripts/start.sh and
  // scripts/test.sh start them on loopback); production uses only what .env says.
  const localSmtpPort = isTest ? e.RINGDOWN_SMTP_TEST_PORT : e.RINGDOWN_SMTP_DEV_PORT;
  const localPaymentsUrl = `http://127.0.0.1:${isTest ? e.RINGDOWN_PAYMENTS_TEST_PORT : e.RINGDOWN_PAYMENTS_DEV_PORT}`;
  const secretKey = e.STRIPE_SECRET_KEY ?? (isProduction ? undefined : LOCAL_FAKE_SECRET_KEY);
  const apiUrl = e.STRIPE_API_URL ?? (isProduction ? undefined : localPaymentsUrl);
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
    mail: {
      smtp: {
        host: e.SMTP_HOST,
        port: e.SMTP_PORT ?? (isProduction ? (e.SMTP_SECURE ? 465 : 587) : localSmtpPort),
        secure: e.SMTP_SECURE,
        ignoreTls: e.SMTP_IGNORE_TLS ?? !isProduction,
        user: e.SMTP_USER,
        password: e.SMTP_PASSWORD,
      },
      from: e.MAIL_FROM,
      captureDir: isProduction
        ? null
        : path.resolve(repoRoot, e.MAIL_CAPTURE_DIR ?? `.data/mail-capture/${isTest ? "test" : "dev"}`),
    },
    billing: {
      enabled: secretKey !== undefined,
      secretKey: secretKey ?? "",
      webhookSecret: e.STRIPE_WEBHOOK_SECRET ?? (isProduction ? "" : LOCAL_FAKE_WEBHOOK_SECRET),
      apiUrl: apiUrl ? new URL(apiUrl) : null,
      seatPriceId: e.BILLING_SEAT_PRICE_ID,
      seatPriceLookupKey: e.BILLING_SEAT_PRICE_LOOKUP_KEY,
      seatAmountMinor: e.BILLING_SEAT_AMOUNT_MINOR,
      currency: e.BILLING_CURRENCY.toLowerCase(),
    },
    teamRateLimits: {
      passwordResetPerIp: { limit: e.PASSWORD_RESET_MAX_PER_IP, windowMs: minutes(60) },
      passwordResetPerAccount: { limit: e.PASSWORD_RESET_MAX_PER_ACCOUNT, windowMs: minutes(60) },
      invitationsPerShop: { limit: e.INVITATIONS_MAX_PER_SHOP, windowMs: minutes(60) },
      invitationAcceptPerIp: { limit: e.INVITATION_ACCEPT_MAX_PER_IP, windowMs: minutes(60) },
    },
    rateLimits: {
      loginPerIp: { limit: e.LOGIN_MAX_PER_IP, windowMs: minutes(15) },
      loginPerAccount: { limit: e.LOGIN_MAX_PER_ACCOUNT, windowMs: minutes(15) },
      signupPerIp: { limit: e.SIGNUP_MAX_PER_IP, windowMs: minutes(60) },
    },
    jobs: { runWorker: e.RUN_WORKER, analysisConcurrency: e.ANALYSIS_CONCURRENCY },
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
