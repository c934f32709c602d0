/**
 * The messages Ringdown sends, each with a plain-text and an HTML part saying the same thing.
 * Every value put into the HTML is escaped.
 */
import { roleLabels, type Role } from "@ringdown/contracts";
import type { OutgoingMail } from "./mailer.js";

export function escapeHtml(value: string): string {
  return value
    .replaceAll("&", "&amp;")
    .replaceAll("<", "&lt;")
    .replaceAll(">", "&gt;")
    .replaceAll('"', "&quot;")
    .replaceAll("'", "&#39;");
}

const dateTime = (date: Date) =>
  `${date.toISOString().slice(0, 16).replace("T", " ")} UTC`;

function page(paragraphs: string[], link: { url: string; label: string }, footer: string): string {
  const body = paragraphs.map((p) => `<p style="margin:0 0 14px">${p}</p>`).join("\n");
  return `<!doctype html>
<html><body style="margin:0;padding:24px;background:#F6F4EE;font-family:'IBM Plex Sans',Arial,sans-serif;color:#22252A;font-size:15px;line-height:1.5">
<div style="max-width:520px;margin:0 auto;background:#FFFFFF;border:1px solid #DAD6CC;border-radius:8px;padding:24px">
<p style="margin:0 0 18px;font-weight:600;color:#33407A">Ringdown</p>
${body}
<p style="margin:20px 0"><a href="${escapeHtml(link.url)}" style="display:inline-block;background:#33407A;color:#FFFFFF;text-decoration:none;padding:10px 16px;border-radius:6px;font-weight:600">${escapeHtml(link.label)}</a></p>
<p style="margin:0 0 14px;font-size:13px;color:#6B6F76">If the button does not work, open this address: <a href="${escapeHtml(link.url)}" style="color:#33407A">${escapeHtml(link.url)}</a></p>
<p style="margin:0;font-size:13px;color:#6B6F76">${footer}</p>
</div></body></html>`;
}

export function invitationMail(input: {
  to: string;
  shopName: string;
  inviterName: string | null;
  role: Role;
  url: string;
  expiresAt: Date;
}): OutgoingMail {
  const who = input.inviterName ?? "The owner";
  const role = roleLabels[input.role].toLowerCase();
  const footer = "If you did not expect this invitation, ignore this message: nothing happens unless the link is used.";
  return {
    to: input.to,
    subject: `${who} invited you to ${input.shopName} on Ringdown`,
    text: [
      `${who} invited you to join ${input.shopName} on Ringdown as ${role}.`,
      "",
      "Ringdown keeps the shop's cutters, measured machines and feeds-and-speeds recipes in one place.",
      "",
      `Accept the invitation: ${input.url}`,
      "",
      `The link works once and until ${dateTime(input.expiresAt)}.`,
      "",
      footer,
    ].join("\n"),
    html: page(
      [
        `${escapeHtml(who)} invited you to join <strong>${escapeHtml(input.shopName)}</strong> on Ringdown as ${escapeHtml(role)}.`,
        "Ringdown keeps the shop's cutters, measured machines and feeds-and-speeds recipes in one place.",
        `The link works once and until ${escapeHtml(dateTime(input.expiresAt))}.`,
      ],
      { url: input.url, label: "Accept the invitation" },
      escapeHtml(footer),
    ),
  };
}

export function passwordResetMail(input: { to: string; name: string; url: string; expiresAt: Date }): OutgoingMail {
  const footer =
    "If you did not ask for this, ignore this message: your password stays as it is. Setting a new password signs you out everywhere else.";
  return {
    to: input.to,
    subject: "Reset your Ringdown password",
    text: [
      `Hello ${input.name},`,
      "",
      "Someone (hopefully you) asked to reset the password of your Ringdown account.",
      "",
      `Choose a new password: ${input.url}`,
      "",
      `The link works once and until ${dateTime(input.expiresAt)}.`,
      "",
      footer,
    ].join("\n"),
    html: page(
      [
        `Hello ${escapeHtml(input.name)},`,
        "Someone (hopefully you) asked to reset the password of your Ringdown account.",
        `The link works once and until ${escapeHtml(dateTime(input.expiresAt))}.`,
      ],
      { url: input.url, label: "Choose a new password" },
      escapeHtml(footer),
    ),
  };
}
