import { isIP } from "node:net";
import type { Response } from "express";
import { currentUser } from "../../http/locals.js";

/** Who made a change, as the audit log keeps it: the account (if any), its name then, and where from. */
export interface AuditActor {
  userId: string | null;
  name: string;
  ip: string | null;
}

/** Changes the payment provider reports through its webhook (no person of the shop made them). */
export const paymentProviderActor: AuditActor = { userId: null, name: "Payment provider", ip: null };

/** A client address fit for the log: a valid IP (IPv4-mapped IPv6 written as IPv4), else null. */
export function auditIp(raw: string | undefined): string | null {
  if (!raw) return null;
  const ip = raw.startsWith("::ffff:") && isIP(raw.slice(7)) === 4 ? raw.slice(7) : raw;
  return isIP(ip) ? ip : null;
}

/** The signed-in person of this request, with the address the request came from. */
export function requestActor(res: Response): AuditActor {
  const user = currentUser(res);
  return { userId: user.id, name: user.name, ip: auditIp(res.req.ip) };
}
