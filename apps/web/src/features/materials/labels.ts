import { materialGroups, type MaterialGroup, type Role } from "@ringdown/contracts";

export const groupLabels: Record<MaterialGroup, string> = {
  softwood: "Softwood",
  hardwood: "Hardwood",
  wood_panel: "Wood panel",
  plastic: "Plastic",
  foam: "Foam",
  composite: "Composite",
  aluminium: "Aluminium",
  copper_alloy: "Copper alloy",
  steel: "Steel",
  stainless: "Stainless steel",
  cast_iron: "Cast iron",
};

export const groupOptions = materialGroups.map((value) => ({ value, label: groupLabels[value] }));

/** Where a row comes from, in the product's words. */
export const originLabels = { global: "Ringdown reference", shop: "Shop's own" } as const;

/** Tooling managers and owners add, copy, edit and delete the shop's materials. */
export function canEditMaterials(role: Role): boolean {
  return role === "owner" || role === "tooling_manager";
}

/**
 * The bracketed keys used in the reference rows' source notes, spelled out. A note may also say
 * "from memory" or "common practice" in words; those keys say the same.
 */
export const sourceKeys: Record<string, string> = {
  VDI: "VDI 3323 material groups with kc1.1 and mc as reprinted in a cutting-tool catalogue (secondary source).",
  TSCH: "Tschätsch & Dietrich, Praxis der Zerspantechnik, 11th ed. 2014, Kienzle table (secondary transcription).",
  GROOV: "Groover, Fundamentals of Modern Manufacturing, unit power table (secondary transcription).",
  CARV: "Carvill, Mechanical Engineer's Data Handbook, 1993, milling speed tables.",
  PMMA: "An acrylic sheet maker's fabrication guide (router speeds and feeds; chip load derived from them).",
  PE: "A plastics distributor's milling guidelines for polyethylene.",
  MDF: "Demir, Cakiroglu & Aydin, Drvna Industrija 73(4), 2022; Doichinov, Acta Fac. Xylologiae Zvolen 65(2), 2023.",
  MEM: "From memory of general machining handbooks; not re-checked against a text.",
  PRACT: "Common practice, no published source (shop-floor starting values).",
};

/** The keys a note cites, in order of first mention, with their meaning when known. */
export function citedSources(note: string): Array<{ key: string; meaning: string }> {
  const seen = new Set<string>();
  const out: Array<{ key: string; meaning: string }> = [];
  for (const match of note.matchAll(/\[([A-Z]+)\]/g)) {
    const key = match[1] as string;
    if (seen.has(key) || !sourceKeys[key]) continue;
    seen.add(key);
    out.push({ key, meaning: sourceKeys[key] });
  }
  return out;
}
