import { ConnectionError } from "sequelize";

/**
 * SQLSTATEs meaning the server cannot serve this session, rather than that the statement is wrong
 * (PostgreSQL manual, Appendix A "PostgreSQL Error Codes"): class 08 (connection exception),
 * 57P01 admin_shutdown, 57P02 crash_shutdown, 57P03 cannot_connect_now (starting or shutting
 * down) and 53300 too_many_connections.
 */
const UNAVAILABLE_SQLSTATES = new Set(["57P01", "57P02", "57P03", "53300"]);

/** Socket-level failures of a connection (Node.js system error codes). */
const SOCKET_CODES = new Set(["ECONNREFUSED", "ECONNRESET", "EPIPE", "ETIMEDOUT", "EHOSTUNREACH", "ENETUNREACH", "ENOTFOUND"]);

/** Messages node-postgres gives, without a code, when it loses or cannot use its connection. */
const LOST_CONNECTION = /Connection terminated|not queryable|Connection closed|timeout exceeded when trying to connect/i;

function codeOf(error: object): string | undefined {
  const code = (error as { code?: unknown }).code;
  return typeof code === "string" ? code : undefined;
}

function describesUnavailable(error: unknown): boolean {
  if (!error || typeof error !== "object") return false;
  const code = codeOf(error);
  if (code && (code.startsWith("08") || UNAVAILABLE_SQLSTATES.has(code) || SOCKET_CODES.has(code))) return true;
  return error instanceof Error && !code && LOST_CONNECTION.test(error.message);
}

/**
 * Whether an error means the database cannot be reached or has just gone away (stopped, restarted,
 * connection cut, no connection free in time), as opposed to a fault in the query or its data.
 * Sequelize wraps driver errors (`parent`/`original`); other code may set `cause`.
 */
export function isDatabaseUnavailable(error: unknown): boolean {
  if (error instanceof ConnectionError) return true;
  let current: unknown = error;
  for (let depth = 0; depth < 4 && current && typeof current === "object"; depth++) {
    if (describesUnavailable(current)) return true;
    const wrapper = current as { parent?: unknown; original?: unknown; cause?: unknown };
    current = wrapper.parent ?? wrapper.original ?? wrapper.cause;
  }
  return false;
}
