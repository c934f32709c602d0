import { createHash, randomBytes } from "node:crypto";

/**
 * Tokens for links sent by e-mail (invitations, password resets): 32 random bytes (256 bits),
 * base64url, 43 characters. Only the SHA-256 hash is stored, so the database alone cannot be used
 * to open a link; a fast hash is enough because the token itself is high-entropy (no guessing).
 */
export function newLinkToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, hash: hashLinkToken(token) };
}

export function hashLinkToken(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}
