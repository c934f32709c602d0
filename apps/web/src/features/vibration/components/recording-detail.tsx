import type { Machine, RecheckOutcome, UnitSystem } from "@ringdown/contracts";
import { Download, TriangleAlert } from "lucide-react";
import { useState } from "react";
import { Link } from "react-router-dom";
import { SafetyBand } from "@/components/recommendation/safety-band";
import { Card, CardBody } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/page-header";
import { LoadingState } from "@/components/ui/spinner";
import { isApiError } from "@/lib/api-client";
import { formatQuantity } from "@/lib/format";
import { recordingFileUrl, useAcceptDialRpm, useAcceptMode, useRecording } from "../api/recordings";
import { formatLabels, kindLabels } from "../labels";
import { formatDateTime } from "../lib/dates";
import { RecheckNotice } from "./recheck-notice";
import { AnalysisProgress, RecordingStatusBadge } from "./recording-status";
import { RecordingResults } from "./recording-results";

/** One recording: its details, the analysis while it runs (or why it failed), then its results. */
export function RecordingDetailView({
  shopId,
  machine,
  recordingId,
  mayEdit,
  system,
  profilePath,
}: {
  shopId: string;
  machine: Machine;
  recordingId: string;
  mayEdit: boolean;
  system: UnitSystem;
  /** Where the machine's recordings are listed */
  profilePath: string;
}) {
  const query = useRecording(shopId, machine.id, recordingId);
  const accept = useAcceptMode(shopId, machine.id);
  const dial = useAcceptDialRpm(shopId, machine.id);
  const [notice, setNotice] = useState<{ saved: string; outcome: RecheckOutcome | null } | null>(null);

  if (query.isPending) return <LoadingState label="Loading the recording…" />;
  if (query.isError) {
    const missing = isApiError(query.error) && query.error.status === 404;
    return (
      <Card className="mx-auto max-w-xl">
        <EmptyState icon={TriangleAlert} title={missing ? "No such recording on this machine" : "The recording could not be loaded"} action={<Link to={profilePath} className="text-sm font-medium text-brand underline">All recordings</Link>}>
          <p>{missing ? "It may have been deleted." : query.error.message}</p>
        </EmptyState>
      </Card>
    );
  }
  const r = query.data;
  const details = [
    formatLabels[r.format],
    r.durationS !== null ? formatQuantity(r.durationS, "s", { significantDigits: 3 }) : null,
    r.sampleRateHz !== null ? formatQuantity(r.sampleRateHz, "Hz", { fractionDigits: 0 }) : null,
    r.channels !== null ? `${r.channels} channel${r.channels === 1 ? "" : "s"}` : null,
    r.rpm !== null ? formatQuantity(r.rpm, "rpm", { fractionDigits: 0 }) : null,
    r.flutes !== null ? `${r.flutes} flute${r.flutes === 1 ? "" : "s"}` : null,
    r.direction ? `direction ${r.direction.toUpperCase()}` : null,
    r.dialSetting ? `dial setting ${r.dialSetting}` : null,
  ].filter(Boolean);

  return (
    <div className="flex flex-col gap-5">
      <Card>
        <CardBody className="flex flex-col gap-3">
          <div className="flex flex-wrap items-start justify-between gap-3">
            <div>
              <h2 className="text-base font-semibold text-ink">
                {kindLabels[r.kind]} of {formatDateTime(r.createdAt)}
              </h2>
              <p className="mt-0.5 text-sm text-muted">
                {r.originalName} · {details.join(" · ")}
              </p>
              {r.note && <p className="mt-1 text-sm text-ink">{r.note}</p>}
            </div>
            <div className="flex items-center gap-3">
              <RecordingStatusBadge recording={r} />
              <a href={recordingFileUrl(shopId, machine.id, r.id)} download={r.originalName} className="inline-flex items-center gap-1.5 text-sm font-medium text-brand hover:underline">
                <Download className="size-4" aria-hidden /> Download the file
              </a>
            </div>
          </div>
          {(r.status === "queued" || r.status === "analysing") && <AnalysisProgress recording={r} />}
          {r.status === "failed" && (
            <div role="alert" className="flex items-start gap-2 rounded-md border border-limit/40 bg-limit/5 px-3 py-2 text-sm text-ink">
              <TriangleAlert className="mt-0.5 size-4 shrink-0 text-limit" aria-hidden />
              <p>
                <span className="font-medium">The analysis failed: </span>
                {r.failureReason ?? "no reason was given."} Record or upload again; the file is kept so you can check it.
              </p>
            </div>
          )}
        </CardBody>
      </Card>

      {notice &&
        (notice.outcome ? (
          <RecheckNotice saved={notice.saved} outcome={notice.outcome} system={system} onDismiss={() => setNotice(null)} />
        ) : (
          <Notice onDismiss={() => setNotice(null)}>{notice.saved}</Notice>
        ))}

      {r.status === "done" && (
        <RecordingResults
          recording={r}
          machine={machine}
          mayEdit={mayEdit && !machine.deletedAt}
          system={system}
          acceptError={accept.error?.message ?? dial.error?.message ?? null}
          accept={{
            pending: accept.isPending,
            onAccept: () =>
              accept.mutate(
                { recordingId: r.id },
                {
                  onSuccess: (result) => {
                    void query.refetch();
                    setNotice({
                      saved: `Added the ${formatQuantity(result.mode.frequencyHz, "Hz", { significantDigits: 4 })} ${result.mode.direction.toUpperCase()} mode to ${machine.name}.`,
                      outcome: result,
                    });
                  },
                },
              ),
          }}
          dial={{
            pending: dial.isPending,
            onApply: () =>
              dial.mutate(
                { recordingId: r.id },
                {
                  onSuccess: (result) => {
                    void query.refetch();
                    setNotice({
                      saved: `Dial setting ${result.dialSetting.label} now runs at ${formatQuantity(result.dialSetting.rpm, "rpm", { fractionDigits: 0 })}${result.dialSetting.previousRpm !== null ? ` (was ${formatQuantity(result.dialSetting.previousRpm, "rpm", { fractionDigits: 0 })})` : ""}.`,
                      outcome: null,
                    });
                  },
                },
              ),
          }}
        />
      )}
      {r.status === "done" && r.kind === "cut" && <SafetyBand />}
    </div>
  );
}
