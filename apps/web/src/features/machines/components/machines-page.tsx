import { machineKinds, type Machine, type MachineKind } from "@ringdown/contracts";
import type { ColumnDef } from "@tanstack/react-table";
import { Factory, Plus } from "lucide-react";
import { useMemo, useState } from "react";
import { Link, useNavigate, useSearchParams } from "react-router-dom";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { DataTable } from "@/components/ui/data-table";
import { Dialog } from "@/components/ui/dialog";
import { EmptyState } from "@/components/ui/empty-state";
import { MeasureValue } from "@/components/ui/measure";
import { Notice, PageHeader } from "@/components/ui/page-header";
import { formatMeasureNumber, measures } from "@/components/ui/units";
import { useActiveShop } from "@/lib/active-shop";
import { useUnitSystem } from "@/lib/auth";
import { NUMBER_UNIT_SPACE } from "@/lib/format";
import { useDocumentTitle } from "@/lib/use-document-title";
import { useDeleteMachine } from "../api/delete-machine";
import { useMachines } from "../api/get-machines";
import { useRestoreMachine } from "../api/restore-machine";
import { canEditMachines, kindLabels } from "../labels";

const kindHints: Record<MachineKind, string> = {
  gantry_router: "Belt or screw driven gantry over a table; light, fast, soft in Y.",
  bench_mill: "Small column mill on a bench; stiffer, slower spindle.",
  knee_mill: "Floor-standing mill with a knee and a ram head.",
  machining_centre: "Enclosed machine with ball screws and a tool changer.",
  other: "Anything else; starts from middle-of-the-road values.",
};

function SpindleRange({ m }: { m: Machine }) {
  const system = useUnitSystem();
  return (
    <span className="tabular whitespace-nowrap">
      <span className="font-medium text-ink">
        {formatMeasureNumber(m.spindle.minRpm, measures.rpm, system)}–{formatMeasureNumber(m.spindle.maxRpm, measures.rpm, system)}
      </span>
      <span className="text-muted">{NUMBER_UNIT_SPACE}rpm</span>
    </span>
  );
}

/** Choose the kind of machine; the new-machine page then starts from that kind's estimates. */
function NewMachineDialog({ open, onClose }: { open: boolean; onClose: () => void }) {
  const navigate = useNavigate();
  const [kind, setKind] = useState<MachineKind>("gantry_router");
  return (
    <Dialog open={open} onClose={onClose} title="Add a machine" description="Pick the kind of machine. Ringdown fills in typical values for it, each marked as an estimate until you measure.">
      <form
        onSubmit={(event) => {
          event.preventDefault();
          navigate(`/machines/new?kind=${kind}`);
        }}
        className="flex flex-col gap-4"
      >
        <fieldset className="flex flex-col gap-1">
          <legend className="sr-only">Kind of machine</legend>
          {machineKinds.map((k) => (
            <label key={k} className="flex cursor-pointer items-start gap-3 rounded-md border border-transparent px-3 py-2 hover:bg-paper has-[:checked]:border-brand/40 has-[:checked]:bg-brand-tint">
              <input type="radio" name="kind" value={k} checked={kind === k} onChange={() => setKind(k)} className="mt-1 size-4 accent-brand" />
              <span>
                <span className="block text-sm font-medium text-ink">{kindLabels[k]}</span>
                <span className="block text-xs text-muted">{kindHints[k]}</span>
              </span>
            </label>
          ))}
        </fieldset>
        <div className="flex justify-end gap-2">
          <Button variant="secondary" onClick={onClose}>
            Cancel
          </Button>
          <Button type="submit">Continue</Button>
        </div>
      </form>
    </Dialog>
  );
}

export function MachinesPage() {
  useDocumentTitle("Machines");
  const shop = useActiveShop();
  const shopId = shop?.shopId ?? "";
  const mayEdit = shop ? canEditMachines(shop.role) : false;
  const [search, setSearch] = useSearchParams();
  const deleted = search.get("deleted") === "true";
  const list = useMachines(shopId, { deleted });
  const remove = useDeleteMachine(shopId);
  const restore = useRestoreMachine(shopId);
  const [adding, setAdding] = useState(false);
  const [deleting, setDeleting] = useState<Machine | null>(null);
  const [notice, setNotice] = useState<{ tone: "ok" | "limit"; text: string } | null>(null);

  const columns = useMemo<Array<ColumnDef<Machine, unknown>>>(
    () => [
      {
        id: "name",
        header: "Name",
        accessorKey: "name",
        cell: ({ row }) =>
          row.original.deletedAt ? (
            <span className="font-medium">{row.original.name}</span>
          ) : (
            <Link to={`/machines/${row.original.id}`} className="font-medium text-ink hover:text-brand hover:underline">
              {row.original.name}
            </Link>
          ),
      },
      { id: "kind", header: "Kind", accessorFn: (m) => kindLabels[m.kind], meta: { className: "whitespace-nowrap" } },
      { id: "spindle", header: "Spindle", meta: { numeric: true }, accessorFn: (m) => m.spindle.maxRpm, cell: ({ row }) => <SpindleRange m={row.original} /> },
      { id: "power", header: "Power", meta: { numeric: true }, accessorFn: (m) => m.spindle.powerW, cell: ({ getValue }) => <MeasureValue value={getValue() as number} measure={measures.power} /> },
      ...(["x", "y", "z"] as const).map<ColumnDef<Machine, unknown>>((axis) => ({
        id: `stiffness-${axis}`,
        header: `Stiffness ${axis.toUpperCase()}`,
        meta: { numeric: true },
        accessorFn: (m) => m.axes[axis].stiffnessNPerMm,
        cell: ({ getValue }) => <MeasureValue value={getValue() as number} measure={measures.stiffness} />,
      })),
      {
        id: "modes",
        header: "Modes",
        meta: { numeric: true },
        accessorFn: (m) => m.modes.length,
        cell: ({ row }) => {
          const n = row.original.modes.length;
          const measured = row.original.modes.filter((x) => x.source === "measured" || x.source === "fitted").length;
          return (
            <span className="tabular">
              {n}
              {n > 0 && <span className="text-muted"> ({measured} measured)</span>}
            </span>
          );
        },
      },
      {
        id: "estimates",
        header: "Estimates",
        meta: { numeric: true },
        accessorFn: (m) => m.estimatedFields.length,
        cell: ({ row }) => {
          const n = row.original.estimatedFields.length;
          return n === 0 ? <Badge tone="ok">None</Badge> : <Badge tone="near" title="Values still at the defaults for this kind of machine">{n} to measure</Badge>;
        },
      },
    ],
    [],
  );

  if (!shop) return null;
  return (
    <div className="mx-auto flex max-w-7xl flex-col gap-5">
      <PageHeader
        title="Machines"
        description="Each machine's spindle, axes, stiffness and vibration modes. Every recipe is held within these figures, so measured values beat estimates."
        actions={
          mayEdit && (
            <Button onClick={() => setAdding(true)}>
              <Plus className="size-4" aria-hidden /> Add machine
            </Button>
          )
        }
      />
      {mayEdit && (
        <label className="flex cursor-pointer items-center gap-2 self-start text-sm text-ink">
          <input
            type="checkbox"
            checked={deleted}
            onChange={(e) => setSearch(e.target.checked ? { deleted: "true" } : {}, { replace: true })}
            className="size-4 accent-brand"
          />
          Deleted machines
        </label>
      )}
      {notice && (
        <Notice tone={notice.tone} onDismiss={() => setNotice(null)}>
          {notice.text}
        </Notice>
      )}
      <DataTable
        label={deleted ? "Deleted machines" : "Machines"}
        columns={columns}
        data={list.data?.items}
        getRowId={(m) => m.id}
        isLoading={list.isPending}
        isFetching={list.isFetching && !list.isPending}
        error={list.isError ? list.error : null}
        onRetry={() => void list.refetch()}
        initialSorting={[{ id: "name", desc: false }]}
        empty={
          deleted ? (
            <EmptyState icon={Factory} title="No deleted machines">
              <p>Deleted machines wait here until they are restored.</p>
            </EmptyState>
          ) : (
            <EmptyState
              icon={Factory}
              title="No machines yet"
              action={
                mayEdit && (
                  <Button onClick={() => setAdding(true)}>
                    <Plus className="size-4" aria-hidden /> Add machine
                  </Button>
                )
              }
            >
              <p>
                Add the shop's routers and mills. Start from typical values for the kind of machine, then replace them with
                measurements: stiffness with a dial indicator, modes from a tap test.
              </p>
            </EmptyState>
          )
        }
        rowActions={
          mayEdit
            ? (m) =>
                m.deletedAt ? (
                  <Button
                    size="sm"
                    variant="secondary"
                    aria-label={`Restore ${m.name}`}
                    pending={restore.isPending && restore.variables === m.id}
                    onClick={() =>
                      restore.mutate(m.id, {
                        onSuccess: (r) => setNotice({ tone: "ok", text: `${r.name} is back in the machine list.` }),
                        onError: (e) => setNotice({ tone: "limit", text: e.message }),
                      })
                    }
                  >
                    Restore
                  </Button>
                ) : (
                  <Button
                    size="sm"
                    variant="quiet"
                    aria-label={`Delete ${m.name}`}
                    onClick={() => {
                      remove.reset();
                      setDeleting(m);
                    }}
                  >
                    Delete
                  </Button>
                )
            : undefined
        }
      />
      <NewMachineDialog open={adding} onClose={() => setAdding(false)} />
      <ConfirmDialog
        open={deleting !== null}
        onClose={() => setDeleting(null)}
        title={deleting ? `Delete ${deleting.name}?` : "Delete machine?"}
        confirmLabel="Delete machine"
        danger
        pending={remove.isPending}
        error={remove.error?.message ?? null}
        onConfirm={() =>
          deleting &&
          remove.mutate(deleting.id, {
            onSuccess: () => {
              setNotice({ tone: "ok", text: `${deleting.name} was deleted. Tick “Deleted machines” to find and restore it.` });
              setDeleting(null);
            },
          })
        }
      >
        <p>The machine goes to the shop's bin, from where it can be restored. A machine with cutter assemblies or recipes cannot be deleted.</p>
      </ConfirmDialog>
    </div>
  );
}
