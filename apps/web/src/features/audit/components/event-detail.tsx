import { roleLabels, roles, type AuditEvent, type Role, type UnitSystem } from "@ringdown/contracts";
import type { ReactNode } from "react";
import { Quantity } from "@/components/ui/quantity";
import { displayDigits, toDisplay, unitOf } from "@/components/ui/units";
import { isIdKey, keyInWords, measureOfKey } from "../labels";

const isRole = (v: unknown): v is Role => typeof v === "string" && (roles as readonly string[]).includes(v);

/**
 * One value of a detail: numbers with their unit (in the reader's unit system), roles by their
 * label, lists joined, yes/no.
 */
function Value({ name, value, system }: { name: string; value: unknown; system: UnitSystem }): ReactNode {
  if (value === null || value === undefined || value === "") return <span className="text-muted">none</span>;
  if (typeof value === "number") {
    const measure = measureOfKey(name);
    if (!measure) return <Quantity value={value} unit="" system={system} />;
    const shown = toDisplay(value, measure, system);
    return <Quantity value={shown} unit={unitOf(measure, system)} system={system} {...displayDigits(shown)} />;
  }
  if (typeof value === "boolean") return value ? "yes" : "no";
  if (isRole(value)) return roleLabels[value];
  if (Array.isArray(value)) {
    if (value.every((v) => typeof v === "string")) return name === "fields" ? value.map(keyInWords).join(", ") : value.join(", ");
    return `${value.length} ${value.length === 1 ? "entry" : "entries"}`;
  }
  if (typeof value === "object") return "changed";
  return String(value);
}

/** A before/after pair of objects: only what differs, as "name: before → after". */
function Changes({ before, after, system }: { before: Record<string, unknown>; after: Record<string, unknown>; system: UnitSystem }) {
  const keys = [...new Set([...Object.keys(before), ...Object.keys(after)])].filter(
    (k) => !isIdKey(k) && JSON.stringify(before[k]) !== JSON.stringify(after[k]),
  );
  if (keys.length === 0) return null;
  return (
    <>
      {keys.map((k) => (
        <li key={k}>
          {keyInWords(k)}: <Value name={k} value={before[k]} system={system} /> → <Value name={k} value={after[k]} system={system} />
        </li>
      ))}
    </>
  );
}

const asRecord = (v: unknown): Record<string, unknown> | null => (v && typeof v === "object" && !Array.isArray(v) ? (v as Record<string, unknown>) : null);

/** The facts an event keeps, as a short list: changes as "from → to", the rest as "name: value". */
export function EventDetail({ event, system }: { event: AuditEvent; system: UnitSystem }) {
  const { from, to, before, after, ...rest } = event.detail;
  const items: ReactNode[] = [];
  if (from !== undefined && to !== undefined) {
    items.push(
      <li key="from-to">
        <Value name="from" value={from} system={system} /> → <Value name="to" value={to} system={system} />
      </li>,
    );
  }
  const was = asRecord(before);
  const now = asRecord(after);
  if (was && now) items.push(<Changes key="changes" before={was} after={now} system={system} />);
  for (const [key, value] of Object.entries(rest)) {
    if (isIdKey(key) || value === undefined) continue;
    items.push(
      <li key={key}>
        {keyInWords(key)}: <Value name={key} value={value} system={system} />
      </li>,
    );
  }
  if (items.length === 0) return <span className="text-muted">—</span>;
  return <ul className="flex flex-col gap-0.5 text-xs text-muted [&_li]:leading-snug">{items}</ul>;
}
