import type { Assembly } from "@ringdown/contracts";
import type { ColumnDef } from "@tanstack/react-table";
import { Plus, TriangleAlert, Wrench } from "lucide-react";
import { useMemo, useState } from "react";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { DataTable } from "@/components/ui/data-table";
import { EmptyState } from "@/components/ui/empty-state";
import { MeasureValue } from "@/components/ui/measure";
import { Notice } from "@/components/ui/page-header";
import { measures } from "@/components/ui/units";
import { useActiveShop } from "@/lib/active-shop";
import { useDeleteAssembly } from "../api/delete-assembly";
import { useAssemblies } from "../api/get-assemblies";
import { useCutterChoices } from "../api/get-cutter-choices";
import { canEditAssemblies, runoutIsLarge } from "../runout";
import { AssemblyFormSheet } from "./assembly-form-sheet";

/** The cutter assemblies on one machine: what its recipes are computed for. */
export function MachineAssemblies({ machineId, machineName }: { machineId: string; machineName: string }) {
  const shop = useActiveShop();
  const shopId = shop?.shopId ?? "";
  const mayEdit = shop ? canEditAssemblies(shop.role) : false;
  const list = useAssemblies(shopId, { machineId });
  const cutters = useCutterChoices(shopId);
  const remove = useDeleteAssembly(shopId);
  const [editing, setEditing] = useState<Assembly | "new" | null>(null);
  const [deleting, setDeleting] = useState<Assembly | null>(null);
  const [notice, setNotice] = useState<string | null>(null);

  const cutterList = useMemo(() => cutters.data?.items ?? [], [cutters.data]);
  const diameterOf = useMemo(() => {
    const map = new Map(cutterList.map((c) => [c.id, c.diameterMm]));
    return (a: Assembly) => a.cutterDiameterMm ?? map.get(a.cutterId);
  }, [cutterList]);
  const nameOf = useMemo(() => {
    const map = new Map(cutterList.map((c) => [c.id, c.name]));
    return (a: Assembly) => a.cutterName ?? map.get(a.cutterId) ?? "Unknown cutter";
  }, [cutterList]);

  const columns = useMemo<Array<ColumnDef<Assembly, unknown>>>(
    () => [
      {
        id: "cutter",
        header: "Cutter",
        accessorFn: (a) => nameOf(a),
        cell: ({ row }) => (
          <div className="min-w-44">
            <div className="font-medium text-ink">{nameOf(row.original)}</div>
            {row.original.cutterStatus && row.original.cutterStatus !== "approved" && (
              <Badge tone={row.original.cutterStatus === "proposed" ? "near" : "neutral"} className="mt-0.5">
                Cutter {row.original.cutterStatus}
              </Badge>
            )}
          </div>
        ),
      },
      {
        id: "diameter",
        header: "Diameter",
        meta: { numeric: true },
        accessorFn: (a) => diameterOf(a),
        cell: ({ getValue }) => <MeasureValue value={getValue() as number | undefined} measure={measures.length} />,
      },
      { id: "holder", header: "Holder", accessorKey: "holder" },
      {
        id: "stickout",
        header: "Stick-out",
        meta: { numeric: true },
        accessorKey: "stickoutMm",
        cell: ({ row }) => <MeasureValue value={row.original.stickoutMm} measure={measures.length} />,
      },
      {
        id: "runout",
        header: "Runout (TIR)",
        meta: { numeric: true },
        accessorKey: "runoutMm",
        cell: ({ row }) => {
          const large = runoutIsLarge(row.original.runoutMm, diameterOf(row.original));
          return (
            <span className="inline-flex items-center justify-end gap-1.5">
              {large && (
                <span className="inline-flex items-center gap-1 text-xs font-medium text-[#8a5a12]">
                  <TriangleAlert className="size-3.5" aria-hidden /> large
                </span>
              )}
              <MeasureValue value={row.original.runoutMm} measure={measures.length} />
            </span>
          );
        },
      },
    ],
    [diameterOf, nameOf],
  );

  const largeCount = (list.data?.items ?? []).filter((a) => runoutIsLarge(a.runoutMm, diameterOf(a))).length;

  return (
    <section aria-labelledby="assemblies-heading" className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h2 id="assemblies-heading" className="text-base font-semibold text-ink">
            Cutter assemblies
          </h2>
          <p className="mt-0.5 max-w-prose text-sm text-muted">
            A cutter in a holder at a stick-out, with its measured runout. Recipes on this machine are computed for an assembly, not a bare cutter.
          </p>
        </div>
        {mayEdit && (
          <Button variant="secondary" onClick={() => setEditing("new")}>
            <Plus className="size-4" aria-hidden /> Add assembly
          </Button>
        )}
      </div>
      {largeCount > 0 && (
        <Notice tone="near">
          <span className="inline-flex items-start gap-2">
            <TriangleAlert className="mt-0.5 size-4 shrink-0 text-[#8a5a12]" aria-hidden />
            {largeCount === 1 ? "One assembly has" : `${largeCount} assemblies have`} large runout for the cutter's size: one flute takes most
            of the cut and small cutters break. Reseat or clean the collet and measure again.
          </span>
        </Notice>
      )}
      {notice && <Notice onDismiss={() => setNotice(null)}>{notice}</Notice>}
      <DataTable
        label={`Cutter assemblies on ${machineName}`}
        columns={columns}
        data={list.data?.items}
        getRowId={(a) => a.id}
        isLoading={list.isPending}
        error={list.isError ? list.error : null}
        onRetry={() => void list.refetch()}
        initialSorting={[{ id: "diameter", desc: false }]}
        maxHeightClassName="max-h-[60vh]"
        empty={
          <EmptyState
            icon={Wrench}
            title="No cutter assemblies on this machine yet"
            action={
              mayEdit && (
                <Button onClick={() => setEditing("new")}>
                  <Plus className="size-4" aria-hidden /> Add assembly
                </Button>
              )
            }
          >
            <p>Put a cutter in a holder, measure its stick-out and runout, and record it here before planning cuts on this machine.</p>
          </EmptyState>
        }
        rowActions={
          mayEdit
            ? (a) => (
                <>
                  <Button size="sm" variant="quiet" aria-label={`Edit assembly of ${nameOf(a)} in ${a.holder}`} onClick={() => setEditing(a)}>
                    Edit
                  </Button>
                  <Button
                    size="sm"
                    variant="quiet"
                    aria-label={`Delete assembly of ${nameOf(a)} in ${a.holder}`}
                    onClick={() => {
                      remove.reset();
                      setDeleting(a);
                    }}
                  >
                    Delete
                  </Button>
                </>
              )
            : undefined
        }
      />
      <AssemblyFormSheet
        shopId={shopId}
        machineId={machineId}
        machineName={machineName}
        open={editing !== null}
        assembly={editing === "new" ? null : editing}
        cutters={cutterList}
        cuttersLoading={cutters.isPending}
        cuttersError={cutters.isError ? cutters.error.message : null}
        onRetryCutters={() => void cutters.refetch()}
        onClose={() => setEditing(null)}
        onSaved={(saved, created) => {
          setEditing(null);
          setNotice(`${created ? "Added" : "Saved"} the assembly of ${nameOf(saved)} in ${saved.holder}.`);
        }}
      />
      <ConfirmDialog
        open={deleting !== null}
        onClose={() => setDeleting(null)}
        title="Delete this assembly?"
        confirmLabel="Delete assembly"
        danger
        pending={remove.isPending}
        error={remove.error?.message ?? null}
        onConfirm={() =>
          deleting &&
          remove.mutate(deleting.id, {
            onSuccess: () => {
              setNotice(`Deleted the assembly of ${nameOf(deleting)} in ${deleting.holder}.`);
              setDeleting(null);
            },
          })
        }
      >
        <p>
          {deleting ? `${nameOf(deleting)} in ${deleting.holder}` : "The assembly"} leaves this machine's list. An assembly that
          recipes use cannot be deleted.
        </p>
      </ConfirmDialog>
    </section>
  );
}
