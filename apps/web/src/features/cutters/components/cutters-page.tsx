import {
  cutterShapeSchema,
  cutterSorts,
  cutterStatusSchema,
  toolMaterialSchema,
  type Cutter,
  type CutterStatus,
} from "@ringdown/contracts";
import type { ColumnDef, PaginationState, SortingState, Updater } from "@tanstack/react-table";
import { Drill, FileUp, Plus } from "lucide-react";
import { useCallback, useMemo, useState } from "react";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { DataTable } from "@/components/ui/data-table";
import { EmptyState } from "@/components/ui/empty-state";
import { MeasureValue } from "@/components/ui/measure";
import { Notice, PageHeader } from "@/components/ui/page-header";
import { measures } from "@/components/ui/units";
import { useActiveShop } from "@/lib/active-shop";
import { isApiError } from "@/lib/api-client";
import { useUnitSystem } from "@/lib/auth";
import { useDocumentTitle } from "@/lib/use-document-title";
import { useListSearchParams } from "@/lib/use-list-search-params";
import { useDeleteCutter } from "../api/delete-cutter";
import { useCutters, type CutterListParams } from "../api/get-cutters";
import { useRestoreCutter } from "../api/restore-cutter";
import { useTransitionCutter } from "../api/transition-cutter";
import { shapeLabels, statusLabels, statusTones, toolMaterialLabels } from "../labels";
import { canAddCutter, canCurate, canEditCutter } from "../permissions";
import { CutterDetailsSheet } from "./cutter-details-sheet";
import { CutterFilters, type CutterFilterValues } from "./cutter-filters";
import { CutterFormSheet } from "./cutter-form-sheet";
import { CutterRowActions, type CutterAction } from "./cutter-row-actions";
import { ExportCuttersMenu } from "./export-cutters-menu";
import { CSV_FORMAT_DOC, ImportCuttersSheet } from "./import-cutters-sheet";

type SortKey = (typeof cutterSorts)[number];
const sortable = new Set<string>(cutterSorts);

/** Filters, sort and page live in the address, so a view can be bookmarked and Back works. */
function useCutterListState() {
  const { search, update } = useListSearchParams();
  const status = cutterStatusSchema.safeParse(search.get("status"));
  const shape = cutterShapeSchema.safeParse(search.get("shape"));
  const toolMaterial = toolMaterialSchema.safeParse(search.get("toolMaterial"));
  const sortParam = search.get("sort");
  const sort: SortKey = sortParam && sortable.has(sortParam) ? (sortParam as SortKey) : "name";
  const dir = search.get("dir") === "desc" ? "desc" : "asc";
  const page = Math.max(1, Number.parseInt(search.get("page") ?? "1", 10) || 1);
  const pageSize = [10, 25, 50, 100].includes(Number(search.get("pageSize"))) ? Number(search.get("pageSize")) : 25;

  const filters: CutterFilterValues = {
    q: search.get("q") ?? "",
    status: status.success ? status.data : "",
    shape: shape.success ? shape.data : "",
    toolMaterial: toolMaterial.success ? toolMaterial.data : "",
    deleted: search.get("deleted") === "true",
  };

  const params: CutterListParams = {
    page,
    pageSize,
    sort,
    dir,
    q: filters.q || undefined,
    status: status.success ? status.data : undefined,
    shape: shape.success ? shape.data : undefined,
    toolMaterial: toolMaterial.success ? toolMaterial.data : undefined,
    deleted: filters.deleted,
  };
  return { filters, params, update, sorting: [{ id: sort, desc: dir === "desc" }] as SortingState };
}

function apply<T>(updater: Updater<T>, old: T): T {
  return typeof updater === "function" ? (updater as (o: T) => T)(old) : updater;
}

export function CuttersPage() {
  useDocumentTitle("Cutters");
  const shop = useActiveShop();
  const system = useUnitSystem();
  const { filters, params, update, sorting } = useCutterListState();
  const list = useCutters(shop?.shopId ?? "", params);
  const transition = useTransitionCutter(shop?.shopId ?? "");
  const remove = useDeleteCutter(shop?.shopId ?? "");
  const restore = useRestoreCutter(shop?.shopId ?? "");

  const [editing, setEditing] = useState<Cutter | "new" | null>(null);
  const [viewing, setViewing] = useState<Cutter | null>(null);
  const [deleting, setDeleting] = useState<Cutter | null>(null);
  const [importing, setImporting] = useState(false);
  const [notice, setNotice] = useState<{ tone: "ok" | "limit"; text: string } | null>(null);
  const [busyId, setBusyId] = useState<string | null>(null);

  const role = shop?.role ?? "operator";
  const curator = canCurate(role);

  const onAction = useCallback(
    async (cutter: Cutter, action: CutterAction) => {
      if (action.kind === "edit") return setEditing(cutter);
      if (action.kind === "view") return setViewing(cutter);
      if (action.kind === "delete") {
        remove.reset();
        return setDeleting(cutter);
      }
      setBusyId(cutter.id);
      try {
        if (action.kind === "transition") {
          const saved = await transition.mutateAsync({ cutterId: cutter.id, to: action.to });
          setNotice({ tone: "ok", text: `${saved.name} is now ${statusLabels[saved.status].toLowerCase()}.` });
        } else {
          const saved = await restore.mutateAsync(cutter.id);
          setNotice({ tone: "ok", text: `${saved.name} is back in the cutter list (${statusLabels[saved.status].toLowerCase()}).` });
        }
      } catch (error) {
        setNotice({ tone: "limit", text: error instanceof Error ? error.message : "The change was not saved." });
      } finally {
        setBusyId(null);
      }
    },
    [remove, restore, transition],
  );

  const columns = useMemo<Array<ColumnDef<Cutter, unknown>>>(
    () => [
      {
        id: "name",
        header: "Name",
        accessorKey: "name",
        cell: ({ row }) => {
          const c = row.original;
          const sub = [c.maker, c.partNumber].filter(Boolean).join(" · ");
          return (
            <div className="min-w-48">
              <div className="font-medium text-ink">{c.name}</div>
              {sub && <div className="text-xs text-muted">{sub}</div>}
            </div>
          );
        },
      },
      { id: "shape", header: "Shape", accessorKey: "shape", cell: ({ row }) => shapeLabels[row.original.shape] },
      {
        id: "diameterMm",
        header: "Diameter",
        accessorKey: "diameterMm",
        meta: { numeric: true },
        cell: ({ row }) => <MeasureValue value={row.original.diameterMm} measure={measures.length} system={system} />,
      },
      { id: "flutes", header: "Flutes", accessorKey: "flutes", meta: { numeric: true } },
      {
        id: "fluteLengthMm",
        header: "Flute length",
        accessorKey: "fluteLengthMm",
        enableSorting: false,
        meta: { numeric: true },
        cell: ({ row }) => <MeasureValue value={row.original.fluteLengthMm} measure={measures.length} system={system} />,
      },
      { id: "toolMaterial", header: "Tool material", accessorKey: "toolMaterial", cell: ({ row }) => toolMaterialLabels[row.original.toolMaterial] },
      {
        id: "maxRpm",
        header: "Maker's max",
        accessorKey: "maxRpm",
        enableSorting: false,
        meta: { numeric: true },
        cell: ({ row }) => <MeasureValue value={row.original.maxRpm} measure={measures.rpm} system={system} />,
      },
      {
        id: "status",
        header: "Status",
        accessorKey: "status",
        cell: ({ row }) =>
          row.original.deletedAt ? <Badge tone="limit">Deleted</Badge> : <Badge tone={statusTones[row.original.status]}>{statusLabels[row.original.status]}</Badge>,
      },
    ],
    [system],
  );

  if (!shop) return null;
  const page = list.data;
  const pagination: PaginationState = { pageIndex: (params.page ?? 1) - 1, pageSize: params.pageSize ?? 25 };
  const filtered = Boolean(filters.q || filters.status || filters.shape || filters.toolMaterial);

  const empty = filters.deleted ? (
    <EmptyState icon={Drill} title="No deleted cutters">
      <p>Deleted cutters wait here until they are restored.</p>
    </EmptyState>
  ) : filtered ? (
    <EmptyState icon={Drill} title="No cutters match these filters" action={<Button variant="secondary" onClick={() => update({ q: "", status: "", shape: "", toolMaterial: "" })}>Clear filters</Button>}>
      <p>Try fewer filters, or a shorter search.</p>
    </EmptyState>
  ) : (
    <EmptyState
      icon={Drill}
      title="No cutters yet"
      action={
        canAddCutter(role) && (
          <div className="flex gap-2">
            <Button onClick={() => setEditing("new")}>
              <Plus className="size-4" aria-hidden /> {curator ? "Add a cutter" : "Propose a cutter"}
            </Button>
            {curator && (
              <Button variant="secondary" onClick={() => setImporting(true)}>
                <FileUp className="size-4" aria-hidden /> Import CSV
              </Button>
            )}
          </div>
        )
      }
    >
      <p>List the cutters the shop uses: diameter, flutes, lengths and the maker's top speed. Recipes are computed for these cutters.</p>
    </EmptyState>
  );

  return (
    <div className="mx-auto flex max-w-7xl flex-col gap-5">
      <PageHeader
        title="Cutters"
        description={
          <>
            The cutters this shop has approved, and those proposed for approval. Figures are the maker's; never run a cutter
            beyond its maker's limits. CSV import and export use Ringdown's own columns, described in{" "}
            <span className="font-mono text-ink">{CSV_FORMAT_DOC}</span>.
          </>
        }
        actions={
          <>
            <ExportCuttersMenu shopId={shop.shopId} status={params.status} preferred={system} />
            {curator && (
              <Button variant="secondary" onClick={() => setImporting(true)}>
                <FileUp className="size-4" aria-hidden /> Import CSV
              </Button>
            )}
            {canAddCutter(role) && (
              <Button onClick={() => setEditing("new")}>
                <Plus className="size-4" aria-hidden /> {curator ? "Add cutter" : "Propose cutter"}
              </Button>
            )}
          </>
        }
      />

      <CutterFilters value={filters} onChange={(next) => update(next)} />

      {notice && (
        <Notice tone={notice.tone} onDismiss={() => setNotice(null)}>
          {notice.text}
        </Notice>
      )}

      <DataTable
        label={filters.deleted ? "Deleted cutters" : "Cutters"}
        columns={columns}
        data={page?.items}
        getRowId={(c) => c.id}
        isLoading={list.isPending}
        isFetching={list.isFetching && !list.isPending}
        error={list.isError ? list.error : null}
        onRetry={() => void list.refetch()}
        empty={empty}
        rowClassName={(c) => (c.status === "retired" || c.deletedAt ? "text-muted" : undefined)}
        rowActions={(c) => (
          <CutterRowActions
            cutter={c}
            canEdit={canEditCutter(role, c)}
            canCurate={curator}
            busy={busyId === c.id}
            onAction={(action) => void onAction(c, action)}
          />
        )}
        server={{
          rowCount: page?.total ?? 0,
          sorting,
          onSortingChange: (updater) => {
            const next = apply(updater, sorting)[0];
            update({ sort: next?.id, dir: next?.desc ? "desc" : undefined });
          },
          pagination,
          onPaginationChange: (updater) => {
            const next = apply(updater, pagination);
            update({ page: next.pageIndex + 1 === 1 ? undefined : next.pageIndex + 1, pageSize: next.pageSize === 25 ? undefined : next.pageSize }, false);
          },
        }}
      />

      <CutterFormSheet
        shopId={shop.shopId}
        open={editing !== null}
        onClose={() => setEditing(null)}
        cutter={editing === "new" ? null : editing}
        mayApprove={curator}
        onSaved={(saved, created) => {
          setEditing(null);
          setNotice({
            tone: "ok",
            text: created ? `${saved.name} was added as ${statusLabels[saved.status].toLowerCase()}.` : `Saved ${saved.name}.`,
          });
        }}
      />
      <CutterDetailsSheet cutter={viewing} onClose={() => setViewing(null)} />
      <ImportCuttersSheet
        shopId={shop.shopId}
        open={importing}
        onClose={() => setImporting(false)}
        onImported={(count) => setNotice({ tone: "ok", text: `Imported ${count} ${count === 1 ? "cutter" : "cutters"} from the CSV file.` })}
      />
      <DeleteCutterDialog
        cutter={deleting}
        onClose={() => setDeleting(null)}
        pending={remove.isPending}
        error={remove.error}
        onConfirm={(c) =>
          remove.mutate(c.id, {
            onSuccess: () => {
              setDeleting(null);
              setNotice({ tone: "ok", text: `${c.name} was deleted. Tick “Deleted cutters” to find and restore it.` });
            },
          })
        }
        onRetire={(c) => {
          setDeleting(null);
          void onAction(c, { kind: "transition", to: "retired" as CutterStatus });
        }}
      />
    </div>
  );
}

function DeleteCutterDialog({
  cutter,
  onClose,
  onConfirm,
  onRetire,
  pending,
  error,
}: {
  cutter: Cutter | null;
  onClose: () => void;
  onConfirm: (c: Cutter) => void;
  onRetire: (c: Cutter) => void;
  pending: boolean;
  error: Error | null;
}) {
  // A cutter that recipes still use is refused (409): say so and offer retiring it instead.
  const refusal = error ? error.message : null;
  const inUse = isApiError(error) && error.status === 409;
  return (
    <ConfirmDialog
      open={cutter !== null}
      onClose={onClose}
      title={cutter ? `Delete ${cutter.name}?` : "Delete cutter?"}
      confirmLabel="Delete cutter"
      danger
      pending={pending}
      onConfirm={() => cutter && onConfirm(cutter)}
      error={refusal}
      alternative={
        inUse && cutter && cutter.status !== "retired" ? (
          <Button variant="secondary" size="sm" onClick={() => onRetire(cutter)}>
            Retire it instead
          </Button>
        ) : undefined
      }
    >
      <p>
        The cutter leaves the list and goes to the shop's bin, from where it can be restored. A cutter that recipes still use
        cannot be deleted; retire it instead, so those recipes keep their history.
      </p>
    </ConfirmDialog>
  );
}
