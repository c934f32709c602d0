/**
 * The recipe list's SQL served bare, as the yardstick for the API's overhead: node:http and a pg
 * Pool of the API's size (10), no Express, no session, no membership check, no response schema.
 * It runs exactly what the route runs — `recipeListSql` with the same parsed query, as the same named
 * prepared statements — and sends the rows as JSON.
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
import { statementName, toBindParameters } from "../src/db/prepared.js";

const pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 10 });
pg.types.setTypeParser(pg.types.builtins.INT8, (value: string) => Number.parseInt(value, 10));

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
    const page = toBindParameters(sql.page, sql.replacements);
    const count = toBindParameters(sql.count, sql.replacements);
    // As the route: the total rides on every row of the page; a page past the end counts apart.
    const rows = await pool.query({ name: statementName(page.text), text: page.text, values: page.values });
    const total = rows.rows.length
      ? rows.rows[0].list_total
      : (await pool.query({ name: statementName(count.text), text: count.text, values: count.values })).rows[0]?.total;
    const body = JSON.stringify({ items: rows.rows, page: query.data.page, pageSize: query.data.pageSize, total: total ?? 0 });
    res.writeHead(200, { "content-type": "application/json" }).end(body);
  } catch (error) {
    console.error(error);
    res.writeHead(500).end();
  }
});

server.listen(Number(process.env.PORT ?? 3991), "127.0.0.1");
process.on("SIGTERM", () => server.close(() => void pool.end().then(() => process.exit(0))));
