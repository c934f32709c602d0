import type { UnitSystem } from "@ringdown/contracts";
import type { Tx } from "../../db/sequelize.js";
import { UserModel } from "./user.model.js";

/** A user as the rest of the API sees it (never the password hash). */
export interface UserRecord {
  id: string;
  email: string;
  name: string;
  unitSystem: UnitSystem;
  activeShopId: string | null;
  sessionVersion: number;
}

const publicAttributes = ["id", "email", "name", "unitSystem", "activeShopId", "sessionVersion"] as const;

function toRecord(row: UserModel): UserRecord {
  return {
    id: row.id,
    email: row.email,
    name: row.name,
    unitSystem: row.unitSystem,
    activeShopId: row.activeShopId,
    sessionVersion: row.sessionVersion,
  };
}

export async function findUserById(id: string, tx?: Tx): Promise<UserRecord | null> {
  const row = await UserModel.findByPk(id, { attributes: [...publicAttributes], transaction: tx ?? null });
  return row ? toRecord(row) : null;
}

export async function findUserIdByEmail(email: string, tx?: Tx): Promise<string | null> {
  const row = await UserModel.findOne({ where: { email }, attributes: ["id"], transaction: tx ?? null });
  return row?.id ?? null;
}

/** Credentials for sign-in only. */
export async function findCredentialsByEmail(
  email: string,
): Promise<{ id: string; passwordHash: string; sessionVersion: number } | null> {
  const row = await UserModel.findOne({ where: { email }, attributes: ["id", "passwordHash", "sessionVersion"] });
  return row ? { id: row.id, passwordHash: row.passwordHash, sessionVersion: row.sessionVersion } : null;
}

export async function createUser(
  input: { id?: string; email: string; name: string; passwordHash: string },
  tx?: Tx,
): Promise<UserRecord> {
  const row = await UserModel.create(input, { transaction: tx ?? null });
  return toRecord(row);
}

export async function updateUser(
  id: string,
  patch: Partial<Pick<UserRecord, "name" | "unitSystem" | "activeShopId">>,
  tx?: Tx,
): Promise<void> {
  if (Object.keys(patch).length === 0) return;
  await UserModel.update(patch, { where: { id }, transaction: tx ?? null });
}

/** Ends every session of the user at once (e.g. after a password change or removal). */
export async function bumpSessionVersion(id: string, tx?: Tx): Promise<void> {
  await UserModel.increment("sessionVersion", { by: 1, where: { id }, transaction: tx ?? null });
}
