import { roleLabels, roles, type AuditEvent, type Role } from "@ringdown/contracts";
import type { ReactNode } from "react";
import { Quantity } from "@/components/ui/quantity";
import { isIdKey, keyInWords, unitOfKey } from "../labels";

const isRole = (v: unknown): v is Role => typeof v === "string" && (roles as readonly string[]).includes(v);

/** One value of a detail: numbers with their unit, roles by their label, lists joined, yes/no. */
function Value({ name, value }: { name: string; value: unknown }): ReactNode {
  if (value === null || value === undefined || value === "") return <span className="text-muted">none</span>;
  if (typeof value === "number") {
    const unit = unitOfKey(name);
    return <Quantity value={value} unit={unit ?? ""} significantDigits={unit ? 4 : undefined} />;
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
function Changes({ before, after }: { before: Record<string, unknown>; after: Record<string, unknown> }) {
  const keys = [...new Set([...Object.keys(before), ...Object.keys(after)])].filter(
    (k) => !isIdKey(k) && JSON.stringify(before[k]) !== JSON.stringify(after[k]),
  );
  if (keys.length === 0) return null;
  return (
    <>
      {keys.map((k) => (
        <li key={k}>
          {keyInWords(k)}: <Value name={k} value={before[k]} /> → <Value name={k} value={after[k]} />
        </li>
      ))}
    </>
  );
}

const asRecord = (v: unknown): Record<string, unknown> | null => (v && typeof v === "object" && !Array.isArray(v) ? (v as Record<string, unknown>) : null);

/** The facts an event keeps, as a short list: changes as "from → to", the rest as "name: value". */
export function EventDetail({ event }: { event: AuditEvent }) {
  const { from, to, before, after, ...rest } = event.detail;
  const items: ReactNode[] = [];
  if (from !== undefined && to !== undefined) {
    items.push(
      <li key="from-to">
        <Value name="from" value={from} /> → <Value name="to" value={to} />
      </li>,
    );
  }
  const was = asRecord(before);
  const now = asRecord(after);
  if (was && now) items.push(<Changes key="changes" before={was} after={now} />);
  for (const [key, value] of Object.entries(rest)) {
    if (isIdKey(key) || value === undefined) continue;
    items.push(
      <li key={key}>
        {keyInWords(key)}: <Value name={key} value={value} />
      </li>,
    );
  }
  if (items.length === 0) return <span className="text-muted">—</span>;
  return <ul className="flex flex-col gap-0.5 text-xs text-muted [&_li]:leading-snug">{items}</ul>;
}
