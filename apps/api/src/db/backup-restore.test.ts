/**
 * docker-free-db/backup.sh and restore.sh end to end: a database holding the demo scenario, extra
 * rows written over HTTP (with awkward text) and a queued analysis job is backed up with its
 * uploads directory, restored into a database that did not exist, and compared table by table:
 * the same tables, indexes, constraints and sequence positions, and in every table the same row
 * count and the same checksum of all its rows.
 */
import { createHash, randomBytes } from "node:crypto";
import { mkdir, mkdtemp, readFile, readdir, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import pg from "pg";
import PgBoss from "pg-boss";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { cutterSchema } from "@ringdown/contracts";
import { createApp } from "../app.js";
import { ANALYSIS_QUEUE, ANALYSIS_QUEUE_OPTIONS } from "../jobs/job-queue.js";
import { cutterBody } from "../modules/machines/library-test-fixtures.js";
import { seedDemo } from "../seed/index.js";
import { createPerson, testConfig } from "../test/harness.js";
import { testDatabaseUrl } from "../test/database-url.js";
import { runScript } from "../test/run-script.js";
import { recreateDatabase } from "./database-admin.js";
import { migrate } from "./migrate.js";
import { closeDatabase, connectDatabase } from "./sequelize.js";

/** A sibling of the test database: ringdown_test → ringdown_backup_<role>_test. */
function siblingUrl(role: string): string {
  const url = new URL(testDatabaseUrl());
  const name = decodeURIComponent(url.pathname.slice(1)).replace(/_test$/, "");
  url.pathname = `/${name}_backup_${role}_test`;
  return url.toString();
}

const sourceUrl = siblingUrl("source");
const restoredUrl = siblingUrl("restored");
let workDir = "";

async function onServer<T>(databaseUrl: string, work: (client: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    return await work(client);
  } finally {
    await client.end();
  }
}

const maintenanceUrl = (databaseUrl: string) => Object.assign(new URL(databaseUrl), { pathname: "/postgres" }).toString();

async function dropDatabase(databaseUrl: string): Promise<void> {
  const name = decodeURIComponent(new URL(databaseUrl).pathname.slice(1));
  await onServer(maintenanceUrl(databaseUrl), (c) => c.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`));
}

interface Snapshot {
  /** "schema.table" → row count and md5 of all rows, each as text, in sorted order. */
  tables: Record<string, { rows: number; md5: string }>;
  indexes: string[];
  constraints: string[];
  sequences: Record<string, string | null>;
}

/** Everything a restore must reproduce, read from the catalog and the tables themselves. */
function snapshot(databaseUrl: string): Promise<Snapshot> {
  return onServer(databaseUrl, async (c) => {
    const userSchemas = "n.nspname NOT IN ('pg_catalog', 'information_schema') AND n.nspname NOT LIKE 'pg\\_%'";
    const tables = await c.query<{ schema: string; name: string }>(
      `SELECT n.nspname AS schema, c.relname AS name FROM pg_class c JOIN pg_namespace n ON n.oid = c.relnamespace
       WHERE c.relkind = 'r' AND ${userSchemas} ORDER BY 1, 2`,
    );
    const result: Snapshot = { tables: {}, indexes: [], constraints: [], sequences: {} };
    for (const { schema, name } of tables.rows) {
      const qualified = `"${schema}"."${name}"`;
      const row = await c.query<{ rows: number; md5: string }>(
        `SELECT count(*)::int AS rows, md5(coalesce(string_agg(t::text, E'\\n' ORDER BY t::text), '')) AS md5 FROM ${qualified} AS t`,
      );
      result.tables[`${schema}.${name}`] = row.rows[0] as { rows: number; md5: string };
    }
    result.indexes = (
      await c.query<{ def: string }>(
        `SELECT pg_get_indexdef(i.indexrelid) AS def FROM pg_index i JOIN pg_class c ON c.oid = i.indexrelid
         JOIN pg_namespace n ON n.oid = c.relnamespace WHERE ${userSchemas} ORDER BY 1`,
      )
    ).rows.map((r) => r.def);
    result.constraints = (
      await c.query<{ def: string }>(
        `SELECT conrelid::regclass::text || ' ' || conname || ' ' || pg_get_constraintdef(k.oid) AS def FROM pg_constraint k
         JOIN pg_namespace n ON n.oid = k.connamespace WHERE ${userSchemas} ORDER BY 1`,
      )
    ).rows.map((r) => r.def);
    const sequences = await c.query<{ name: string; last: string | null }>(
      `SELECT schemaname || '.' || sequencename AS name, last_value::text AS last FROM pg_sequences ORDER BY 1`,
    );
    result.sequences = Object.fromEntries(sequences.rows.map((r) => [r.name, r.last]));
    return result;
  });
}

/** Relative path → sha256 of every file under a directory. */
async function fileDigests(root: string): Promise<Record<string, string>> {
  const entries = await readdir(root, { recursive: true, withFileTypes: true });
  const files = entries.filter((e) => e.isFile()).map((e) => path.relative(root, path.join(e.parentPath, e.name)));
  const digests = await Promise.all(files.map(async (f) => [f, createHash("sha256").update(await readFile(path.join(root, f))).digest("hex")]));
  return Object.fromEntries(digests.sort(([a], [b]) => String(a).localeCompare(String(b))));
}

afterAll(async () => {
  await closeDatabase();
  await dropDatabase(restoredUrl).catch(() => undefined);
  await dropDatabase(sourceUrl).catch(() => undefined);
  if (workDir) await rm(workDir, { recursive: true, force: true });
});

let extraCutterId = "";

beforeAll(async () => {
  workDir = await mkdtemp(path.join(tmpdir(), "ringdown-backup-"));
  await recreateDatabase(sourceUrl);
  await dropDatabase(restoredUrl);
  const sequelize = connectDatabase(sourceUrl);
  await migrate(sequelize, sourceUrl);
  await seedDemo();

  // Extra rows through the API, with text that quoting, encoding or escaping could spoil.
  const app = createApp(testConfig({ databaseUrl: sourceUrl }));
  const person = await createPerson(app, "backup", "Backup «Ørsted» \"quoted\" shop");
  const res = await person.agent
    .post(`/api/shops/${person.shopId}/cutters`)
    .send(cutterBody({ name: `It's a "¼-inch" \\ back-slashed cutter — 切削`, maker: "Ünïcode & Söns; DROP TABLE x;--" }));
  expect(res.status).toBe(201);
  extraCutterId = cutterSchema.parse(res.body).id;

  // A queued analysis job, in the job queue's own schema.
  const boss = new PgBoss({ connectionString: sourceUrl, schema: "pgboss", max: 2 });
  boss.on("error", () => undefined);
  await boss.start();
  await boss.createQueue(ANALYSIS_QUEUE, { name: ANALYSIS_QUEUE, ...ANALYSIS_QUEUE_OPTIONS });
  await boss.send(ANALYSIS_QUEUE, { recordingId: "00000000-0000-4000-8000-00000000b4c7" });
  await boss.stop({ graceful: false, wait: true });

  // Uploaded files, nested as the storage keeps them, one with a space in its name.
  const storage = path.join(workDir, "storage");
  await mkdir(path.join(storage, "shops", person.shopId, "photos"), { recursive: true });
  await writeFile(path.join(storage, "shops", person.shopId, "photos", "first cut.jpg"), randomBytes(70_000));
  await writeFile(path.join(storage, "shops", person.shopId, "photos", "second.png"), randomBytes(1_000));
  await closeDatabase();
}, 120_000);

describe("backup.sh and restore.sh", () => {
  it("restore into a new database finds every table, index, constraint, sequence and row, and every uploaded file", async () => {
    const archive = path.join(workDir, "backups", "nightly.dump");
    const backup = await runScript("docker-free-db/backup.sh", [
      "--database-url", sourceUrl, "--out", archive, "--storage-dir", path.join(workDir, "storage"),
    ]);
    expect(backup.code, backup.stderr).toBe(0);
    const filesArchive = path.join(workDir, "backups", "nightly.files.tar.gz");
    expect(backup.stdout.trim().split("\n")).toEqual([archive, filesArchive]);

    const restoredFiles = path.join(workDir, "restored-storage");
    const restore = await runScript("docker-free-db/restore.sh", [archive, "--database-url", restoredUrl, "--storage-dir", restoredFiles]);
    expect(restore.code, restore.stderr).toBe(0);

    const [before, after] = await Promise.all([snapshot(sourceUrl), snapshot(restoredUrl)]);
    // Not a comparison of two empty shells: the scenario, the extra rows and the job are there.
    expect(Object.keys(before.tables).length).toBeGreaterThanOrEqual(20);
    for (const table of ["public.users", "public.shops", "public.memberships", "public.cutters", "public.machines", "public.recipes", "public.schema_migrations"]) {
      expect(before.tables[table]?.rows, table).toBeGreaterThan(0);
    }
    // pg-boss keeps jobs in one partition per queue, under its parent table pgboss.job.
    const queued = "SELECT data->>'recordingId' AS id FROM pgboss.job WHERE name = $1";
    const jobs = await onServer(restoredUrl, (c) => c.query<{ id: string }>(queued, [ANALYSIS_QUEUE]));
    expect(jobs.rows).toEqual([{ id: "00000000-0000-4000-8000-00000000b4c7" }]);
    expect(before.indexes.length).toBeGreaterThan(10);
    expect(after).toEqual(before);
    const extra = await onServer(restoredUrl, (c) => c.query<{ name: string; maker: string }>("SELECT name, maker FROM cutters WHERE id = $1", [extraCutterId]));
    expect(extra.rows).toEqual([{ name: `It's a "¼-inch" \\ back-slashed cutter — 切削`, maker: "Ünïcode & Söns; DROP TABLE x;--" }]);

    expect(await fileDigests(restoredFiles)).toEqual(await fileDigests(path.join(workDir, "storage")));
    expect(Object.keys(await fileDigests(restoredFiles))).toHaveLength(2);
  });

  it("refuses to restore over a database that holds tables, in one line, and replaces it only when told to", async () => {
    const archive = path.join(workDir, "backups", "nightly.dump");
    const refused = await runScript("docker-free-db/restore.sh", [archive, "--database-url", restoredUrl]);
    expect(refused.code).toBe(1);
    expect(refused.stderr.trim().split("\n")).toHaveLength(1);
    expect(refused.stderr).toMatch(/^restore\.sh: error: database \w+ already holds \d+ tables, views or sequences; pass --replace/);

    // A change made after the restore is gone once the archive replaces the database.
    await onServer(restoredUrl, (c) => c.query("DELETE FROM cutters WHERE id = $1", [extraCutterId]));
    const replaced = await runScript("docker-free-db/restore.sh", [archive, "--database-url", restoredUrl, "--replace"]);
    expect(replaced.code, replaced.stderr).toBe(0);
    expect((await snapshot(restoredUrl)).tables).toEqual((await snapshot(sourceUrl)).tables);
  });

  it("says in one line when the archive is not one, or the server cannot be reached", async () => {
    const bogus = path.join(workDir, "not-a-backup.dump");
    await writeFile(bogus, "just text\n");
    const notArchive = await runScript("docker-free-db/restore.sh", [bogus, "--database-url", restoredUrl]);
    expect(notArchive.code).toBe(1);
    expect(notArchive.stderr).toMatch(/^restore\.sh: error: .*not-a-backup\.dump is not a database archive written by backup\.sh: .+\n$/);

    const unreachable = await runScript("docker-free-db/backup.sh", ["--database-url", "postgres://postgres@127.0.0.1:1/nothing", "--out", path.join(workDir, "x.dump"), "--no-files"]);
    expect(unreachable.code).toBe(1);
    expect(unreachable.stderr).toMatch(/^backup\.sh: error: pg_dump could not back up postgres:\/\/postgres@127\.0\.0\.1:1\/nothing: .*refused\n$/);
  });
});
