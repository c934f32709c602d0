import type { Machine, RecheckOutcome, StiffnessReading, UnitSystem } from "@ringdown/contracts";
import type { ColumnDef } from "@tanstack/react-table";
import { Gauge, Plus, Trash2 } from "lucide-react";
import { useMemo, useState } from "react";
import { Button } from "@/components/ui/button";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { DataTable } from "@/components/ui/data-table";
import { EmptyState } from "@/components/ui/empty-state";
import { MeasureValue } from "@/components/ui/measure";
import { LoadingState } from "@/components/ui/spinner";
import { formatMeasure, measures } from "@/components/ui/units";
import { useDeleteStiffnessReading } from "../api/delete-stiffness-reading";
import { useStiffnessMap } from "../api/get-stiffness-map";
import { useStiffnessReadings } from "../api/get-stiffness-readings";
import { formatDate } from "../lib/dates";
import { StiffnessHeatMap } from "./stiffness-heat-map";
import { forceMeasure, StiffnessReadingSheet } from "./stiffness-reading-sheet";

/** Dial-indicator stiffness: the map of the bed, the readings behind it, and the form to add one. */
export function StiffnessSection({
  shopId,
  machine,
  mayEdit,
  system,
  onOutcome,
}: {
  shopId: string;
  machine: Machine;
  mayEdit: boolean;
  system: UnitSystem;
  onOutcome: (saved: string, outcome: RecheckOutcome) => void;
}) {
  const readings = useStiffnessReadings(shopId, machine.id);
  const map = useStiffnessMap(shopId, machine.id);
  const remove = useDeleteStiffnessReading(shopId, machine.id);
  const [adding, setAdding] = useState(false);
  const [deleting, setDeleting] = useState<StiffnessReading | null>(null);

  const columns = useMemo<Array<ColumnDef<StiffnessReading, unknown>>>(
    () => [
      { id: "measuredAt", header: "Measured", accessorKey: "measuredAt", cell: ({ row }) => <span className="tabular whitespace-nowrap">{formatDate(row.original.measuredAt)}</span> },
      { id: "direction", header: "Direction", accessorKey: "direction", cell: ({ row }) => row.original.direction.toUpperCase() },
      { id: "x", header: "X", meta: { numeric: true }, accessorKey: "xMm", cell: ({ row }) => <MeasureValue value={row.original.xMm} measure={measures.length} /> },
      { id: "y", header: "Y", meta: { numeric: true }, accessorKey: "yMm", cell: ({ row }) => <MeasureValue value={row.original.yMm} measure={measures.length} /> },
      { id: "z", header: "Z", meta: { numeric: true }, accessorKey: "zMm", cell: ({ row }) => <MeasureValue value={row.original.zMm} measure={measures.length} /> },
      { id: "force", header: "Force", meta: { numeric: true }, accessorKey: "forceN", cell: ({ row }) => <MeasureValue value={row.original.forceN} measure={forceMeasure} /> },
      {
        id: "deflection",
        header: "Deflection",
        meta: { numeric: true },
        accessorKey: "deflectionMm",
        cell: ({ row }) => <MeasureValue value={row.original.deflectionMm} measure={measures.length} />,
      },
      {
        id: "stiffness",
        header: "Stiffness F/δ",
        meta: { numeric: true },
        accessorKey: "stiffnessNPerMm",
        cell: ({ row }) => <MeasureValue value={row.original.stiffnessNPerMm} measure={measures.stiffness} />,
      },
      { id: "note", header: "Note", accessorKey: "note", enableSorting: false, cell: ({ row }) => <span className="text-muted">{row.original.note || "—"}</span> },
    ],
    [],
  );

  return (
    <Card>
      <CardHeader
        title="Stiffness across the bed"
        description="Measured with a known push and a dial indicator. The machine's stiffness in each direction is the softest place on the map."
        actions={
          mayEdit && (
            <Button variant="secondary" onClick={() => setAdding(true)}>
              <Plus className="size-4" aria-hidden /> Add reading
            </Button>
          )
        }
      />
      <CardBody className="flex flex-col gap-6">
        <div className="grid gap-3 sm:grid-cols-3">
          {(["x", "y", "z"] as const).map((d) => {
            const dir = map.data?.directions.find((m) => m.direction === d);
            return (
              <div key={d} className="rounded-md border border-rule bg-paper/60 px-3 py-2">
                <p className="text-xs text-muted">Machine stiffness {d.toUpperCase()}</p>
                <p className="text-lg">
                  <MeasureValue value={dir?.machineNPerMm ?? machine.axes[d].stiffnessNPerMm} measure={measures.stiffness} />
                </p>
                <p className="text-xs text-muted">
                  {dir && dir.pointCount > 0
                    ? `worst case of ${dir.pointCount} position${dir.pointCount === 1 ? "" : "s"}`
                    : machine.estimatedFields.includes(`axes.${d}.stiffnessNPerMm`)
                      ? "estimate: not measured yet"
                      : "entered on the machine, no readings"}
                </p>
              </div>
            );
          })}
        </div>

        {map.isPending ? (
          <LoadingState label="Loading the stiffness map…" />
        ) : map.isError ? (
          <p role="alert" className="text-sm text-limit">
            Cannot load the stiffness map: {map.error.message}
          </p>
        ) : (
          <StiffnessHeatMap map={map.data} system={system} />
        )}

        <div className="flex flex-col gap-2">
          <h3 className="text-sm font-semibold text-ink">Readings</h3>
          <DataTable
            label={`Stiffness readings on ${machine.name}`}
            columns={columns}
            data={readings.data?.items}
            getRowId={(r) => r.id}
            isLoading={readings.isPending}
            error={readings.isError ? readings.error : null}
            onRetry={() => void readings.refetch()}
            initialSorting={[{ id: "measuredAt", desc: true }]}
            pageSize={10}
            maxHeightClassName="max-h-[50vh]"
            rowActions={
              mayEdit
                ? (r) => (
                    <Button variant="quiet" size="sm" onClick={() => setDeleting(r)} aria-label={`Delete the reading of ${formatDate(r.measuredAt)} in ${r.direction.toUpperCase()}`}>
                      <Trash2 className="size-4" aria-hidden /> Delete
                    </Button>
                  )
                : undefined
            }
            empty={
              <EmptyState
                icon={Gauge}
                title="No stiffness readings yet"
                action={
                  mayEdit && (
                    <Button onClick={() => setAdding(true)}>
                      <Plus className="size-4" aria-hidden /> Add the first stiffness reading
                    </Button>
                  )
                }
              >
                <p>
                  Clamp a dial indicator to the bed, push the spindle with a known force in X, then Y, and note how far it moves. Repeat at the
                  corners and the middle of the bed: belts and long beams are softer far from their supports.
                </p>
              </EmptyState>
            }
          />
        </div>
      </CardBody>

      {adding && (
        <StiffnessReadingSheet
          shopId={shopId}
          machine={machine}
          open={adding}
          onClose={() => setAdding(false)}
          onSaved={(result) => {
            setAdding(false);
            onOutcome(
              `Added a reading of ${formatMeasure(result.reading.stiffnessNPerMm, measures.stiffness, system)} in ${result.reading.direction.toUpperCase()}.`,
              result,
            );
          }}
        />
      )}
      <ConfirmDialog
        open={deleting !== null}
        onClose={() => {
          setDeleting(null);
          remove.reset();
        }}
        title="Delete this stiffness reading?"
        confirmLabel="Delete reading"
        danger
        pending={remove.isPending}
        error={remove.error?.message ?? null}
        onConfirm={() => {
          if (!deleting) return;
          remove.mutate(deleting.id, {
            onSuccess: (result) => {
              setDeleting(null);
              onOutcome(`Deleted the reading of ${formatDate(result.reading.measuredAt)} in ${result.reading.direction.toUpperCase()}.`, result);
            },
          });
        }}
      >
        {deleting && (
          <p>
            {formatDate(deleting.measuredAt)}, {deleting.direction.toUpperCase()} at X {formatMeasure(deleting.xMm, measures.length, system)}, Y{" "}
            {formatMeasure(deleting.yMm, measures.length, system)}: {formatMeasure(deleting.stiffnessNPerMm, measures.stiffness, system)}. The map and the
            machine's stiffness are worked out again from the remaining readings.
          </p>
        )}
      </ConfirmDialog>
    </Card>
  );
}
