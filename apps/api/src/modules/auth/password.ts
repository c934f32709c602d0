import bcrypt from "bcryptjs";

/** bcrypt work factor. Kept at 12 everywhere (tests included) so production never runs weaker. */
export const BCRYPT_COST = 12;

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, BCRYPT_COST);
}

export function verifyPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

let dummyHash: Promise<string> | undefined;

/**
 * Spends the same time as a real check when the e-mail address is unknown, so response times do
 * not tell which addresses have accounts.
 */
export async function burnPasswordCheck(password: string): Promise<void> {
  dummyHash ??= bcrypt.hash("ringdown-timing-equaliser", BCRYPT_COST);
  await bcrypt.compare(password, await dummyHash);
}
