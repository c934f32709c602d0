import {
  materialBodySchema,
  type Material,
  type MaterialBody,
  type MaterialListQuery,
  type MaterialPage,
  type MaterialPatchBody,
} from "@ringdown/contracts";
import { inTransaction } from "../../db/sequelize.js";
import { AppError } from "../../http/app-error.js";
import {
  countRecipesUsingMaterial,
  findVisibleMaterial,
  flagRecipesOfMaterial,
  insertMaterial,
  listMaterials,
  setMaterialDeleted,
  updateMaterial,
} from "./materials.repository.js";
import { changedFields, recordAuditEvent, type AuditActor } from "../audit/audit.service.js";

const materialSubject = (m: Pick<Material, "id" | "name">) => ({ type: "material" as const, id: m.id, label: m.name });

const READ_ONLY =
  "Global materials are read-only reference data. Copy it into your shop (POST …/materials/:id/copy) to adjust it.";

export async function listShopMaterials(shopId: string, query: MaterialListQuery): Promise<MaterialPage> {
  const { items, total } = await listMaterials(shopId, query);
  return { items, total, page: query.page, pageSize: query.pageSize };
}

export async function getMaterial(shopId: string, id: string): Promise<Material> {
  const material = await findVisibleMaterial(shopId, id);
  if (!material) throw AppError.notFound("Material not found.");
  return material;
}

export function createMaterial(shopId: string, body: MaterialBody, actor: AuditActor): Promise<Material> {
  return inTransaction(async (tx) => {
    const created = await insertMaterial(shopId, body, null, tx);
    await recordAuditEvent(tx, { shopId, actor, action: "material.created", subject: materialSubject(created) });
    return created;
  });
}

function bodyOf(m: Material): MaterialBody {
  return {
    name: m.name,
    group: m.group,
    hardness: m.hardness,
    cuttingSpeed: m.cuttingSpeed,
    chipLoad: m.chipLoad,
    kc11NPerMm2: m.kc11NPerMm2,
    mc: m.mc,
    unitPowerJPerMm3: m.unitPowerJPerMm3,
    minChipThicknessMm: m.minChipThicknessMm,
    sourceNote: m.sourceNote,
  };
}

/** Copies a global or own material into the shop, so the shop can adjust it. */
export async function copyMaterial(shopId: string, id: string, name: string | undefined, actor: AuditActor): Promise<Material> {
  const source = await getMaterial(shopId, id);
  if (source.deletedAt) throw AppError.conflict("This material is deleted; restore it before copying it.");
  const copyName = name ?? `${source.name} (shop copy)`.slice(0, 120);
  return inTransaction(async (tx) => {
    const copy = await insertMaterial(shopId, { ...bodyOf(source), name: copyName }, source.id, tx);
    await recordAuditEvent(tx, {
      shopId,
      actor,
      action: "material.copied",
      subject: materialSubject(copy),
      detail: { fromId: source.id, fromName: source.name, fromGlobal: source.readOnly },
    });
    return copy;
  });
}

async function ownMaterial(shopId: string, id: string): Promise<Material> {
  const material = await getMaterial(shopId, id);
  if (material.readOnly) throw AppError.forbidden(READ_ONLY);
  return material;
}

/** Changes only the fields sent; the merged material is validated as a whole. */
export async function patchMaterial(shopId: string, id: string, patch: MaterialPatchBody, actor: AuditActor): Promise<Material> {
  return inTransaction(async (tx) => {
    const current = await ownMaterial(shopId, id);
    const merged = materialBodySchema.parse({ ...bodyOf(current), ...patch });
    const updated = await updateMaterial(shopId, id, merged, tx);
    if (!updated) throw AppError.notFound("Material not found.");
    const { name: _n, sourceNote: _s, ...numbers } = patch;
    if (Object.keys(numbers).length > 0) await flagRecipesOfMaterial(shopId, id, tx);
    const fields = changedFields<MaterialBody>(patch, bodyOf(current));
    if (fields.length > 0) await recordAuditEvent(tx, { shopId, actor, action: "material.updated", subject: materialSubject(updated), detail: { fields } });
    return updated;
  });
}

export async function deleteMaterial(shopId: string, id: string, actor: AuditActor): Promise<void> {
  await inTransaction(async (tx) => {
    const current = await ownMaterial(shopId, id);
    const recipes = await countRecipesUsingMaterial(shopId, id, tx);
    if (recipes > 0) {
      throw AppError.conflict(
        `This material is used by ${recipes} recipe${recipes === 1 ? "" : "s"}; it cannot be deleted while they use it.`,
      );
    }
    await setMaterialDeleted(shopId, id, true, tx);
    await recordAuditEvent(tx, { shopId, actor, action: "material.deleted", subject: materialSubject(current) });
  });
}

export async function restoreMaterial(shopId: string, id: string, actor: AuditActor): Promise<Material> {
  const current = await ownMaterial(shopId, id);
  return inTransaction(async (tx) => {
    const restored = await setMaterialDeleted(shopId, id, false, tx);
    if (!restored) throw AppError.notFound("Material not found.");
    if (current.deletedAt) await recordAuditEvent(tx, { shopId, actor, action: "material.restored", subject: materialSubject(restored) });
    return restored;
  });
}
