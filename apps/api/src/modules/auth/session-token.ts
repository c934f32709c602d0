import { createSecretKey, randomUUID, type KeyObject } from "node:crypto";
import jwt from "jsonwebtoken";
import { AppError } from "../../http/app-error.js";

const ISSUER = "ringdown";
const ALGORITHM = "HS256";

export interface SessionClaims {
  /** User id. */
  sub: string;
  /** The user's session version when the token was issued. */
  sv: number;
  /** Token id, used to revoke this one session at sign-out. */
  jti: string;
  /** Expiry [s since epoch]. */
  exp: number;
}

export interface IssuedToken {
  token: string;
  tokenId: string;
  expiresAt: Date;
}

export function signSessionToken(
  user: { id: string; sessionVersion: number },
  secret: string,
  ttlHours: number,
): IssuedToken {
  const tokenId = randomUUID();
  const ttlSeconds = Math.round(ttlHours * 3600);
  const token = jwt.sign({ sv: user.sessionVersion }, secret, {
    algorithm: ALGORITHM,
    issuer: ISSUER,
    subject: user.id,
    jwtid: tokenId,
    expiresIn: ttlSeconds,
  });
  const { exp } = jwt.decode(token) as { exp: number };
  return { token, tokenId, expiresAt: new Date(exp * 1000) };
}

// jsonwebtoken turns a string secret into a key on every call, first trying it as a PEM public key
// and catching the failure: about a millisecond per request. The key object is made once instead.
let verifyKey: { secret: string; key: KeyObject } | undefined;
function keyFor(secret: string): KeyObject {
  if (verifyKey?.secret !== secret) verifyKey = { secret, key: createSecretKey(Buffer.from(secret, "utf8")) };
  return verifyKey.key;
}

/** Verifies signature, algorithm, issuer and expiry; throws `unauthenticated` otherwise. */
export function verifySessionToken(token: string, secret: string): SessionClaims {
  let payload: unknown;
  try {
    payload = jwt.verify(token, keyFor(secret), { algorithms: [ALGORITHM], issuer: ISSUER });
  } catch (error) {
    if (error instanceof jwt.TokenExpiredError) {
      throw AppError.unauthenticated("Your session has expired. Sign in again.");
    }
    throw AppError.unauthenticated("Your session is not valid. Sign in again.");
  }
  const claims = payload as Partial<SessionClaims>;
  if (
    typeof claims.sub !== "string" ||
    typeof claims.sv !== "number" ||
    typeof claims.jti !== "string" ||
    typeof claims.exp !== "number"
  ) {
    throw AppError.unauthenticated("Your session is not valid. Sign in again.");
  }
  return claims as SessionClaims;
}
