import { Op, type Order, type WhereOptions } from "sequelize";
import type { Cutter, CutterBody, CutterListQuery, CutterStatus } from "@ringdown/contracts";
import { getSequelize, type Tx } from "../../db/sequelize.js";
import { likePattern } from "../materials/materials.repository.js";
import { CutterModel } from "./cutter.model.js";

function toCutter(row: CutterModel): Cutter {
  return {
    id: row.id,
    shopId: row.shopId,
    name: row.name,
    shape: row.shape,
    diameterMm: row.diameterMm,
    flutes: row.flutes,
    fluteLengthMm: row.fluteLengthMm,
    overallLengthMm: row.overallLengthMm,
    shankDiameterMm: row.shankDiameterMm,
    helixDeg: row.helixDeg,
    cornerRadiusMm: row.cornerRadiusMm,
    tipAngleDeg: row.tipAngleDeg,
    toolMaterial: row.toolMaterial,
    coating: row.coating,
    maker: row.maker,
    partNumber: row.partNumber,
    maxRpm: row.maxRpm,
    notes: row.notes,
    status: row.status,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    deletedAt: row.deletedAt ? row.deletedAt.toISOString() : null,
  };
}

const sortColumn: Record<CutterListQuery["sort"], string> = {
  name: "name",
  diameterMm: "diameterMm",
  shape: "shape",
  status: "status",
  toolMaterial: "toolMaterial",
  flutes: "flutes",
  createdAt: "createdAt",
  updatedAt: "updatedAt",
};

export async function listCutters(shopId: string, query: CutterListQuery): Promise<{ items: Cutter[]; total: number }> {
  const and: WhereOptions[] = [{ shopId }, { deletedAt: query.deleted ? { [Op.ne]: null } : null }];
  if (query.status) and.push({ status: query.status });
  if (query.shape) and.push({ shape: query.shape });
  if (query.toolMaterial) and.push({ toolMaterial: query.toolMaterial });
  if (query.q) {
    const like = likePattern(query.q);
    and.push({
      [Op.or]: [{ name: { [Op.iLike]: like } }, { maker: { [Op.iLike]: like } }, { partNumber: { [Op.iLike]: like } }],
    });
  }
  const direction = query.dir === "desc" ? "DESC" : "ASC";
  const order: Order = [[sortColumn[query.sort], direction]];
  if (query.sort !== "name") order.push(["name", "ASC"]);
  order.push(["id", "ASC"]);
  const { rows, count } = await CutterModel.findAndCountAll({
    where: { [Op.and]: and },
    order,
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  return { items: rows.map(toCutter), total: count };
}

/** Every cutter of the shop not in the bin (optionally of one status), by name: for exports. */
export async function listAllCutters(shopId: string, status?: CutterStatus): Promise<Cutter[]> {
  const rows = await CutterModel.findAll({
    where: { shopId, deletedAt: null, ...(status ? { status } : {}) },
    order: [
      ["name", "ASC"],
      ["id", "ASC"],
    ],
  });
  return rows.map(toCutter);
}

/** Lower-cased names of the shop's cutters not in the bin. */
export async function cutterNames(shopId: string): Promise<Set<string>> {
  const rows = await CutterModel.findAll({ where: { shopId, deletedAt: null }, attributes: ["name"] });
  return new Set(rows.map((r) => r.name.toLowerCase()));
}

/** The shop's cutter (in the bin or not), or null. `lock` holds the row until the transaction ends. */
export async function findCutter(shopId: string, id: string, tx?: Tx, lock = false): Promise<Cutter | null> {
  const row = await CutterModel.findOne({
    where: { id, shopId },
    transaction: tx ?? null,
    ...(tx && lock ? { lock: tx.LOCK.UPDATE } : {}),
  });
  return row ? toCutter(row) : null;
}

export async function insertCutters(
  shopId: string,
  cutters: Array<CutterBody & { status: CutterStatus }>,
  tx?: Tx,
): Promise<Cutter[]> {
  const rows = await CutterModel.bulkCreate(
    cutters.map((c) => ({ ...c, shopId })),
    { transaction: tx ?? null, returning: true, validate: false },
  );
  return rows.map(toCutter);
}

export async function updateCutter(
  shopId: string,
  id: string,
  changes: Partial<CutterBody> & { status?: CutterStatus; deletedAt?: Date | null },
  tx?: Tx,
): Promise<Cutter | null> {
  const row = await CutterModel.findOne({ where: { id, shopId }, transaction: tx ?? null });
  if (!row) return null;
  await row.update(changes, { transaction: tx ?? null });
  return toCutter(row);
}

/** How many recipes and assemblies (not deleted) use the cutter. */
export async function countCutterReferences(
  shopId: string,
  id: string,
  tx?: Tx,
): Promise<{ recipes: number; assemblies: number }> {
  const [rows] = await getSequelize().query(
    `SELECT (SELECT count(*) FROM recipes WHERE shop_id = $1 AND cutter_id = $2 AND deleted_at IS NULL) AS recipes,
            (SELECT count(*) FROM assemblies WHERE shop_id = $1 AND cutter_id = $2 AND deleted_at IS NULL) AS assemblies`,
    { bind: [shopId, id], transaction: tx ?? null },
  );
  return rows[0] as { recipes: number; assemblies: number };
}

/** Flags the shop's recipes using the cutter for a re-check after its geometry changed. */
export async function flagRecipesOfCutter(shopId: string, id: string, tx?: Tx): Promise<void> {
  await getSequelize().query(
    "UPDATE recipes SET needs_recheck = true WHERE shop_id = $1 AND cutter_id = $2 AND deleted_at IS NULL",
    { bind: [shopId, id], transaction: tx ?? null },
  );
}
