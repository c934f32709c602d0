import {
  assemblyBodySchema,
  type Assembly,
  type AssemblyBody,
  type AssemblyListQuery,
  type AssemblyPage,
  type AssemblyPatchBody,
} from "@ringdown/contracts";
import { inTransaction, type Tx } from "../../db/sequelize.js";
import { AppError } from "../../http/app-error.js";
import {
  countRecipesOnAssembly,
  findAssembly,
  findParts,
  flagRecipesOfAssembly,
  insertAssembly,
  listAssemblies,
  updateAssembly,
} from "./assemblies.repository.js";

export async function listShopAssemblies(shopId: string, query: AssemblyListQuery): Promise<AssemblyPage> {
  const { items, total } = await listAssemblies(shopId, query);
  return { items, total, page: query.page, pageSize: query.pageSize };
}

export async function getAssembly(shopId: string, id: string, tx?: Tx): Promise<Assembly> {
  const assembly = await findAssembly(shopId, id, tx);
  if (!assembly) throw AppError.notFound("Assembly not found.");
  return assembly;
}

/**
 * The machine and cutter must be the shop's (404 otherwise, as for any record of another shop);
 * a retired cutter cannot go into a new assembly (409).
 */
async function checkParts(
  shopId: string,
  machineId: string,
  cutterId: string,
  tx: Tx,
  cutterChanged: boolean,
): Promise<void> {
  const { machine, cutter } = await findParts(shopId, machineId, cutterId, tx);
  if (!machine) throw new AppError("not_found", "Machine not found.", { fields: { machineId: "No such machine in this shop" } });
  if (!cutter) throw new AppError("not_found", "Cutter not found.", { fields: { cutterId: "No such cutter in this shop" } });
  if (cutterChanged && cutter.status === "retired") {
    throw AppError.conflict(`The cutter “${cutter.name}” is retired; choose an approved or proposed cutter.`, {
      cutterId: "This cutter is retired",
    });
  }
}

export async function createAssembly(shopId: string, body: AssemblyBody): Promise<Assembly> {
  return inTransaction(async (tx) => {
    await checkParts(shopId, body.machineId, body.cutterId, tx, true);
    const id = await insertAssembly(shopId, body, tx);
    return getAssembly(shopId, id, tx);
  });
}

function bodyOf(a: Assembly): AssemblyBody {
  return {
    machineId: a.machineId,
    cutterId: a.cutterId,
    holder: a.holder,
    stickoutMm: a.stickoutMm,
    runoutMm: a.runoutMm,
    notes: a.notes,
  };
}

export async function patchAssembly(shopId: string, id: string, patch: AssemblyPatchBody): Promise<Assembly> {
  return inTransaction(async (tx) => {
    const current = await findAssembly(shopId, id, tx, true);
    if (!current) throw AppError.notFound("Assembly not found.");
    if (current.deletedAt) throw AppError.conflict("This assembly is deleted; restore it before editing it.");
    const merged = assemblyBodySchema.parse({ ...bodyOf(current), ...patch });
    const partsChanged = merged.machineId !== current.machineId || merged.cutterId !== current.cutterId;
    if (partsChanged) await checkParts(shopId, merged.machineId, merged.cutterId, tx, merged.cutterId !== current.cutterId);
    await updateAssembly(shopId, id, merged, tx);
    const numbersChanged =
      partsChanged || merged.stickoutMm !== current.stickoutMm || merged.runoutMm !== current.runoutMm;
    if (numbersChanged) await flagRecipesOfAssembly(shopId, id, tx);
    return getAssembly(shopId, id, tx);
  });
}

/** Soft delete; refused while recipes use the assembly. */
export async function deleteAssembly(shopId: string, id: string): Promise<void> {
  await inTransaction(async (tx) => {
    const current = await findAssembly(shopId, id, tx, true);
    if (!current || current.deletedAt) throw AppError.notFound("Assembly not found.");
    const recipes = await countRecipesOnAssembly(shopId, id, tx);
    if (recipes > 0) {
      throw AppError.conflict(
        `This assembly is used by ${recipes} ${recipes === 1 ? "recipe" : "recipes"}; retire or move ${recipes === 1 ? "it" : "them"} first.`,
      );
    }
    await updateAssembly(shopId, id, { deletedAt: new Date() }, tx);
  });
}

/** Brings an assembly back from the bin, if its machine and cutter are still there. */
export async function restoreAssembly(shopId: string, id: string): Promise<Assembly> {
  return inTransaction(async (tx) => {
    const current = await findAssembly(shopId, id, tx, true);
    if (!current) throw AppError.notFound("Assembly not found.");
    if (!current.deletedAt) return current;
    const { machine, cutter } = await findParts(shopId, current.machineId, current.cutterId, tx);
    if (!machine || !cutter) {
      throw AppError.conflict(`Its ${machine ? "cutter" : "machine"} is deleted; restore that first.`);
    }
    await updateAssembly(shopId, id, { deletedAt: null }, tx);
    return getAssembly(shopId, id, tx);
  });
}
