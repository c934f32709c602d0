/**
 * Which database failures count as "the database is unavailable" (503), checked with the real
 * errors Sequelize and node-postgres raise: sessions ended by the server (pg_terminate_backend sends
 * the same 57P01 admin_shutdown as a stopping server), a refused connection, and ordinary query
 * faults that must stay errors of their own. Only this file's own sessions are terminated.
 */
import pg from "pg";
import { QueryTypes, Sequelize } from "sequelize";
import { afterAll, describe, expect, it } from "vitest";
import { isDatabaseUnavailable } from "./connection-errors.js";
import { closeDatabase, connectDatabase } from "./sequelize.js";
import { testDatabaseUrl } from "../test/database-url.js";

const url = testDatabaseUrl();
// The app's own connection set-up. Queries here run one at a time, so the pool holds a single
// session and the one terminated is the one the next query would be handed.
const sequelize = connectDatabase(url);
afterAll(closeDatabase);

const backendPid = async () =>
  (await sequelize.query<{ pid: number }>("SELECT pg_backend_pid() AS pid", { type: QueryTypes.SELECT }))[0]?.pid;

async function terminate(pid: number | undefined): Promise<void> {
  const admin = new pg.Client({ connectionString: url });
  await admin.connect();
  try {
    const res = await admin.query<{ done: boolean }>("SELECT pg_terminate_backend($1) AS done", [pid]);
    expect(res.rows[0]?.done).toBe(true);
  } finally {
    await admin.end();
  }
}

const failureOf = (work: Promise<unknown>) =>
  work.then(
    () => {
      throw new Error("expected the query to fail");
    },
    (error: unknown) => error,
  );

describe("isDatabaseUnavailable", () => {
  it("recognises a query whose session the server ends mid-statement (57P01), and the pool drops that session instead of handing it out again", async () => {
    const pid = await backendPid();
    const running = failureOf(sequelize.query("SELECT pg_sleep(30)"));
    // Let the statement reach the server before ending its session.
    await new Promise((r) => setTimeout(r, 300));
    await terminate(pid);
    const error = await running;
    expect((error as { parent?: { code?: string } }).parent?.code).toBe("57P01");
    expect(isDatabaseUnavailable(error)).toBe(true);
    const next = await backendPid();
    expect(next).toBeTypeOf("number");
    expect(next).not.toBe(pid);
  });

  it("lets the pool replace an idle session the server ended, without an error", async () => {
    const pid = await backendPid();
    await terminate(pid);
    await new Promise((r) => setTimeout(r, 200));
    const next = await backendPid();
    expect(next).not.toBe(pid);
  });

  it("recognises a refused connection", async () => {
    const nowhere = new Sequelize("postgres://postgres@127.0.0.1:1/nothing_test", { dialect: "postgres", dialectModule: pg, logging: false });
    try {
      const error = await failureOf(nowhere.query("SELECT 1"));
      expect(isDatabaseUnavailable(error)).toBe(true);
    } finally {
      await nowhere.close();
    }
  });

  it("leaves faults of the query itself alone: a syntax error, a missing table, a division by zero", async () => {
    for (const sql of ["SELEC 1", "SELECT * FROM no_such_table_here", "SELECT 1 / 0"]) {
      const error = await failureOf(sequelize.query(sql));
      expect(isDatabaseUnavailable(error), sql).toBe(false);
    }
    expect(isDatabaseUnavailable(new Error("something else broke"))).toBe(false);
    expect(isDatabaseUnavailable(undefined)).toBe(false);
  });
});
