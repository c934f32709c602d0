import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { capturedMailListSchema } from "@ringdown/contracts";
import type { Express } from "express";
import { startStandIns, type StandIns } from "../../dev-services/stand-ins.js";
import { extractLinks } from "../../dev-services/mail-capture/store.js";
import { disconnectTestDatabase, makeTestApp, testConfig, uniqueEmail } from "../../test/harness.js";
import { closeMailers, createMailer } from "./mailer.js";
import { escapeHtml, invitationMail } from "./templates.js";

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

describe("sending through SMTP to the local capture server", () => {
  it("delivers a plain-text and an HTML part, stored for other processes to read", async () => {
    const to = uniqueEmail("mailbox");
    const config = { ...testConfig().mail, ...standIns.config(testConfig()).mail! };
    const mail = invitationMail({
      to,
      shopName: "Burr & <Sons>",
      inviterName: "Ada",
      role: "tooling_manager",
      url: "http://localhost:3000/invitations/abc?x=1&y=2",
      expiresAt: new Date("2031-05-04T10:20:00Z"),
    });
    await createMailer(config).send(mail);
    const stored = await standIns.waitForMail(to);
    expect(stored.subject).toBe("Ada invited you to Burr & <Sons> on Ringdown");
    expect(stored.from).toBe("Ringdown <no-reply@ringdown.localhost>");
    expect(stored.text).toContain("as tooling manager");
    expect(stored.text).toContain("until 2031-05-04 10:20 UTC");
    // Values are escaped in the HTML part.
    expect(stored.html).toContain("Burr &amp; &lt;Sons&gt;");
    expect(stored.html).not.toContain("<Sons>");
    expect(stored.links).toEqual(["http://localhost:3000/invitations/abc?x=1&y=2"]);
  });
});

describe("GET /api/dev/mail", () => {
  it("lists captured messages newest first with their links, and serves the HTML part", async () => {
    const to = uniqueEmail("devpage");
    await createMailer({ ...testConfig().mail, ...standIns.config(testConfig()).mail! }).send({
      to,
      subject: "Dev page check",
      text: "Open http://localhost:3000/reset-password/tok. Thanks",
      html: '<p><a href="http://localhost:3000/reset-password/tok">open</a></p>',
    });
    await standIns.waitForMail(to);
    const res = await request(app).get("/api/dev/mail");
    expect(res.status).toBe(200);
    const list = capturedMailListSchema.parse(res.body);
    const item = list.items.find((m) => m.to.includes(to));
    expect(item).toMatchObject({ subject: "Dev page check", hasHtml: true, links: ["http://localhost:3000/reset-password/tok"] });
    expect(list.items[0]!.receivedAt >= item!.receivedAt).toBe(true);

    const html = await request(app).get(`/api/dev/mail/${item!.id}/html`);
    expect(html.status).toBe(200);
    expect(html.headers["content-type"]).toMatch(/text\/html/);
    expect(html.text).toContain("reset-password/tok");
    expect((await request(app).get("/api/dev/mail/../../etc/html")).status).toBe(404);
  });

  it("does not exist in production", async () => {
    const prod = makeTestApp({ ...standIns.config(testConfig()), isProduction: true });
    const res = await request(prod).get("/api/dev/mail");
    expect(res.status).toBe(404);
  });
});

describe("helpers", () => {
  it("escapes the five HTML-significant characters", () => {
    expect(escapeHtml(`<a href="x">'&'</a>`)).toBe("&lt;a href=&quot;x&quot;&gt;&#39;&amp;&#39;&lt;/a&gt;");
  });
  it("extracts links without trailing punctuation, once each, from text and HTML", () => {
    expect(extractLinks("See https://a.example/x. And (https://b.example/y) or https://a.example/x", '<a href="https://c.example/?a=1&amp;b=2">c</a>')).toEqual([
      "https://a.example/x",
      "https://b.example/y",
      "https://c.example/?a=1&b=2",
    ]);
  });
});
