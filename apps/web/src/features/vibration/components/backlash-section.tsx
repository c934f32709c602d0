import { backlashReadingBodySchema, type BacklashReading, type BacklashReadingBody, type Machine, type RecheckOutcome, type UnitSystem } from "@ringdown/contracts";
import type { ColumnDef } from "@tanstack/react-table";
import { MoveHorizontal, Plus, Trash2 } from "lucide-react";
import { useId, useMemo, useState } from "react";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { DataTable } from "@/components/ui/data-table";
import { Dialog } from "@/components/ui/dialog";
import { EmptyState } from "@/components/ui/empty-state";
import { TextField } from "@/components/ui/field";
import { Form, FormError } from "@/components/ui/form";
import { MeasureValue } from "@/components/ui/measure";
import { NumberField } from "@/components/ui/number-field";
import { SelectField } from "@/components/ui/select";
import { TextareaField } from "@/components/ui/textarea";
import { formatMeasure, measures } from "@/components/ui/units";
import { useBacklashReadings, useCreateBacklashReading, useDeleteBacklashReading } from "../api/backlash-readings";
import { directionOptions } from "../labels";
import { formatDate, todayIso } from "../lib/dates";

/** Backlash per axis from a dial-indicator reversal test; the latest reading of an axis is the machine's value. */
export function BacklashSection({
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
  const list = useBacklashReadings(shopId, machine.id);
  const create = useCreateBacklashReading(shopId, machine.id);
  const remove = useDeleteBacklashReading(shopId, machine.id);
  const [adding, setAdding] = useState(false);
  const [deleting, setDeleting] = useState<BacklashReading | null>(null);
  const formId = useId();

  // The latest reading per axis is the machine's backlash.
  const latest = useMemo(() => {
    const ids = new Set<string>();
    for (const axis of ["x", "y", "z"] as const) {
      const newest = (list.data?.items ?? [])
        .filter((r) => r.axis === axis)
        .sort((a, b) => b.measuredAt.localeCompare(a.measuredAt) || b.createdAt.localeCompare(a.createdAt))[0];
      if (newest) ids.add(newest.id);
    }
    return ids;
  }, [list.data]);

  const columns = useMemo<Array<ColumnDef<BacklashReading, unknown>>>(
    () => [
      { id: "measuredAt", header: "Measured", accessorKey: "measuredAt", cell: ({ row }) => <span className="tabular whitespace-nowrap">{formatDate(row.original.measuredAt)}</span> },
      {
        id: "axis",
        header: "Axis",
        accessorKey: "axis",
        cell: ({ row }) => (
          <span className="inline-flex items-center gap-2">
            {row.original.axis.toUpperCase()}
            {latest.has(row.original.id) && <Badge tone="measured">in use</Badge>}
          </span>
        ),
      },
      {
        id: "backlash",
        header: "Backlash",
        meta: { numeric: true },
        accessorKey: "backlashMm",
        cell: ({ row }) => <MeasureValue value={row.original.backlashMm} measure={measures.length} />,
      },
      { id: "note", header: "Note", accessorKey: "note", enableSorting: false, cell: ({ row }) => <span className="text-muted">{row.original.note || "—"}</span> },
    ],
    [latest],
  );

  const defaults: BacklashReadingBody = { axis: "x", backlashMm: Number.NaN, note: "", measuredAt: todayIso() };

  return (
    <Card>
      <CardHeader
        title="Backlash"
        description={`Reversal test: approach a dial indicator, zero it, reverse the axis by a small move and back; the lost motion is the backlash. In use now: X ${formatMeasure(machine.axes.x.backlashMm, measures.length, system)}, Y ${formatMeasure(machine.axes.y.backlashMm, measures.length, system)}, Z ${formatMeasure(machine.axes.z.backlashMm, measures.length, system)}.`}
        actions={
          mayEdit && (
            <Button variant="secondary" onClick={() => setAdding(true)}>
              <Plus className="size-4" aria-hidden /> Add reading
            </Button>
          )
        }
      />
      <CardBody>
        <DataTable
          label={`Backlash readings on ${machine.name}`}
          columns={columns}
          data={list.data?.items}
          getRowId={(r) => r.id}
          isLoading={list.isPending}
          error={list.isError ? list.error : null}
          onRetry={() => void list.refetch()}
          initialSorting={[{ id: "measuredAt", desc: true }]}
          pageSize={10}
          maxHeightClassName="max-h-[40vh]"
          rowActions={
            mayEdit
              ? (r) => (
                  <Button variant="quiet" size="sm" onClick={() => setDeleting(r)} aria-label={`Delete the ${r.axis.toUpperCase()} backlash reading of ${formatDate(r.measuredAt)}`}>
                    <Trash2 className="size-4" aria-hidden /> Delete
                  </Button>
                )
              : undefined
          }
          empty={
            <EmptyState
              icon={MoveHorizontal}
              title="No backlash readings yet"
              action={
                mayEdit && (
                  <Button onClick={() => setAdding(true)}>
                    <Plus className="size-4" aria-hidden /> Add the first backlash reading
                  </Button>
                )
              }
            >
              <p>Backlash decides whether climb milling is safe on this machine: a loose axis lets the cutter pull the table into the cut.</p>
            </EmptyState>
          }
        />
      </CardBody>

      <Dialog open={adding} onClose={() => setAdding(false)} title="Add a backlash reading" description={`On ${machine.name}.`}>
        <Form
          id={formId}
          aria-label="New backlash reading"
          schema={backlashReadingBodySchema}
          defaultValues={defaults}
          className="flex flex-col gap-4"
          onSubmit={async (values) => {
            const result = await create.mutateAsync(values);
            setAdding(false);
            onOutcome(`Added a backlash reading of ${formatMeasure(result.reading.backlashMm, measures.length, system)} on ${result.reading.axis.toUpperCase()}.`, result);
          }}
        >
          {() => (
            <>
              <FormError />
              <div className="grid grid-cols-2 gap-3">
                <SelectField name="axis" label="Axis" options={directionOptions} />
                <NumberField name="backlashMm" label="Backlash" measure={measures.length} />
              </div>
              <TextField name="measuredAt" type="date" label="Measured on" max={todayIso()} />
              <TextareaField name="note" label="Note" rows={2} />
              <div className="flex justify-end gap-2">
                <Button variant="secondary" onClick={() => setAdding(false)}>
                  Cancel
                </Button>
                <Button type="submit" pending={create.isPending}>
                  Add reading
                </Button>
              </div>
            </>
          )}
        </Form>
      </Dialog>

      <ConfirmDialog
        open={deleting !== null}
        onClose={() => {
          setDeleting(null);
          remove.reset();
        }}
        title="Delete this backlash reading?"
        confirmLabel="Delete reading"
        danger
        pending={remove.isPending}
        error={remove.error?.message ?? null}
        onConfirm={() => {
          if (!deleting) return;
          remove.mutate(deleting.id, {
            onSuccess: (result) => {
              setDeleting(null);
              onOutcome(`Deleted the ${result.reading.axis.toUpperCase()} backlash reading of ${formatDate(result.reading.measuredAt)}.`, result);
            },
          });
        }}
      >
        {deleting && (
          <p>
            {deleting.axis.toUpperCase()}, {formatMeasure(deleting.backlashMm, measures.length, system)} on {formatDate(deleting.measuredAt)}. The axis goes back
            to its previous reading.
          </p>
        )}
      </ConfirmDialog>
    </Card>
  );
}
