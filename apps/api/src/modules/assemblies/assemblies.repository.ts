import { Op, type WhereOptions } from "sequelize";
import type { Assembly, AssemblyBody, AssemblyListQuery } from "@ringdown/contracts";
import { getSequelize, type Tx } from "../../db/sequelize.js";
import { CutterModel } from "../cutters/cutter.model.js";
import { MachineModel } from "../machines/machine.model.js";
import { AssemblyModel } from "./assembly.model.js";

const withNames = [
  { model: MachineModel, as: "machine", attributes: ["id", "name"] },
  { model: CutterModel, as: "cutter", attributes: ["id", "name", "status", "diameterMm"] },
];

function toAssembly(row: AssemblyModel): Assembly {
  return {
    id: row.id,
    shopId: row.shopId,
    machineId: row.machineId,
    cutterId: row.cutterId,
    holder: row.holder,
    stickoutMm: row.stickoutMm,
    runoutMm: row.runoutMm,
    notes: row.notes,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    deletedAt: row.deletedAt ? row.deletedAt.toISOString() : null,
    ...(row.machine ? { machineName: row.machine.name } : {}),
    ...(row.cutter
      ? { cutterName: row.cutter.name, cutterStatus: row.cutter.status, cutterDiameterMm: row.cutter.diameterMm }
      : {}),
  };
}

export async function listAssemblies(shopId: string, query: AssemblyListQuery): Promise<{ items: Assembly[]; total: number }> {
  const and: WhereOptions[] = [{ shopId }, { deletedAt: query.deleted ? { [Op.ne]: null } : null }];
  if (query.machineId) and.push({ machineId: query.machineId });
  if (query.cutterId) and.push({ cutterId: query.cutterId });
  const { rows, count } = await AssemblyModel.findAndCountAll({
    where: { [Op.and]: and },
    include: withNames,
    order: [
      [{ model: MachineModel, as: "machine" }, "name", "ASC"],
      [{ model: CutterModel, as: "cutter" }, "name", "ASC"],
      ["stickoutMm", "ASC"],
      ["id", "ASC"],
    ],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  return { items: rows.map(toAssembly), total: count };
}

export async function findAssembly(shopId: string, id: string, tx?: Tx, lock = false): Promise<Assembly | null> {
  const row = await AssemblyModel.findOne({
    where: { id, shopId },
    include: withNames,
    transaction: tx ?? null,
    // FOR UPDATE cannot apply to the nullable side of an outer join, so lock this table only.
    ...(tx && lock ? { lock: { level: tx.LOCK.UPDATE, of: AssemblyModel } } : {}),
  });
  return row ? toAssembly(row) : null;
}

export async function insertAssembly(shopId: string, body: AssemblyBody, tx?: Tx, id?: string): Promise<string> {
  const row = await AssemblyModel.create({ ...(id ? { id } : {}), shopId, ...body }, { transaction: tx ?? null });
  return row.id;
}

export async function updateAssembly(
  shopId: string,
  id: string,
  changes: Partial<AssemblyBody> & { deletedAt?: Date | null },
  tx?: Tx,
): Promise<void> {
  await AssemblyModel.update(changes, { where: { id, shopId }, transaction: tx ?? null });
}

/** The shop's machine and cutter as an assembly needs them (null when missing or in the bin). */
export async function findParts(
  shopId: string,
  machineId: string,
  cutterId: string,
  tx?: Tx,
): Promise<{ machine: { id: string } | null; cutter: { id: string; status: string; name: string } | null }> {
  const [machine, cutter] = await Promise.all([
    MachineModel.findOne({ where: { id: machineId, shopId, deletedAt: null }, attributes: ["id"], transaction: tx ?? null }),
    CutterModel.findOne({
      where: { id: cutterId, shopId, deletedAt: null },
      attributes: ["id", "status", "name"],
      transaction: tx ?? null,
    }),
  ]);
  return {
    machine: machine ? { id: machine.id } : null,
    cutter: cutter ? { id: cutter.id, status: cutter.status, name: cutter.name } : null,
  };
}

export async function countRecipesOnAssembly(shopId: string, id: string, tx?: Tx): Promise<number> {
  const [rows] = await getSequelize().query(
    "SELECT count(*) AS n FROM recipes WHERE shop_id = $1 AND assembly_id = $2 AND deleted_at IS NULL",
    { bind: [shopId, id], transaction: tx ?? null },
  );
  return (rows[0] as { n: number }).n;
}

/** Flags the assembly's recipes for a re-check after its stick-out, runout or parts changed. */
export async function flagRecipesOfAssembly(shopId: string, id: string, tx?: Tx): Promise<void> {
  await getSequelize().query(
    "UPDATE recipes SET needs_recheck = true WHERE shop_id = $1 AND assembly_id = $2 AND deleted_at IS NULL",
    { bind: [shopId, id], transaction: tx ?? null },
  );
}
