/**
 * Creating and dropping whole databases. This talks to the server's maintenance database
 * ("postgres") because a database cannot create or drop itself.
 */
import pg from "pg";

function split(databaseUrl: string): { name: string; maintenanceUrl: string } {
  const url = new URL(databaseUrl);
  const name = decodeURIComponent(url.pathname.replace(/^\//, ""));
  if (!name) throw new Error(`DATABASE_URL names no database: ${redact(databaseUrl)}`);
  url.pathname = "/postgres";
  return { name, maintenanceUrl: url.toString() };
}

/** The URL without its password, for messages. */
export function redact(databaseUrl: string): string {
  try {
    const url = new URL(databaseUrl);
    if (url.password) url.password = "***";
    return url.toString();
  } catch {
    return "(unparsable URL)";
  }
}

const quoteIdent = (name: string) => `"${name.replace(/"/g, '""')}"`;

async function withMaintenanceClient<T>(databaseUrl: string, work: (c: pg.Client, name: string) => Promise<T>) {
  const { name, maintenanceUrl } = split(databaseUrl);
  const client = new pg.Client({ connectionString: maintenanceUrl, connectionTimeoutMillis: 5_000 });
  await client.connect();
  try {
    return await work(client, name);
  } finally {
    await client.end();
  }
}

/** Creates the database named in the URL if it does not exist yet. Returns true if it created it. */
export function ensureDatabase(databaseUrl: string): Promise<boolean> {
  return withMaintenanceClient(databaseUrl, async (client, name) => {
    const found = await client.query("SELECT 1 FROM pg_database WHERE datname = $1", [name]);
    if (found.rowCount) return false;
    try {
      await client.query(`CREATE DATABASE ${quoteIdent(name)} ENCODING 'UTF8' TEMPLATE template0`);
      return true;
    } catch (error) {
      // Another instance created it between our check and our CREATE.
      if ((error as { code?: string }).code === "42P04") return false;
      throw error;
    }
  });
}

/**
 * Drops and creates the database named in the URL. Only for throwaway test databases: refuses any
 * name that does not end in "_test" or "_e2e".
 */
export function recreateDatabase(databaseUrl: string): Promise<void> {
  return withMaintenanceClient(databaseUrl, async (client, name) => {
    if (!/_(test|e2e)$/.test(name)) {
      throw new Error(`Refusing to drop "${name}": only databases named *_test or *_e2e are recreated`);
    }
    await client.query(`DROP DATABASE IF EXISTS ${quoteIdent(name)} WITH (FORCE)`);
    await client.query(`CREATE DATABASE ${quoteIdent(name)} ENCODING 'UTF8' TEMPLATE template0`);
  });
}
