import {
  operations,
  operationSchema,
  recipeSortFields,
  recipeStatuses,
  recipeStatusSchema,
  type RecipeListItem,
  type Role,
  type UnitSystem,
} from "@ringdown/contracts";
import type { ColumnDef, PaginationState, SortingState, Updater } from "@tanstack/react-table";
import { ClipboardList, RefreshCw, Search, Trash2 } from "lucide-react";
import { useEffect, useId, useMemo, useState } from "react";
import { Link, useLocation, useNavigate } from "react-router-dom";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { DataTable } from "@/components/ui/data-table";
import { EmptyState } from "@/components/ui/empty-state";
import { Input } from "@/components/ui/field";
import { MeasureValue } from "@/components/ui/measure";
import { Notice } from "@/components/ui/page-header";
import { Select, type SelectOption } from "@/components/ui/select";
import { measures } from "@/components/ui/units";
import { useListSearchParams } from "@/lib/use-list-search-params";
import { useRecipes, type RecipeListParams } from "../api/get-recipes";
import { useRestoreDeletedRecipe } from "../api/restore-deleted-recipe";
import { operationLabels, statusLabels } from "../labels";
import { canDeleteRecipe } from "../life-cycle";
import { RecipeStatusBadge } from "./status-badge";

type SortKey = (typeof recipeSortFields)[number];
const sortable = new Set<string>(recipeSortFields);
const uuidLike = /^[0-9a-f-]{36}$/i;
const PAGE_SIZES = [10, 25, 50, 100];

export interface RecipeFilterOptions {
  machines: SelectOption[];
  materials: SelectOption[];
  cutters: SelectOption[];
}

interface Filters {
  q: string;
  machineId: string;
  materialId: string;
  cutterId: string;
  operation: string;
  status: string;
  /** The shop's bin instead of its live recipes. */
  deleted: boolean;
}

/** What the recipe page hands over after moving a recipe to the bin, so the list can offer Undo. */
export interface DeletedRecipeState {
  deletedRecipe: { id: string; name: string };
}

function deletedRecipeOf(state: unknown): DeletedRecipeState["deletedRecipe"] | null {
  const value = (state as Partial<DeletedRecipeState> | null)?.deletedRecipe;
  return value && typeof value.id === "string" && typeof value.name === "string" ? value : null;
}

/** Filters, sort and page live in the address: a view can be bookmarked, shared and gone back to. */
function useRecipeListState() {
  const { search, update } = useListSearchParams();
  const id = (key: string) => {
    const v = search.get(key);
    return v && uuidLike.test(v) ? v : "";
  };
  const operation = operationSchema.safeParse(search.get("operation"));
  const status = recipeStatusSchema.safeParse(search.get("status"));
  const sortParam = search.get("sort");
  const sort: SortKey = sortParam && sortable.has(sortParam) ? (sortParam as SortKey) : "updatedAt";
  const order = search.get("order") === "asc" ? "asc" : search.get("order") === "desc" ? "desc" : sort === "updatedAt" ? "desc" : "asc";
  const page = Math.max(1, Number.parseInt(search.get("page") ?? "1", 10) || 1);
  const pageSize = PAGE_SIZES.includes(Number(search.get("pageSize"))) ? Number(search.get("pageSize")) : 25;

  const filters: Filters = {
    q: search.get("q") ?? "",
    machineId: id("machineId"),
    materialId: id("materialId"),
    cutterId: id("cutterId"),
    operation: operation.success ? operation.data : "",
    status: status.success ? status.data : "",
    deleted: search.get("deleted") === "true",
  };

  const params: RecipeListParams = {
    page,
    pageSize,
    sort,
    order,
    ...(filters.q.trim() ? { q: filters.q.trim() } : {}),
    ...(filters.machineId ? { machineId: filters.machineId } : {}),
    ...(filters.materialId ? { materialId: filters.materialId } : {}),
    ...(filters.cutterId ? { cutterId: filters.cutterId } : {}),
    ...(operation.success ? { operation: operation.data } : {}),
    ...(status.success ? { status: status.data } : {}),
    ...(filters.deleted ? { deleted: true } : {}),
  };
  return { filters, params, update, sorting: [{ id: sort, desc: order === "desc" }] as SortingState };
}

function apply<T>(updater: Updater<T>, old: T): T {
  return typeof updater === "function" ? (updater as (o: T) => T)(old) : updater;
}

const dateFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "2-digit" });

/**
 * The shop's recipes: a server-side table (filters, sort and page are the server's work, so it
 * stays quick with thousands of recipes). Operators see approved recipes only.
 */
export function RecipesPage({ shopId, role, system, options }: { shopId: string; role: Role; system: UnitSystem; options: RecipeFilterOptions }) {
  const { filters, params, update, sorting } = useRecipeListState();
  const operator = role === "operator";
  // Operators never see the bin (the server refuses it too).
  const bin = filters.deleted && !operator;
  const list = useRecipes(shopId, bin ? params : { ...params, deleted: undefined });
  const restore = useRestoreDeletedRecipe(shopId);
  const [notice, setNotice] = useState<{ tone: "ok" | "limit"; text: string; undo?: { id: string; name: string } } | null>(null);

  // A recipe just deleted from its page: say so here, with Undo, and forget it on reload.
  const location = useLocation();
  const navigate = useNavigate();
  const justDeleted = deletedRecipeOf(location.state);
  useEffect(() => {
    if (!justDeleted) return;
    setNotice({ tone: "ok", text: `${justDeleted.name} was moved to the bin.`, undo: justDeleted });
    void navigate({ search: location.search }, { replace: true, state: null });
  }, [justDeleted?.id]);

  const onRestore = (recipe: { id: string; name: string }) =>
    restore.mutate(recipe.id, {
      onSuccess: (restored) => setNotice({ tone: "ok", text: `${restored.name} is back in the shop's recipes.` }),
      onError: (error) => setNotice({ tone: "limit", text: `${recipe.name} could not be restored: ${error.message}` }),
    });

  const columns = useMemo<Array<ColumnDef<RecipeListItem, unknown>>>(
    () => [
      {
        id: "name",
        header: "Recipe",
        accessorKey: "name",
        cell: ({ row }) => {
          const r = row.original;
          return (
            <div className="min-w-52">
              {r.deletedAt ? (
                // A binned recipe has no page to open until it is restored.
                <span className="font-medium text-ink">{r.name}</span>
              ) : (
                // The link covers the whole row (the row is positioned), so a click anywhere opens it.
                <Link
                  to={`/recipes/${r.id}`}
                  className="font-medium text-ink after:absolute after:inset-0 after:content-[''] hover:text-brand hover:underline focus-visible:outline-none focus-visible:after:outline-2 focus-visible:after:outline-brand"
                >
                  {r.name}
                </Link>
              )}
              <div className="mt-0.5 flex flex-wrap items-center gap-1.5 text-xs text-muted">
                <span>{operationLabels[r.operation]}</span>
                <span aria-hidden>·</span>
                <span>rev. {r.revision}</span>
                <span aria-hidden>·</span>
                <span>
                  {r.cutLogCount} {r.cutLogCount === 1 ? "cut" : "cuts"} logged
                </span>
                {r.deletedAt && (
                  <Badge tone="limit">
                    <Trash2 className="size-3" aria-hidden />
                    Deleted <time dateTime={r.deletedAt}>{dateFormat.format(new Date(r.deletedAt))}</time>
                  </Badge>
                )}
                {!r.deletedAt && r.needsRecheck && (
                  <Badge tone="near" title="The machine, cutter, assembly or material changed since this recipe was computed">
                    <RefreshCw className="size-3" aria-hidden />
                    Needs recheck
                  </Badge>
                )}
              </div>
            </div>
          );
        },
      },
      { id: "status", header: "Status", accessorKey: "status", cell: ({ row }) => <RecipeStatusBadge status={row.original.status} /> },
      {
        id: "machineName",
        header: "Machine and cutter",
        accessorKey: "machineName",
        meta: { className: "min-w-44" },
        cell: ({ row }) => (
          <div>
            <div className="text-ink">{row.original.machineName}</div>
            <div className="text-xs text-muted">{row.original.cutterName}</div>
          </div>
        ),
      },
      { id: "materialName", header: "Material", accessorKey: "materialName", meta: { className: "min-w-36" } },
      {
        id: "rpm",
        header: "Spindle speed",
        accessorFn: (r) => r.result.rpm,
        meta: { numeric: true },
        cell: ({ row }) => <MeasureValue value={Math.round(row.original.result.rpm)} measure={measures.rpm} system={system} />,
      },
      {
        id: "feedMmPerMin",
        header: "Feed",
        accessorFn: (r) => r.result.feedMmPerMin,
        meta: { numeric: true },
        cell: ({ row }) => <MeasureValue value={row.original.result.feedMmPerMin} measure={measures.feedRate} system={system} />,
      },
      {
        id: "chipLoad",
        header: "Chip load",
        accessorFn: (r) => r.result.chipLoadMm,
        enableSorting: false,
        meta: { numeric: true },
        cell: ({ row }) => <MeasureValue value={row.original.result.chipLoadMm} measure={measures.chipLoad} system={system} />,
      },
      {
        id: "updatedAt",
        header: "Updated",
        accessorKey: "updatedAt",
        meta: { numeric: true },
        cell: ({ row }) => <time dateTime={row.original.updatedAt}>{dateFormat.format(new Date(row.original.updatedAt))}</time>,
      },
    ],
    [system],
  );

  const pagination: PaginationState = { pageIndex: params.page - 1, pageSize: params.pageSize };
  const filtered = Boolean(filters.q || filters.machineId || filters.materialId || filters.cutterId || filters.operation || filters.status);

  return (
    <div className="flex flex-col gap-4">
      <RecipeFilters value={filters} onChange={(changes) => update({ ...changes })} options={options} operator={operator} />
      {notice && (
        <Notice tone={notice.tone} onDismiss={() => setNotice(null)}>
          <span>{notice.text}</span>
          {notice.undo && (
            <Button
              size="sm"
              variant="secondary"
              className="ml-3"
              pending={restore.isPending}
              onClick={() => onRestore(notice.undo!)}
              aria-label={`Undo: restore ${notice.undo.name}`}
            >
              Undo
            </Button>
          )}
        </Notice>
      )}
      <DataTable
        label={bin ? "Deleted recipes" : "Recipes"}
        columns={columns}
        data={list.data?.items}
        getRowId={(r) => r.id}
        isLoading={list.isPending}
        isFetching={list.isFetching && !list.isPending}
        error={list.isError ? list.error : null}
        onRetry={() => void list.refetch()}
        rowClassName={(r) => (r.status === "retired" || r.deletedAt ? "relative text-muted" : "relative")}
        rowActions={
          bin
            ? (r) =>
                canDeleteRecipe(role, r.status) ? (
                  <Button size="sm" variant="secondary" onClick={() => onRestore(r)} disabled={restore.isPending} aria-label={`Restore ${r.name}`}>
                    Restore
                  </Button>
                ) : null
            : undefined
        }
        server={{
          rowCount: list.data?.total ?? 0,
          sorting,
          onSortingChange: (updater) => {
            const next = apply(updater, sorting)[0];
            update(next ? { sort: next.id, order: next.desc ? "desc" : "asc" } : { sort: undefined, order: undefined });
          },
          pagination,
          onPaginationChange: (updater) => {
            const next = apply(updater, pagination);
            update({ page: next.pageIndex + 1 === 1 ? undefined : next.pageIndex + 1, pageSize: next.pageSize === 25 ? undefined : next.pageSize }, false);
          },
        }}
        empty={
          bin ? (
            <EmptyState icon={Trash2} title={filtered ? "No deleted recipe matches these filters" : "No deleted recipes"}>
              <p>Deleted recipes wait here, with their history and cut log, until they are restored.</p>
            </EmptyState>
          ) : filtered ? (
            <EmptyState icon={Search} title="No recipe matches these filters">
              <p>Clear a filter or search for something shorter.</p>
            </EmptyState>
          ) : (
            <EmptyState
              icon={ClipboardList}
              title={operator ? "No approved recipes yet" : "No recipes yet"}
              action={
                operator ? undefined : (
                  <Link to="/planner" className="inline-flex h-10 items-center rounded-md bg-brand px-4 text-sm font-medium text-white hover:bg-brand-strong">
                    Plan a cut
                  </Link>
                )
              }
            >
              <p>
                {operator
                  ? "Recipes appear here once a tooling manager approves them."
                  : "Plan a cut in the planner and save it: it starts as a draft, goes on trial, is proven with logged cuts and then approved."}
              </p>
            </EmptyState>
          )
        }
      />
    </div>
  );
}

function RecipeFilters({
  value,
  onChange,
  options,
  operator,
}: {
  value: Filters;
  onChange: (changes: Partial<Filters>) => void;
  options: RecipeFilterOptions;
  operator: boolean;
}) {
  const id = useId();
  const [text, setText] = useState(value.q);
  useEffect(() => setText(value.q), [value.q]);
  // Ticked at once, while the address (a transition) catches up.
  const [bin, setBin] = useState(value.deleted);
  useEffect(() => setBin(value.deleted), [value.deleted]);
  useEffect(() => {
    if (text === value.q) return;
    // Wait for a pause in typing before asking the server.
    const timer = setTimeout(() => onChange({ q: text }), 300);
    return () => clearTimeout(timer);
  }, [text, value.q, onChange]);

  const select = (key: Exclude<keyof Filters, "deleted">, label: string, opts: readonly SelectOption[], any: string, width = "w-48") => (
    <div className={`flex ${width} flex-col gap-1.5`}>
      <label htmlFor={`${id}-${key}`} className="text-xs font-medium text-muted">
        {label}
      </label>
      <Select id={`${id}-${key}`} value={value[key]} onChange={(e) => onChange({ [key]: e.target.value })} options={opts} placeholder={any} />
    </div>
  );

  return (
    <div role="search" aria-label="Filter recipes" className="flex flex-wrap items-end gap-3">
      <div className="flex min-w-56 flex-1 flex-col gap-1.5">
        <label htmlFor={`${id}-q`} className="text-xs font-medium text-muted">
          Search
        </label>
        <div className="relative">
          <Search aria-hidden className="pointer-events-none absolute top-1/2 left-3 size-4 -translate-y-1/2 text-muted" />
          <Input
            id={`${id}-q`}
            type="search"
            value={text}
            onChange={(event) => setText(event.target.value)}
            placeholder="Name, notes, cutter, material, machine…"
            className="pl-9"
          />
        </div>
      </div>
      {select("machineId", "Machine", options.machines, "Any machine")}
      {select("materialId", "Material", options.materials, "Any material")}
      {select("cutterId", "Cutter", options.cutters, "Any cutter")}
      {select(
        "operation",
        "Operation",
        operations.map((o) => ({ value: o, label: operationLabels[o] })),
        "Any operation",
        "w-44",
      )}
      {!operator &&
        select(
          "status",
          "Status",
          recipeStatuses.map((s) => ({ value: s, label: statusLabels[s] })),
          "Any status",
          "w-36",
        )}
      {!operator && (
        <label className="flex h-10 cursor-pointer items-center gap-2 text-sm text-ink">
          <input
            type="checkbox"
            checked={bin}
            onChange={(e) => {
              setBin(e.target.checked);
              onChange({ deleted: e.target.checked });
            }}
            className="size-4 accent-brand"
          />
          Deleted recipes
        </label>
      )}
    </div>
  );
}
