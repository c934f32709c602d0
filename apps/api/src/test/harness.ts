/**
 * Shared set-up for route tests: one connection pool per test file, an app with generous limits
 * (rate-limit tests build their own), and helpers that sign people up over real HTTP.
 */
import { randomUUID } from "node:crypto";
import request from "supertest";
import type { Express } from "express";
import { meSchema, type Me, type Role } from "@ringdown/contracts";
import { createApp } from "../app.js";
import { readConfig, type AppConfig } from "../config/env.js";
import { closeDatabase, connectDatabase } from "../db/sequelize.js";
import { settleRateLimitWrites } from "../http/rate-limit-store.js";
import { hashPassword } from "../modules/auth/password.js";
import { signSessionToken } from "../modules/auth/session-token.js";
import { addMember, createShopWithOwner } from "../modules/shops/shops.repository.js";
import { createUser, updateUser } from "../modules/users/users.repository.js";
import { inTransaction } from "../db/sequelize.js";
import { testDatabaseUrl } from "./database-url.js";

export const TEST_PASSWORD = "correct horse battery";

/** Configuration for tests: the test database, the test environment, high rate limits. */
export function testConfig(overrides: Partial<AppConfig> = {}): AppConfig {
  const base = readConfig();
  const roomy = { limit: 10_000, windowMs: 60_000 };
  return {
    ...base,
    databaseUrl: testDatabaseUrl(),
    appOrigin: "http://localhost:3000",
    rateLimits: { loginPerIp: roomy, loginPerAccount: roomy, signupPerIp: roomy },
    ...overrides,
  };
}

let connected = false;

export function connectTestDatabase(): void {
  if (connected) return;
  connectDatabase(testDatabaseUrl());
  connected = true;
}

export async function disconnectTestDatabase(): Promise<void> {
  if (!connected) return;
  connected = false;
  await settleRateLimitWrites();
  await closeDatabase();
}

/** A connected app with a fresh rate-limit namespace (so files never share counters). */
export function makeTestApp(overrides: Partial<AppConfig> = {}): Express {
  connectTestDatabase();
  return createApp(testConfig(overrides), { rateLimitPrefix: `rl-test-${randomUUID()}:` });
}

export function uniqueEmail(label = "person"): string {
  return `${label}-${randomUUID().slice(0, 8)}@tests.example`;
}

export interface SignedUp {
  agent: ReturnType<typeof request.agent>;
  me: Me;
  email: string;
  userId: string;
  shopId: string;
  cookie: string;
}

/** Signs a new person up (they own a new shop) and returns an agent holding their session cookie. */
export async function signUp(app: Express, label = "person", shopName = `Shop ${label}`): Promise<SignedUp> {
  const agent = request.agent(app);
  const email = uniqueEmail(label);
  const res = await agent
    .post("/api/auth/signup")
    .send({ email, password: TEST_PASSWORD, name: `Test ${label}`, shopName });
  if (res.status !== 201) throw new Error(`sign-up failed: ${res.status} ${JSON.stringify(res.body)}`);
  const me = meSchema.parse(res.body);
  const cookie = sessionCookieOf(res.headers["set-cookie"]);
  if (!cookie || !me.activeShopId) throw new Error("sign-up returned no session or no shop");
  return { agent, me, email, userId: me.user.id, shopId: me.activeShopId, cookie };
}

let passwordHash: Promise<string> | undefined;

/**
 * A person who owns a new shop, created directly in the database (with a real bcrypt hash of
 * TEST_PASSWORD, computed once per file) and holding a real session token. Much faster than
 * `signUp` for tests that are not about signing up; the sign-up route has its own tests.
 */
export async function createPerson(app: Express, label = "person", shopName = `Shop ${label}`): Promise<SignedUp> {
  passwordHash ??= hashPassword(TEST_PASSWORD);
  const hash = await passwordHash;
  const email = uniqueEmail(label);
  const { user, shopId } = await inTransaction(async (tx) => {
    const created = await createUser({ email, name: `Test ${label}`, passwordHash: hash }, tx);
    const shop = await createShopWithOwner({ name: shopName, ownerId: created.id }, tx);
    await updateUser(created.id, { activeShopId: shop.id }, tx);
    return { user: created, shopId: shop.id };
  });
  const config = testConfig();
  const cookie = `rd_session=${signSessionToken(user, config.jwtSecret, config.sessionTtlHours).token}`;
  const agent = request.agent(app).set("Cookie", cookie);
  const me = meSchema.parse((await agent.get("/api/me")).body);
  return { agent, me, email, userId: user.id, shopId, cookie };
}

/** Adds an existing user to a shop with a role (team management has no route yet). */
export async function joinShop(userId: string, shopId: string, role: Role): Promise<void> {
  await addMember({ shopId, userId, role });
}

/** The `rd_session=…` pair from a Set-Cookie header, if any. */
export function sessionCookieOf(setCookie: string | string[] | undefined): string | undefined {
  const list = Array.isArray(setCookie) ? setCookie : setCookie ? [setCookie] : [];
  const line = list.find((c) => c.startsWith("rd_session="));
  return line?.split(";")[0];
}
