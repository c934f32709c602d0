/** Test-cut ladders; every query is filtered by the shop. */
import { QueryTypes } from "sequelize";
import { ladderSchema, type Ladder, type LadderParameter, type LadderRung } from "@ringdown/contracts";
import { getSequelize, type Tx } from "../../db/sequelize.js";
import { LadderModel } from "./ladder.model.js";

type Row = Record<string, unknown>;

const iso = (v: unknown): string => (v instanceof Date ? v : new Date(String(v))).toISOString();

function toLadder(r: Row): Ladder {
  return ladderSchema.parse({
    id: r.id,
    recipeId: r.recipe_id,
    parameter: r.parameter,
    rungs: r.rungs,
    chosenRung: r.chosen_rung,
    createdAt: iso(r.created_at),
    updatedAt: iso(r.updated_at),
    baseRevision: r.base_revision,
    window: r.step_window,
    note: r.note,
    createdById: r.created_by,
    createdByName: r.created_by_name,
  });
}

const SQL = `SELECT t.*, u.name AS created_by_name FROM test_cut_ladders t JOIN users u ON u.id = t.created_by`;

/** The recipe's newest ladder, or null. */
export async function findLatestLadder(shopId: string, recipeId: string, tx?: Tx): Promise<Ladder | null> {
  const rows = await getSequelize().query<Row>(
    `${SQL} WHERE t.shop_id = :shopId AND t.recipe_id = :recipeId ORDER BY t.created_at DESC, t.id DESC LIMIT 1${tx ? " FOR UPDATE OF t" : ""}`,
    { replacements: { shopId, recipeId }, type: QueryTypes.SELECT, transaction: tx ?? null },
  );
  return rows[0] ? toLadder(rows[0]) : null;
}

export async function listAllLadders(shopId: string): Promise<Ladder[]> {
  const rows = await getSequelize().query<Row>(`${SQL} WHERE t.shop_id = :shopId ORDER BY t.recipe_id, t.created_at, t.id`, {
    replacements: { shopId },
    type: QueryTypes.SELECT,
  });
  return rows.map(toLadder);
}

export async function insertLadder(
  shopId: string,
  recipeId: string,
  ladder: { parameter: LadderParameter; rungs: LadderRung[]; baseRevision: number; window: { min: number; max: number; unit: string }; note: string },
  createdBy: string,
  tx?: Tx,
): Promise<string> {
  const row = await LadderModel.create(
    {
      shopId,
      recipeId,
      parameter: ladder.parameter,
      rungs: ladder.rungs,
      chosenRung: null,
      baseRevision: ladder.baseRevision,
      stepWindow: ladder.window,
      note: ladder.note,
      createdBy,
    },
    { transaction: tx ?? null },
  );
  return row.id;
}

export async function updateLadder(shopId: string, id: string, change: { rungs?: LadderRung[]; chosenRung?: number }, tx: Tx): Promise<void> {
  await LadderModel.update(change, { where: { shopId, id }, transaction: tx });
}
