import type { Machine, MachineModeRecord, RecheckOutcome, UnitSystem } from "@ringdown/contracts";
import type { ColumnDef } from "@tanstack/react-table";
import { AudioWaveform, Pencil, Plus, Trash2 } from "lucide-react";
import { useMemo, useState } from "react";
import { Badge, type BadgeTone } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { DataTable } from "@/components/ui/data-table";
import { EmptyState } from "@/components/ui/empty-state";
import { MeasureValue } from "@/components/ui/measure";
import { formatMeasure, measures } from "@/components/ui/units";
import { formatNumber, formatQuantity } from "@/lib/format";
import { useDeleteMode, useModes } from "../api/modes";
import { formatDate } from "../lib/dates";
import { ModeSheet } from "./mode-sheet";

const sourceBadges: Record<MachineModeRecord["source"], { label: string; tone: BadgeTone }> = {
  measured: { label: "Measured", tone: "measured" },
  fitted: { label: "Fitted", tone: "measured" },
  manual: { label: "Entered", tone: "neutral" },
  estimated: { label: "Estimate", tone: "near" },
};

/** The machine's vibration modes: the frequencies tooth-passing must avoid and the stability chart is drawn from. */
export function ModesSection({
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
  const modes = useModes(shopId, machine.id);
  const remove = useDeleteMode(shopId, machine.id);
  const [editing, setEditing] = useState<MachineModeRecord | "new" | null>(null);
  const [deleting, setDeleting] = useState<MachineModeRecord | null>(null);

  const columns = useMemo<Array<ColumnDef<MachineModeRecord, unknown>>>(
    () => [
      { id: "direction", header: "Direction", accessorKey: "direction", cell: ({ row }) => row.original.direction.toUpperCase() },
      {
        id: "frequency",
        header: "Frequency",
        meta: { numeric: true },
        accessorKey: "frequencyHz",
        cell: ({ row }) => <MeasureValue value={row.original.frequencyHz} measure={measures.frequency} />,
      },
      {
        id: "damping",
        header: "Damping ζ",
        meta: { numeric: true },
        accessorKey: "dampingRatio",
        cell: ({ row }) => (
          <span className="tabular" title={`${formatNumber(row.original.dampingRatio * 100, { significantDigits: 3 })} % of critical damping`}>
            {formatNumber(row.original.dampingRatio, { significantDigits: 3 })}
          </span>
        ),
      },
      {
        id: "stiffness",
        header: "Modal stiffness",
        meta: { numeric: true },
        accessorKey: "stiffnessNPerMm",
        cell: ({ row }) => <MeasureValue value={row.original.stiffnessNPerMm} measure={measures.stiffness} />,
      },
      {
        id: "source",
        header: "Source",
        accessorKey: "source",
        cell: ({ row }) => {
          const b = sourceBadges[row.original.source];
          return (
            <span className="inline-flex flex-col items-start gap-0.5">
              <Badge tone={b.tone}>{b.label}</Badge>
              {row.original.source === "estimated" && row.original.massKg !== null && (
                <span className="text-xs text-muted">from {formatMeasure(row.original.massKg, measures.mass, system)}</span>
              )}
            </span>
          );
        },
      },
      { id: "measuredAt", header: "Date", accessorKey: "measuredAt", cell: ({ row }) => <span className="tabular whitespace-nowrap">{formatDate(row.original.measuredAt)}</span> },
      { id: "note", header: "Note", accessorKey: "note", enableSorting: false, cell: ({ row }) => <span className="text-muted">{row.original.note || "—"}</span> },
    ],
    [system],
  );

  const estimates = (modes.data?.items ?? []).filter((m) => m.source === "estimated").length;

  return (
    <Card>
      <CardHeader
        title="Modes"
        description={`Frequencies at which the machine rings. Tooth-passing is kept ${formatQuantity(machine.modeMarginPct, "%")} away from each, and the X and Y modes draw the stability chart.`}
        actions={
          mayEdit && (
            <Button variant="secondary" onClick={() => setEditing("new")}>
              <Plus className="size-4" aria-hidden /> Add mode
            </Button>
          )
        }
      />
      <CardBody className="flex flex-col gap-3">
        {estimates > 0 && (
          <p className="text-sm text-[#8a5a12]">
            {estimates === 1 ? "One mode is an estimate" : `${estimates} modes are estimates`} from mass and stiffness. A tap test recorded on the Recordings tab
            measures the real frequency and damping.
          </p>
        )}
        <DataTable
          label={`Modes of ${machine.name}`}
          columns={columns}
          data={modes.data?.items}
          getRowId={(m) => m.id}
          isLoading={modes.isPending}
          error={modes.isError ? modes.error : null}
          onRetry={() => void modes.refetch()}
          initialSorting={[{ id: "frequency", desc: false }]}
          maxHeightClassName="max-h-[50vh]"
          rowActions={
            mayEdit
              ? (m) => (
                  <>
                    <Button variant="quiet" size="sm" onClick={() => setEditing(m)} aria-label={`Edit the ${formatQuantity(m.frequencyHz, "Hz", { significantDigits: 4 })} ${m.direction.toUpperCase()} mode`}>
                      <Pencil className="size-4" aria-hidden /> Edit
                    </Button>
                    <Button variant="quiet" size="sm" onClick={() => setDeleting(m)} aria-label={`Delete the ${formatQuantity(m.frequencyHz, "Hz", { significantDigits: 4 })} ${m.direction.toUpperCase()} mode`}>
                      <Trash2 className="size-4" aria-hidden /> Delete
                    </Button>
                  </>
                )
              : undefined
          }
          empty={
            <EmptyState
              icon={AudioWaveform}
              title="No modes yet"
              action={
                mayEdit && (
                  <Button onClick={() => setEditing("new")}>
                    <Plus className="size-4" aria-hidden /> Add a mode
                  </Button>
                )
              }
            >
              <p>Without modes recipes are not checked for resonance or chatter. Record a tap test, or estimate a mode from the moving mass and stiffness.</p>
            </EmptyState>
          }
        />
      </CardBody>

      {editing !== null && (
        <ModeSheet
          shopId={shopId}
          machine={machine}
          mode={editing === "new" ? null : editing}
          open
          system={system}
          onClose={() => setEditing(null)}
          onSaved={(result, created) => {
            setEditing(null);
            onOutcome(
              `${created ? "Added" : "Saved"} the ${formatQuantity(result.mode.frequencyHz, "Hz", { significantDigits: 4 })} ${result.mode.direction.toUpperCase()} mode.`,
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
        title="Delete this mode?"
        confirmLabel="Delete mode"
        danger
        pending={remove.isPending}
        error={remove.error?.message ?? null}
        onConfirm={() => {
          if (!deleting) return;
          remove.mutate(deleting.id, {
            onSuccess: (result) => {
              setDeleting(null);
              onOutcome(`Deleted the ${formatQuantity(result.mode.frequencyHz, "Hz", { significantDigits: 4 })} ${result.mode.direction.toUpperCase()} mode.`, result);
            },
          });
        }}
      >
        {deleting && (
          <p>
            {formatQuantity(deleting.frequencyHz, "Hz", { significantDigits: 4 })} in {deleting.direction.toUpperCase()} ({sourceBadges[deleting.source].label.toLowerCase()}).
            Recipes on this machine will no longer avoid it.
          </p>
        )}
      </ConfirmDialog>
    </Card>
  );
}
