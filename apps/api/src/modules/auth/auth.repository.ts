import { Op } from "sequelize";
import { RevokedSessionModel } from "./revoked-session.model.js";

export async function isSessionRevoked(tokenId: string): Promise<boolean> {
  return (await RevokedSessionModel.count({ where: { tokenId } })) > 0;
}

/** Records a signed-out token until its own expiry, and drops records that expired already. */
export async function revokeSession(tokenId: string, expiresAt: Date): Promise<void> {
  await RevokedSessionModel.upsert({ tokenId, expiresAt });
  await RevokedSessionModel.destroy({ where: { expiresAt: { [Op.lt]: new Date() } } });
}
