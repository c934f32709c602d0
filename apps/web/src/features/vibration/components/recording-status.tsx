import type { RecordingSummary } from "@ringdown/contracts";
import { Badge, type BadgeTone } from "@/components/ui/badge";
import { Spinner } from "@/components/ui/spinner";
import { formatNumber } from "@/lib/format";
import { statusLabels } from "../labels";

const tones: Record<RecordingSummary["status"], BadgeTone> = { queued: "neutral", analysing: "brand", done: "ok", failed: "limit" };

/** Status as a badge, with the analysis progress while it runs. */
export function RecordingStatusBadge({ recording }: { recording: Pick<RecordingSummary, "status" | "progress"> }) {
  const running = recording.status === "queued" || recording.status === "analysing";
  return (
    <Badge tone={tones[recording.status]}>
      {running && <Spinner className="size-3" />}
      {statusLabels[recording.status]}
      {recording.status === "analysing" && <span className="tabular"> {formatNumber(recording.progress * 100, { fractionDigits: 0 })} %</span>}
    </Badge>
  );
}

/** The analysis as a progress bar: queued, then analysing with its percentage. */
export function AnalysisProgress({ recording }: { recording: Pick<RecordingSummary, "status" | "progress"> }) {
  const pct = Math.round(recording.progress * 100);
  return (
    <div className="flex flex-col gap-1.5" role="status" aria-live="polite">
      <div className="flex items-baseline justify-between text-sm">
        <span className="inline-flex items-center gap-2 text-ink">
          <Spinner />
          {recording.status === "queued" ? "Queued: waiting for the analysis worker…" : "Analysing the recording…"}
        </span>
        {recording.status === "analysing" && <span className="tabular text-muted">{pct} %</span>}
      </div>
      <div
        role="progressbar"
        aria-label="Analysis progress"
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={recording.status === "analysing" ? pct : 0}
        className="h-2 overflow-hidden rounded-sm border border-rule bg-paper"
      >
        <div className="h-full bg-brand transition-[width] motion-reduce:transition-none" style={{ width: `${recording.status === "analysing" ? Math.max(3, pct) : 0}%` }} />
      </div>
    </div>
  );
}
