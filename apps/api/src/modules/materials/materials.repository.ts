import { Op, type WhereOptions } from "sequelize";
import type { Material, MaterialBody, MaterialListQuery } from "@ringdown/contracts";
import { getSequelize, type Tx } from "../../db/sequelize.js";
import { MaterialModel } from "./material.model.js";

/** `%` and `_` typed by a person are literal characters in a search, not wildcards. */
export function likePattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

function toMaterial(row: MaterialModel): Material {
  return {
    id: row.id,
    shopId: row.shopId,
    readOnly: row.shopId === null,
    copiedFromId: row.copiedFromId ?? null,
    name: row.name,
    group: row.materialGroup,
    hardness: row.hardness,
    cuttingSpeed: row.cuttingSpeed,
    chipLoad: row.chipLoad,
    kc11NPerMm2: row.kc11NPerMm2,
    mc: row.mc,
    unitPowerJPerMm3: row.unitPowerJPerMm3,
    minChipThicknessMm: row.minChipThicknessMm,
    sourceNote: row.sourceNote,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    deletedAt: row.deletedAt ? row.deletedAt.toISOString() : null,
  };
}

function toColumns(body: MaterialBody) {
  return {
    name: body.name,
    materialGroup: body.group,
    hardness: body.hardness,
    cuttingSpeed: body.cuttingSpeed,
    chipLoad: body.chipLoad,
    kc11NPerMm2: body.kc11NPerMm2,
    mc: body.mc,
    unitPowerJPerMm3: body.unitPowerJPerMm3,
    minChipThicknessMm: body.minChipThicknessMm,
    sourceNote: body.sourceNote,
  };
}

/** Global rows plus the shop's own (the shop's deleted rows instead when `query.deleted`). */
export async function listMaterials(shopId: string, query: MaterialListQuery): Promise<{ items: Material[]; total: number }> {
  const and: WhereOptions[] = [];
  if (query.deleted) and.push({ shopId, deletedAt: { [Op.ne]: null } });
  else {
    and.push({ deletedAt: null });
    if (query.scope === "global") and.push({ shopId: null });
    else if (query.scope === "shop") and.push({ shopId });
    else and.push({ [Op.or]: [{ shopId: null }, { shopId }] });
  }
  if (query.group) and.push({ materialGroup: query.group });
  if (query.q) and.push({ name: { [Op.iLike]: likePattern(query.q) } });
  const { rows, count } = await MaterialModel.findAndCountAll({
    where: { [Op.and]: and },
    order: [
      ["name", "ASC"],
      ["id", "ASC"],
    ],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  return { items: rows.map(toMaterial), total: count };
}

/** A material the shop can see (global or its own, deleted or not), or null. */
export async function findVisibleMaterial(shopId: string, id: string, tx?: Tx): Promise<Material | null> {
  const row = await MaterialModel.findOne({
    where: { id, [Op.or]: [{ shopId: null }, { shopId }] },
    transaction: tx ?? null,
  });
  return row ? toMaterial(row) : null;
}

export async function insertMaterial(
  shopId: string,
  body: MaterialBody,
  copiedFromId: string | null,
  tx?: Tx,
): Promise<Material> {
  const row = await MaterialModel.create({ shopId, copiedFromId, ...toColumns(body) }, { transaction: tx ?? null });
  return toMaterial(row);
}

/** Updates one of the shop's own rows (never a global one). */
export async function updateMaterial(shopId: string, id: string, body: MaterialBody, tx?: Tx): Promise<Material | null> {
  const row = await MaterialModel.findOne({ where: { id, shopId }, transaction: tx ?? null });
  if (!row) return null;
  await row.update(toColumns(body), { transaction: tx ?? null });
  return toMaterial(row);
}

export async function setMaterialDeleted(shopId: string, id: string, deleted: boolean, tx?: Tx): Promise<Material | null> {
  const row = await MaterialModel.findOne({ where: { id, shopId }, transaction: tx ?? null });
  if (!row) return null;
  await row.update({ deletedAt: deleted ? new Date() : null }, { transaction: tx ?? null });
  return toMaterial(row);
}

/** Recipes (not deleted) of the shop that use the material. */
export async function countRecipesUsingMaterial(shopId: string, id: string, tx?: Tx): Promise<number> {
  const [rows] = await getSequelize().query(
    "SELECT count(*) AS n FROM recipes WHERE shop_id = $1 AND material_id = $2 AND deleted_at IS NULL",
    { bind: [shopId, id], transaction: tx ?? null },
  );
  return (rows[0] as { n: number }).n;
}

/** Flags the shop's recipes on the material for a re-check after its numbers changed. */
export async function flagRecipesOfMaterial(shopId: string, id: string, tx?: Tx): Promise<void> {
  await getSequelize().query(
    "UPDATE recipes SET needs_recheck = true WHERE shop_id = $1 AND material_id = $2 AND deleted_at IS NULL",
    { bind: [shopId, id], transaction: tx ?? null },
  );
}
