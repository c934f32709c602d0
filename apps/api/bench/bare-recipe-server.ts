/**
 * The recipe list's SQL served bare, as the yardstick for the API's overhead: node:http and a pg
 * Pool of the API's size (10), no Express, no session, no membership check, no response schema.
 * It runs exactly what the route runs — `recipeListSql` with the same parsed query — with the
 * named replacements turned into bind parameters, and sends the rows as JSON.
 *
 *   GET /shops/:shopId/recipes?<the route's query>   (header x-approved-only: 1 = an operator's list)
 *   GET /health
 *
 * Started by recipe-search.bench.ts with DATABASE_URL and PORT.
 */
import { createServer } from "node:http";
import pg from "pg";
import { recipeListQuerySchema } from "@ringdown/contracts";
import { recipeListSql } from "../src/modules/recipes/recipes.repository.js";

const pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 10 });
pg.types.setTypeParser(pg.types.builtins.INT8, (value: string) => Number.parseInt(value, 10));

/** `:name` placeholders → `$n` with the values in order (a `::cast` is left alone). */
function toBind(sql: string, replacements: Record<string, unknown>): { text: string; values: unknown[] } {
  const names: string[] = [];
  const text = sql.replace(/(?<!:):([A-Za-z_]\w*)/g, (_m, name: string) => {
    if (!(name in replacements)) throw new Error(`no value for :${name}`);
    let i = names.indexOf(name);
    if (i < 0) i = names.push(name) - 1;
    return `$${i + 1}`;
  });
  return { text, values: names.map((n) => replacements[n]) };
}

const server = createServer(async (req, res) => {
  const url = new URL(req.url ?? "/", "http://bare");
  if (url.pathname === "/health") {
    res.writeHead(200).end("ok");
    return;
  }
  const match = /^\/shops\/([0-9a-f-]{36})\/recipes$/.exec(url.pathname);
  if (!match) {
    res.writeHead(404).end();
    return;
  }
  const query = recipeListQuerySchema.safeParse(Object.fromEntries(url.searchParams));
  if (!query.success) {
    res.writeHead(400).end();
    return;
  }
  try {
    const sql = recipeListSql(match[1]!, query.data, req.headers["x-approved-only"] === "1");
    const page = toBind(sql.page, sql.replacements);
    const count = toBind(sql.count, sql.replacements);
    const [rows, total] = await Promise.all([pool.query(page.text, page.values), pool.query(count.text, count.values)]);
    const body = JSON.stringify({ items: rows.rows, page: query.data.page, pageSize: query.data.pageSize, total: total.rows[0]?.total ?? 0 });
    res.writeHead(200, { "content-type": "application/json" }).end(body);
  } catch (error) {
    console.error(error);
    res.writeHead(500).end();
  }
});

server.listen(Number(process.env.PORT ?? 3991), "127.0.0.1");
process.on("SIGTERM", () => server.close(() => void pool.end().then(() => process.exit(0))));
