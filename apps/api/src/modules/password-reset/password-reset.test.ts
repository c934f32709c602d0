import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { apiErrorSchema, meSchema, passwordResetLinkSchema, passwordResetRequestedSchema } from "@ringdown/contracts";
import type { Express } from "express";
import { readMails } from "../../dev-services/mail-capture/store.js";
import { startStandIns, type StandIns } from "../../dev-services/stand-ins.js";
import { createPerson, disconnectTestDatabase, makeTestApp, sessionCookieOf, testConfig, TEST_PASSWORD, uniqueEmail } from "../../test/harness.js";
import { hashLinkToken } from "../auth/link-token.js";
import { settleBackgroundMail } from "../mail/background.js";
import { closeMailers } from "../mail/mailer.js";
import { setResetTokenExpiry } from "./password-reset.repository.js";

let standIns: StandIns;
let app: Express;
beforeAll(async () => {
  standIns = await startStandIns();
  app = makeTestApp(standIns.config(testConfig()));
});
afterAll(async () => {
  await settleBackgroundMail();
  closeMailers();
  await standIns.close();
  await disconnectTestDatabase();
});

const errorOf = (body: unknown) => apiErrorSchema.parse(body).error;
const NEW_PASSWORD = "a brand new passphrase";

async function requestLink(email: string): Promise<string> {
  const res = await request(app).post("/api/auth/password-reset").send({ email });
  expect(res.status).toBe(202);
  const mail = await standIns.waitForMail(email);
  const link = mail.links.find((l) => l.includes("/reset-password/"));
  const token = link?.split("/reset-password/")[1];
  if (!token) throw new Error("no reset link in the message");
  expect(mail.text).toContain(link);
  expect(mail.html).toContain(`href="${link}"`);
  return token;
}

describe("POST /api/auth/password-reset", () => {
  it("answers 202 with the same words whether or not the address has an account, and mails only real accounts", async () => {
    const person = await createPerson(app, "reset-real");
    const ghost = uniqueEmail("ghost");
    const real = await request(app).post("/api/auth/password-reset").send({ email: person.email.toUpperCase() });
    const unknown = await request(app).post("/api/auth/password-reset").send({ email: ghost });
    expect(real.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(passwordResetRequestedSchema.parse(real.body)).toEqual(passwordResetRequestedSchema.parse(unknown.body));
    const mail = await standIns.waitForMail(person.email);
    expect(mail.subject).toBe("Reset your Ringdown password");
    await settleBackgroundMail();
    expect((await readMails(standIns.mail.dir)).some((m) => m.envelope.to.includes(ghost))).toBe(false);
  });

  it("validates the address (400)", async () => {
    const res = await request(app).post("/api/auth/password-reset").send({ email: "not an address" });
    expect(res.status).toBe(400);
    expect(errorOf(res.body).fields?.email).toBe("Enter a valid e-mail address");
  });
});

describe("POST /api/auth/password-reset/:token", () => {
  it("sets the new password once, signs this browser in and ends every other session", async () => {
    const person = await createPerson(app, "reset-flow");
    const otherDevice = person.cookie;
    const token = await requestLink(person.email);

    const link = passwordResetLinkSchema.parse((await request(app).get(`/api/auth/password-reset/${token}`)).body);
    expect(link.status).toBe("valid");
    expect(Date.parse(link.expiresAt) - Date.now()).toBeLessThanOrEqual(3_600_000);
    expect(Date.parse(link.expiresAt) - Date.now()).toBeGreaterThan(3_000_000);

    const res = await request(app).post(`/api/auth/password-reset/${token}`).send({ password: NEW_PASSWORD });
    expect(res.status).toBe(200);
    expect(meSchema.parse(res.body).user.id).toBe(person.userId);
    const fresh = sessionCookieOf(res.headers["set-cookie"]);
    expect(fresh).toBeDefined();
    expect((await request(app).get("/api/me").set("Cookie", fresh!)).status).toBe(200);
    expect((await request(app).get("/api/me").set("Cookie", otherDevice)).status).toBe(401);

    expect((await request(app).post("/api/auth/login").send({ email: person.email, password: TEST_PASSWORD })).status).toBe(401);
    expect((await request(app).post("/api/auth/login").send({ email: person.email, password: NEW_PASSWORD })).status).toBe(200);

    // Single use.
    expect(passwordResetLinkSchema.parse((await request(app).get(`/api/auth/password-reset/${token}`)).body).status).toBe("used");
    const again = await request(app).post(`/api/auth/password-reset/${token}`).send({ password: "yet another passphrase" });
    expect(again.status).toBe(409);
    expect(errorOf(again.body).message).toMatch(/already been used/);
  });

  it("refuses an expired link (409) and keeps the old password", async () => {
    const person = await createPerson(app, "reset-expired");
    const token = await requestLink(person.email);
    await setResetTokenExpiry(hashLinkToken(token), new Date(Date.now() - 1000));
    expect(passwordResetLinkSchema.parse((await request(app).get(`/api/auth/password-reset/${token}`)).body).status).toBe("expired");
    const res = await request(app).post(`/api/auth/password-reset/${token}`).send({ password: NEW_PASSWORD });
    expect(res.status).toBe(409);
    expect(errorOf(res.body).message).toMatch(/has expired/);
    expect((await request(app).post("/api/auth/login").send({ email: person.email, password: TEST_PASSWORD })).status).toBe(200);
  });

  it("a newer request replaces the older link", async () => {
    const person = await createPerson(app, "reset-twice");
    const first = await requestLink(person.email);
    await new Promise((r) => setTimeout(r, 5));
    const res = await request(app).post("/api/auth/password-reset").send({ email: person.email });
    expect(res.status).toBe(202);
    await settleBackgroundMail();
    expect((await request(app).get(`/api/auth/password-reset/${first}`)).status).toBe(404);
  });

  it("answers 404 for an unknown token, 400 for a malformed one or a short password", async () => {
    expect((await request(app).get(`/api/auth/password-reset/${"B".repeat(43)}`)).status).toBe(404);
    expect((await request(app).post(`/api/auth/password-reset/x`).send({ password: NEW_PASSWORD })).status).toBe(400);
    const short = await request(app).post(`/api/auth/password-reset/${"B".repeat(43)}`).send({ password: "short" });
    expect(short.status).toBe(400);
    expect(errorOf(short.body).fields?.password).toBe("Use at least 10 characters");
  });
});

describe("password-reset rate limits", () => {
  it("limits requests per address with a 429, whatever the client address", async () => {
    const limited = makeTestApp({
      ...standIns.config(testConfig()),
      trustProxy: 1,
      teamRateLimits: { ...testConfig().teamRateLimits, passwordResetPerAccount: { limit: 2, windowMs: 3_600_000 } },
    });
    const email = uniqueEmail("flood");
    for (let i = 0; i < 2; i++) {
      const ok = await request(limited).post("/api/auth/password-reset").set("X-Forwarded-For", `198.51.100.${i + 1}`).send({ email });
      expect(ok.status).toBe(202);
    }
    const res = await request(limited).post("/api/auth/password-reset").set("X-Forwarded-For", "198.51.100.9").send({ email });
    expect(res.status).toBe(429);
    expect(errorOf(res.body).message).toBe("Too many password-reset requests for this address. Try again in 60 minutes.");
  });
});
