import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import {
  apiErrorSchema,
  invitationListSchema,
  invitationPreviewSchema,
  invitationSchema,
  meSchema,
  memberPageSchema,
} from "@ringdown/contracts";
import type { Express } from "express";
import { getSequelize } from "../../db/sequelize.js";
import { startStandIns, type StandIns } from "../../dev-services/stand-ins.js";
import { createPerson, disconnectTestDatabase, joinShop, makeTestApp, testConfig, TEST_PASSWORD, uniqueEmail } from "../../test/harness.js";
import { hashLinkToken } from "../auth/link-token.js";
import { closeMailers } from "../mail/mailer.js";
import { setInvitationExpiry } from "./invitations.repository.js";

let standIns: StandIns;
let app: Express;

beforeAll(async () => {
  standIns = await startStandIns();
  app = makeTestApp(standIns.config(testConfig()));
});
afterAll(async () => {
  closeMailers();
  await standIns.close();
  await disconnectTestDatabase();
});

const errorOf = (body: unknown) => apiErrorSchema.parse(body).error;
const tokenFrom = (link: string) => /\/invitations\/([A-Za-z0-9_-]{43})$/.exec(link)?.[1];

/** Invites and returns the invitation plus the token read from the captured e-mail. */
async function inviteAndRead(owner: Awaited<ReturnType<typeof createPerson>>, email: string, role: string) {
  const res = await owner.agent.post(`/api/shops/${owner.shopId}/invitations`).send({ email, role });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  const invitation = invitationSchema.parse(res.body);
  const mail = await standIns.waitForMail(email, (m) => m.receivedAt >= invitation.sentAt.slice(0, 19));
  const link = mail.links.find((l) => l.includes("/invitations/"));
  const token = link ? tokenFrom(link) : undefined;
  if (!token) throw new Error(`no invitation link in ${JSON.stringify(mail.links)}`);
  return { invitation, token, mail };
}

describe("inviting by e-mail", () => {
  it("sends a message with a plain-text and an HTML part carrying a single-use 7-day link; stores only the token's hash", async () => {
    const owner = await createPerson(app, "inv-owner", "Invite shop");
    const email = uniqueEmail("newcomer");
    const { invitation, token, mail } = await inviteAndRead(owner, email, "operator");

    expect(invitation).toMatchObject({ email, role: "operator", status: "pending", invitedByName: "Test inv-owner" });
    const days = (Date.parse(invitation.expiresAt) - Date.parse(invitation.sentAt)) / 86_400_000;
    expect(days).toBeCloseTo(7, 3);

    expect(mail.subject).toBe("Test inv-owner invited you to Invite shop on Ringdown");
    expect(mail.text).toContain(`http://localhost:3000/invitations/${token}`);
    expect(mail.text).toMatch(/as operator/);
    expect(mail.html).toContain(`href="http://localhost:3000/invitations/${token}"`);

    const [rows] = await getSequelize().query(`SELECT token_hash FROM invitations WHERE id = $1`, { bind: [invitation.id] });
    const stored = (rows as Array<{ token_hash: string }>)[0]!.token_hash;
    expect(stored).toBe(hashLinkToken(token));
    expect(stored).not.toContain(token);

    const list = invitationListSchema.parse((await owner.agent.get(`/api/shops/${owner.shopId}/invitations`)).body);
    expect(list.items.map((i) => i.email)).toEqual([email]);
  });

  it("refuses people who are not owners (403) and validates the body (400 with fields)", async () => {
    const owner = await createPerson(app, "inv-owner2");
    const manager = await createPerson(app, "inv-manager");
    await joinShop(manager.userId, owner.shopId, "tooling_manager");
    const refused = await manager.agent.post(`/api/shops/${owner.shopId}/invitations`).send({ email: uniqueEmail("x"), role: "operator" });
    expect(refused.status).toBe(403);
    const bad = await owner.agent.post(`/api/shops/${owner.shopId}/invitations`).send({ email: "nope", role: "captain" });
    expect(bad.status).toBe(400);
    expect(Object.keys(errorOf(bad.body).fields ?? {}).sort()).toEqual(["email", "role"]);
  });

  it("answers 409 for someone who is already a member", async () => {
    const owner = await createPerson(app, "inv-owner3");
    const member = await createPerson(app, "inv-member");
    await joinShop(member.userId, owner.shopId, "operator");
    const res = await owner.agent.post(`/api/shops/${owner.shopId}/invitations`).send({ email: member.email, role: "operator" });
    expect(res.status).toBe(409);
    expect(errorOf(res.body).fields?.email).toMatch(/already a member/);
  });

  it("re-inviting replaces the old link: the old one says it was replaced, the new one works", async () => {
    const owner = await createPerson(app, "inv-reinvite");
    const email = uniqueEmail("twice");
    const first = await inviteAndRead(owner, email, "operator");
    const second = await inviteAndRead(owner, email, "operator");
    expect(second.token).not.toBe(first.token);

    const old = invitationPreviewSchema.parse((await request(app).get(`/api/invitations/${first.token}`)).body);
    expect(old.status).toBe("revoked");
    const oldAccept = await request(app).post(`/api/invitations/${first.token}`).send({ name: "Twice", password: TEST_PASSWORD });
    expect(oldAccept.status).toBe(409);
    expect(errorOf(oldAccept.body).message).toMatch(/replaced by a newer one/);

    const list = invitationListSchema.parse((await owner.agent.get(`/api/shops/${owner.shopId}/invitations`)).body);
    expect(list.items).toHaveLength(1);
    expect(list.items[0]!.id).toBe(second.invitation.id);

    // Re-send through its own route: again a new link.
    const resent = await owner.agent.post(`/api/shops/${owner.shopId}/invitations/${second.invitation.id}/resend`);
    expect(resent.status).toBe(201);
    expect(invitationSchema.parse(resent.body).id).not.toBe(second.invitation.id);
    expect(invitationPreviewSchema.parse((await request(app).get(`/api/invitations/${second.token}`)).body).status).toBe("revoked");
  });

  it("revoking stops the link (clear status), and a second revoke is a 404", async () => {
    const owner = await createPerson(app, "inv-revoke");
    const { invitation, token } = await inviteAndRead(owner, uniqueEmail("revoked"), "operator");
    expect((await owner.agent.delete(`/api/shops/${owner.shopId}/invitations/${invitation.id}`)).status).toBe(204);
    expect(invitationPreviewSchema.parse((await request(app).get(`/api/invitations/${token}`)).body).status).toBe("revoked");
    expect((await request(app).post(`/api/invitations/${token}`).send({ name: "R", password: TEST_PASSWORD })).status).toBe(409);
    expect((await owner.agent.delete(`/api/shops/${owner.shopId}/invitations/${invitation.id}`)).status).toBe(404);
    expect(invitationListSchema.parse((await owner.agent.get(`/api/shops/${owner.shopId}/invitations`)).body).items).toEqual([]);
  });
});

describe("accepting an invitation", () => {
  it("a newcomer creates an account from the link, is signed in, and has the invited role", async () => {
    const owner = await createPerson(app, "acc-owner", "Accept shop");
    const email = uniqueEmail("fresh");
    const { token } = await inviteAndRead(owner, email, "operator");

    const preview = invitationPreviewSchema.parse((await request(app).get(`/api/invitations/${token}`)).body);
    expect(preview).toMatchObject({ status: "pending", shopName: "Accept shop", role: "operator", email, accountExists: false });

    const agent = request.agent(app);
    const res = await agent.post(`/api/invitations/${token}`).send({ name: "  Fresh Person ", password: TEST_PASSWORD });
    expect(res.status).toBe(201);
    const me = meSchema.parse(res.body);
    expect(me.user).toMatchObject({ email, name: "Fresh Person" });
    expect(me.activeShopId).toBe(owner.shopId);
    expect(me.memberships).toEqual([{ shopId: owner.shopId, shopName: "Accept shop", role: "operator" }]);
    expect((await agent.get("/api/me")).status).toBe(200);

    // Signs in with the chosen password and the right role.
    const login = await request(app).post("/api/auth/login").send({ email, password: TEST_PASSWORD });
    expect(meSchema.parse(login.body).memberships[0]?.role).toBe("operator");

    // Single use.
    expect(invitationPreviewSchema.parse((await request(app).get(`/api/invitations/${token}`)).body).status).toBe("accepted");
    const again = await request(app).post(`/api/invitations/${token}`).send({ name: "Again", password: TEST_PASSWORD });
    expect(again.status).toBe(409);
    expect(errorOf(again.body).message).toBe("This invitation has already been used. Sign in to reach the shop.");
  });

  it("asks a newcomer for name and password (400 naming both)", async () => {
    const owner = await createPerson(app, "acc-fields");
    const { token } = await inviteAndRead(owner, uniqueEmail("fields"), "operator");
    const res = await request(app).post(`/api/invitations/${token}`).send({});
    expect(res.status).toBe(400);
    expect(Object.keys(errorOf(res.body).fields ?? {}).sort()).toEqual(["name", "password"]);
  });

  it("an existing person signed in with the invited address joins the shop", async () => {
    const owner = await createPerson(app, "acc-owner2", "Second shop");
    const existing = await createPerson(app, "acc-existing", "Own shop");
    const { token } = await inviteAndRead(owner, existing.email, "operator");

    const preview = invitationPreviewSchema.parse((await request(app).get(`/api/invitations/${token}`)).body);
    expect(preview.accountExists).toBe(true);
    // Not signed in: told to sign in first.
    const anonymous = await request(app).post(`/api/invitations/${token}`).send({ name: "X", password: TEST_PASSWORD });
    expect(anonymous.status).toBe(409);
    expect(errorOf(anonymous.body).message).toMatch(/already exists\. Sign in/);

    const res = await existing.agent.post(`/api/invitations/${token}`).send({});
    expect(res.status).toBe(200);
    const me = meSchema.parse(res.body);
    expect(me.activeShopId).toBe(owner.shopId);
    expect(me.memberships.map((m) => [m.shopName, m.role]).sort()).toEqual([
      ["Own shop", "owner"],
      ["Second shop", "operator"],
    ]);
  });

  it("refuses someone signed in with another address", async () => {
    const owner = await createPerson(app, "acc-owner3");
    const other = await createPerson(app, "acc-other");
    const { token } = await inviteAndRead(owner, uniqueEmail("intended"), "operator");
    const res = await other.agent.post(`/api/invitations/${token}`).send({});
    expect(res.status).toBe(409);
    expect(errorOf(res.body).message).toMatch(/you are signed in as/);
    const members = memberPageSchema.parse((await owner.agent.get(`/api/shops/${owner.shopId}/members`)).body);
    expect(members.items.map((m) => m.userId)).not.toContain(other.userId);
  });

  it("an expired link says so, on view and on accept", async () => {
    const owner = await createPerson(app, "acc-expired");
    const { invitation, token } = await inviteAndRead(owner, uniqueEmail("late"), "operator");
    await setInvitationExpiry(invitation.id, new Date(Date.now() - 60_000));
    expect(invitationPreviewSchema.parse((await request(app).get(`/api/invitations/${token}`)).body).status).toBe("expired");
    const res = await request(app).post(`/api/invitations/${token}`).send({ name: "Late", password: TEST_PASSWORD });
    expect(res.status).toBe(409);
    expect(errorOf(res.body).message).toBe("This invitation has expired. Ask the shop's owner to send a new one.");
    const list = invitationListSchema.parse((await owner.agent.get(`/api/shops/${owner.shopId}/invitations`)).body);
    expect(list.items[0]?.status).toBe("expired");
  });

  it("answers 404 for an unknown token and 400 for a malformed one", async () => {
    const unknown = await request(app).get(`/api/invitations/${"A".repeat(43)}`);
    expect(unknown.status).toBe(404);
    expect(errorOf(unknown.body).message).toMatch(/not valid/);
    expect((await request(app).get(`/api/invitations/short`)).status).toBe(400);
  });
});

describe("seats and invitations", () => {
  it("the free plan's single paid seat is the owner's: inviting a programmer is refused with how to add seats; operators are free", async () => {
    const owner = await createPerson(app, "seat-owner");
    const refused = await owner.agent.post(`/api/shops/${owner.shopId}/invitations`).send({ email: uniqueEmail("prog"), role: "programmer" });
    expect(refused.status).toBe(409);
    const message = errorOf(refused.body).message;
    expect(message).toMatch(/free plan includes 1 paid seat/);
    expect(message).toMatch(/upgrade to the team plan on the Billing page/);
    expect(message).toMatch(/Operators are free/);

    for (let i = 0; i < 3; i++) {
      const ok = await owner.agent.post(`/api/shops/${owner.shopId}/invitations`).send({ email: uniqueEmail(`op${i}`), role: "operator" });
      expect(ok.status).toBe(201);
    }
  });
});

describe("invitation rate limit", () => {
  it("limits invitations per shop with a clear 429", async () => {
    const limited = makeTestApp({
      ...standIns.config(testConfig()),
      teamRateLimits: { ...testConfig().teamRateLimits, invitationsPerShop: { limit: 2, windowMs: 3_600_000 } },
    });
    const owner = await createPerson(limited, "rl-owner");
    for (let i = 0; i < 2; i++) {
      expect((await owner.agent.post(`/api/shops/${owner.shopId}/invitations`).send({ email: uniqueEmail("rl"), role: "operator" })).status).toBe(201);
    }
    const res = await owner.agent.post(`/api/shops/${owner.shopId}/invitations`).send({ email: uniqueEmail("rl"), role: "operator" });
    expect(res.status).toBe(429);
    expect(errorOf(res.body).message).toBe("Too many invitations sent from this shop. Try again in 60 minutes.");
  });
});

describe("when the mail server is down", () => {
  it("answers 503 and saves nothing, so the owner can simply try again", async () => {
    const down = makeTestApp({
      ...standIns.config(testConfig()),
      mail: { ...testConfig().mail, smtp: { ...testConfig().mail.smtp, host: "127.0.0.1", port: 9 } },
    });
    const owner = await createPerson(down, "smtp-down");
    const res = await owner.agent.post(`/api/shops/${owner.shopId}/invitations`).send({ email: uniqueEmail("lost"), role: "operator" });
    expect(res.status).toBe(503);
    expect(errorOf(res.body).message).toMatch(/could not be sent/);
    expect(invitationListSchema.parse((await owner.agent.get(`/api/shops/${owner.shopId}/invitations`)).body).items).toEqual([]);
  });
});
