import { randomUUID } from "node:crypto";
import jwt from "jsonwebtoken";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { apiErrorSchema, meSchema } from "@ringdown/contracts";
import {
  disconnectTestDatabase,
  makeTestApp,
  sessionCookieOf,
  createPerson,
  signUp,
  testConfig,
  TEST_PASSWORD,
  uniqueEmail,
} from "../../test/harness.js";
import { bumpSessionVersion } from "../users/users.repository.js";

const app = makeTestApp();
const secret = testConfig().jwtSecret;

afterAll(disconnectTestDatabase);

function errorOf(body: unknown) {
  return apiErrorSchema.parse(body).error;
}

describe("POST /api/auth/signup", () => {
  it("creates the user and their shop, returns me and an httpOnly SameSite=Lax session cookie with an expiry", async () => {
    const email = uniqueEmail("signup");
    const res = await request(app)
      .post("/api/auth/signup")
      .send({ email: `  ${email.toUpperCase()} `, password: TEST_PASSWORD, name: " Ada Quist ", shopName: "Quist Jigs" });

    expect(res.status).toBe(201);
    const me = meSchema.parse(res.body);
    expect(me.user.email).toBe(email); // trimmed and lower-cased
    expect(me.user.name).toBe("Ada Quist");
    expect(me.user.unitSystem).toBe("metric");
    expect(me.memberships).toEqual([{ shopId: me.activeShopId, shopName: "Quist Jigs", role: "owner" }]);

    const setCookie = ([] as string[]).concat(res.headers["set-cookie"] ?? []);
    const cookie = setCookie.find((c) => c.startsWith("rd_session="));
    expect(cookie).toBeDefined();
    expect(cookie).toMatch(/; HttpOnly/);
    expect(cookie).toMatch(/; SameSite=Lax/);
    expect(cookie).toMatch(/; Path=\//);
    expect(cookie).toMatch(/; Expires=/);
    expect(cookie).not.toMatch(/; Secure/); // Secure only in production

    const meRes = await request(app).get("/api/me").set("Cookie", sessionCookieOf(res.headers["set-cookie"])!);
    expect(meRes.status).toBe(200);
    expect(meSchema.parse(meRes.body)).toEqual(me);
  });

  it("answers 409 with a field error when the e-mail address already has an account", async () => {
    const { email } = await createPerson(app, "dup");
    const res = await request(app)
      .post("/api/auth/signup")
      .send({ email: email.toUpperCase(), password: TEST_PASSWORD, name: "Someone", shopName: "Other shop" });
    expect(res.status).toBe(409);
    const error = errorOf(res.body);
    expect(error.code).toBe("conflict");
    expect(error.fields?.email).toMatch(/already exists/);
  });

  it("rejects a short password with a 400 naming the field", async () => {
    const res = await request(app)
      .post("/api/auth/signup")
      .send({ email: uniqueEmail("short"), password: "short", name: "Sam", shopName: "Shop" });
    expect(res.status).toBe(400);
    const error = errorOf(res.body);
    expect(error.code).toBe("validation_failed");
    expect(error.fields).toEqual({ password: "Use at least 10 characters" });
  });

  it("reports every invalid or missing field at once", async () => {
    const res = await request(app).post("/api/auth/signup").send({ email: "not-an-address", password: 12345678901 });
    expect(res.status).toBe(400);
    const error = errorOf(res.body);
    expect(error.code).toBe("validation_failed");
    expect(Object.keys(error.fields ?? {}).sort()).toEqual(["email", "name", "password", "shopName"]);
    expect(error.fields?.email).toBe("Enter a valid e-mail address");
  });

  it("answers 400 for malformed JSON, without leaking parser details", async () => {
    const res = await request(app)
      .post("/api/auth/signup")
      .set("Content-Type", "application/json")
      .send('{"email": "a@b.example", "password": ');
    expect(res.status).toBe(400);
    const error = errorOf(res.body);
    expect(error).toEqual({ code: "validation_failed", message: "The request body is not valid JSON." });
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.js|SyntaxError/);
  });

  it("answers 415 for a body that is not JSON", async () => {
    const res = await request(app)
      .post("/api/auth/signup")
      .set("Content-Type", "application/x-www-form-urlencoded")
      .send("email=a%40b.example&password=xxxxxxxxxxxx");
    expect(res.status).toBe(415);
    expect(errorOf(res.body).code).toBe("unsupported_media_type");
  });

  it("answers 400 when a JSON body is an array instead of an object", async () => {
    const res = await request(app).post("/api/auth/signup").send([1, 2, 3]);
    expect(res.status).toBe(400);
    expect(errorOf(res.body).code).toBe("validation_failed");
  });
});

describe("POST /api/auth/login", () => {
  it("signs in with any letter case of the address and returns me with a fresh cookie", async () => {
    const { email, userId } = await createPerson(app, "login");
    const res = await request(app).post("/api/auth/login").send({ email: email.toUpperCase(), password: TEST_PASSWORD });
    expect(res.status).toBe(200);
    expect(meSchema.parse(res.body).user.id).toBe(userId);
    expect(sessionCookieOf(res.headers["set-cookie"])).toMatch(/^rd_session=.+/);
  });

  it("gives the same 401 for a wrong password and an unknown address", async () => {
    const { email } = await createPerson(app, "wrongpw");
    const wrong = await request(app).post("/api/auth/login").send({ email, password: "not the password" });
    const unknown = await request(app).post("/api/auth/login").send({ email: uniqueEmail("ghost"), password: TEST_PASSWORD });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(errorOf(wrong.body)).toEqual({ code: "unauthenticated", message: "The e-mail address or password is incorrect." });
    expect(errorOf(unknown.body)).toEqual(errorOf(wrong.body));
    expect(sessionCookieOf(wrong.headers["set-cookie"])).toBeUndefined();
  });

  it("answers 400 with field errors for an empty body", async () => {
    const res = await request(app).post("/api/auth/login").send({});
    expect(res.status).toBe(400);
    const error = errorOf(res.body);
    expect(Object.keys(error.fields ?? {}).sort()).toEqual(["email", "password"]);
  });
});

describe("POST /api/auth/logout", () => {
  it("clears the cookie and ends that session on the server", async () => {
    const { agent, cookie } = await signUp(app, "logout");
    const res = await agent.post("/api/auth/logout");
    expect(res.status).toBe(204);
    const cleared = ([] as string[]).concat(res.headers["set-cookie"] ?? []).find((c) => c.startsWith("rd_session="));
    expect(cleared).toMatch(/^rd_session=;/);
    expect(cleared).toMatch(/Expires=Thu, 01 Jan 1970/);

    // The browser forgot the cookie; a copy of the old token must not work either.
    expect((await agent.get("/api/me")).status).toBe(401);
    const replay = await request(app).get("/api/me").set("Cookie", cookie);
    expect(replay.status).toBe(401);
    expect(errorOf(replay.body).code).toBe("unauthenticated");
  });

  it("leaves the person's other sessions alone", async () => {
    const { email, cookie: first } = await createPerson(app, "twodevices");
    const second = await request(app).post("/api/auth/login").send({ email, password: TEST_PASSWORD });
    const secondCookie = sessionCookieOf(second.headers["set-cookie"])!;
    await request(app).post("/api/auth/logout").set("Cookie", secondCookie).expect(204);
    expect((await request(app).get("/api/me").set("Cookie", first)).status).toBe(200);
  });

  it("answers 204 without a session", async () => {
    const res = await request(app).post("/api/auth/logout");
    expect(res.status).toBe(204);
  });
});

describe("session tokens", () => {
  const sign = (payload: object, key = secret, options: jwt.SignOptions = {}) =>
    jwt.sign(payload, key, { algorithm: "HS256", issuer: "ringdown", ...options });

  async function meWith(token: string) {
    return request(app).get("/api/me").set("Cookie", `rd_session=${token}`);
  }

  it("answers 401 without a cookie", async () => {
    const res = await request(app).get("/api/me");
    expect(res.status).toBe(401);
    expect(errorOf(res.body)).toEqual({ code: "unauthenticated", message: "Sign in to continue." });
  });

  it("answers 401 for an expired token and clears the cookie", async () => {
    const { userId } = await createPerson(app, "expired");
    const expired = sign({ sv: 1, exp: Math.floor(Date.now() / 1000) - 60 }, secret, { subject: userId, jwtid: randomUUID() });
    const res = await meWith(expired);
    expect(res.status).toBe(401);
    expect(errorOf(res.body).message).toBe("Your session has expired. Sign in again.");
    expect(([] as string[]).concat(res.headers["set-cookie"] ?? []).some((c) => c.startsWith("rd_session=;"))).toBe(true);
  });

  it("answers 401 for a token signed with another key", async () => {
    const { userId } = await createPerson(app, "forged");
    const forged = sign({ sv: 1 }, "an attacker's secret that is long enough", {
      subject: userId,
      jwtid: randomUUID(),
      expiresIn: 3600,
    });
    const res = await meWith(forged);
    expect(res.status).toBe(401);
    expect(errorOf(res.body).message).toBe("Your session is not valid. Sign in again.");
  });

  it("answers 401 for an unsigned (alg none) token and for a tampered payload", async () => {
    const { userId, cookie } = await createPerson(app, "tamper");
    const unsigned = jwt.sign({ sv: 1, sub: userId, jti: randomUUID(), iss: "ringdown" }, null, {
      algorithm: "none",
      expiresIn: 3600,
    });
    expect((await meWith(unsigned)).status).toBe(401);

    const [header, , signature] = cookie.replace("rd_session=", "").split(".");
    const otherPayload = Buffer.from(
      JSON.stringify({ sv: 1, sub: randomUUID(), iss: "ringdown", jti: randomUUID(), exp: 9999999999 }),
    ).toString("base64url");
    expect((await meWith(`${header}.${otherPayload}.${signature}`)).status).toBe(401);
    expect((await meWith("not-a-jwt")).status).toBe(401);
  });

  it("answers 401 once the user's session version moves on (every session ended at once)", async () => {
    const { userId, cookie } = await createPerson(app, "version");
    expect((await request(app).get("/api/me").set("Cookie", cookie)).status).toBe(200);
    await bumpSessionVersion(userId);
    const res = await request(app).get("/api/me").set("Cookie", cookie);
    expect(res.status).toBe(401);
    expect(errorOf(res.body).message).toBe("Your session has ended. Sign in again.");
  });
});
