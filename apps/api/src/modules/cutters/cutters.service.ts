import {
  cutterBodySchema,
  type Cutter,
  type CutterBody,
  type CutterCreateBody,
  type CutterExportQuery,
  type CutterImportReport,
  type CutterListQuery,
  type CutterPage,
  type CutterPatchBody,
  type CutterStatus,
  type Role,
} from "@ringdown/contracts";
import { inTransaction } from "../../db/sequelize.js";
import { AppError } from "../../http/app-error.js";
import { roleAtLeast } from "../shops/require-shop-role.js";
import { changedFields, recordAuditEvent, type AuditActor } from "../audit/audit.service.js";
import { cuttersToCsv, parseCutterCsv, type UnitChoice } from "./cutters-csv.js";
import {
  countCutterReferences,
  cutterNames,
  findCutter,
  flagRecipesOfCutter,
  insertCutters,
  listAllCutters,
  listCutters,
  updateCutter,
} from "./cutters.repository.js";

const isManager = (role: Role) => roleAtLeast(role, "tooling_manager");

/** The subject of a cutter's audit events. */
const cutterSubject = (c: Pick<Cutter, "id" | "name">) => ({ type: "cutter" as const, id: c.id, label: c.name });

export async function listShopCutters(shopId: string, query: CutterListQuery): Promise<CutterPage> {
  const { items, total } = await listCutters(shopId, query);
  return { items, total, page: query.page, pageSize: query.pageSize };
}

export async function getCutter(shopId: string, id: string): Promise<Cutter> {
  const cutter = await findCutter(shopId, id);
  if (!cutter) throw AppError.notFound("Cutter not found.");
  return cutter;
}

/** Programmers propose; tooling managers and owners may add an approved cutter directly. */
export async function createCutter(shopId: string, role: Role, body: CutterCreateBody, actor: AuditActor): Promise<Cutter> {
  const { status = "proposed", ...fields } = body;
  if (status === "approved" && !isManager(role)) {
    throw AppError.forbidden("Only a tooling manager or owner can add an approved cutter; propose it instead.");
  }
  return inTransaction(async (tx) => {
    const [created] = await insertCutters(shopId, [{ ...fields, status }], tx);
    if (!created) throw new Error("insert returned no cutter");
    await recordAuditEvent(tx, { shopId, actor, action: "cutter.created", subject: cutterSubject(created), detail: { status } });
    return created;
  });
}

function bodyOf(c: Cutter): CutterBody {
  const { id: _i, shopId: _s, status: _st, createdAt: _c, updatedAt: _u, deletedAt: _d, ...body } = c;
  return body;
}

// Fields that change no computed number: editing them does not ask recipes for a re-check.
const descriptive = new Set<keyof CutterBody>(["name", "coating", "maker", "partNumber", "notes"]);

export async function patchCutter(shopId: string, role: Role, id: string, patch: CutterPatchBody, actor: AuditActor): Promise<Cutter> {
  return inTransaction(async (tx) => {
    const current = await findCutter(shopId, id, tx, true);
    if (!current) throw AppError.notFound("Cutter not found.");
    if (current.deletedAt) throw AppError.conflict("This cutter is deleted; restore it before editing it.");
    if (!isManager(role) && current.status !== "proposed") {
      throw AppError.forbidden(
        `Programmers can edit a cutter only while it is proposed; this one is ${current.status}. Ask a tooling manager.`,
      );
    }
    const merged = cutterBodySchema.parse({ ...bodyOf(current), ...patch });
    const updated = await updateCutter(shopId, id, merged, tx);
    if (!updated) throw AppError.notFound("Cutter not found.");
    const changedNumbers = (Object.keys(patch) as Array<keyof CutterBody>).some(
      (k) => !descriptive.has(k) && patch[k] !== current[k],
    );
    if (changedNumbers) await flagRecipesOfCutter(shopId, id, tx);
    const fields = changedFields<CutterBody>(patch, current);
    if (fields.length > 0) {
      await recordAuditEvent(tx, { shopId, actor, action: "cutter.updated", subject: cutterSubject(updated), detail: { fields } });
    }
    return updated;
  });
}

/** The cutter's life: proposed → approved → retired, and back from retired to approved. */
const allowedMoves: Record<CutterStatus, CutterStatus[]> = {
  proposed: ["approved"],
  approved: ["retired"],
  retired: ["approved"],
};

export async function transitionCutter(shopId: string, id: string, to: CutterStatus, actor: AuditActor): Promise<Cutter> {
  return inTransaction(async (tx) => {
    const current = await findCutter(shopId, id, tx, true);
    if (!current) throw AppError.notFound("Cutter not found.");
    if (current.deletedAt) throw AppError.conflict("This cutter is deleted; restore it first.");
    if (current.status === to) throw AppError.conflict(`This cutter is already ${to}.`);
    if (!allowedMoves[current.status].includes(to)) {
      const hint = current.status === "proposed" && to === "retired" ? " Delete the proposal instead." : "";
      throw AppError.conflict(
        `A ${current.status} cutter can only become ${allowedMoves[current.status].join(" or ")}.${hint}`,
        { to: `Cannot go from ${current.status} to ${to}` },
      );
    }
    const updated = await updateCutter(shopId, id, { status: to }, tx);
    if (!updated) throw AppError.notFound("Cutter not found.");
    await recordAuditEvent(tx, {
      shopId,
      actor,
      action: "cutter.status_changed",
      subject: cutterSubject(updated),
      detail: { from: current.status, to },
    });
    return updated;
  });
}

function mayBin(role: Role, cutter: Cutter): void {
  if (!isManager(role) && cutter.status !== "proposed") {
    throw AppError.forbidden("Programmers can delete or restore only proposed cutters. Ask a tooling manager.");
  }
}

const count = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/** Soft delete; refused while recipes or assemblies use the cutter (retire it instead). */
export async function deleteCutter(shopId: string, role: Role, id: string, actor: AuditActor): Promise<void> {
  await inTransaction(async (tx) => {
    const current = await findCutter(shopId, id, tx, true);
    if (!current || current.deletedAt) throw AppError.notFound("Cutter not found.");
    mayBin(role, current);
    const refs = await countCutterReferences(shopId, id, tx);
    if (refs.recipes + refs.assemblies > 0) {
      const parts = [
        refs.recipes > 0 ? count(refs.recipes, "recipe", "recipes") : "",
        refs.assemblies > 0 ? count(refs.assemblies, "assembly", "assemblies") : "",
      ]
        .filter(Boolean)
        .join(" and ");
      throw AppError.conflict(`This cutter is used by ${parts} — retire it instead.`);
    }
    await updateCutter(shopId, id, { deletedAt: new Date() }, tx);
    await recordAuditEvent(tx, { shopId, actor, action: "cutter.deleted", subject: cutterSubject(current), detail: { status: current.status } });
  });
}

export async function restoreCutter(shopId: string, role: Role, id: string, actor: AuditActor): Promise<Cutter> {
  return inTransaction(async (tx) => {
    const current = await findCutter(shopId, id, tx, true);
    if (!current) throw AppError.notFound("Cutter not found.");
    mayBin(role, current);
    if (!current.deletedAt) return current;
    const restored = await updateCutter(shopId, id, { deletedAt: null }, tx);
    if (!restored) throw AppError.notFound("Cutter not found.");
    await recordAuditEvent(tx, { shopId, actor, action: "cutter.restored", subject: cutterSubject(restored) });
    return restored;
  });
}

/**
 * Imports a cutter CSV. A dry run only reports. A real import writes every row in one transaction
 * or, when any row (or the file) has a problem, nothing: `ok` is false and the report says why.
 * Rows with a blank status become approved (only tooling managers and owners import).
 */
export async function importCutters(
  shopId: string,
  file: Buffer,
  dryRun: boolean,
  actor: AuditActor,
  fileName = "",
): Promise<{ ok: boolean; report: CutterImportReport }> {
  const parsed = parseCutterCsv(file, { defaultStatus: "approved", existingNames: await cutterNames(shopId) });
  const valid = parsed.rows.filter((r) => r.cutter !== null);
  const report: CutterImportReport = {
    dryRun,
    fileErrors: parsed.fileErrors,
    rows: parsed.rows,
    counts: { total: parsed.rows.length, valid: valid.length, invalid: parsed.rows.length - valid.length },
    imported: 0,
  };
  const ok = parsed.fileErrors.length === 0 && report.counts.invalid === 0;
  if (dryRun || !ok) return { ok, report };
  const created = await inTransaction(async (tx) => {
    const rows = await insertCutters(
      shopId,
      valid.map((r) => r.cutter!),
      tx,
    );
    await recordAuditEvent(tx, {
      shopId,
      actor,
      action: "cutter.imported",
      subject: { type: "cutter", id: null, label: fileName ? `Cutter list ${fileName}` : "Cutter list" },
      detail: { rows: rows.length },
    });
    return rows;
  });
  return { ok: true, report: { ...report, imported: created.length } };
}

/** Message for a refused import. */
export function importRefusal(report: CutterImportReport): string {
  if (report.fileErrors.length > 0) return `${report.fileErrors[0]} Nothing was imported.`;
  const one = report.counts.invalid === 1;
  return `${count(report.counts.invalid, "row", "rows")} of ${report.counts.total} ${one ? "has" : "have"} errors; nothing was imported. Fix ${one ? "it" : "them"} and upload the file again.`;
}

export async function exportCutters(shopId: string, query: CutterExportQuery): Promise<string> {
  return cuttersToCsv(await listAllCutters(shopId, query.status), query.units as UnitChoice);
}
