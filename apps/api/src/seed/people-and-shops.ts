/**
 * Demo shops and people (all invented; logins listed in ./README.md, for local use only).
 * Idempotent: records have fixed ids and are created only when missing.
 */
import type { Role } from "@ringdown/contracts";
import { inTransaction } from "../db/sequelize.js";
import { hashPassword } from "../modules/auth/password.js";
import { MembershipModel } from "../modules/shops/membership.model.js";
import { ShopModel } from "../modules/shops/shop.model.js";
import { UserModel } from "../modules/users/user.model.js";
import { demoShopIds, demoUserIds } from "./demo-ids.js";

interface DemoPerson {
  id: string;
  email: string;
  name: string;
  password: string;
  unitSystem: "metric" | "imperial";
  activeShopId: string;
  memberships: Array<{ shopId: string; role: Role }>;
}

const shops = [
  { id: demoShopIds.quillfeather, name: "Quillfeather Fixture Works" },
  { id: demoShopIds.ostrander, name: "Ostrander Sign & Panel" },
];

export const demoPeople: DemoPerson[] = [
  {
    id: demoUserIds.maren,
    email: "maren@quillfeather.example",
    name: "Maren Tolliver",
    password: "demo-owner-2026",
    unitSystem: "metric",
    activeShopId: demoShopIds.quillfeather,
    memberships: [{ shopId: demoShopIds.quillfeather, role: "owner" }],
  },
  {
    id: demoUserIds.imke,
    email: "imke@quillfeather.example",
    name: "Imke Harrow",
    password: "demo-tooling-2026",
    unitSystem: "metric",
    activeShopId: demoShopIds.quillfeather,
    memberships: [{ shopId: demoShopIds.quillfeather, role: "tooling_manager" }],
  },
  {
    id: demoUserIds.teodor,
    email: "teodor@quillfeather.example",
    name: "Teodor Vance",
    password: "demo-programmer-2026",
    unitSystem: "metric",
    activeShopId: demoShopIds.quillfeather,
    memberships: [{ shopId: demoShopIds.quillfeather, role: "programmer" }],
  },
  {
    id: demoUserIds.sunniva,
    email: "sunniva@quillfeather.example",
    name: "Sunniva Brack",
    password: "demo-operator-2026",
    unitSystem: "metric",
    activeShopId: demoShopIds.quillfeather,
    memberships: [{ shopId: demoShopIds.quillfeather, role: "operator" }],
  },
  {
    id: demoUserIds.callum,
    email: "callum@contract-cam.example",
    name: "Callum Reyes-Lund",
    password: "demo-contractor-2026",
    unitSystem: "imperial",
    activeShopId: demoShopIds.quillfeather,
    memberships: [
      { shopId: demoShopIds.quillfeather, role: "programmer" },
      { shopId: demoShopIds.ostrander, role: "programmer" },
    ],
  },
  {
    id: demoUserIds.halvard,
    email: "halvard@ostrander-sign.example",
    name: "Halvard Ostrander",
    password: "demo-ostrander-2026",
    unitSystem: "imperial",
    activeShopId: demoShopIds.ostrander,
    memberships: [{ shopId: demoShopIds.ostrander, role: "owner" }],
  },
];

/** Returns how many records it created (0 on a second run). */
export async function seedPeopleAndShops(): Promise<number> {
  // Hash only for people not there yet (bcrypt is slow on purpose).
  const existing = new Set(
    (await UserModel.findAll({ where: { id: demoPeople.map((p) => p.id) }, attributes: ["id"] })).map((u) => u.id),
  );
  const hashes = new Map<string, string>();
  for (const person of demoPeople) {
    if (!existing.has(person.id)) hashes.set(person.id, await hashPassword(person.password));
  }

  return inTransaction(async (transaction) => {
    let created = 0;
    for (const shop of shops) {
      const [, isNew] = await ShopModel.findOrCreate({ where: { id: shop.id }, defaults: shop, transaction });
      if (isNew) created++;
    }
    for (const person of demoPeople) {
      const hash = hashes.get(person.id);
      if (hash) {
        const [, isNew] = await UserModel.findOrCreate({
          where: { id: person.id },
          defaults: {
            id: person.id,
            email: person.email,
            name: person.name,
            passwordHash: hash,
            unitSystem: person.unitSystem,
            activeShopId: person.activeShopId,
          },
          transaction,
        });
        if (isNew) created++;
      }
      for (const m of person.memberships) {
        const [, isNew] = await MembershipModel.findOrCreate({
          where: { shopId: m.shopId, userId: person.id },
          defaults: { shopId: m.shopId, userId: person.id, role: m.role },
          transaction,
        });
        if (isNew) created++;
      }
    }
    return created;
  });
}
