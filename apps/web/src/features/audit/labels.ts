import type { AuditAction, AuditSubjectType } from "@ringdown/contracts";
import { measures, type Measure } from "@/components/ui/units";

/** What happened, in a few words, for each action code. */
export const actionLabels: Record<AuditAction, string> = {
  "shop.created": "Opened the shop",
  "shop.renamed": "Renamed the shop",
  "shop.exported": "Downloaded the shop's data",
  "member.role_changed": "Changed a person's role",
  "member.removed": "Took a person out of the shop",
  "invitation.sent": "Sent an invitation",
  "invitation.revoked": "Withdrew an invitation",
  "invitation.accepted": "Joined through an invitation",
  "billing.checkout_started": "Started buying seats",
  "billing.plan_changed": "Plan changed",
  "cutter.created": "Added a cutter",
  "cutter.updated": "Edited a cutter",
  "cutter.status_changed": "Moved a cutter on",
  "cutter.deleted": "Binned a cutter",
  "cutter.restored": "Brought back a cutter",
  "cutter.imported": "Imported cutters",
  "material.created": "Added a material",
  "material.copied": "Copied a material into the shop",
  "material.updated": "Edited a material",
  "material.deleted": "Binned a material",
  "material.restored": "Brought back a material",
  "machine.created": "Added a machine",
  "machine.updated": "Edited a machine",
  "machine.deleted": "Binned a machine",
  "machine.restored": "Brought back a machine",
  "machine.ceilings_changed": "Changed a machine's ceilings",
  "stiffness_reading.added": "Entered a stiffness reading",
  "stiffness_reading.deleted": "Deleted a stiffness reading",
  "backlash_reading.added": "Entered a backlash reading",
  "backlash_reading.deleted": "Deleted a backlash reading",
  "mode.added": "Added a vibration mode",
  "mode.updated": "Edited a vibration mode",
  "mode.deleted": "Deleted a vibration mode",
  "recording.uploaded": "Uploaded a recording",
  "recording.deleted": "Deleted a recording",
  "recording.mode_accepted": "Took a mode from a recording",
  "recording.dial_rpm_accepted": "Took a dial speed from a recording",
  "recipe.created": "Created a recipe",
  "recipe.revised": "Revised a recipe",
  "recipe.status_changed": "Moved a recipe on",
  "recipe.deleted": "Binned a recipe",
  "recipe.restored": "Brought back a recipe",
  "recipe.copied": "Copied a recipe to another machine",
  "cut_log.created": "Logged a cut",
};

/** What a record is, as the "Record" column names it. */
export const subjectLabels: Record<AuditSubjectType, string> = {
  shop: "Shop",
  member: "Person",
  invitation: "Invitation",
  subscription: "Plan",
  cutter: "Cutter",
  material: "Material",
  machine: "Machine",
  stiffness_reading: "Stiffness reading",
  backlash_reading: "Backlash reading",
  mode: "Vibration mode",
  recording: "Recording",
  recipe: "Recipe",
  cut_log: "Cut log",
};

/** The "Kind of change" filter: each choice is an action prefix the API filters on. */
export const actionGroupOptions = [
  { value: "shop.", label: "Shop and its data" },
  { value: "member.", label: "People and roles" },
  { value: "invitation.", label: "Invitations" },
  { value: "billing.", label: "Plan and seats" },
  { value: "cutter.", label: "Cutters" },
  { value: "material.", label: "Materials" },
  { value: "machine.", label: "Machines and ceilings" },
  { value: "stiffness_reading.", label: "Stiffness readings" },
  { value: "backlash_reading.", label: "Backlash readings" },
  { value: "mode.", label: "Vibration modes" },
  { value: "recording.", label: "Recordings" },
  { value: "recipe.", label: "Recipes" },
  { value: "cut_log.", label: "Cut logs" },
] as const;

/**
 * What a detail key measures, from the unit in its name ("xMm" → a length), so the number is shown
 * with its unit and, for lengths, stiffnesses and masses, in the reader's unit system.
 */
export function measureOfKey(key: string): Measure | null {
  if (/NPerMm$/.test(key)) return measures.stiffness;
  if (/Mm$/.test(key)) return measures.length;
  if (/Hz$/.test(key)) return measures.frequency;
  if (/Kg$/.test(key)) return measures.mass;
  if (/Pct$/.test(key)) return measures.percent;
  if (/Bytes$/.test(key)) return { unit: "bytes" };
  if (/[rR]pm$/.test(key)) return measures.rpm;
  return null;
}

const keyWords: Record<string, string> = {
  from: "from",
  to: "to",
  fields: "fields",
  rows: "rows",
  role: "role",
  status: "status",
  seats: "seats",
  cancelAtPeriodEnd: "ends with the period",
  recipesFlagged: "recipes marked for a re-check",
  dampingRatio: "damping ratio",
  fromName: "copied from",
  fromRevision: "from revision",
  note: "note",
  comment: "comment",
  revision: "revision",
  outcome: "outcome",
  photos: "photos",
  file: "file",
  kind: "kind",
  format: "format",
  newAccount: "new account",
  alreadyMember: "was already a member",
  dialSetting: "dial setting",
  previousRpm: "previous speed",
  rpm: "speed",
  statusFrom: "status was",
  statusTo: "status now",
  fromGlobal: "from the global library",
  deflectionCeilingMm: "deflection ceiling",
  modeMarginPct: "mode margin",
  avoidBands: "bands to avoid",
};

/**
 * A detail key in words: known keys by name, others split where the case changes, the unit
 * suffix left off (the unit is shown with the number): "stickoutMm" → "stickout".
 */
export function keyInWords(key: string): string {
  if (keyWords[key]) return keyWords[key];
  const bare = key.replace(/(NPerMm|Mm|Hz|Kg|Pct|Bytes)$/, "");
  const words = bare.replace(/([a-z0-9])([A-Z])/g, "$1 $2").replace(/[._]/g, " ").toLowerCase();
  return words || key;
}

/** Detail keys that only link records (ids): not shown as text. */
export function isIdKey(key: string): boolean {
  return /(^id$|Id$)/.test(key);
}
