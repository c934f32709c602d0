import { Router } from "express";
import { capturedMailListSchema, type CapturedMail } from "@ringdown/contracts";
import { AppError } from "../../http/app-error.js";
import { readMail, readMails, type StoredMail } from "../../dev-services/mail-capture/store.js";

const toCaptured = (m: StoredMail): CapturedMail => ({
  id: m.id,
  receivedAt: m.receivedAt,
  from: m.from,
  to: m.to,
  subject: m.subject,
  text: m.text,
  hasHtml: m.html !== null,
  links: m.links,
});

/**
 * /api/dev/mail — only mounted outside production, when a capture folder is configured: the
 * messages the local capture server stored, so a newcomer can follow an invitation link.
 * Public on purpose (the invited person has no account yet); loopback development only.
 */
export function createDevMailRouter(captureDir: string): Router {
  const router = Router();
  router.get("/", async (_req, res) => {
    const items = (await readMails(captureDir)).map(toCaptured);
    res.json(capturedMailListSchema.parse({ items, directory: captureDir }));
  });
  // The HTML part as sent, under the app's strict CSP (no scripts run).
  router.get("/:id/html", async (req, res) => {
    const mail = await readMail(captureDir, String(req.params.id));
    if (!mail?.html) throw AppError.notFound("No captured message with an HTML part has this id.");
    res.type("html").send(mail.html);
  });
  return router;
}
