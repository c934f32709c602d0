import { RECORDING_LIMITS, recordingUploadFieldsSchema, type Machine, type RecordingKind, type RecordingSummary } from "@ringdown/contracts";
import { FileAudio, Mic, RotateCcw, Square } from "lucide-react";
import { useEffect, useId, useMemo, useRef, useState } from "react";
import { useWatch } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Form, FormError } from "@/components/ui/form";
import { NumberField } from "@/components/ui/number-field";
import { SelectField } from "@/components/ui/select";
import { Sheet } from "@/components/ui/sheet";
import { TextareaField } from "@/components/ui/textarea";
import { measures } from "@/components/ui/units";
import { isApiError } from "@/lib/api-client";
import { cn } from "@/lib/cn";
import { formatNumber, formatQuantity } from "@/lib/format";
import { useUploadRecording, type UploadProgress } from "../api/upload-recording";
import { directionOptions, kindHints, kindOptions } from "../labels";
import { MAX_RECORDING_S, useMicrophoneRecorder } from "../lib/use-microphone-recorder";
import { LevelMeter } from "./level-meter";

export type RecordingSource = "microphone" | "file";

const MB = 1024 * 1024;
const ACCEPTED = ".wav,.wave,.csv,.txt,audio/wav,audio/x-wav,audio/wave,text/csv";

function formatBytes(bytes: number): string {
  return bytes >= MB ? formatQuantity(bytes / MB, "MB", { significantDigits: 3 }) : formatQuantity(bytes / 1024, "kB", { fractionDigits: 0 });
}

function KindFields({ machine }: { machine: Machine }) {
  const kind = useWatch({ name: "kind" }) as RecordingKind;
  const dials = machine.spindle.dialSettings;
  return (
    <>
      <SelectField name="kind" label="What was recorded" options={kindOptions} hint={kindHints[kind]} />
      {kind === "cut" && (
        <div className="grid grid-cols-2 gap-3">
          <NumberField name="rpm" label="Spindle speed" measure={measures.rpm} nullable hint="As set for the cut." />
          <NumberField name="flutes" label="Flutes" measure={measures.count} nullable hint="Of the cutter in use." />
        </div>
      )}
      {(kind === "tap" || kind === "frf") && (
        <SelectField
          name="direction"
          label="Direction"
          options={directionOptions}
          placeholder="Choose…"
          hint={kind === "tap" ? "The direction you tapped; the stiffness measured in it completes the mode." : "The direction the response was measured in."}
        />
      )}
      {kind === "spindle_free" &&
        (dials.length > 0 ? (
          <SelectField
            name="dialSetting"
            label="Dial setting running"
            options={dials.map((d) => ({ value: d.label, label: `${d.label} — ${formatNumber(d.rpm, { fractionDigits: 0 })} rpm${d.measured ? " (measured)" : ""}` }))}
            placeholder="Choose…"
          />
        ) : (
          <NumberField name="rpm" label="Nominal spindle speed" measure={measures.rpm} nullable hint="This spindle has no dial settings: give the speed it was set to." />
        ))}
      <TextareaField name="note" label="Note" rows={2} placeholder="e.g. 6 mm flat in birch ply, 3 mm deep, phone on the gantry" />
    </>
  );
}

/**
 * A new recording for a machine, from the microphone (recorded here, encoded as WAV) or from a file
 * (WAV, CSV time series, CSV frequency response), uploaded with what it shows; the analysis then
 * runs on the server.
 */
export function NewRecordingSheet({
  shopId,
  machine,
  open,
  initialSource,
  onClose,
  onUploaded,
}: {
  shopId: string;
  machine: Machine;
  open: boolean;
  initialSource: RecordingSource;
  onClose: () => void;
  onUploaded: (recording: RecordingSummary) => void;
}) {
  const formId = useId();
  const fileId = useId();
  const [source, setSource] = useState<RecordingSource>(initialSource);
  const [file, setFile] = useState<File | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const [progress, setProgress] = useState<UploadProgress | null>(null);
  const upload = useUploadRecording(shopId, machine.id);
  const recorder = useMicrophoneRecorder();
  const abort = useRef<AbortController | null>(null);
  const audioUrl = useMemo(() => (recorder.recorded ? URL.createObjectURL(recorder.recorded.wav) : null), [recorder.recorded]);
  useEffect(() => () => (audioUrl ? URL.revokeObjectURL(audioUrl) : undefined), [audioUrl]);
  useEffect(() => () => abort.current?.abort(), []);

  const recordingBusy = recorder.state === "recording" || recorder.state === "requesting" || recorder.state === "stopping";
  const ready = source === "file" ? file !== null : recorder.state === "recorded";
  const uploading = upload.isPending;

  const close = () => {
    abort.current?.abort();
    recorder.reset();
    onClose();
  };

  return (
    <Sheet
      open={open}
      onClose={close}
      width="max-w-lg"
      title="New recording"
      description={`For ${machine.name}. The analysis runs on the server; you can leave this page while it works.`}
      footer={
        <>
          <Button variant="secondary" onClick={close}>
            {uploading ? "Cancel upload" : "Cancel"}
          </Button>
          <Button type="submit" form={formId} pending={uploading} disabled={!ready || recordingBusy}>
            Upload and analyse
          </Button>
        </>
      }
    >
      <div role="radiogroup" aria-label="Where the recording comes from" className="mb-5 grid grid-cols-2 gap-1 rounded-md border border-rule bg-surface p-1">
        {(
          [
            ["microphone", "Record with the microphone", Mic],
            ["file", "Upload a file", FileAudio],
          ] as const
        ).map(([value, label, Icon]) => (
          <button
            key={value}
            type="button"
            role="radio"
            aria-checked={source === value}
            disabled={recordingBusy || uploading}
            onClick={() => setSource(value)}
            className={cn(
              "inline-flex h-9 cursor-pointer items-center justify-center gap-2 rounded text-sm font-medium disabled:cursor-not-allowed",
              source === value ? "bg-brand-tint text-brand" : "text-muted hover:text-ink",
            )}
          >
            <Icon className="size-4" aria-hidden />
            {label}
          </button>
        ))}
      </div>

      <Form
        id={formId}
        aria-label="Recording details"
        schema={recordingUploadFieldsSchema}
        defaultValues={{ kind: "cut", rpm: null, flutes: null, direction: "", dialSetting: "", note: "" }}
        className="flex flex-col gap-4"
        onSubmit={async (values) => {
          const blob = source === "file" ? file : (recorder.recorded?.wav ?? null);
          if (!blob) return;
          if (blob.size > RECORDING_LIMITS.maxBytes) {
            setFileError(`The file is ${formatBytes(blob.size)}; recordings can be at most ${formatBytes(RECORDING_LIMITS.maxBytes)}.`);
            return;
          }
          const name = source === "file" && file ? file.name : `microphone-${new Date().toISOString().replace(/[:.]/g, "-")}.wav`;
          abort.current = new AbortController();
          setProgress({ loadedBytes: 0, totalBytes: blob.size });
          try {
            const recording = await upload.mutateAsync({ file: blob, fileName: name, fields: values, onProgress: setProgress, signal: abort.current.signal });
            onUploaded(recording);
          } catch (error) {
            setProgress(null);
            if (error instanceof DOMException && error.name === "AbortError") return;
            if (isApiError(error) && error.fields.file) setFileError(error.fields.file);
            throw error;
          }
        }}
      >
        {() => (
          <>
            <FormError />
            {source === "microphone" ? (
              <section aria-label="Microphone" className="flex flex-col gap-3 rounded-md border border-rule bg-surface px-4 py-3">
                <p className="text-xs text-muted">
                  Hold the phone or laptop still, near the spindle but out of the chip stream. Up to {MAX_RECORDING_S} s; a few seconds of steady cutting is enough.
                </p>
                {recorder.state === "recording" || recorder.state === "stopping" ? (
                  <>
                    <LevelMeter peak={recorder.level} />
                    <div className="flex items-center justify-between">
                      <p className="text-sm tabular" aria-live="off">
                        <span className="mr-2 inline-block size-2.5 animate-pulse rounded-full bg-limit motion-reduce:animate-none" aria-hidden />
                        Recording {formatQuantity(recorder.elapsedS, "s", { fractionDigits: 1 })}
                      </p>
                      <Button onClick={recorder.stop} pending={recorder.state === "stopping"}>
                        <Square className="size-4" aria-hidden /> Stop
                      </Button>
                    </div>
                  </>
                ) : recorder.state === "recorded" && recorder.recorded ? (
                  <div className="flex flex-col gap-2">
                    <p className="text-sm text-ink" role="status">
                      Recorded {formatQuantity(recorder.recorded.durationS, "s", { fractionDigits: 1 })} at{" "}
                      {formatQuantity(recorder.recorded.sampleRateHz, "Hz", { fractionDigits: 0 })}, {formatBytes(recorder.recorded.wav.size)} as WAV
                      {recorder.recorded.peak >= 0.98 ? " — it clipped: record again further away for a clean spectrum." : "."}
                    </p>
                    {audioUrl && <audio controls src={audioUrl} className="w-full" aria-label="Play back the recording" />}
                    <div>
                      <Button variant="secondary" size="sm" onClick={() => recorder.reset()} disabled={uploading}>
                        <RotateCcw className="size-4" aria-hidden /> Record again
                      </Button>
                    </div>
                  </div>
                ) : (
                  <div className="flex flex-col gap-2">
                    {recorder.error && (
                      <p role="alert" className="text-sm text-limit">
                        {recorder.error}
                      </p>
                    )}
                    <div>
                      <Button onClick={() => void recorder.start()} pending={recorder.state === "requesting"}>
                        <Mic className="size-4" aria-hidden /> Start recording
                      </Button>
                    </div>
                  </div>
                )}
              </section>
            ) : (
              <div className="flex flex-col gap-1.5">
                <label htmlFor={fileId} className="text-sm font-medium text-ink">
                  File
                </label>
                <input
                  id={fileId}
                  type="file"
                  accept={ACCEPTED}
                  aria-invalid={fileError ? true : undefined}
                  aria-describedby={`${fileId}-hint`}
                  onChange={(event) => {
                    const chosen = event.target.files?.[0] ?? null;
                    setFileError(chosen && chosen.size > RECORDING_LIMITS.maxBytes ? `The file is ${formatBytes(chosen.size)}; recordings can be at most ${formatBytes(RECORDING_LIMITS.maxBytes)}.` : null);
                    setFile(chosen && chosen.size <= RECORDING_LIMITS.maxBytes ? chosen : null);
                  }}
                  className="block w-full cursor-pointer rounded-md border border-rule-strong bg-surface text-sm text-ink file:mr-3 file:h-10 file:cursor-pointer file:border-0 file:border-r file:border-rule file:bg-paper file:px-3 file:text-sm file:font-medium"
                />
                {fileError ? (
                  <p className="text-xs font-medium text-limit">{fileError}</p>
                ) : (
                  <p id={`${fileId}-hint`} className="text-xs text-muted">
                    WAV (16- or 24-bit PCM or 32-bit float, mono or stereo, {formatNumber(RECORDING_LIMITS.minSampleRateHz / 1000)}–
                    {formatNumber(RECORDING_LIMITS.maxSampleRateHz / 1000)} kHz), a CSV time series (time, value) or a CSV frequency response (frequency, real,
                    imaginary). At most {formatBytes(RECORDING_LIMITS.maxBytes)} and {formatNumber(RECORDING_LIMITS.maxDurationS / 60)} minutes.
                  </p>
                )}
              </div>
            )}

            <KindFields machine={machine} />

            {progress && (
              <div className="flex flex-col gap-1" role="status">
                <div className="flex justify-between text-xs text-muted tabular">
                  <span>{progress.loadedBytes >= progress.totalBytes ? "Uploaded, waiting for the server…" : "Uploading…"}</span>
                  <span>
                    {formatBytes(progress.loadedBytes)} of {formatBytes(progress.totalBytes)}
                  </span>
                </div>
                <progress
                  className="h-2 w-full overflow-hidden rounded-sm [&::-webkit-progress-bar]:bg-paper [&::-webkit-progress-value]:bg-brand"
                  max={progress.totalBytes || 1}
                  value={progress.loadedBytes}
                  aria-label="Upload progress"
                />
              </div>
            )}
          </>
        )}
      </Form>
    </Sheet>
  );
}
