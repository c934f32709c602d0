import type { CutterImportRow } from "@ringdown/contracts";
import type { ColumnDef } from "@tanstack/react-table";
import { CircleCheck, CircleX, FileUp, TriangleAlert } from "lucide-react";
import { useState } from "react";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { DataTable } from "@/components/ui/data-table";
import { MeasureValue } from "@/components/ui/measure";
import { Notice } from "@/components/ui/page-header";
import { Sheet } from "@/components/ui/sheet";
import { Spinner } from "@/components/ui/spinner";
import { measures } from "@/components/ui/units";
import { formatNumber } from "@/lib/format";
import { useImportCutters, usePreviewCutterImport, type ImportOutcome } from "../api/import-cutters";
import { shapeLabels } from "../labels";

/** Where the column set is described (written alongside the import route). */
export const CSV_FORMAT_DOC = "docs/csv-cutters.md";

/** The file as it was when picked: what was checked is exactly what gets imported. */
interface PickedFile {
  blob: Blob;
  name: string;
}

const previewColumns: Array<ColumnDef<CutterImportRow, unknown>> = [
  { id: "line", header: "Line", accessorKey: "line", meta: { numeric: true, className: "w-16" } },
  {
    id: "result",
    header: "Check",
    meta: { className: "whitespace-nowrap" },
    accessorFn: (row) => Object.keys(row.errors).length,
    cell: ({ row }) => {
      const problems = Object.keys(row.original.errors).length;
      return problems === 0 ? (
        <span className="inline-flex items-center gap-1 font-medium text-ok">
          <CircleCheck className="size-4" aria-hidden /> Ready
        </span>
      ) : (
        <span className="inline-flex items-center gap-1 font-medium text-limit">
          <CircleX className="size-4" aria-hidden /> {problems === 1 ? "1 problem" : `${problems} problems`}
        </span>
      );
    },
  },
  {
    id: "name",
    header: "Name",
    accessorFn: (row) => row.cutter?.name ?? row.values.name ?? "",
    cell: ({ getValue }) => (getValue() as string) || <span className="text-muted">(no name)</span>,
  },
  {
    id: "shape",
    header: "Shape",
    accessorFn: (row) => (row.cutter ? shapeLabels[row.cutter.shape] : (row.values.shape ?? "")),
  },
  {
    id: "diameter",
    header: "Diameter",
    meta: { numeric: true },
    accessorFn: (row) => row.cutter?.diameterMm ?? null,
    cell: ({ row }) =>
      row.original.cutter ? (
        <MeasureValue value={row.original.cutter.diameterMm} measure={measures.length} />
      ) : (
        <span className="text-muted">
          {row.original.values.diameter_mm
            ? `${row.original.values.diameter_mm}\u202Fmm`
            : row.original.values.diameter_in
              ? `${row.original.values.diameter_in}\u202Fin`
              : "—"}
        </span>
      ),
  },
  {
    id: "problems",
    header: "What to fix",
    enableSorting: false,
    cell: ({ row }) => {
      const errors = Object.entries(row.original.errors);
      const warnings = row.original.warnings;
      if (errors.length === 0 && warnings.length === 0) return <span className="text-muted">—</span>;
      return (
        <ul className="flex flex-col gap-0.5 text-xs">
          {errors.map(([column, message]) => (
            <li key={column} className="text-limit">
              <span className="font-mono">{column}</span>: {message}
            </li>
          ))}
          {warnings.map((w) => (
            <li key={w} className="text-[#8a5a12]">
              {w}
            </li>
          ))}
        </ul>
      );
    },
  },
];

function Summary({ outcome, fileName }: { outcome: ImportOutcome; fileName: string }) {
  const { counts, fileErrors } = outcome.report;
  const ready = fileErrors.length === 0 && counts.invalid === 0 && counts.total > 0;
  return (
    <div className="flex flex-col gap-2 rounded-lg border border-rule bg-surface px-4 py-3 text-sm">
      <p className="text-ink">
        <span className="font-medium">{fileName}</span>:{" "}
        <span className="tabular">
          {formatNumber(counts.total)} {counts.total === 1 ? "row" : "rows"}
        </span>
        {" — "}
        <Badge tone="ok">{formatNumber(counts.valid)} ready</Badge>{" "}
        <Badge tone={counts.invalid > 0 ? "limit" : "neutral"}>{formatNumber(counts.invalid)} with problems</Badge>
      </p>
      {fileErrors.length > 0 && (
        <ul className="flex flex-col gap-1 text-limit" aria-label="Problems with the whole file">
          {fileErrors.map((e) => (
            <li key={e} className="flex items-start gap-2">
              <TriangleAlert className="mt-0.5 size-4 shrink-0" aria-hidden />
              {e}
            </li>
          ))}
        </ul>
      )}
      {ready ? (
        <p className="text-muted">Every row can be imported. Nothing has been written yet.</p>
      ) : counts.total === 0 && fileErrors.length === 0 ? (
        <p className="text-limit">The file has no data rows under its header.</p>
      ) : (
        <p className="text-ink">
          Nothing has been imported. Fix the problems marked below in the file, save it, and choose it again: the import
          takes all rows or none.
        </p>
      )}
    </div>
  );
}

/**
 * Cutter import in two steps: pick a CSV → the server checks every row (dry run) and the preview
 * marks each as ready or lists what to fix → import, all rows in one transaction or none.
 */
export function ImportCuttersSheet({
  shopId,
  open,
  onClose,
  onImported,
}: {
  shopId: string;
  open: boolean;
  onClose: () => void;
  onImported: (count: number) => void;
}) {
  const [picked, setPicked] = useState<PickedFile | null>(null);
  const [readError, setReadError] = useState<string | null>(null);
  const preview = usePreviewCutterImport(shopId);
  const run = useImportCutters(shopId);

  const close = () => {
    setPicked(null);
    setReadError(null);
    preview.reset();
    run.reset();
    onClose();
  };

  const onPick = async (file: File | undefined) => {
    if (!file) return;
    setReadError(null);
    run.reset();
    let blob: Blob;
    try {
      // A copy taken now: edits to the file after this point need a new pick (and a new check).
      blob = new Blob([await file.arrayBuffer()], { type: file.type || "text/csv" });
    } catch {
      setReadError(`Ringdown could not read ${file.name}. If it is open in another program, save and close it, then choose it again.`);
      return;
    }
    const next = { blob, name: file.name };
    setPicked(next);
    preview.mutate({ file: next.blob, fileName: next.name });
  };

  const outcome = run.data?.refused ? run.data : preview.data;
  const report = outcome?.report;
  const ready = Boolean(report && !run.data?.refused && report.fileErrors.length === 0 && report.counts.invalid === 0 && report.counts.total > 0);
  const imported = run.data && !run.data.refused ? run.data.report.imported : null;
  const requestError = preview.error ?? run.error;

  return (
    <Sheet
      open={open}
      onClose={close}
      width="max-w-4xl"
      title="Import cutters from a CSV file"
      description={
        <>
          Ringdown checks every row first and shows what it found; nothing is written until you import, and the import takes
          all rows or none. The columns are described in <span className="font-mono text-ink">{CSV_FORMAT_DOC}</span> in
          Ringdown's documentation; an export from this page is a ready-made template.
        </>
      }
      footer={
        imported !== null ? (
          <Button onClick={close}>Done</Button>
        ) : (
          <>
            <Button variant="secondary" onClick={close}>
              Cancel
            </Button>
            <Button
              disabled={!ready || !picked}
              pending={run.isPending}
              onClick={() =>
                picked &&
                run.mutate(
                  { file: picked.blob, fileName: picked.name },
                  { onSuccess: (outcome) => outcome.refused === null && onImported(outcome.report.imported) },
                )
              }
            >
              {report && ready ? `Import ${formatNumber(report.counts.valid)} ${report.counts.valid === 1 ? "cutter" : "cutters"}` : "Import"}
            </Button>
          </>
        )
      }
    >
      <div className="flex flex-col gap-5">
        {imported !== null ? (
          <Notice>
            Imported {formatNumber(imported)} {imported === 1 ? "cutter" : "cutters"} from {picked?.name}. They are in the cutter
            table now.
          </Notice>
        ) : (
          <div className="flex flex-wrap items-center gap-3">
            <label className="inline-flex h-10 cursor-pointer items-center gap-2 rounded-md border border-rule-strong bg-surface px-4 text-sm font-medium text-ink hover:bg-paper has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-brand">
              <input
                type="file"
                accept=".csv,text/csv"
                className="sr-only"
                onChange={(event) => {
                  const file = event.target.files?.[0];
                  // Cleared so that choosing the same (fixed) file again fires a change.
                  event.target.value = "";
                  void onPick(file);
                }}
              />
              <FileUp className="size-4" aria-hidden />
              {picked ? "Choose the file again" : "Choose a CSV file"}
            </label>
            {picked && !preview.isPending && <span className="text-sm text-muted">Checked: {picked.name}</span>}
            {preview.isPending && (
              <span role="status" className="flex items-center gap-2 text-sm text-muted">
                <Spinner /> Checking {picked?.name}…
              </span>
            )}
          </div>
        )}

        {readError && <Notice tone="limit">{readError}</Notice>}
        {requestError && <Notice tone="limit">{requestError.message}</Notice>}
        {run.data?.refused && <Notice tone="limit">{run.data.refused.message} Nothing was imported.</Notice>}

        {outcome && report && picked && imported === null && (
          <>
            <Summary outcome={outcome} fileName={picked.name} />
            {report.rows.length > 0 && (
              <DataTable
                columns={previewColumns}
                data={report.rows}
                label={`Rows of ${picked.name}`}
                getRowId={(row) => String(row.line)}
                pageSize={50}
                rowClassName={(row) => (Object.keys(row.errors).length > 0 ? "bg-limit/5" : undefined)}
                maxHeightClassName="max-h-[55vh]"
              />
            )}
          </>
        )}
      </div>
    </Sheet>
  );
}
