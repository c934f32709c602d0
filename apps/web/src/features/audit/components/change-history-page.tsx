import { auditActionSchema, type AuditEvent } from "@ringdown/contracts";
import type { ColumnDef, PaginationState, Updater } from "@tanstack/react-table";
import { History, Lock } from "lucide-react";
import { useCallback, useId, useMemo } from "react";
import { Link, useSearchParams } from "react-router-dom";
import { Button } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { DataTable } from "@/components/ui/data-table";
import { EmptyState } from "@/components/ui/empty-state";
import { Input } from "@/components/ui/field";
import { PageHeader } from "@/components/ui/page-header";
import { Select } from "@/components/ui/select";
import { useActiveShop } from "@/lib/active-shop";
import { useUnitSystem } from "@/lib/auth";
import { useDocumentTitle } from "@/lib/use-document-title";
import { useAuditEvents, type AuditEventListParams } from "../api/get-audit-events";
import { actionGroupOptions, actionLabels, subjectLabels } from "../labels";
import { EventDetail } from "./event-detail";

const PAGE_SIZES = [25, 50, 100];

/** Times in the reader's own locale and time zone. */
const timeFormat = new Intl.DateTimeFormat(undefined, { dateStyle: "medium", timeStyle: "medium" });

/** A "YYYY-MM-DD" from a date input as the first instant of that day where the reader is. */
function startOfLocalDay(day: string): string | undefined {
  const [y, m, d] = day.split("-").map(Number);
  if (!y || !m || !d) return undefined;
  return new Date(y, m - 1, d).toISOString();
}

/** The last millisecond of that local day (the API's `to` includes it). */
function endOfLocalDay(day: string): string | undefined {
  const [y, m, d] = day.split("-").map(Number);
  if (!y || !m || !d) return undefined;
  return new Date(new Date(y, m - 1, d + 1).getTime() - 1).toISOString();
}

const dayPattern = /^\d{4}-\d{2}-\d{2}$/;
const validGroup = (v: string | null) => actionGroupOptions.some((o) => o.value === v);

/** Filters and page live in the address, so a view can be bookmarked and Back works. */
function useHistoryState() {
  const [search, setSearch] = useSearchParams();
  const group = search.get("kind");
  const from = search.get("from") ?? "";
  const to = search.get("to") ?? "";
  const filters = {
    kind: validGroup(group) ? (group as string) : "",
    person: search.get("person") ?? "",
    from: dayPattern.test(from) ? from : "",
    to: dayPattern.test(to) ? to : "",
  };
  const page = Math.max(1, Number.parseInt(search.get("page") ?? "1", 10) || 1);
  const pageSize = PAGE_SIZES.includes(Number(search.get("pageSize"))) ? Number(search.get("pageSize")) : 25;
  const rangeBackwards = filters.from !== "" && filters.to !== "" && filters.from > filters.to;

  const update = useCallback(
    (changes: Record<string, string | number | undefined>, resetPage = true) => {
      setSearch(
        (prev) => {
          const next = new URLSearchParams(prev);
          for (const [key, value] of Object.entries(changes)) {
            if (value === undefined || value === "") next.delete(key);
            else next.set(key, String(value));
          }
          if (resetPage) next.delete("page");
          return next;
        },
        { replace: true },
      );
    },
    [setSearch],
  );

  const params: AuditEventListParams = {
    page,
    pageSize,
    action: filters.kind || undefined,
    actorId: filters.person || undefined,
    from: filters.from ? startOfLocalDay(filters.from) : undefined,
    to: filters.to ? endOfLocalDay(filters.to) : undefined,
  };
  return { filters, params, update, rangeBackwards, filtered: Object.values(filters).some((v) => v !== "") };
}

function apply<T>(updater: Updater<T>, old: T): T {
  return typeof updater === "function" ? (updater as (o: T) => T)(old) : updater;
}

/** The Team area's change history: who changed what in the shop, and when. Owners only. */
export function ChangeHistoryPage() {
  useDocumentTitle("Change history");
  const shop = useActiveShop();
  if (!shop) {
    return (
      <Card>
        <EmptyState icon={History} title="No shop selected">
          <p>Create or choose a shop to see its change history.</p>
        </EmptyState>
      </Card>
    );
  }
  if (shop.role !== "owner") {
    return (
      <Card>
        <EmptyState icon={Lock} title="Only owners see the change history" action={<Link to="/team" className="font-medium text-brand underline underline-offset-4">Back to the team</Link>}>
          <p>The record of who changed what in {shop.shopName} is kept for the shop's owners. Ask an owner if you need something from it.</p>
        </EmptyState>
      </Card>
    );
  }
  return <HistoryForShop shopId={shop.shopId} shopName={shop.shopName} />;
}

function HistoryForShop({ shopId, shopName }: { shopId: string; shopName: string }) {
  const { filters, params, update, rangeBackwards, filtered } = useHistoryState();
  const list = useAuditEvents(rangeBackwards ? "" : shopId, params);
  const system = useUnitSystem();
  const id = useId();

  // People who appear on this page of the history, for the "Person" filter (includes people
  // who have since left the shop: their name is kept with each change).
  const people = useMemo(() => {
    const seen = new Map<string, string>();
    for (const e of list.data?.items ?? []) if (e.actorId && !seen.has(e.actorId)) seen.set(e.actorId, e.actorName);
    if (filters.person && !seen.has(filters.person)) seen.set(filters.person, "The chosen person");
    return [...seen].map(([value, label]) => ({ value, label }));
  }, [list.data, filters.person]);

  const columns = useMemo<Array<ColumnDef<AuditEvent>>>(
    () => [
      {
        id: "when",
        header: "When",
        enableSorting: false,
        meta: { className: "whitespace-nowrap" },
        cell: (c) => <time dateTime={c.row.original.createdAt}>{timeFormat.format(new Date(c.row.original.createdAt))}</time>,
      },
      {
        id: "who",
        header: "Who",
        enableSorting: false,
        cell: (c) => {
          const e = c.row.original;
          return (
            <span className="flex flex-col">
              <span className="font-medium text-ink">{e.actorName}</span>
              {e.ip && <span className="text-xs text-muted">from {e.ip}</span>}
            </span>
          );
        },
      },
      {
        id: "what",
        header: "What happened",
        enableSorting: false,
        cell: (c) => {
          const parsed = auditActionSchema.safeParse(c.row.original.action);
          return parsed.success ? actionLabels[parsed.data] : c.row.original.action;
        },
      },
      {
        id: "record",
        header: "Record",
        enableSorting: false,
        cell: (c) => {
          const e = c.row.original;
          return (
            <span className="flex flex-col">
              <span className="text-ink">{e.subjectLabel || "—"}</span>
              <span className="text-xs text-muted">{subjectLabels[e.subjectType]}</span>
            </span>
          );
        },
      },
      { id: "detail", header: "Details", enableSorting: false, cell: (c) => <EventDetail event={c.row.original} system={system} /> },
    ],
    [system],
  );

  const pagination: PaginationState = { pageIndex: (params.page ?? 1) - 1, pageSize: params.pageSize ?? 25 };

  return (
    <div className="mx-auto flex max-w-6xl flex-col gap-6">
      <PageHeader
        eyebrow={
          <Link to="/team" className="text-brand underline underline-offset-4">
            Team
          </Link>
        }
        title="Change history"
        description={`Who changed what in ${shopName}, newest first, in your time zone. Names are kept as they were when each change was made.`}
      />

      <div role="search" aria-label="Filter the change history" className="flex flex-wrap items-end gap-3">
        <div className="flex min-w-48 flex-1 flex-col gap-1.5 sm:max-w-64">
          <label htmlFor={`${id}-kind`} className="text-xs font-medium text-muted">
            Kind of change
          </label>
          <Select id={`${id}-kind`} value={filters.kind} onChange={(e) => update({ kind: e.target.value })} options={actionGroupOptions} placeholder="Every kind" />
        </div>
        <div className="flex min-w-44 flex-1 flex-col gap-1.5 sm:max-w-60">
          <label htmlFor={`${id}-person`} className="text-xs font-medium text-muted">
            Person
          </label>
          <Select id={`${id}-person`} value={filters.person} onChange={(e) => update({ person: e.target.value })} options={people} placeholder="Anyone" />
        </div>
        <div className="flex w-40 flex-col gap-1.5">
          <label htmlFor={`${id}-from`} className="text-xs font-medium text-muted">
            From (day)
          </label>
          <Input id={`${id}-from`} type="date" value={filters.from} max={filters.to || undefined} onChange={(e) => update({ from: e.target.value })} invalid={rangeBackwards} />
        </div>
        <div className="flex w-40 flex-col gap-1.5">
          <label htmlFor={`${id}-to`} className="text-xs font-medium text-muted">
            To (day, included)
          </label>
          <Input
            id={`${id}-to`}
            type="date"
            value={filters.to}
            min={filters.from || undefined}
            onChange={(e) => update({ to: e.target.value })}
            invalid={rangeBackwards}
            describedBy={rangeBackwards ? `${id}-range` : undefined}
          />
        </div>
        {filtered && (
          <Button variant="secondary" onClick={() => update({ kind: "", person: "", from: "", to: "" })}>
            Clear filters
          </Button>
        )}
      </div>
      {rangeBackwards && (
        <p id={`${id}-range`} role="alert" className="-mt-3 text-sm text-limit">
          The first day comes after the last day: swap them to see changes.
        </p>
      )}
      {!rangeBackwards && (
          <DataTable
            label="Changes in the shop, newest first"
            columns={columns}
            data={list.data?.items}
            getRowId={(e) => e.id}
            isLoading={list.isPending}
            isFetching={list.isFetching && !list.isPending}
            error={list.error}
            onRetry={() => void list.refetch()}
            pageSizeOptions={PAGE_SIZES}
            empty={
              filtered ? (
                <p className="py-10 text-center text-muted">No changes match these filters. Widen the period or clear the filters.</p>
              ) : (
                <p className="py-10 text-center text-muted">No changes recorded yet. Changes to the team, the library, machines and recipes appear here as they are made.</p>
              )
            }
            server={{
              rowCount: list.data?.total ?? 0,
              sorting: [],
              onSortingChange: () => undefined,
              pagination,
              onPaginationChange: (updater) => {
                const next = apply(updater, pagination);
                update({ page: next.pageIndex + 1 === 1 ? undefined : next.pageIndex + 1, pageSize: next.pageSize === 25 ? undefined : next.pageSize }, false);
              },
            }}
          />
      )}
    </div>
  );
}
