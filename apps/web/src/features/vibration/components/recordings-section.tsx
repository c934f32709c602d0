import type { Machine, RecordingSummary, UnitSystem } from "@ringdown/contracts";
import type { ColumnDef } from "@tanstack/react-table";
import { Download, FileAudio, Mic, Trash2 } from "lucide-react";
import { useMemo, useState } from "react";
import { Link, useNavigate } from "react-router-dom";
import { Button } from "@/components/ui/button";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { DataTable } from "@/components/ui/data-table";
import { EmptyState } from "@/components/ui/empty-state";
import { formatNumber, formatQuantity } from "@/lib/format";
import { recordingFileUrl, useDeleteRecording, useRecordings } from "../api/recordings";
import { formatLabels, kindLabels } from "../labels";
import { formatDateTime } from "../lib/dates";
import { NewRecordingSheet, type RecordingSource } from "./new-recording-sheet";
import { RecordingStatusBadge } from "./recording-status";

/** Where a recording's results are shown. */
export function recordingPath(machineId: string, recordingId: string): string {
  return `/machines/${encodeURIComponent(machineId)}/recordings/${encodeURIComponent(recordingId)}`;
}

function settingsOf(r: RecordingSummary): string {
  const parts: string[] = [];
  if (r.rpm !== null) parts.push(formatQuantity(r.rpm, "rpm", { fractionDigits: 0 }));
  if (r.flutes !== null) parts.push(`${r.flutes} flute${r.flutes === 1 ? "" : "s"}`);
  if (r.direction) parts.push(`direction ${r.direction.toUpperCase()}`);
  if (r.dialSetting) parts.push(`dial ${r.dialSetting}`);
  return parts.join(" · ") || "—";
}

/** Recordings of a machine (cuts, tap tests, spindle running free, frequency responses) and their analysis. */
export function RecordingsSection({ shopId, machine, mayDelete }: { shopId: string; machine: Machine; mayDelete: boolean; system: UnitSystem }) {
  const list = useRecordings(shopId, machine.id);
  const remove = useDeleteRecording(shopId, machine.id);
  const navigate = useNavigate();
  const [adding, setAdding] = useState<RecordingSource | null>(null);
  const [deleting, setDeleting] = useState<RecordingSummary | null>(null);

  const columns = useMemo<Array<ColumnDef<RecordingSummary, unknown>>>(
    () => [
      {
        id: "createdAt",
        header: "Recorded",
        accessorKey: "createdAt",
        cell: ({ row }) => (
          <Link to={recordingPath(machine.id, row.original.id)} className="font-medium whitespace-nowrap text-brand underline-offset-2 hover:underline">
            {formatDateTime(row.original.createdAt)}
          </Link>
        ),
      },
      { id: "kind", header: "Kind", accessorKey: "kind", cell: ({ row }) => kindLabels[row.original.kind] },
      {
        id: "file",
        header: "File",
        accessorKey: "originalName",
        cell: ({ row }) => (
          <div className="min-w-40">
            <div className="max-w-56 truncate" title={row.original.originalName}>
              {row.original.originalName}
            </div>
            <div className="text-xs text-muted">
              {formatLabels[row.original.format]}
              {row.original.durationS !== null && ` · ${formatQuantity(row.original.durationS, "s", { significantDigits: 3 })}`}
              {row.original.sampleRateHz !== null && ` · ${formatQuantity(row.original.sampleRateHz, "Hz", { fractionDigits: 0 })}`}
            </div>
          </div>
        ),
      },
      { id: "settings", header: "Settings", enableSorting: false, cell: ({ row }) => <span className="text-sm tabular">{settingsOf(row.original)}</span> },
      {
        id: "status",
        header: "Analysis",
        accessorKey: "status",
        cell: ({ row }) => (
          <div className="flex flex-col items-start gap-0.5">
            <RecordingStatusBadge recording={row.original} />
            {row.original.status === "failed" && row.original.failureReason && <span className="max-w-64 text-xs text-limit">{row.original.failureReason}</span>}
          </div>
        ),
      },
    ],
    [machine.id],
  );

  return (
    <Card>
      <CardHeader
        title="Recordings"
        description="Sound of a cut, a tap test, the spindle running free, or a measured frequency response. Every member can record; the results are kept with the machine."
        actions={
          <>
            <Button variant="secondary" onClick={() => setAdding("file")}>
              <FileAudio className="size-4" aria-hidden /> Upload a file
            </Button>
            <Button onClick={() => setAdding("microphone")}>
              <Mic className="size-4" aria-hidden /> Record
            </Button>
          </>
        }
      />
      <CardBody>
        <DataTable
          label={`Recordings of ${machine.name}`}
          columns={columns}
          data={list.data?.items}
          getRowId={(r) => r.id}
          isLoading={list.isPending}
          isFetching={list.isFetching && !list.isPending}
          error={list.isError ? list.error : null}
          onRetry={() => void list.refetch()}
          initialSorting={[{ id: "createdAt", desc: true }]}
          pageSize={10}
          maxHeightClassName="max-h-[60vh]"
          rowActions={(r) => (
            <>
              <a
                href={recordingFileUrl(shopId, machine.id, r.id)}
                download={r.originalName}
                className="inline-flex h-8 items-center gap-1.5 rounded-md px-2.5 text-sm font-medium text-ink hover:bg-ink/5"
                aria-label={`Download ${r.originalName}`}
              >
                <Download className="size-4" aria-hidden /> File
              </a>
              {mayDelete && (
                <Button variant="quiet" size="sm" onClick={() => setDeleting(r)} aria-label={`Delete the recording ${r.originalName}`}>
                  <Trash2 className="size-4" aria-hidden /> Delete
                </Button>
              )}
            </>
          )}
          empty={
            <EmptyState
              icon={Mic}
              title="No recordings yet"
              action={
                <Button onClick={() => setAdding("microphone")}>
                  <Mic className="size-4" aria-hidden /> Record with the microphone
                </Button>
              }
            >
              <p>
                Record a few seconds of a cut to tell tooth-passing harmonics from chatter, or tap the spindle with a small hammer to measure a mode's frequency
                and damping.
              </p>
            </EmptyState>
          }
        />
        {list.data && list.data.items.length > 0 && (
          <p className="mt-2 text-xs text-muted">
            {formatNumber(list.data.items.filter((r) => r.status === "done").length)} analysed. Open a recording to see its spectrum and what it suggests.
          </p>
        )}
      </CardBody>

      {adding && (
        <NewRecordingSheet
          shopId={shopId}
          machine={machine}
          open
          initialSource={adding}
          onClose={() => setAdding(null)}
          onUploaded={(recording) => {
            setAdding(null);
            void navigate(recordingPath(machine.id, recording.id));
          }}
        />
      )}
      <ConfirmDialog
        open={deleting !== null}
        onClose={() => {
          setDeleting(null);
          remove.reset();
        }}
        title="Delete this recording?"
        confirmLabel="Delete recording"
        danger
        pending={remove.isPending}
        error={remove.error?.message ?? null}
        onConfirm={() => {
          if (!deleting) return;
          remove.mutate(deleting.id, { onSuccess: () => setDeleting(null) });
        }}
      >
        {deleting && (
          <p>
            {deleting.originalName}, {kindLabels[deleting.kind].toLowerCase()} of {formatDateTime(deleting.createdAt)}. The file and its analysis are removed; a mode
            or dial speed taken from it stays on the machine.
          </p>
        )}
      </ConfirmDialog>
    </Card>
  );
}
