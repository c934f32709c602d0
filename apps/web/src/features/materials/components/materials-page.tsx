import { materialGroupSchema, type Material } from "@ringdown/contracts";
import type { ColumnDef } from "@tanstack/react-table";
import { Boxes, Plus, Search } from "lucide-react";
import { useEffect, useId, useMemo, useState } from "react";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { DataTable } from "@/components/ui/data-table";
import { EmptyState } from "@/components/ui/empty-state";
import { Input } from "@/components/ui/field";
import { MeasureValue } from "@/components/ui/measure";
import { Notice, PageHeader } from "@/components/ui/page-header";
import { Select } from "@/components/ui/select";
import { formatMeasureNumber, measures, unitOf } from "@/components/ui/units";
import { useActiveShop } from "@/lib/active-shop";
import { useUnitSystem } from "@/lib/auth";
import { NUMBER_UNIT_SPACE } from "@/lib/format";
import { useDocumentTitle } from "@/lib/use-document-title";
import { useListSearchParams } from "@/lib/use-list-search-params";
import { useCopyMaterial } from "../api/copy-material";
import { useDeleteMaterial } from "../api/delete-material";
import { useMaterials, type MaterialListParams } from "../api/get-materials";
import { useRestoreMaterial } from "../api/restore-material";
import { canEditMaterials, groupLabels, groupOptions, originLabels } from "../labels";
import { MaterialDetailsSheet } from "./material-details-sheet";
import { MaterialFormSheet } from "./material-form-sheet";

const scopeOptions = [
  { value: "global", label: originLabels.global },
  { value: "shop", label: originLabels.shop },
];

/** "150–1 000 m/min": a range with one unit. */
function SpeedRange({ min, max }: { min: number; max: number }) {
  const system = useUnitSystem();
  return (
    <span className="tabular whitespace-nowrap">
      <span className="font-medium text-ink">
        {formatMeasureNumber(min, measures.cuttingSpeed, system)}–{formatMeasureNumber(max, measures.cuttingSpeed, system)}
      </span>
      <span className="text-muted">
        {NUMBER_UNIT_SPACE}
        {unitOf(measures.cuttingSpeed, system)}
      </span>
    </span>
  );
}

export function MaterialsPage() {
  useDocumentTitle("Materials");
  const shop = useActiveShop();
  const shopId = shop?.shopId ?? "";
  const mayEdit = shop ? canEditMaterials(shop.role) : false;
  const { search, update } = useListSearchParams();
  const id = useId();

  const group = materialGroupSchema.safeParse(search.get("group"));
  const scopeParam = search.get("scope");
  const scope = scopeParam === "global" || scopeParam === "shop" ? scopeParam : undefined;
  const deleted = search.get("deleted") === "true";
  const q = search.get("q") ?? "";
  const [text, setText] = useState(q);
  useEffect(() => setText(q), [q]);

  // The list has no pages: nothing to reset.
  const setParam = (key: string, value: string) => update({ [key]: value }, false);
  useEffect(() => {
    if (text === q) return;
    const timer = setTimeout(() => setParam("q", text), 300);
    return () => clearTimeout(timer);
  }, [text, q]);

  const params: MaterialListParams = {
    group: group.success ? group.data : undefined,
    scope: deleted ? "shop" : scope,
    q: q || undefined,
    deleted,
  };
  const list = useMaterials(shopId, params);
  const copy = useCopyMaterial(shopId);
  const remove = useDeleteMaterial(shopId);
  const restore = useRestoreMaterial(shopId);

  const [viewing, setViewing] = useState<Material | null>(null);
  const [editing, setEditing] = useState<Material | "new" | null>(null);
  const [deleting, setDeleting] = useState<Material | null>(null);
  const [notice, setNotice] = useState<{ tone: "ok" | "limit"; text: string } | null>(null);

  const onCopy = (m: Material) =>
    copy.mutate(m.id, {
      onSuccess: (created) => {
        setViewing(null);
        setNotice({ tone: "ok", text: `Copied ${m.name} into the shop as “${created.name}”. Adjust it and say where the new numbers come from.` });
        setEditing(created);
      },
      onError: (error) => setNotice({ tone: "limit", text: error.message }),
    });

  const onRestore = (m: Material) =>
    restore.mutate(m.id, {
      onSuccess: (restored) => {
        setViewing(null);
        setNotice({ tone: "ok", text: `${restored.name} is back in the shop's materials.` });
      },
      onError: (error) => setNotice({ tone: "limit", text: error.message }),
    });

  const columns = useMemo<Array<ColumnDef<Material, unknown>>>(
    () => [
      {
        id: "name",
        header: "Name",
        accessorKey: "name",
        cell: ({ row }) => (
          <div className="min-w-48">
            <button
              type="button"
              onClick={() => setViewing(row.original)}
              aria-haspopup="dialog"
              className="cursor-pointer text-left font-medium text-ink underline decoration-rule underline-offset-2 hover:text-brand hover:decoration-brand"
            >
              {row.original.name}
            </button>
            {row.original.hardness && <div className="text-xs text-muted">{row.original.hardness}</div>}
          </div>
        ),
      },
      { id: "group", header: "Group", accessorFn: (m) => groupLabels[m.group], meta: { className: "whitespace-nowrap" } },
      {
        id: "origin",
        header: "Origin",
        meta: { className: "whitespace-nowrap" },
        accessorFn: (m) => (m.readOnly ? originLabels.global : originLabels.shop),
        cell: ({ row }) =>
          row.original.deletedAt ? (
            <Badge tone="limit">Deleted</Badge>
          ) : (
            <Badge tone={row.original.readOnly ? "neutral" : "brand"}>{row.original.readOnly ? originLabels.global : originLabels.shop}</Badge>
          ),
      },
      {
        id: "carbide",
        header: "Speed, carbide",
        meta: { numeric: true },
        accessorFn: (m) => m.cuttingSpeed.carbide.maxMPerMin,
        cell: ({ row }) => <SpeedRange min={row.original.cuttingSpeed.carbide.minMPerMin} max={row.original.cuttingSpeed.carbide.maxMPerMin} />,
      },
      {
        id: "hss",
        header: "Speed, HSS",
        meta: { numeric: true },
        accessorFn: (m) => m.cuttingSpeed.hss.maxMPerMin,
        cell: ({ row }) => <SpeedRange min={row.original.cuttingSpeed.hss.minMPerMin} max={row.original.cuttingSpeed.hss.maxMPerMin} />,
      },
      {
        id: "force",
        header: "kc1.1 or unit power",
        meta: { numeric: true },
        accessorFn: (m) => m.kc11NPerMm2 ?? undefined,
        sortUndefined: "last",
        cell: ({ row }) =>
          row.original.kc11NPerMm2 !== null ? (
            <MeasureValue value={row.original.kc11NPerMm2} measure={measures.specificForce} />
          ) : (
            <MeasureValue value={row.original.unitPowerJPerMm3} measure={measures.specificEnergy} />
          ),
      },
      {
        id: "minChip",
        header: "Min. chip",
        meta: { numeric: true },
        accessorKey: "minChipThicknessMm",
        cell: ({ row }) => <MeasureValue value={row.original.minChipThicknessMm} measure={measures.length} />,
      },
    ],
    [],
  );

  if (!shop) return null;
  const filtered = Boolean(q || group.success || scope);

  return (
    <div className="mx-auto flex max-w-7xl flex-col gap-5">
      <PageHeader
        title="Materials"
        description="Workpiece materials with their cutting speeds, chip loads and cutting-force constants, each with the source of its numbers. Ringdown's reference rows are read-only; copy one to adjust it for your shop."
        actions={
          mayEdit && (
            <Button onClick={() => setEditing("new")}>
              <Plus className="size-4" aria-hidden /> Add material
            </Button>
          )
        }
      />

      <div role="search" aria-label="Filter materials" className="flex flex-wrap items-end gap-3">
        <div className="flex min-w-56 flex-1 flex-col gap-1.5">
          <label htmlFor={`${id}-q`} className="text-xs font-medium text-muted">
            Search
          </label>
          <div className="relative">
            <Search aria-hidden className="pointer-events-none absolute top-1/2 left-3 size-4 -translate-y-1/2 text-muted" />
            <Input id={`${id}-q`} type="search" value={text} onChange={(e) => setText(e.target.value)} placeholder="Name or hardness…" className="pl-9" />
          </div>
        </div>
        <div className="flex min-w-36 flex-1 flex-col gap-1.5 sm:max-w-52">
          <label htmlFor={`${id}-group`} className="text-xs font-medium text-muted">
            Group
          </label>
          <Select id={`${id}-group`} value={group.success ? group.data : ""} onChange={(e) => setParam("group", e.target.value)} options={groupOptions} placeholder="Any group" />
        </div>
        <div className="flex min-w-36 flex-1 flex-col gap-1.5 sm:max-w-52">
          <label htmlFor={`${id}-scope`} className="text-xs font-medium text-muted">
            Origin
          </label>
          <Select id={`${id}-scope`} value={scope ?? ""} onChange={(e) => setParam("scope", e.target.value)} options={scopeOptions} placeholder="Any origin" disabled={deleted} />
        </div>
        {mayEdit && (
          <label className="flex h-10 cursor-pointer items-center gap-2 text-sm text-ink">
            <input type="checkbox" checked={deleted} onChange={(e) => setParam("deleted", e.target.checked ? "true" : "")} className="size-4 accent-brand" />
            Deleted materials
          </label>
        )}
      </div>

      {notice && (
        <Notice tone={notice.tone} onDismiss={() => setNotice(null)}>
          {notice.text}
        </Notice>
      )}

      <DataTable
        label={deleted ? "Deleted materials" : "Materials"}
        columns={columns}
        data={list.data?.items}
        getRowId={(m) => m.id}
        isLoading={list.isPending}
        isFetching={list.isFetching && !list.isPending}
        error={list.isError ? list.error : null}
        onRetry={() => void list.refetch()}
        initialSorting={[{ id: "name", desc: false }]}
        pageSize={50}
        empty={
          deleted ? (
            <EmptyState icon={Boxes} title="No deleted materials">
              <p>The shop's deleted materials wait here until they are restored.</p>
            </EmptyState>
          ) : filtered ? (
            <EmptyState icon={Boxes} title="No materials match these filters">
              <p>Try another group or a shorter search.</p>
            </EmptyState>
          ) : (
            <EmptyState icon={Boxes} title="No materials">
              <p>Ringdown's reference materials could not be listed. Reload the page; if it persists, report it.</p>
            </EmptyState>
          )
        }
        rowActions={
          mayEdit
            ? (m) =>
                m.deletedAt ? (
                  <Button size="sm" variant="secondary" onClick={() => onRestore(m)} disabled={restore.isPending} aria-label={`Restore ${m.name}`}>
                    Restore
                  </Button>
                ) : m.readOnly ? (
                  <Button size="sm" variant="quiet" onClick={() => onCopy(m)} disabled={copy.isPending} aria-label={`Copy ${m.name} to adjust`}>
                    Copy to adjust
                  </Button>
                ) : (
                  <Button size="sm" variant="quiet" onClick={() => setEditing(m)} aria-label={`Edit ${m.name}`}>
                    Edit
                  </Button>
                )
            : undefined
        }
      />
      {list.data && list.data.total > list.data.items.length && (
        <p className="text-sm text-muted">
          Showing the first {list.data.items.length} of {list.data.total} materials; narrow the list with the filters above.
        </p>
      )}

      <MaterialDetailsSheet
        material={viewing}
        onClose={() => setViewing(null)}
        mayEdit={mayEdit}
        busy={copy.isPending || restore.isPending}
        onCopy={onCopy}
        onEdit={(m) => {
          setViewing(null);
          setEditing(m);
        }}
        onDelete={(m) => {
          setViewing(null);
          remove.reset();
          setDeleting(m);
        }}
        onRestore={onRestore}
      />
      <MaterialFormSheet
        shopId={shopId}
        open={editing !== null}
        material={editing === "new" ? null : editing}
        onClose={() => setEditing(null)}
        onSaved={(saved, created) => {
          setEditing(null);
          setNotice({ tone: "ok", text: created ? `Added ${saved.name}.` : `Saved ${saved.name}.` });
        }}
      />
      <ConfirmDialog
        open={deleting !== null}
        onClose={() => setDeleting(null)}
        title={deleting ? `Delete ${deleting.name}?` : "Delete material?"}
        confirmLabel="Delete material"
        danger
        pending={remove.isPending}
        error={remove.error?.message ?? null}
        onConfirm={() =>
          deleting &&
          remove.mutate(deleting.id, {
            onSuccess: () => {
              setNotice({ tone: "ok", text: `${deleting.name} was deleted. Tick “Deleted materials” to find and restore it.` });
              setDeleting(null);
            },
          })
        }
      >
        <p>The material goes to the shop's bin, from where it can be restored. A material that recipes use cannot be deleted.</p>
      </ConfirmDialog>
    </div>
  );
}
