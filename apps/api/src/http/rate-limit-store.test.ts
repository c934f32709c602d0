import { randomUUID } from "node:crypto";
import { afterAll, describe, expect, it } from "vitest";
import { getSequelize } from "../db/sequelize.js";
import { connectTestDatabase, disconnectTestDatabase } from "../test/harness.js";
import { PostgresRateLimitStore, purgeExpiredRateLimits } from "./rate-limit-store.js";

connectTestDatabase();
afterAll(disconnectTestDatabase);

function store(windowMs = 60_000) {
  const s = new PostgresRateLimitStore(getSequelize(), `store-test-${randomUUID()}:`);
  s.init({ windowMs } as Parameters<PostgresRateLimitStore["init"]>[0]);
  return s;
}

/** Moves a counter's window end into the past, as if the window had run out. */
async function expire(s: PostgresRateLimitStore, key: string) {
  await getSequelize().query(`UPDATE rate_limit_counters SET reset_at = now() - interval '1 second' WHERE key = $1`, {
    bind: [`${s.prefix}${key}`],
  });
}

describe("PostgresRateLimitStore", () => {
  it("counts hits per key within a window and reports when the window ends", async () => {
    const s = store(60_000);
    const before = Date.now();
    const first = await s.increment("a");
    const second = await s.increment("a");
    const other = await s.increment("b");
    expect([first.totalHits, second.totalHits, other.totalHits]).toEqual([1, 2, 1]);
    expect(second.resetTime?.getTime()).toBe(first.resetTime?.getTime());
    // The window ends about a minute after the first hit (database and test clocks are the same host's).
    expect(first.resetTime!.getTime()).toBeGreaterThan(before + 50_000);
    expect(first.resetTime!.getTime()).toBeLessThan(before + 70_000);
  });

  it("starts a new window at 1 once the old one ended", async () => {
    const s = store();
    await s.increment("k");
    await s.increment("k");
    await expire(s, "k");
    expect(await s.get("k")).toBeUndefined();
    expect((await s.increment("k")).totalHits).toBe(1);
  });

  it("counts concurrent hits exactly (atomic upsert)", async () => {
    const s = store();
    const results = await Promise.all(Array.from({ length: 20 }, () => s.increment("burst")));
    expect(results.map((r) => r.totalHits).sort((x, y) => x - y)).toEqual(Array.from({ length: 20 }, (_, i) => i + 1));
  });

  it("decrements, resets one key, and resets only its own prefix", async () => {
    const s = store();
    const neighbour = store();
    await s.increment("x");
    await s.increment("x");
    await s.decrement("x");
    expect((await s.get("x"))?.totalHits).toBe(1);
    await s.resetKey("x");
    expect(await s.get("x")).toBeUndefined();

    await s.increment("y");
    await neighbour.increment("y");
    await s.resetAll();
    expect(await s.get("y")).toBeUndefined();
    expect((await neighbour.get("y"))?.totalHits).toBe(1);
  });

  it("purges counters whose window ended over an hour ago", async () => {
    const s = store();
    await s.increment("old");
    await getSequelize().query(`UPDATE rate_limit_counters SET reset_at = now() - interval '2 hours' WHERE key = $1`, {
      bind: [`${s.prefix}old`],
    });
    await purgeExpiredRateLimits(getSequelize());
    const [rows] = await getSequelize().query(`SELECT 1 FROM rate_limit_counters WHERE key = $1`, { bind: [`${s.prefix}old`] });
    expect(rows).toHaveLength(0);
  });
});
