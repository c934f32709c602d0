import type { Options, Store, ClientRateLimitInfo } from "express-rate-limit";
import { QueryTypes, type Sequelize } from "sequelize";

/** Counter writes still in flight (a decrement runs after the response has been sent). */
const inFlight = new Set<Promise<unknown>>();

function track<T>(work: Promise<T>): Promise<T> {
  inFlight.add(work);
  void work.finally(() => inFlight.delete(work)).catch(() => undefined);
  return work;
}

/**
 * Waits for counter writes still running, e.g. before closing the database at shutdown. One
 * macrotask first, so that writes queued by responses that just finished have started.
 */
export async function settleRateLimitWrites(): Promise<void> {
  await new Promise((resolve) => setImmediate(resolve));
  await Promise.allSettled([...inFlight]);
}

/**
 * express-rate-limit store keeping fixed-window counters in PostgreSQL, so that every API
 * instance sees the same counts (memory stores would give each instance its own allowance).
 * One row per key; an expired window restarts at 1 in the same atomic upsert.
 */
export class PostgresRateLimitStore implements Store {
  readonly localKeys = false;
  readonly prefix: string;
  private windowMs = 60_000;

  constructor(
    private readonly sequelize: Sequelize,
    prefix: string,
  ) {
    this.prefix = prefix;
  }

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  private key(key: string): string {
    return `${this.prefix}${key}`;
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const rows = await this.sequelize.query<{ hits: number; reset_at: Date }>(
      `SELECT hits, reset_at FROM rate_limit_counters WHERE key = $1 AND reset_at > now()`,
      { bind: [this.key(key)], type: QueryTypes.SELECT },
    );
    const row = rows[0];
    return row ? { totalHits: row.hits, resetTime: new Date(row.reset_at) } : undefined;
  }

  async increment(key: string): Promise<ClientRateLimitInfo> {
    const rows = await track(this.sequelize.query<{ hits: number; reset_at: Date }>(
      `INSERT INTO rate_limit_counters AS c (key, hits, reset_at)
       VALUES ($1, 1, now() + $2 * interval '1 millisecond')
       ON CONFLICT (key) DO UPDATE SET
         hits = CASE WHEN c.reset_at <= now() THEN 1 ELSE c.hits + 1 END,
         reset_at = CASE WHEN c.reset_at <= now() THEN EXCLUDED.reset_at ELSE c.reset_at END
       RETURNING hits, reset_at`,
      { bind: [this.key(key), this.windowMs], type: QueryTypes.SELECT },
    ));
    const row = rows[0];
    if (!row) throw new Error("rate limit upsert returned no row");
    return { totalHits: row.hits, resetTime: new Date(row.reset_at) };
  }

  async decrement(key: string): Promise<void> {
    await track(
      this.sequelize.query(
        `UPDATE rate_limit_counters SET hits = GREATEST(hits - 1, 0) WHERE key = $1 AND reset_at > now()`,
        { bind: [this.key(key)] },
      ),
    );
  }

  async resetKey(key: string): Promise<void> {
    await this.sequelize.query(`DELETE FROM rate_limit_counters WHERE key = $1`, { bind: [this.key(key)] });
  }

  async resetAll(): Promise<void> {
    await this.sequelize.query(`DELETE FROM rate_limit_counters WHERE key LIKE $1`, {
      bind: [`${this.prefix.replace(/[\\%_]/g, "\\$&")}%`],
    });
  }
}

/** Deletes counters whose window ended (they are only kept to be overwritten otherwise). */
export async function purgeExpiredRateLimits(sequelize: Sequelize): Promise<void> {
  await sequelize.query(`DELETE FROM rate_limit_counters WHERE reset_at < now() - interval '1 hour'`);
}
