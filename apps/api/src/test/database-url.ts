import { readConfig } from "../config/env.js";

/**
 * The integration tests' database: the one named in DATABASE_URL, or ringdown_test on that server
 * when the URL names none. Only *_test / *_e2e databases are ever recreated.
 */
export function testDatabaseUrl(): string {
  const url = new URL(readConfig().databaseUrl);
  if (url.pathname === "/" || url.pathname === "") url.pathname = "/ringdown_test";
  return url.toString();
}
