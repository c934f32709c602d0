/**
 * The folder the local mail capture server writes to: one JSON file per message (plus the raw
 * .eml beside it). Files are written under a temporary name and renamed, so a reader in another
 * process (the API's development mail page, an end-to-end test) never sees half a message.
 */
import { randomUUID } from "node:crypto";
import { mkdir, readdir, readFile, rename, rm, writeFile } from "node:fs/promises";
import path from "node:path";

export interface StoredMail {
  id: string;
  receivedAt: string;
  /** SMTP envelope sender and recipients (what the server was told, not the headers). */
  envelope: { from: string; to: string[] };
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  /** Every http(s) link, from the plain-text part first, then the HTML part's hrefs. */
  links: string[];
}

/** Oldest messages beyond this many are deleted as new ones arrive. */
export const KEEP_MESSAGES = 500;

const ID_PATTERN = /^[0-9]{13}-[0-9a-f]{8}$/;

export function isMailId(id: string): boolean {
  return ID_PATTERN.test(id);
}

/** Links in text: http(s) up to whitespace or a closing bracket/quote. */
export function extractLinks(text: string, html: string | null): string[] {
  const found = [...text.matchAll(/https?:\/\/[^\s<>"')\]]+/g)].map((m) => m[0].replace(/[.,;:]+$/, ""));
  if (html) {
    for (const m of html.matchAll(/href="(https?:\/\/[^"]+)"/g)) found.push(m[1]!.replaceAll("&amp;", "&"));
  }
  return [...new Set(found)];
}

export async function writeMail(dir: string, mail: Omit<StoredMail, "id" | "links">, raw: Buffer): Promise<StoredMail> {
  await mkdir(dir, { recursive: true });
  const id = `${Date.now().toString().padStart(13, "0")}-${randomUUID().slice(0, 8)}`;
  const stored: StoredMail = { id, ...mail, links: extractLinks(mail.text, mail.html) };
  const tmp = path.join(dir, `.${id}.json.tmp`);
  await writeFile(path.join(dir, `${id}.eml`), raw);
  await writeFile(tmp, JSON.stringify(stored, null, 2));
  await rename(tmp, path.join(dir, `${id}.json`));
  await prune(dir);
  return stored;
}

async function messageFiles(dir: string): Promise<string[]> {
  try {
    return (await readdir(dir)).filter((f) => f.endsWith(".json") && isMailId(f.slice(0, -5))).sort();
  } catch (error) {
    if ((error as { code?: string }).code === "ENOENT") return [];
    throw error;
  }
}

async function prune(dir: string): Promise<void> {
  const files = await messageFiles(dir);
  for (const file of files.slice(0, Math.max(0, files.length - KEEP_MESSAGES))) {
    const id = file.slice(0, -5);
    await rm(path.join(dir, file), { force: true });
    await rm(path.join(dir, `${id}.eml`), { force: true });
  }
}

/** Captured messages, newest first; an absent folder is an empty list. */
export async function readMails(dir: string, limit = 200): Promise<StoredMail[]> {
  const files = (await messageFiles(dir)).reverse().slice(0, limit);
  const mails: StoredMail[] = [];
  for (const file of files) {
    try {
      mails.push(JSON.parse(await readFile(path.join(dir, file), "utf8")) as StoredMail);
    } catch (error) {
      // Pruned between listing and reading: skip it.
      if ((error as { code?: string }).code !== "ENOENT") throw error;
    }
  }
  return mails;
}

export async function readMail(dir: string, id: string): Promise<StoredMail | null> {
  if (!isMailId(id)) return null;
  try {
    return JSON.parse(await readFile(path.join(dir, `${id}.json`), "utf8")) as StoredMail;
  } catch (error) {
    if ((error as { code?: string }).code === "ENOENT") return null;
    throw error;
  }
}

/** Deletes every captured message (tests start clean with this). */
export async function clearMails(dir: string): Promise<void> {
  await rm(dir, { recursive: true, force: true });
}
